/**
 * What the sample files need beyond the api's schedule workbook writer
 * (api/src/imports/template-workbook.ts, the one the template download
 * uses): fixed dates and zip entry times, so that a regenerated sample is
 * byte-identical, and the Members sheet as CSV.
 */
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import {
  memberLayout,
  writeScheduleWorkbook,
  type CellInput,
  type ScheduleWorkbookOptions,
  type MemberRowInput,
} from '../../api/src/imports/template-workbook';
import type { UnitSystemId } from '../../common/src/units';

export type { LoadRowInput, MemberRowInput } from '../../api/src/imports/template-workbook';

/** The day every sample file is dated. */
const SAMPLE_DATE = new Date(Date.UTC(2025, 0, 6, 9, 0, 0));

/** A schedule workbook (see writeScheduleWorkbook) dated SAMPLE_DATE. */
export function writeSampleWorkbook(workbook: ExcelJS.Workbook, opts: ScheduleWorkbookOptions): void {
  writeScheduleWorkbook(workbook, opts);
  workbook.lastModifiedBy = 'Sagline';
  workbook.created = SAMPLE_DATE;
  workbook.modified = SAMPLE_DATE;
}

function csvField(v: CellInput): string {
  if (v === null || v === undefined) return '';
  const s = String(v);
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** The Members sheet as CSV (RFC 4180: comma-separated, CRLF line ends, quotes where needed). */
export function membersCsv(opts: { unitSystem: UnitSystemId; loadCases?: readonly string[]; members: readonly MemberRowInput[] }): string {
  const layout = memberLayout(opts.unitSystem, opts.loadCases);
  const lines = [layout.map((c) => csvField(c.header)).join(',')];
  for (const row of opts.members) {
    lines.push(layout.map((c) => csvField(c.loadCase ? row.loads?.[c.loadCase] : row.values[c.def.key])).join(','));
  }
  return lines.join('\r\n') + '\r\n';
}

/**
 * The workbook as xlsx bytes with every zip entry dated the same fixed day,
 * so that a regenerated sample is byte-identical (exceljs stamps entries
 * with the current time).
 */
export async function workbookBytes(workbook: ExcelJS.Workbook): Promise<Buffer> {
  const raw = await workbook.xlsx.writeBuffer();
  const zip = await JSZip.loadAsync(raw as ArrayBuffer);
  const fixed = workbook.created;
  const out = new JSZip();
  // Keep exceljs's entry order ([Content_Types].xml first).
  for (const name of Object.keys(zip.files)) {
    const entry = zip.files[name];
    if (entry.dir) continue;
    out.file(name, await entry.async('uint8array'), { date: fixed, createFolders: false });
  }
  return out.generateAsync({ type: 'nodebuffer', compression: 'DEFLATE', compressionOptions: { level: 6 } });
}

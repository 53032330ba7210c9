/**
 * Writes member schedule workbooks (the blank template and filled examples)
 * from the column definitions in common/src/schedule, so that the headers,
 * drop-down lists and help text always match what the parser accepts.
 * Plain functions over an exceljs Workbook: the api can reuse them for its
 * template download.
 */
import ExcelJS from 'exceljs';
import JSZip from 'jszip';
import {
  LOAD_CASE_COLUMN,
  LOAD_COLUMNS,
  MEMBER_COLUMNS,
  SHEET_NAMES,
  TEMPLATE_HELP,
  TEMPLATE_LOAD_CASES,
  codeTables,
  columnHeader,
  columnHelpRows,
  unitSystemNote,
  type ColumnDef,
} from '../../common/src/schedule';
import type { UnitSystemId } from '../../common/src/units';

export type CellInput = string | number | null | undefined;

/** One Members row: values by column key, in the header units; uniform loads by load case. */
export interface MemberRowInput {
  values: Partial<Record<string, CellInput>>;
  loads?: Partial<Record<string, number>>;
}

/** One Loads row: values by LOAD_COLUMNS key, in the header units. */
export type LoadRowInput = Partial<Record<string, CellInput>>;

export interface ScheduleWorkbookOptions {
  unitSystem: UnitSystemId;
  /** Limit-set category ids offered in the Category drop-down. */
  categories: readonly string[];
  /** What each category means, for the Codes sheet (e.g. from the limit-set presets). */
  categoryLabels?: Readonly<Record<string, string>>;
  /** Load cases that get a Members column (default D, L, Lr, S, W). */
  loadCases?: readonly string[];
  /** Rows below the header that get drop-down lists (default 1000, or the data rows + 200). */
  validationRows?: number;
  /** Shown at the top of the "How to fill in" sheet. */
  title?: string;
}

/** A Members column in sheet order: a definition, and the case of a load column. */
export interface LaidOutColumn {
  def: ColumnDef;
  header: string;
  loadCase?: string;
}

/** Members columns in template order: the fixed columns to Camber, the load cases, then Reviewer and Notes. */
export function memberLayout(unitSystem: UnitSystemId, loadCases: readonly string[] = TEMPLATE_LOAD_CASES): LaidOutColumn[] {
  const out: LaidOutColumn[] = [];
  for (const def of MEMBER_COLUMNS) {
    out.push({ def, header: columnHeader(def, unitSystem) });
    if (def.key === 'camber') {
      for (const c of loadCases) out.push({ def: LOAD_CASE_COLUMN, header: columnHeader(LOAD_CASE_COLUMN, unitSystem, c), loadCase: c });
    }
  }
  return out;
}

export function loadLayout(unitSystem: UnitSystemId): LaidOutColumn[] {
  return LOAD_COLUMNS.map((def) => ({ def, header: columnHeader(def, unitSystem) }));
}

function letter(index: number): string {
  let n = index + 1;
  let s = '';
  while (n > 0) {
    s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

const HEADER_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE8ECEF' } };
const REQUIRED_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFD5DEE6' } };

function writeHeader(sheet: ExcelJS.Worksheet, layout: LaidOutColumn[]): void {
  sheet.columns = layout.map((c) => ({ header: c.header, key: c.header, width: Math.max(c.def.width, c.header.length + 2) }));
  const row = sheet.getRow(1);
  row.font = { bold: true };
  layout.forEach((c, i) => {
    const cell = row.getCell(i + 1);
    cell.fill = c.def.required ? REQUIRED_FILL : HEADER_FILL;
    cell.note = `${c.def.required ? 'Required. ' : ''}${c.def.help}`;
  });
  sheet.views = [{ state: 'frozen', xSplit: 1, ySplit: 1 }];
}

/** Codes sheet: one two-column table per coded column; returns each list's range for validations. */
function writeCodes(workbook: ExcelJS.Workbook, opts: ScheduleWorkbookOptions): Map<string, string> {
  const sheet = workbook.addWorksheet(SHEET_NAMES.codes);
  const ranges = new Map<string, string>();
  codeTables(opts.categories, opts.categoryLabels).forEach((table, t) => {
    const col = t * 3 + 1;
    sheet.getColumn(col).width = 26;
    sheet.getColumn(col + 1).width = 48;
    const head = sheet.getCell(1, col);
    head.value = table.title;
    head.font = { bold: true };
    sheet.getCell(1, col + 1).value = 'Meaning';
    sheet.getCell(1, col + 1).font = { bold: true };
    table.codes.forEach((code, i) => {
      sheet.getCell(i + 2, col).value = code.code;
      sheet.getCell(i + 2, col + 1).value = code.help;
      sheet.getCell(i + 2, col + 1).alignment = { wrapText: true, vertical: 'top' };
    });
    const l = letter(col - 1);
    ranges.set(table.column, `'${SHEET_NAMES.codes}'!$${l}$2:$${l}$${Math.max(2, table.codes.length + 1)}`);
  });
  return ranges;
}

function listValidation(range: string, what: string): ExcelJS.DataValidation {
  return {
    type: 'list',
    allowBlank: true,
    formulae: [range],
    showErrorMessage: true,
    errorStyle: 'warning',
    errorTitle: `Not a ${what} code`,
    error: `Pick a ${what} from the list (see the ${SHEET_NAMES.codes} sheet). Sagline reports anything else when the file is uploaded.`,
  };
}

function addValidations(sheet: ExcelJS.Worksheet, layout: LaidOutColumn[], ranges: Map<string, string>, rows: number): void {
  layout.forEach((c, i) => {
    const range = ranges.get(c.def.name);
    if (!range) return;
    const l = letter(i);
    const validation = listValidation(range, c.def.name.toLowerCase());
    for (let r = 2; r <= rows + 1; r++) sheet.getCell(`${l}${r}`).dataValidation = validation;
  });
}

function writeHelp(workbook: ExcelJS.Workbook, opts: ScheduleWorkbookOptions): void {
  const sheet = workbook.addWorksheet(SHEET_NAMES.help);
  sheet.getColumn(1).width = 12;
  sheet.getColumn(2).width = 34;
  sheet.getColumn(3).width = 10;
  sheet.getColumn(4).width = 40;
  sheet.getColumn(5).width = 36;
  sheet.getColumn(6).width = 80;
  let r = 1;
  const line = (text: string, bold = false): void => {
    const cell = sheet.getCell(r, 1);
    cell.value = text;
    if (bold) cell.font = { bold: true, size: r === 1 ? 14 : 11 };
    r++;
  };
  line(opts.title ?? TEMPLATE_HELP[0], true);
  if (opts.title) line(TEMPLATE_HELP[0], true);
  line(unitSystemNote(opts.unitSystem));
  for (const text of TEMPLATE_HELP.slice(1)) line(text, false);
  r++;
  line('Columns', true);
  const head = sheet.getRow(r);
  ['Sheet', 'Header', 'Required', 'Accepted', 'Also accepted as header', 'What to enter'].forEach((h, i) => {
    head.getCell(i + 1).value = h;
    head.getCell(i + 1).font = { bold: true };
    head.getCell(i + 1).fill = HEADER_FILL;
  });
  r++;
  for (const row of columnHelpRows(opts.unitSystem, opts.categories)) {
    const cells = [row.sheet, row.header, row.required ? 'yes' : 'no', row.accepted, row.aliases, row.help];
    cells.forEach((v, i) => {
      const cell = sheet.getCell(r, i + 1);
      cell.value = v;
      cell.alignment = { wrapText: true, vertical: 'top' };
    });
    r++;
  }
  r++;
  line(`The ${SHEET_NAMES.codes} sheet lists every code with its meaning.`);
}

function cellValue(v: CellInput): ExcelJS.CellValue {
  return v === undefined ? null : v;
}

/**
 * Adds the Members, Loads, "How to fill in" and Codes sheets to `workbook`,
 * with optional data rows. Coded columns (Category, Material, Supports, Case,
 * Kind) get drop-down lists that point at the Codes sheet.
 */
export function writeScheduleWorkbook(
  workbook: ExcelJS.Workbook,
  opts: ScheduleWorkbookOptions & { members?: readonly MemberRowInput[]; loads?: readonly LoadRowInput[] },
): void {
  // Fixed dates so that regenerating a sample gives the same file.
  workbook.creator = 'Sagline';
  workbook.lastModifiedBy = 'Sagline';
  workbook.created = new Date(Date.UTC(2025, 0, 6, 9, 0, 0));
  workbook.modified = workbook.created;

  const members = workbook.addWorksheet(SHEET_NAMES.members);
  const loads = workbook.addWorksheet(SHEET_NAMES.loads);
  writeHelp(workbook, opts);
  const ranges = writeCodes(workbook, opts);

  const mLayout = memberLayout(opts.unitSystem, opts.loadCases);
  writeHeader(members, mLayout);
  for (const row of opts.members ?? []) {
    members.addRow(mLayout.map((c) => cellValue(c.loadCase ? row.loads?.[c.loadCase] : row.values[c.def.key])));
  }
  const lLayout = loadLayout(opts.unitSystem);
  writeHeader(loads, lLayout);
  for (const row of opts.loads ?? []) loads.addRow(lLayout.map((c) => cellValue(row[c.def.key])));

  const rows = opts.validationRows ?? Math.max(1000, (opts.members?.length ?? 0) + 200);
  addValidations(members, mLayout, ranges, rows);
  addValidations(loads, lLayout, ranges, Math.max(rows, (opts.loads?.length ?? 0) + 200));
}

/** The blank template: headers, drop-downs, help and codes, no rows. */
export function writeTemplate(workbook: ExcelJS.Workbook, opts: ScheduleWorkbookOptions): void {
  writeScheduleWorkbook(workbook, { ...opts, members: [], loads: [] });
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

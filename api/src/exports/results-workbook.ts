import ExcelJS from 'exceljs';
import { describeSource, VERDICT_CAUTION, type LimitRule } from '@sagline/common/limits';
import { defaultUnit, fromSI, type Quantity } from '@sagline/common/units';
import type { ExportMember, ExportResult, ExportRevision } from './exports.repository';

/**
 * The results workbook of one revision:
 * - Results: one row per member with its governing check (the largest
 *   utilisation): deflection, span ratio, limit, utilisation, verdict and the
 *   moment of inertia that would pass, in the project's unit system;
 * - All checks: every member × check × segment;
 * - About: the revision, the caution every verdict carries, and the source
 *   of each limit used.
 * Header rows frozen, auto-filters, failing verdicts and utilisations over 1
 * highlighted (conditional formatting, so a sort or edit keeps it right).
 */

const BOLD: Partial<ExcelJS.Font> = { bold: true };
const HEADER_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE8ECEF' } };
const FAIL_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', bgColor: { argb: 'FFF8D7DA' }, fgColor: { argb: 'FFF8D7DA' } };
const PASS_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', bgColor: { argb: 'FFDFF0D8' }, fgColor: { argb: 'FFDFF0D8' } };

interface Column {
  header: string;
  width: number;
  numFmt?: string;
}

function headerRow(sheet: ExcelJS.Worksheet, columns: Column[]): void {
  sheet.columns = columns.map((c) => ({ header: c.header, width: c.width, style: c.numFmt ? { numFmt: c.numFmt } : {} }));
  const row = sheet.getRow(1);
  row.font = BOLD;
  row.eachCell((cell) => (cell.fill = HEADER_FILL));
  sheet.views = [{ state: 'frozen', xSplit: 1, ySplit: 1 }];
  sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: columns.length } };
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

function highlight(sheet: ExcelJS.Worksheet, verdictCol: number, utilCol: number, rows: number): void {
  if (rows === 0) return;
  const v = letter(verdictCol);
  const u = letter(utilCol);
  sheet.addConditionalFormatting({
    ref: `${v}2:${v}${rows + 1}`,
    rules: [
      { type: 'containsText', operator: 'containsText', text: 'FAIL', priority: 1, style: { fill: FAIL_FILL, font: { bold: true, color: { argb: 'FF9C0006' } } } },
      { type: 'containsText', operator: 'containsText', text: 'PASS', priority: 2, style: { fill: PASS_FILL } },
    ],
  });
  sheet.addConditionalFormatting({
    ref: `${u}2:${u}${rows + 1}`,
    rules: [{ type: 'cellIs', operator: 'greaterThan', formulae: ['1'], priority: 3, style: { fill: FAIL_FILL } }],
  });
}

function limitText(r: ExportResult, deflectionUnit: string): string {
  const parts = [`L/${r.limit_ratio}`];
  if (r.plus) parts[0] += ` + ${round(fromSI(r.plus, deflectionUnit), 3)} ${deflectionUnit}`;
  if (r.max_abs !== null) parts.push(`max ${round(fromSI(r.max_abs, deflectionUnit), 3)} ${deflectionUnit}`);
  return parts.join(', ');
}

function round(v: number, digits: number): number {
  const f = 10 ** digits;
  return Math.round(v * f) / f;
}

function segmentName(r: ExportResult, spansBefore: number): string {
  return r.segment_kind === 'overhang' ? 'overhang' : `span ${spansBefore + 1}`;
}

/** The results workbook as xlsx bytes. */
export async function resultsWorkbook(rev: ExportRevision, members: readonly ExportMember[], results: readonly ExportResult[]): Promise<Buffer> {
  const system = rev.unit_system;
  const unit = (q: Quantity) => defaultUnit(q, system);
  const dU = unit('deflection');
  const lU = unit('span');
  const iU = unit('inertia');
  const rules = new Map<string, LimitRule>(rev.limit_set.rules.map((r) => [r.id, r]));
  const byMember = new Map<number, ExportResult[]>();
  for (const r of results) {
    const list = byMember.get(r.member_id);
    if (list) list.push(r);
    else byMember.set(r.member_id, [r]);
  }

  const wb = new ExcelJS.Workbook();
  wb.creator = 'Sagline';
  wb.title = `${rev.project_name}: results of revision ${rev.number}`;

  // ---------------------------------------------------------------- Results
  const sheet = wb.addWorksheet('Results');
  const cols: Column[] = [
    { header: 'Mark', width: 14 }, { header: 'Level', width: 8 }, { header: 'Grid', width: 10 }, { header: 'Category', width: 24 },
    { header: 'Material', width: 16 }, { header: 'Section', width: 14 }, { header: 'Governing check', width: 20 }, { header: 'Combination', width: 12 },
    { header: 'Segment', width: 10 }, { header: `Deflection [${dU}]`, width: 15, numFmt: '0.0##' }, { header: 'Direction', width: 9 },
    { header: 'Span ratio (L/…)', width: 15, numFmt: '0' }, { header: 'Limit', width: 18 }, { header: `Allowed [${dU}]`, width: 13, numFmt: '0.0##' },
    { header: 'Utilisation', width: 11, numFmt: '0.00' }, { header: 'Verdict', width: 9 }, { header: `I [${iU}]`, width: 14, numFmt: '0.###' },
    { header: `I required [${iU}]`, width: 18, numFmt: '0.###' }, { header: 'Reviewer', width: 30 }, { header: 'Limit source', width: 60 },
  ];
  headerRow(sheet, cols);
  for (const m of members) {
    const list = byMember.get(m.id) ?? [];
    const gov = list.reduce<ExportResult | null>((best, r) => (!best || r.utilization > best.utilization ? r : best), null);
    const rule = gov ? rules.get(gov.rule_id) : undefined;
    const spansBefore = gov ? list.filter((r) => r.check_name === gov.check_name && r.segment_index < gov.segment_index && r.segment_kind === 'span').length : 0;
    sheet.addRow([
      m.mark, m.level_name, m.grid, m.category, m.material, m.section,
      gov ? gov.check_name : 'no check applies', gov?.combination ?? null, gov ? segmentName(gov, spansBefore) : null,
      gov ? round(fromSI(Math.abs(gov.deflection), dU), 4) : null, gov ? (gov.deflection < 0 ? 'down' : gov.deflection > 0 ? 'up' : '') : null,
      gov?.span_ratio != null ? Math.round(gov.span_ratio) : null, gov ? limitText(gov, dU) : null, gov ? round(fromSI(gov.allowed, dU), 4) : null,
      m.max_utilization !== null ? round(m.max_utilization, 4) : null, m.verdict ? m.verdict.toUpperCase() : 'NO CHECK',
      round(fromSI(m.i, iU), 4), m.required_i !== null ? round(fromSI(m.required_i, iU), 4) : null, m.reviewer_email,
      rule ? describeSource(rule.source) : null,
    ]);
  }
  highlight(sheet, 15, 14, members.length);

  // ---------------------------------------------------------------- All checks
  const all = wb.addWorksheet('All checks');
  const allCols: Column[] = [
    { header: 'Mark', width: 14 }, { header: 'Level', width: 8 }, { header: 'Check', width: 20 }, { header: 'Combination', width: 12 },
    { header: 'Segment', width: 10 }, { header: `From [${lU}]`, width: 10, numFmt: '0.00#' }, { header: `To [${lU}]`, width: 10, numFmt: '0.00#' },
    { header: `x [${lU}]`, width: 10, numFmt: '0.00#' }, { header: `Deflection [${dU}]`, width: 15, numFmt: '0.0##' },
    { header: `Effective length [${lU}]`, width: 20, numFmt: '0.00#' }, { header: 'Span ratio (L/…)', width: 15, numFmt: '0' }, { header: 'Limit', width: 18 },
    { header: `Allowed [${dU}]`, width: 13, numFmt: '0.0##' }, { header: 'Utilisation', width: 11, numFmt: '0.00' }, { header: 'Verdict', width: 9 },
    { header: `I required [${iU}]`, width: 18, numFmt: '0.###' }, { header: 'Limit source', width: 60 },
  ];
  headerRow(all, allCols);
  let n = 0;
  for (const m of members) {
    const list = byMember.get(m.id) ?? [];
    for (const r of list) {
      const spansBefore = list.filter((o) => o.check_name === r.check_name && o.segment_index < r.segment_index && o.segment_kind === 'span').length;
      const rule = rules.get(r.rule_id);
      all.addRow([
        m.mark, m.level_name, r.check_name, r.combination, segmentName(r, spansBefore), round(fromSI(r.segment_from, lU), 4), round(fromSI(r.segment_to, lU), 4),
        round(fromSI(r.x, lU), 4), round(fromSI(r.deflection, dU), 4), round(fromSI(r.effective_length, lU), 4),
        r.span_ratio !== null ? Math.round(r.span_ratio) : null, limitText(r, dU), round(fromSI(r.allowed, dU), 4), round(r.utilization, 4),
        r.pass ? 'PASS' : 'FAIL', round(fromSI(r.required_i, iU), 4), rule ? describeSource(rule.source) : null,
      ]);
      n++;
    }
  }
  highlight(all, 14, 13, n);

  // ---------------------------------------------------------------- About
  const about = wb.addWorksheet('About');
  about.getColumn(1).width = 26;
  about.getColumn(2).width = 22;
  about.getColumn(3).width = 14;
  about.getColumn(4).width = 12;
  about.getColumn(5).width = 90;
  const line = (a: string, b?: string | number) => {
    const row = about.addRow(b === undefined ? [a] : [a, b]);
    row.getCell(1).font = BOLD;
    return row;
  };
  about.addRow([`${rev.project_name} (${rev.project_number}): deflection check results, revision ${rev.number}${rev.label ? ` "${rev.label}"` : ''}`]).font = { bold: true, size: 14 };
  about.addRow([]);
  const caution = about.addRow([`Caution: ${VERDICT_CAUTION}`]);
  caution.font = { bold: true, color: { argb: 'FF9C0006' } };
  about.mergeCells(caution.number, 1, caution.number, 5);
  caution.getCell(1).alignment = { wrapText: true, vertical: 'top' };
  caution.height = 48;
  about.addRow([]);
  line('Schedule file', rev.file_name);
  line('Committed', `${rev.created_at.toISOString().slice(0, 16).replace('T', ' ')} UTC${rev.uploader_name ? ` (uploaded by ${rev.uploader_name})` : ''}`);
  line('Members', `${rev.member_count} (${rev.pass_count} pass, ${rev.fail_count} fail)`);
  line('Limit set', rev.limit_set.name);
  line('Units', `lengths in ${lU}, deflections in ${dU}, I in ${iU}; deflection sign: down is a sag`);
  about.addRow([]);
  const used = new Set(results.map((r) => r.rule_id));
  const head = about.addRow(['Check', 'Category', 'Combination', 'Limit', 'Source']);
  head.font = BOLD;
  head.eachCell((c) => (c.fill = HEADER_FILL));
  for (const rule of rev.limit_set.rules) {
    if (!used.has(rule.id)) continue;
    const limit = `L/${rule.ratio}${rule.plus ? ` + ${round(fromSI(rule.plus, dU), 3)} ${dU}` : ''}${rule.maxAbs !== null ? `, max ${round(fromSI(rule.maxAbs, dU), 3)} ${dU}` : ''}`;
    const combination = Object.entries(rule.combination).map(([c, f]) => `${f === 1 ? '' : f}${c}`).join(' + ');
    const row = about.addRow([rule.check, rule.category + (rule.materials ? ` (${rule.materials.join(', ')})` : ''), combination, limit, `${describeSource(rule.source)}${rule.source.note ? `. ${rule.source.note}` : ''}`]);
    row.getCell(5).alignment = { wrapText: true, vertical: 'top' };
  }
  return Buffer.from(await wb.xlsx.writeBuffer());
}

import ExcelJS from 'exceljs';
import { describeSource, VERDICT_CAUTION, type LimitRule } from '@sagline/common/limits';
import type { FlagStatus } from '@sagline/common/api-types';
import type { FlagExportRow, FlagsExportProject } from './exports.repository';

/**
 * The flags workbook of a project (for the manager chasing closure):
 * - Flags: one row per flag, overdue first: mark, level, check, status,
 *   overdue and by how many days, due date, assignee, raiser, when raised,
 *   changed and closed, the member's verdict and utilisation in the latest
 *   revision, the last comment, the link to the flag, the limit's source;
 * - About: the project, when the workbook was made, counts by status, the
 *   caution every verdict carries, and the source of each check named.
 * Header frozen, auto-filter, statuses and overdue flags coloured by
 * conditional formatting (so a sort or a filter keeps them right). Dates
 * are UTC; utilisation is deflection over allowed deflection (1 = at the limit).
 */

const BOLD: Partial<ExcelJS.Font> = { bold: true };
const HEADER_FILL: ExcelJS.Fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: 'FFE8ECEF' } };
const fill = (argb: string): ExcelJS.Fill => ({ type: 'pattern', pattern: 'solid', bgColor: { argb }, fgColor: { argb } });
const STATUS_STYLE: Record<FlagStatus, { fill: ExcelJS.Fill; font?: Partial<ExcelJS.Font> }> = {
  open: { fill: fill('FFFFF1D6'), font: { color: { argb: 'FF8A5300' } } },
  answered: { fill: fill('FFDCEBFA'), font: { color: { argb: 'FF1F4E79' } } },
  closed: { fill: fill('FFDFF0D8'), font: { color: { argb: 'FF2E6B30' } } },
  waived: { fill: fill('FFEDEDED'), font: { color: { argb: 'FF555555' } } },
};
const OVERDUE_STYLE = { fill: fill('FFF8D7DA'), font: { bold: true, color: { argb: 'FF9C0006' } } };

interface Column {
  key: string;
  header: string;
  width: number;
  numFmt?: string;
}

export const FLAG_COLUMNS: Column[] = [
  { key: 'id', header: 'Flag', width: 7 },
  { key: 'mark', header: 'Mark', width: 12 },
  { key: 'level', header: 'Level', width: 8 },
  { key: 'check', header: 'Check', width: 18 },
  { key: 'title', header: 'Title', width: 40 },
  { key: 'status', header: 'Status', width: 11 },
  { key: 'overdue', header: 'Overdue', width: 9 },
  { key: 'daysOverdue', header: 'Days overdue [d]', width: 10, numFmt: '0' },
  { key: 'due', header: 'Due (date)', width: 12, numFmt: 'yyyy-mm-dd' },
  { key: 'assignee', header: 'Assignee', width: 20 },
  { key: 'raiser', header: 'Raised by', width: 20 },
  { key: 'created', header: 'Raised (UTC)', width: 17, numFmt: 'yyyy-mm-dd hh:mm' },
  { key: 'updated', header: 'Last change (UTC)', width: 17, numFmt: 'yyyy-mm-dd hh:mm' },
  { key: 'closed', header: 'Closed (UTC)', width: 17, numFmt: 'yyyy-mm-dd hh:mm' },
  { key: 'revision', header: 'Raised in revision', width: 10, numFmt: '0' },
  { key: 'verdict', header: 'Verdict (latest revision)', width: 14 },
  { key: 'utilisation', header: 'Utilisation [Δ/allowed]', width: 12, numFmt: '0.00' },
  { key: 'lastComment', header: 'Last comment', width: 50 },
  { key: 'lastCommentBy', header: 'Last comment by', width: 20 },
  { key: 'lastCommentAt', header: 'Last comment (UTC)', width: 17, numFmt: 'yyyy-mm-dd hh:mm' },
  { key: 'waiveReason', header: 'Waive reason', width: 36 },
  { key: 'link', header: 'Link', width: 44 },
  { key: 'source', header: 'Limit source', width: 50 },
];

function letter(index: number): string {
  let n = index + 1;
  let s = '';
  while (n > 0) {
    s = String.fromCharCode(65 + ((n - 1) % 26)) + s;
    n = Math.floor((n - 1) / 26);
  }
  return s;
}

const col = (key: string) => letter(FLAG_COLUMNS.findIndex((c) => c.key === key));

/** A calendar date as a date cell (midnight UTC, which Excel shows as that day). */
function day(d: string | null): Date | null {
  return d ? new Date(`${d}T00:00:00Z`) : null;
}

/** The rule a flag's check came from: same check and category, the member's material variant before the general one. */
function ruleFor(rules: LimitRule[], check: string | null, category: string | null, material: string | null): LimitRule | undefined {
  if (!check) return undefined;
  const same = rules.filter((r) => r.check === check && (category === null || r.category === category));
  return same.find((r) => material !== null && r.materials?.includes(material as never)) ?? same.find((r) => r.materials === null) ?? same[0];
}

export interface FlagsWorkbookInput {
  project: FlagsExportProject;
  flags: readonly FlagExportRow[];
  publicUrl: string;
  projectId: number;
  madeAt: Date;
}

export async function flagsWorkbook({ project, flags, publicUrl, projectId, madeAt }: FlagsWorkbookInput): Promise<Buffer> {
  const rules = project.limit_set?.rules ?? [];
  const wb = new ExcelJS.Workbook();
  wb.creator = 'Sagline';
  wb.title = `${project.project_name}: flags`;

  // ---------------------------------------------------------------- Flags
  const sheet = wb.addWorksheet('Flags');
  sheet.columns = FLAG_COLUMNS.map((c) => ({ header: c.header, key: c.key, width: c.width, style: c.numFmt ? { numFmt: c.numFmt } : {} }));
  const head = sheet.getRow(1);
  head.font = BOLD;
  head.alignment = { wrapText: true, vertical: 'top' };
  head.eachCell((cell) => (cell.fill = HEADER_FILL));
  sheet.views = [{ state: 'frozen', xSplit: 2, ySplit: 1 }];
  sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: FLAG_COLUMNS.length } };

  const used = new Map<string, LimitRule>();
  for (const f of flags) {
    const check = f.check_name ?? f.governing_check;
    const rule = ruleFor(rules, check, f.category, f.material);
    if (rule) used.set(rule.id, rule);
    const link = `${publicUrl}/projects/${projectId}/flags/${f.id}`;
    const row = sheet.addRow({
      id: f.id,
      mark: f.mark,
      level: f.level_name ?? 'not in the latest revision',
      check: f.check_name ?? (f.governing_check ? `whole member (governing: ${f.governing_check})` : 'whole member'),
      title: f.title,
      status: f.status,
      overdue: f.overdue ? 'OVERDUE' : null,
      daysOverdue: f.days_overdue,
      due: day(f.due_date),
      assignee: f.assignee_name ?? 'unassigned',
      raiser: f.raiser_name,
      created: f.created_at,
      updated: f.updated_at,
      closed: f.closed_at,
      revision: f.raised_in_revision,
      verdict: f.verdict ? f.verdict.toUpperCase() : f.level_name ? 'NO CHECK' : null,
      utilisation: f.max_utilization !== null ? Math.round(f.max_utilization * 10_000) / 10_000 : null,
      lastComment: f.last_comment,
      lastCommentBy: f.last_comment_by,
      lastCommentAt: f.last_comment_at,
      waiveReason: f.waive_reason,
      link: { text: link, hyperlink: link },
      source: rule ? describeSource(rule.source) : null,
    });
    row.getCell('lastComment').alignment = { wrapText: true, vertical: 'top' };
  }

  const last = flags.length + 1;
  if (flags.length) {
    const s = col('status');
    sheet.addConditionalFormatting({
      ref: `${s}2:${s}${last}`,
      rules: (Object.keys(STATUS_STYLE) as FlagStatus[]).map((status, i) => ({
        type: 'containsText' as const,
        operator: 'containsText' as const,
        text: status,
        priority: i + 1,
        style: STATUS_STYLE[status],
      })),
    });
    // The whole row's mark and overdue cells turn red when the flag is overdue.
    const o = col('overdue');
    sheet.addConditionalFormatting({
      ref: `${o}2:${o}${last}`,
      rules: [{ type: 'containsText', operator: 'containsText', text: 'OVERDUE', priority: 5, style: OVERDUE_STYLE }],
    });
    const m = col('mark');
    sheet.addConditionalFormatting({
      ref: `${m}2:${m}${last}`,
      rules: [{ type: 'expression', formulae: [`$${o}2="OVERDUE"`], priority: 6, style: OVERDUE_STYLE }],
    });
    const u = col('utilisation');
    sheet.addConditionalFormatting({
      ref: `${u}2:${u}${last}`,
      rules: [{ type: 'cellIs', operator: 'greaterThan', formulae: ['1'], priority: 7, style: { fill: fill('FFF8D7DA') } }],
    });
  }

  // ---------------------------------------------------------------- About
  const about = wb.addWorksheet('About');
  about.getColumn(1).width = 26;
  about.getColumn(2).width = 22;
  about.getColumn(3).width = 70;
  const line = (a: string, b: string | number) => {
    const row = about.addRow([a, b]);
    row.getCell(1).font = BOLD;
    return row;
  };
  about.addRow([`${project.project_name}${project.project_number ? ` (${project.project_number})` : ''}: flags`]).font = { bold: true, size: 14 };
  about.addRow([]);
  const caution = about.addRow([`Caution: ${VERDICT_CAUTION}`]);
  caution.font = { bold: true, color: { argb: 'FF9C0006' } };
  about.mergeCells(caution.number, 1, caution.number, 3);
  caution.getCell(1).alignment = { wrapText: true, vertical: 'top' };
  caution.height = 48;
  about.addRow([]);
  line('Made', `${madeAt.toISOString().slice(0, 16).replace('T', ' ')} UTC`);
  line('Member facts from', project.revision_number !== null ? `revision ${project.revision_number} (the latest)` : 'no revision yet');
  const count = (s: FlagStatus) => flags.filter((f) => f.status === s).length;
  line('Flags', `${flags.length}: ${count('open')} open, ${count('answered')} answered, ${count('closed')} closed, ${count('waived')} waived`);
  line('Overdue', `${flags.filter((f) => f.overdue).length} (open or answered, due before today, UTC)`);
  line('Units', 'dates and times in UTC; utilisation = deflection / allowed deflection (over 1 fails)');
  about.addRow([]);
  const sources = about.addRow(['Check', 'Category', 'Source']);
  sources.font = BOLD;
  sources.eachCell((c) => (c.fill = HEADER_FILL));
  for (const rule of used.values()) {
    const row = about.addRow([rule.check, rule.category + (rule.materials ? ` (${rule.materials.join(', ')})` : ''), `${describeSource(rule.source)}${rule.source.note ? `. ${rule.source.note}` : ''}`]);
    row.getCell(3).alignment = { wrapText: true, vertical: 'top' };
  }
  if (used.size === 0) about.addRow(['No flag names a check of the latest revision\'s limit set.']);

  return Buffer.from(await wb.xlsx.writeBuffer());
}

import ExcelJS from 'exceljs';
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
  columnLetter,
  unitSystemNote,
  type ColumnDef,
} from '@sagline/common/schedule';
import type { UnitSystemId } from '@sagline/common/units';

/**
 * The member schedule workbook the Imports screen offers for download: a
 * Members and a Loads sheet with the headers of common/src/schedule (units in
 * the project's unit system), drop-down lists on the coded columns pointing
 * at a Codes sheet, and a "How to fill in" sheet. Headers, codes and help
 * come from the column definitions the parser reads, so the template always
 * matches what an upload accepts. samples/scripts writes the sample files
 * with the same functions.
 */

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
  /** The project limit set's categories, offered in the Category drop-down. */
  categories: readonly string[];
  categoryLabels?: Readonly<Record<string, string>>;
  /** Load cases that get a Members column (default D, L, Lr, S, R, W). */
  loadCases?: readonly string[];
  /** Shown at the top of the "How to fill in" sheet. */
  title?: string;
  members?: readonly MemberRowInput[];
  loads?: readonly LoadRowInput[];
  /** Rows below the header that get drop-down lists (default 1000, or the data rows + 200). */
  validationRows?: number;
}

/** A column in sheet order: a definition, and the case of a load column. */
export interface LaidOutColumn {
  def: ColumnDef;
  header: string;
  loadCase?: string;
}

/** Members columns in template order: the fixed columns to Camber, one per load case, then Reviewer and Notes. */
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

/** Codes sheet: one table per coded column; returns each list's range for the drop-downs. */
function writeCodes(workbook: ExcelJS.Workbook, opts: ScheduleWorkbookOptions): Map<string, string> {
  const sheet = workbook.addWorksheet(SHEET_NAMES.codes);
  const ranges = new Map<string, string>();
  codeTables(opts.categories, opts.categoryLabels).forEach((table, t) => {
    const col = t * 3 + 1;
    sheet.getColumn(col).width = 26;
    sheet.getColumn(col + 1).width = 48;
    sheet.getCell(1, col).value = table.title;
    sheet.getCell(1, col).font = { bold: true };
    sheet.getCell(1, col + 1).value = 'Meaning';
    sheet.getCell(1, col + 1).font = { bold: true };
    table.codes.forEach((code, i) => {
      sheet.getCell(i + 2, col).value = code.code;
      sheet.getCell(i + 2, col + 1).value = code.help;
      sheet.getCell(i + 2, col + 1).alignment = { wrapText: true, vertical: 'top' };
    });
    const l = columnLetter(col - 1);
    ranges.set(table.column, `'${SHEET_NAMES.codes}'!$${l}$2:$${l}$${Math.max(2, table.codes.length + 1)}`);
  });
  return ranges;
}

function addValidations(sheet: ExcelJS.Worksheet, layout: LaidOutColumn[], ranges: Map<string, string>, rows: number): void {
  layout.forEach((c, i) => {
    const range = ranges.get(c.def.name);
    if (!range) return;
    const what = c.def.name.toLowerCase();
    const validation: ExcelJS.DataValidation = {
      type: 'list',
      allowBlank: true,
      formulae: [range],
      showErrorMessage: true,
      errorStyle: 'warning',
      errorTitle: `Not a ${what} code`,
      error: `Pick a ${what} from the list (see the ${SHEET_NAMES.codes} sheet). Sagline reports anything else when the file is uploaded.`,
    };
    const l = columnLetter(i);
    for (let r = 2; r <= rows + 1; r++) sheet.getCell(`${l}${r}`).dataValidation = validation;
  });
}

function writeHelp(workbook: ExcelJS.Workbook, opts: ScheduleWorkbookOptions): void {
  const sheet = workbook.addWorksheet(SHEET_NAMES.help);
  [12, 34, 10, 40, 36, 80].forEach((w, i) => (sheet.getColumn(i + 1).width = w));
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
  for (const text of TEMPLATE_HELP.slice(1)) line(text);
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
    [row.sheet, row.header, row.required ? 'yes' : 'no', row.accepted, row.aliases, row.help].forEach((v, i) => {
      const cell = sheet.getCell(r, i + 1);
      cell.value = v;
      cell.alignment = { wrapText: true, vertical: 'top' };
    });
    r++;
  }
  r++;
  line(`The ${SHEET_NAMES.codes} sheet lists every code with its meaning.`);
}

const cellValue = (v: CellInput): ExcelJS.CellValue => (v === undefined ? null : v);

/**
 * Adds the Members, Loads, "How to fill in" and Codes sheets to `workbook`,
 * with optional data rows. Coded columns (Category, Material, Supports, Case,
 * Kind) get drop-down lists that point at the Codes sheet.
 */
export function writeScheduleWorkbook(workbook: ExcelJS.Workbook, opts: ScheduleWorkbookOptions): void {
  workbook.creator = 'Sagline';
  const members = workbook.addWorksheet(SHEET_NAMES.members);
  const loads = workbook.addWorksheet(SHEET_NAMES.loads);
  writeHelp(workbook, opts);
  const ranges = writeCodes(workbook, opts);

  const mLayout = memberLayout(opts.unitSystem, opts.loadCases);
  writeHeader(members, mLayout);
  for (const row of opts.members ?? []) members.addRow(mLayout.map((c) => cellValue(c.loadCase ? row.loads?.[c.loadCase] : row.values[c.def.key])));
  const lLayout = loadLayout(opts.unitSystem);
  writeHeader(loads, lLayout);
  for (const row of opts.loads ?? []) loads.addRow(lLayout.map((c) => cellValue(row[c.def.key])));

  const rows = opts.validationRows ?? Math.max(1000, (opts.members?.length ?? 0) + 200);
  addValidations(members, mLayout, ranges, rows);
  addValidations(loads, lLayout, ranges, Math.max(rows, (opts.loads?.length ?? 0) + 200));
}

/** A schedule workbook (template or filled) as xlsx bytes. */
export async function scheduleWorkbook(opts: ScheduleWorkbookOptions): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  writeScheduleWorkbook(workbook, opts);
  return Buffer.from(await workbook.xlsx.writeBuffer());
}

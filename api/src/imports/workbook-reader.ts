import ExcelJS from 'exceljs';
import type { ImportProblem } from '@sagline/common/api-types';
import { findSheet, resolveCell, type CellValue, type SheetData } from '@sagline/common/schedule';
import { ApiError } from '../common/api-error';
import { openXlsxSheets, type MergeRange, type XlsxSheets } from './sheet-xml';

/** The sheets a schedule parse needs, and what stopped the file from being read as a schedule. */
export interface ReadSchedule {
  members: SheetData | null;
  loads: SheetData | null;
  problems: ImportProblem[];
}


/**
 * Opens an xlsx (already checked by the zip guard) and hands over the
 * Members and Loads sheets as plain cell values (formula cells keep
 * `{ formula, result }`: nothing is calculated, so `result` is what the
 * writing program cached, and the schedule parser says so when there is none).
 * The fast reader of sheet-xml.ts reads only those two sheets, with the
 * values exceljs would give; a file it does not recognise is read by
 * exceljs's `Workbook.xlsx.load`, which also says why a broken one cannot be.
 * Merged cells on those sheets are fatal: a merged block shows one value in
 * several rows or columns, and which member it belongs to is a guess.
 */
export async function readWorkbook(bytes: Buffer, fileName: string): Promise<ReadSchedule> {
  let fast: XlsxSheets | null = null;
  try {
    fast = openXlsxSheets(bytes);
  } catch {
    fast = null; // exceljs reads it, or says why it cannot
  }
  if (fast) return fromSheets(fast.names, fileName, (name) => {
    const { merges, ...data } = fast.sheet(name);
    return { data: trimmed(data), merges };
  });
  return readWithExceljs(bytes, fileName);
}

/** The sheets chosen and checked, whichever reader opened the file. */
function fromSheets(names: string[], fileName: string, open: (name: string) => { data: SheetData; merges: MergeRange[] }): ReadSchedule {
  const problems: ImportProblem[] = [];
  if (names.length === 0) {
    problems.push(sheetProblem('NO_SHEETS', '(workbook)', `"${fileName}" has no sheets. Put the members on a sheet named "Members" (the template download has one).`));
    return { members: null, loads: null, problems };
  }
  const membersName = findSheet(names, 'members');
  if (membersName === undefined) {
    problems.push(
      sheetProblem(
        'NO_MEMBERS_SHEET',
        '(workbook)',
        `No sheet of "${fileName}" is the member list: its sheets are ${names.map((n) => `"${n}"`).join(', ')}. Name the sheet with one row per member "Members" (or upload a workbook with that sheet only).`,
      ),
    );
    return { members: null, loads: null, problems };
  }
  const loadsName = findSheet(names, 'loads');
  const members = open(membersName);
  const loads = loadsName ? open(loadsName) : null;
  for (const sheet of loads ? [members, loads] : [members]) problems.push(...mergeProblems(sheet.data.name, sheet.merges));
  return { members: members.data, loads: loads ? loads.data : null, problems };
}

/** The general reader, for files the fast one does not recognise. */
async function readWithExceljs(bytes: Buffer, fileName: string): Promise<ReadSchedule> {
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(bytes as unknown as ArrayBuffer);
  } catch (e) {
    throw new ApiError(
      'IMPORT_FILE_INVALID',
      `"${fileName}" could not be read as an Excel workbook (${e instanceof Error ? e.message.slice(0, 200) : 'unreadable content'}). Open it in your spreadsheet program, save it as .xlsx and upload it again.`,
    );
  }
  return fromSheets(
    workbook.worksheets.map((w) => w.name),
    fileName,
    (name) => {
      const sheet = workbook.getWorksheet(name)!;
      // exceljs keeps merges by their top-left address; `model.merges` would rebuild the whole sheet model.
      const merges = Object.values((sheet as unknown as { _merges: Record<string, MergeRange> })._merges ?? {});
      return { data: sheetData(sheet), merges };
    },
  );
}

function sheetProblem(code: string, sheet: string, message: string): ImportProblem {
  return { severity: 'error', code, sheet, row: 1, column: null, value: null, message };
}

function mergeProblems(sheetName: string, merges: MergeRange[]): ImportProblem[] {
  return [...merges]
    .sort((a, b) => a.top - b.top || a.left - b.left)
    .map((m) => ({
      severity: 'error' as const,
      code: 'MERGED_CELLS',
      sheet: sheetName,
      row: m.top,
      column: m.range.split(':')[0].replace(/\d+$/, ''),
      value: m.range,
      message: `Cells ${m.range} of the ${sheetName} sheet are merged. Unmerge them and fill in every cell (each member on its own row, each value in its own column), then upload again.`,
    }));
}

/** Rows 1.. of a sheet as arrays of cell values (row 0 = the header), without trailing empty rows. */
function sheetData(sheet: ExcelJS.Worksheet): SheetData {
  const values = sheet.getSheetValues() as unknown as (CellValue[] | undefined)[];
  const rows: CellValue[][] = [];
  // values[r] is row r (1-based) with cells at [1..]; absent rows are holes.
  for (let r = 1; r < values.length; r++) {
    const row = values[r];
    rows.push(row ? row.slice(1) : []);
  }
  return trimmed({ name: sheet.name, rows });
}

/** Without trailing empty rows. */
function trimmed(data: SheetData): SheetData {
  const { rows } = data;
  while (rows.length > 0 && rows[rows.length - 1].every((cell) => resolveCell(cell).kind === 'blank')) rows.pop();
  return data;
}

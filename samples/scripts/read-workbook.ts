/**
 * Turns an exceljs worksheet into the plain cell values common/src/schedule
 * parses (row 0 = header). Used by make-samples.ts to check every generated
 * file the way an upload would read it.
 */
import type ExcelJS from 'exceljs';
import type { CellValue, SheetData } from '../../common/src/schedule';

export function sheetData(sheet: ExcelJS.Worksheet): SheetData {
  const rows: CellValue[][] = [];
  const width = sheet.columnCount;
  for (let r = 1; r <= sheet.rowCount; r++) {
    const row = sheet.getRow(r);
    const cells: CellValue[] = [];
    for (let c = 1; c <= width; c++) cells.push(row.getCell(c).value as CellValue);
    rows.push(cells);
  }
  return { name: sheet.name, rows };
}

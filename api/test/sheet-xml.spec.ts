import ExcelJS from 'exceljs';
import { displayValue, resolveCell, type CellValue } from '@sagline/common/schedule';
import { openXlsxSheets } from '../src/imports/sheet-xml';
import { readWorkbook } from '../src/imports/workbook-reader';
import { zipOf } from './fixtures/bad-files';
import { floorBeams, xlsxOf } from './fixtures/schedule-files';

/**
 * The fast sheet reader gives every cell what exceljs's full load gives it,
 * as the schedule parser sees it (resolveCell and the value shown in a
 * problem report), for the sheet names, order and merged ranges too.
 */
async function viaExceljs(bytes: Buffer) {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  return wb;
}

const seen = (cell: CellValue) => [resolveCell(cell), displayValue(cell)];

async function expectSameAsExceljs(bytes: Buffer): Promise<void> {
  const fast = openXlsxSheets(bytes);
  expect(fast).not.toBeNull();
  const wb = await viaExceljs(bytes);
  expect(fast!.names).toEqual(wb.worksheets.map((w) => w.name));
  for (const ws of wb.worksheets) {
    const mine = fast!.sheet(ws.name);
    const theirs = ws.getSheetValues() as unknown as (CellValue[] | undefined)[];
    const height = Math.max(mine.rows.length, theirs.length - 1);
    for (let r = 0; r < height; r++) {
      const a = mine.rows[r] ?? [];
      const b = (theirs[r + 1] ?? []).slice(1);
      const width = Math.max(a.length, b.length);
      for (let c = 0; c < width; c++) expect({ at: `${ws.name}!${r + 1}:${c + 1}`, cell: seen(a[c]) }).toEqual({ at: `${ws.name}!${r + 1}:${c + 1}`, cell: seen(b[c]) });
    }
    const merges = Object.keys((ws as unknown as { _merges: Record<string, unknown> })._merges).length;
    expect(mine.merges).toHaveLength(merges);
  }
}

describe('fast sheet reader', () => {
  it('reads a generated schedule with loads exactly as exceljs does', async () => {
    const members = floorBeams(60, { levels: ['L1', 'L2'], failEvery: 7 });
    const loads = members.slice(0, 5).map((m) => ({ mark: m.mark, case: 'D', kind: 'point', position: 1, value: 3.5 }));
    await expectSameAsExceljs(await xlsxOf(members, { loads }));
  });

  it('reads formulas (own and shared, with and without cached values), dates, rich text, booleans, errors and odd text as exceljs does', async () => {
    const wb = new ExcelJS.Workbook();
    wb.addWorksheet('Notes').getCell('A1').value = 'first sheet, not the members';
    const ws = wb.addWorksheet('Members');
    ws.addRow(['Mark', 'Span', 'Double', 'When', 'Flag', 'Text']);
    ws.addRow(['B1', 6, { formula: 'B2*2', result: 12 }, new Date(Date.UTC(2026, 3, 1)), true, 'a & b < c "q" \'s\'']);
    ws.addRow(['B2', 7, { sharedFormula: 'C2', result: 14 } as ExcelJS.CellValue, new Date(Date.UTC(2026, 3, 2, 12)), false, '  padded\ttab\nline\r\nwindows\rmac  ']);
    ws.addRow(['B3', 8, { formula: 'B4*2' } as ExcelJS.CellValue, null, null, { richText: [{ text: 'rich ' }, { font: { bold: true }, text: 'text' }] }]);
    ws.addRow(['B4', { error: '#DIV/0!' } as ExcelJS.CellValue, { formula: 'A5&"x"', result: 'B4x' }, { formula: 'D2+1', result: new Date(Date.UTC(2026, 3, 2)) }, { formula: 'TRUE()', result: true }, '']);
    ws.addRow([]);
    ws.addRow(['B6', 1e-7, -0, 12345678901234.5, 'ünïcödé ✓', '&amp;']);
    ws.getCell('D2').numFmt = 'yyyy-mm-dd';
    ws.getCell('D3').numFmt = '[$-409]d mmm yyyy h:mm';
    ws.getCell('D5').numFmt = 'dd/mm/yyyy';
    ws.getCell('B7').numFmt = '0.00E+00';
    const loads = wb.addWorksheet('Loads');
    loads.addRow(['Mark', 'Case']);
    loads.addRow(['B1', 'D']);
    loads.mergeCells('A3:B4');
    await expectSameAsExceljs(Buffer.from(await wb.xlsx.writeBuffer()));
  });

  it('honours the 1904 date system', async () => {
    const wb = new ExcelJS.Workbook();
    wb.properties.date1904 = true;
    const ws = wb.addWorksheet('Members');
    ws.addRow(['Mark', 'Checked']);
    ws.addRow(['B1', new Date(Date.UTC(2026, 0, 15))]);
    ws.getCell('B2').numFmt = 'd-mmm-yy';
    await expectSameAsExceljs(Buffer.from(await wb.xlsx.writeBuffer()));
  });

  it('reads a hand-written workbook: parts under other names, rows and cells without references, inline strings', async () => {
    const xml = (s: string) => Buffer.from(`<?xml version="1.0" encoding="UTF-8" standalone="yes"?>\n${s}`);
    const ns = 'xmlns="http://schemas.openxmlformats.org/spreadsheetml/2006/main" xmlns:r="http://schemas.openxmlformats.org/officeDocument/2006/relationships"';
    const rel = 'http://schemas.openxmlformats.org/officeDocument/2006/relationships';
    const bytes = zipOf([
      {
        name: '[Content_Types].xml',
        data: xml(
          '<Types xmlns="http://schemas.openxmlformats.org/package/2006/content-types"><Default Extension="rels" ContentType="application/vnd.openxmlformats-package.relationships+xml"/><Default Extension="xml" ContentType="application/xml"/>' +
            '<Override PartName="/xl/workbook.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.sheet.main+xml"/>' +
            '<Override PartName="/xl/worksheets/list.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/>' +
            '<Override PartName="/xl/worksheets/other.xml" ContentType="application/vnd.openxmlformats-officedocument.spreadsheetml.worksheet+xml"/></Types>',
        ),
      },
      { name: '_rels/.rels', data: xml(`<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId1" Type="${rel}/officeDocument" Target="xl/workbook.xml"/></Relationships>`) },
      { name: 'xl/worksheets/other.xml', data: xml(`<worksheet ${ns}><sheetData><row r="1"><c r="A1" t="inlineStr"><is><t>other</t></is></c></row></sheetData></worksheet>`) },
      {
        name: 'xl/worksheets/list.xml',
        data: xml(
          `<worksheet ${ns}><sheetData><row><c t="inlineStr"><is><t>Mark</t></is></c><c t="inlineStr"><is><t>Span</t></is></c></row>` +
            '<row><c t="inlineStr"><is><t>B&amp;1</t></is></c><c><v>6.5</v></c></row>' +
            '<row r="5"><c r="B5"><v>7</v></c><c t="inlineStr"><is><r><t>ri</t></r><r><t xml:space="preserve">ch </t></r></is></c></row></sheetData></worksheet>',
        ),
      },
      { name: 'xl/_rels/workbook.xml.rels', data: xml(`<Relationships xmlns="http://schemas.openxmlformats.org/package/2006/relationships"><Relationship Id="rId7" Type="${rel}/worksheet" Target="/xl/worksheets/list.xml"/><Relationship Id="rId3" Type="${rel}/worksheet" Target="worksheets/other.xml"/></Relationships>`) },
      { name: 'xl/workbook.xml', data: xml(`<workbook ${ns}><sheets><sheet name="Other &amp; notes" sheetId="2" r:id="rId3"/><sheet name="Members" sheetId="1" r:id="rId7"/></sheets></workbook>`) },
    ]);
    const fast = openXlsxSheets(bytes)!;
    expect(fast.names).toEqual(['Other & notes', 'Members']);
    const members = fast.sheet('Members');
    expect(members.rows.map((r) => Array.from(r, (c) => resolveCell(c)))).toEqual([
      [{ kind: 'text', text: 'Mark' }, { kind: 'text', text: 'Span' }],
      [{ kind: 'text', text: 'B&1' }, { kind: 'number', value: 6.5 }],
      [],
      [],
      [{ kind: 'blank' }, { kind: 'number', value: 7 }, { kind: 'text', text: 'rich' }],
    ]);
    const read = await readWorkbook(bytes, 'hand.xlsx');
    expect(read.problems).toEqual([]);
    expect(read.members!.name).toBe('Members');
  });

  it('reports merged cells on the Members sheet from the sheet part itself', async () => {
    const wb = new ExcelJS.Workbook();
    const ws = wb.addWorksheet('members');
    ws.addRow(['Mark', 'Span']);
    ws.addRow(['B1', 6]);
    ws.addRow(['B2', 6]);
    ws.mergeCells('B2:B3');
    const read = await readWorkbook(Buffer.from(await wb.xlsx.writeBuffer()), 'merged.xlsx');
    expect(read.problems).toEqual([expect.objectContaining({ code: 'MERGED_CELLS', sheet: 'members', row: 2, column: 'B', value: 'B2:B3' })]);
  });
});

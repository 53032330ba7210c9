import type { CellValue, SheetData } from '@sagline/common/schedule';
import { inflateEntry, readCentralDirectory, type ZipEntry } from './zip-guard';

/**
 * A fast reader of the few parts of an xlsx (ECMA-376 SpreadsheetML) a
 * schedule needs, straight from the archive the zip guard has already
 * checked: the sheet list (xl/workbook.xml and its relationships), the shared
 * strings, the number formats that make a number a date (xl/styles.xml), and
 * the cells and merged ranges of the sheets asked for, nothing else (no
 * styles kept, no drawings, no other sheets).
 *
 * It gives each cell the value exceljs's `Workbook.xlsx.load` gives it
 * (`api/test/sheet-xml.spec.ts` compares the two): text, number, boolean,
 * date (a number in a date format), `{ error }`, `{ richText }`, and formula
 * cells as `{ formula, result }` / `{ sharedFormula, result }` with the value
 * the writing program cached. It reads the parts with regular expressions,
 * which is several times faster than a general XML parser on a 10,000-row
 * sheet; anything it does not recognise (namespace prefixes, parts where they
 * are not normally, no sheet list) makes it answer `null`, and the caller
 * reads the file with exceljs instead.
 */

export interface XlsxSheets {
  /** Every worksheet's name, in workbook order. */
  names: string[];
  /** A named sheet's cells, rows from 1 (row 0 = spreadsheet row 1), without trailing empty rows trimmed. */
  sheet(name: string): SheetData & { merges: MergeRange[] };
}

export interface MergeRange {
  range: string;
  top: number;
  left: number;
}

const ENTITY = /&(?:#(\d+)|#x([0-9a-fA-F]+)|(lt|gt|amp|quot|apos));/g;
const NAMED: Record<string, string> = { lt: '<', gt: '>', amp: '&', quot: '"', apos: "'" };

/** Text content with line ends normalised (XML 1.0 §2.11: CR LF and CR become LF) and the entities resolved. */
function xmlText(raw: string): string {
  const s = raw.indexOf('\r') < 0 ? raw : raw.replace(/\r\n?/g, '\n');
  if (s.indexOf('&') < 0) return s;
  return s.replace(ENTITY, (_m, dec: string | undefined, hex: string | undefined, name: string | undefined) =>
    dec ? String.fromCodePoint(Number(dec)) : hex ? String.fromCodePoint(parseInt(hex, 16)) : NAMED[name!],
  );
}

/** exceljs decodes the five named entities once more for `t="str"` text (its utils.xmlDecode); kept for the same values. */
function xmlDecodeAgain(s: string): string {
  return s.indexOf('&') < 0 ? s : s.replace(/&([a-z]*);/g, (c, name: string) => NAMED[name] ?? c);
}

const ATTRS = new Map<string, RegExp>();

function attr(attrs: string, name: string): string | undefined {
  let re = ATTRS.get(name);
  if (!re) ATTRS.set(name, (re = new RegExp(`(?:^|\\s)${name.replace(':', '\\:')}\\s*=\\s*(?:"([^"]*)"|'([^']*)')`)));
  const m = re.exec(attrs);
  return m ? xmlText(m[1] ?? m[2]) : undefined;
}

/** The built-in number formats that are dates or times (ECMA-376 Part 1, 18.8.30). */
const BUILTIN_DATE_FORMATS = new Set([14, 15, 16, 17, 18, 19, 20, 21, 22, 45, 46, 47]);

/** The same test exceljs applies to a format code (utils.isDateFmt). */
function isDateFormat(code: string): boolean {
  const bare = code.replace(/\[[^\]]*]/g, '').replace(/"[^"]*"/g, '');
  return /[ymdhMsb]+/.test(bare);
}

function excelToDate(v: number, date1904: boolean): Date {
  return new Date(Math.round((v - 25569 + (date1904 ? 1462 : 0)) * 24 * 3600 * 1000));
}

/** Plain text or runs of an `<si>` / `<is>`: a string, or `{ richText }` when it has runs (as exceljs gives). */
function stringItem(inner: string): CellValue {
  const body = inner.replace(/<rPh\b[\s\S]*?<\/rPh>/g, '');
  if (/<r>|<r\s/.test(body)) {
    const runs: { text: string }[] = [];
    for (const r of body.matchAll(/<r\b[^>]*>([\s\S]*?)<\/r>/g)) runs.push({ text: tText(r[1]) });
    return { richText: runs } as CellValue;
  }
  return tText(body);
}

function tText(s: string): string {
  let out = '';
  for (const t of s.matchAll(/<t\b[^>]*?(?:\/>|>([\s\S]*?)<\/t>)/g)) out += xmlText(t[1] ?? '');
  return out;
}

/** Column number (1-based) and row number of an A1 reference (`$` allowed), null when it is not one. */
function decodeRef(ref: string): { col: number; row: number } | null {
  let i = 0;
  let col = 0;
  let row = 0;
  if (ref.charCodeAt(i) === 36) i++;
  const colStart = i;
  for (let c = ref.charCodeAt(i); c >= 65 && c <= 90; c = ref.charCodeAt(++i)) col = col * 26 + (c - 64);
  if (i === colStart || i - colStart > 3) return null;
  if (ref.charCodeAt(i) === 36) i++;
  const rowStart = i;
  for (let c = ref.charCodeAt(i); c >= 48 && c <= 57; c = ref.charCodeAt(++i)) row = row * 10 + (c - 48);
  if (i === rowStart || i !== ref.length) return null;
  return { col, row };
}

const CELL_ATTR = /([\w:]+)\s*=\s*(?:"([^"]*)"|'([^']*)')/g;

/** The r, s and t attributes of a `<c>`, in one pass over its attributes. */
function cellAttrs(attrs: string): { r?: string; s?: string; t?: string } {
  const out: { r?: string; s?: string; t?: string } = {};
  CELL_ATTR.lastIndex = 0;
  for (let m = CELL_ATTR.exec(attrs); m; m = CELL_ATTR.exec(attrs)) {
    const name = m[1];
    if (name === 'r' || name === 's' || name === 't') out[name] = xmlText(m[2] ?? m[3]);
  }
  return out;
}

const CELL = /<row\b([^>]*?)(\/?)>|<c\b([^>]*?)(?:\/>|>([\s\S]*?)<\/c>)/g;

/**
 * Opens the sheets of an xlsx checked by `checkZip`; `null` when the file is
 * not laid out as this reader expects (the caller then uses exceljs).
 */
export function openXlsxSheets(buf: Buffer): XlsxSheets | null {
  const entries = new Map<string, ZipEntry>();
  for (const e of readCentralDirectory(buf)) entries.set(e.name, e);
  const part = (name: string): string | null => {
    const e = entries.get(name);
    return e ? inflateEntry(buf, e).toString('utf8') : null;
  };
  const workbook = part('xl/workbook.xml');
  const rels = part('xl/_rels/workbook.xml.rels');
  if (!workbook || !rels || !/<workbook[\s>]/.test(workbook) || !/<sheets[\s>]/.test(workbook) || !/<Relationships[\s>]/.test(rels)) return null;

  const targets = new Map<string, string>();
  for (const m of rels.matchAll(/<Relationship\b([^>]*)>/g)) {
    const id = attr(m[1], 'Id');
    const target = attr(m[1], 'Target');
    const type = attr(m[1], 'Type') ?? '';
    if (id && target && /\/worksheet$/.test(type)) targets.set(id, target.startsWith('/') ? target.slice(1) : `xl/${target}`);
  }
  const sheets: { name: string; path: string }[] = [];
  for (const m of workbook.matchAll(/<sheet\b([^>]*?)\/?>/g)) {
    const name = attr(m[1], 'name');
    const rid = attr(m[1], 'r:id');
    const path = rid ? targets.get(rid) : undefined;
    if (name === undefined || !path) return null;
    sheets.push({ name, path });
  }
  if (sheets.length === 0) return null;
  const wbPr = /<workbookPr\b([^>]*)>/.exec(workbook);
  const date1904Attr = wbPr ? attr(wbPr[1], 'date1904') : undefined;
  const date1904 = date1904Attr === '1' || date1904Attr === 'true';

  let shared: CellValue[] | null = null;
  const sharedStrings = (): CellValue[] => {
    if (shared) return shared;
    const xml = part('xl/sharedStrings.xml') ?? '';
    shared = [];
    for (const m of xml.matchAll(/<si\b[^>]*?(?:\/>|>([\s\S]*?)<\/si>)/g)) shared.push(stringItem(m[1] ?? ''));
    return shared;
  };

  // Which cell formats (the `s` of a cell) show a number as a date.
  let dateStyles: boolean[] | null = null;
  const isDateStyle = (s: number): boolean => {
    if (!dateStyles) {
      dateStyles = [];
      const xml = part('xl/styles.xml') ?? '';
      const custom = new Map<number, string>();
      for (const m of xml.matchAll(/<numFmt\b([^>]*?)\/?>/g)) custom.set(Number(attr(m[1], 'numFmtId')), attr(m[1], 'formatCode') ?? '');
      const xfs = /<cellXfs\b[^>]*>([\s\S]*?)<\/cellXfs>/.exec(xml);
      if (xfs) {
        for (const m of xfs[1].matchAll(/<xf\b([^>]*?)\/?>/g)) {
          const id = Number(attr(m[1], 'numFmtId') ?? 0);
          const code = custom.get(id);
          dateStyles.push(code !== undefined ? isDateFormat(code) : BUILTIN_DATE_FORMATS.has(id));
        }
      }
    }
    return dateStyles[s] === true;
  };

  return {
    names: sheets.map((s) => s.name),
    sheet(name) {
      const found = sheets.find((s) => s.name === name);
      const xml = found ? part(found.path) : null;
      if (xml === null) throw new Error(`the part of sheet "${name}" is missing`);
      const open = xml.search(/<sheetData\b/);
      const close = xml.lastIndexOf('</sheetData>');
      const data = open < 0 ? '' : close < 0 ? xml.slice(open) : xml.slice(open, close);

      const rows: CellValue[][] = [];
      const masters = new Map<string, string>();
      let rowNo = 0;
      let colNo = 0;
      let row: CellValue[] = [];
      CELL.lastIndex = 0;
      for (let m = CELL.exec(data); m; m = CELL.exec(data)) {
        if (m[1] !== undefined) {
          const r = attr(m[1], 'r');
          rowNo = r ? Number(r) : rowNo + 1;
          colNo = 0;
          row = rows[rowNo - 1] ?? (rows[rowNo - 1] = []);
          continue;
        }
        const attrs = cellAttrs(m[3]);
        const inner = m[4];
        const ref = attrs.r;
        const pos = ref ? decodeRef(ref) : null;
        if (pos) {
          if (pos.row !== rowNo) {
            rowNo = pos.row;
            row = rows[rowNo - 1] ?? (rows[rowNo - 1] = []);
          }
          colNo = pos.col;
        } else {
          colNo += 1;
        }
        row[colNo - 1] = cellValue(attrs, inner, ref ?? '', masters);
      }
      for (let i = 0; i < rows.length; i++) if (!rows[i]) rows[i] = [];

      const merges: MergeRange[] = [];
      for (const m of xml.matchAll(/<mergeCell\b([^>]*?)\/?>/g)) {
        const range = attr(m[1], 'ref');
        const tl = range ? decodeRef(range.split(':')[0]) : null;
        if (range && tl) merges.push({ range, top: tl.row, left: tl.col });
      }
      return { name, rows, merges };
    },
  };

  function cellValue(attrs: { s?: string; t?: string }, inner: string | undefined, ref: string, masters: Map<string, string>): CellValue {
    const { t, s } = attrs;
    const style = s === undefined ? 0 : Number(s);
    if (inner === undefined) return null;
    let f: RegExpExecArray | null = null;
    let v: string | undefined;
    if (inner.startsWith('<v>') && inner.indexOf('<', 3) === inner.length - 4 && inner.endsWith('</v>')) {
      v = xmlText(inner.slice(3, -4)); // the usual `<v>…</v>` alone: no search needed
    } else {
      f = /<f\b([^>]*?)(?:\/>|>([\s\S]*?)<\/f>)/.exec(inner);
      const vm = /<v\b[^>]*?(?:\/>|>([\s\S]*?)<\/v>)/.exec(inner);
      v = vm ? xmlText(vm[1] ?? '') : undefined;
    }
    if (f) {
      const fAttrs = f[1];
      const shareType = attr(fAttrs, 't');
      const cell: Record<string, unknown> = {};
      let formula = f[2] !== undefined ? xmlText(f[2]) : '';
      if (shareType === 'shared') {
        const si = attr(fAttrs, 'si') ?? '';
        if (attr(fAttrs, 'ref') !== undefined) masters.set(si, ref);
        else {
          cell.sharedFormula = masters.get(si);
          formula = '';
        }
      }
      if (cell.sharedFormula === undefined) cell.formula = formula;
      if (v) {
        if (t === 'str') cell.result = xmlDecodeAgain(v);
        else if (t === 'b') cell.result = parseInt(v, 10) !== 0;
        else if (t === 'e') cell.result = { error: v };
        else {
          const n = parseFloat(v);
          cell.result = isDateStyle(style) ? excelToDate(n, date1904) : n;
        }
      }
      return cell as CellValue;
    }
    if (t === 'inlineStr') {
      const is = /<is\b[^>]*>([\s\S]*?)<\/is>/.exec(inner);
      return is ? stringItem(is[1]) : null;
    }
    if (v === undefined) return null;
    switch (t) {
      case 's':
        return sharedStrings()[parseInt(v, 10)] ?? null;
      case 'str':
        return xmlDecodeAgain(v);
      case 'b':
        return parseInt(v, 10) !== 0;
      case 'e':
        return { error: v } as CellValue;
      default: {
        const n = parseFloat(v);
        return isDateStyle(style) ? excelToDate(n, date1904) : n;
      }
    }
  }
}

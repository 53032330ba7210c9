import type { SheetData } from './cells';

/**
 * Splits CSV text into rows of cells (RFC 4180: quoted fields may hold the
 * delimiter, doubled quotes and line breaks). A leading byte-order mark is
 * dropped. The delimiter is a comma, or a semicolon when the header line has
 * more semicolons than commas outside quotes (what spreadsheet programs write
 * in locales with a decimal comma). Cells stay text; the schedule parser reads
 * numbers from text.
 */
export function parseCsv(text: string, delimiter?: ',' | ';' | '\t'): string[][] {
  const src = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const sep = delimiter ?? detectDelimiter(src);
  const rows: string[][] = [];
  let row: string[] = [];
  let field = '';
  let quoted = false;
  let i = 0;
  while (i < src.length) {
    const c = src[i];
    if (quoted) {
      if (c === '"') {
        if (src[i + 1] === '"') {
          field += '"';
          i += 2;
          continue;
        }
        quoted = false;
        i++;
        continue;
      }
      field += c;
      i++;
      continue;
    }
    if (c === '"' && field === '') {
      quoted = true;
      i++;
    } else if (c === sep) {
      row.push(field);
      field = '';
      i++;
    } else if (c === '\r' || c === '\n') {
      row.push(field);
      rows.push(row);
      row = [];
      field = '';
      i += c === '\r' && src[i + 1] === '\n' ? 2 : 1;
    } else {
      field += c;
      i++;
    }
  }
  if (field !== '' || row.length > 0) {
    row.push(field);
    rows.push(row);
  }
  return rows;
}

function detectDelimiter(src: string): ',' | ';' | '\t' {
  let commas = 0;
  let semicolons = 0;
  let tabs = 0;
  let quoted = false;
  for (const c of src) {
    if (c === '"') quoted = !quoted;
    else if (!quoted && (c === '\n' || c === '\r')) break;
    else if (!quoted && c === ',') commas++;
    else if (!quoted && c === ';') semicolons++;
    else if (!quoted && c === '\t') tabs++;
  }
  if (tabs > commas && tabs > semicolons) return '\t';
  return semicolons > commas ? ';' : ',';
}

/** A CSV file as the Members sheet (a CSV holds one sheet). */
export function csvSheet(text: string, name = 'Members'): SheetData {
  return { name, rows: parseCsv(text) };
}

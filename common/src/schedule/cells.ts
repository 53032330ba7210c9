/**
 * Cell values as a spreadsheet reader hands them over (exceljs shapes; a CSV
 * reader gives strings), and the one place that decides what a cell holds.
 */
export type CellPrimitive = string | number | boolean | Date | null | undefined;

export interface FormulaCell {
  formula?: string;
  sharedFormula?: string;
  /** The value the writing program cached; exceljs never calculates formulas. */
  result?: CellPrimitive | ErrorCell | RichTextCell;
}
export interface RichTextCell {
  richText: { text: string }[];
}
export interface HyperlinkCell {
  text: string | RichTextCell;
  hyperlink: string;
}
export interface ErrorCell {
  error: string;
}

export type CellValue = CellPrimitive | FormulaCell | RichTextCell | HyperlinkCell | ErrorCell;

/** One sheet: row 0 is the header; reports number rows as the spreadsheet does (header = row 1). */
export interface SheetData {
  name: string;
  rows: CellValue[][];
}

export type ResolvedCell =
  | { kind: 'blank' }
  | { kind: 'text'; text: string; fromFormula?: string }
  | { kind: 'number'; value: number; fromFormula?: string }
  | { kind: 'boolean'; value: boolean }
  | { kind: 'date'; value: Date }
  | { kind: 'no-result'; formula: string }
  | { kind: 'error'; error: string };

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !(value instanceof Date);
}

function richText(value: RichTextCell): string {
  return value.richText.map((part) => part.text ?? '').join('');
}

/** What a cell holds, with formulas replaced by their cached result. */
export function resolveCell(value: CellValue): ResolvedCell {
  if (value === null || value === undefined) return { kind: 'blank' };
  if (typeof value === 'string') return value.trim() === '' ? { kind: 'blank' } : { kind: 'text', text: value.trim() };
  if (typeof value === 'number') return Number.isFinite(value) ? { kind: 'number', value } : { kind: 'error', error: String(value) };
  if (typeof value === 'boolean') return { kind: 'boolean', value };
  if (value instanceof Date) return { kind: 'date', value };
  if (!isObject(value)) return { kind: 'blank' };
  const obj = value as Record<string, unknown>;
  if ('formula' in obj || 'sharedFormula' in obj) {
    const formula = String(obj.formula ?? obj.sharedFormula ?? '');
    if (obj.result === undefined || obj.result === null) return { kind: 'no-result', formula };
    const inner = resolveCell(obj.result as CellValue);
    if (inner.kind === 'text' || inner.kind === 'number') return { ...inner, fromFormula: formula };
    // A cached empty string is a formula that shows nothing: treat as blank.
    return inner;
  }
  if (Array.isArray(obj.richText)) return resolveCell(richText(obj as unknown as RichTextCell));
  if ('hyperlink' in obj) {
    const text = obj.text;
    if (typeof text === 'string') return resolveCell(text);
    if (isObject(text) && Array.isArray((text as Record<string, unknown>).richText)) return resolveCell(richText(text as unknown as RichTextCell));
    return resolveCell(String(obj.hyperlink));
  }
  if ('error' in obj) return { kind: 'error', error: String(obj.error) };
  return { kind: 'blank' };
}

/** A cell as it can go into a problem report (JSON-safe). */
export function displayValue(value: CellValue): string | number | boolean | null {
  if (value === null || value === undefined) return null;
  if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') return value;
  if (value instanceof Date) return value.toISOString();
  if (isObject(value)) {
    const obj = value as Record<string, unknown>;
    if ('formula' in obj || 'sharedFormula' in obj) {
      return `=${String(obj.formula ?? obj.sharedFormula ?? '').replace(/^=/, '')}`;
    }
    const r = resolveCell(value);
    if (r.kind === 'text') return r.text;
    if (r.kind === 'number') return r.value;
    if (r.kind === 'error') return r.error;
  }
  return null;
}

/** Spreadsheet column letter of a 0-based index: 0 → A, 25 → Z, 26 → AA. */
export function columnLetter(index: number): string {
  let n = index + 1;
  let letters = '';
  while (n > 0) {
    const rem = (n - 1) % 26;
    letters = String.fromCharCode(65 + rem) + letters;
    n = Math.floor((n - 1) / 26);
  }
  return letters;
}

export function isBlankRow(row: readonly CellValue[] | undefined): boolean {
  return !row || row.every((cell) => resolveCell(cell).kind === 'blank');
}

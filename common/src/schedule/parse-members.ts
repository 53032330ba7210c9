import type { UnitSystemId } from '../units';
import { isBlankRow, resolveCell, type SheetData } from './cells';
import { MATERIALS, SUPPORT_CODES, wordKey, type MaterialCode, type SupportCode } from './codes';
import { MEMBER_COLUMNS } from './columns';
import { readHeader, type BoundColumn } from './header';
import type { ProblemList } from './problems';
import { FAIL, RowReader, shown, type Read } from './read-cells';
import type { ScheduleLoad, ScheduleMember } from './types';

/** What the Loads sheet and the warnings need to know about each Members row. */
export interface MemberRow {
  mark: string;
  key: string;
  row: number;
  /** Total length in m when the geometry could be read. */
  length: number | null;
  /** The member, or null when its row had an error. */
  member: ScheduleMember | null;
}

export interface MembersContext {
  system: UnitSystemId;
  categories: readonly string[];
  levels?: readonly string[];
  maxRows: number;
}

/** Spans longer than this are reported as a probable unit mistake (common practice, no source). */
export const LONG_SPAN_M = 60;

const EMAIL = /^[^\s@<>()[\],;:"]+@[^\s@<>()[\],;:"]+\.[^\s@<>()[\],;:"]+$/;

/** The matching key of a mark: marks are unique ignoring case and surrounding spaces. */
export function markKey(mark: string): string {
  return mark.trim().toLowerCase();
}

export function parseMembersSheet(
  sheet: SheetData,
  ctx: MembersContext,
  problems: ProblemList,
): { rows: MemberRow[]; byMark: Map<string, MemberRow>; dataRows: number; columns: Map<string, BoundColumn> } {
  const rows: MemberRow[] = [];
  const byMark = new Map<string, MemberRow>();
  if (sheet.rows.length === 0 || isBlankRow(sheet.rows[0])) {
    problems.error('EMPTY_SHEET', { sheet: sheet.name, row: 1 }, `The ${sheet.name} sheet is empty. Row 1 must hold the column headers (download the template to start from one).`);
    return { rows, byMark, dataRows: 0, columns: new Map() };
  }
  const columns = readHeader(sheet, MEMBER_COLUMNS, { system: ctx.system, allowLoadCases: true }, problems);
  const col = (key: string): BoundColumn | undefined => columns.byKey.get(key);
  const requiredMissing = MEMBER_COLUMNS.some((d) => d.required && !columns.byKey.has(d.key));
  const categoryByKey = new Map(ctx.categories.map((c) => [wordKey(c), c]));
  const levelByKey = ctx.levels ? new Map(ctx.levels.map((l) => [l.trim().toLowerCase(), l])) : null;

  let dataRows = 0;
  for (let i = 1; i < sheet.rows.length; i++) {
    const cells = sheet.rows[i] ?? [];
    if (isBlankRow(cells)) continue;
    dataRows++;
    const rowNumber = i + 1;
    if (dataRows > ctx.maxRows) {
      problems.error(
        'TOO_MANY_ROWS',
        { sheet: sheet.name, row: rowNumber },
        `The ${sheet.name} sheet has more than ${ctx.maxRows} member rows (row ${rowNumber} is number ${dataRows}). Split the schedule into several files of at most ${ctx.maxRows} members.`,
      );
      break;
    }
    const r = new RowReader(sheet.name, rowNumber, cells, problems);

    // Mark first, so every later problem of the row names the member.
    const markCol = col('mark');
    const mark = r.text(markCol, MEMBER_COLUMNS[0].maxLength);
    if (mark === null && markCol) {
      r.fail('EMPTY_MARK', markCol, 'the row has values but no mark. Give the member a mark that is unique in the schedule (e.g. L3-B12), or delete the row.');
    }
    const info: MemberRow = { mark: typeof mark === 'string' ? mark : '', key: typeof mark === 'string' ? markKey(mark) : '', row: rowNumber, length: null, member: null };
    if (typeof mark === 'string') {
      r.mark = mark;
      const first = byMark.get(info.key);
      if (first) {
        r.fail('DUPLICATE_MARK', markCol, `the mark "${mark}" is already used on row ${first.row}. Marks must be unique in the schedule; rename one of the two.`);
      } else {
        byMark.set(info.key, info);
      }
    }
    rows.push(info);

    const level = readLevel(r, col('level'), levelByKey);
    const grid = r.text(col('grid'), 120);
    const category = readCategory(r, col('category'), categoryByKey, ctx.categories);
    const material = required(r, col('material'), r.code(col('material'), MATERIALS, 'UNKNOWN_MATERIAL', 'material'), 'Material', 'the material (e.g. steel, timber, concrete)');
    const section = r.text(col('section'), 120);
    const supports = r.code(col('supports'), SUPPORT_CODES, 'UNKNOWN_SUPPORT', 'support code (end condition)') ?? 'pinned';
    const spans = readSpans(r, col('spans'));
    const leftOverhang = nonNegative(r, col('leftOverhang'), r.quantity(col('leftOverhang'), 'length'), 'An overhang') ?? 0;
    const rightOverhang = nonNegative(r, col('rightOverhang'), r.quantity(col('rightOverhang'), 'length'), 'An overhang') ?? 0;
    const E = positive(r, col('E'), required(r, col('E'), r.quantity(col('E'), 'stress'), 'E', 'the modulus'), 'E');
    const I = positive(r, col('I'), required(r, col('I'), r.quantity(col('I'), 'inertia'), 'I', 'the moment of inertia'), 'I');
    const depth = positive(r, col('depth'), r.quantity(col('depth'), 'length'), 'Depth');
    const camber = nonNegative(r, col('camber'), r.quantity(col('camber'), 'length'), 'Camber (upward precamber)');
    const reviewer = readEmail(r, col('reviewer'));
    const notes = r.text(col('notes'), MEMBER_COLUMNS.find((d) => d.key === 'notes')!.maxLength);

    let length: number | null = null;
    if (Array.isArray(spans) && leftOverhang !== FAIL && rightOverhang !== FAIL && supports !== FAIL) {
      if (supports === 'cantilever-left' || supports === 'cantilever-right') {
        if (spans.length > 1) {
          r.fail('CANTILEVER_LAYOUT', col('spans'), `a ${supports} member has one length, but Spans holds ${spans.length} spans. Enter the cantilever length only, or use pinned supports with an overhang.`);
        } else if (leftOverhang > 0 || rightOverhang > 0) {
          r.fail('CANTILEVER_LAYOUT', col(leftOverhang > 0 ? 'leftOverhang' : 'rightOverhang'), `a ${supports} member has no overhang: put its whole length in Spans and leave the overhangs empty (or use pinned supports with an overhang for a back-span).`);
        } else {
          length = spans[0];
        }
      } else {
        length = leftOverhang + spans.reduce((a, b) => a + b, 0) + rightOverhang;
      }
      for (const [key, value] of [['spans', Math.max(...spans)], ['leftOverhang', leftOverhang], ['rightOverhang', rightOverhang]] as const) {
        if (value > LONG_SPAN_M) {
          const c = col(key);
          r.warn('LONG_SPAN', c, `${shown(value, c?.unit)} is an unusually long ${key === 'spans' ? 'span' : 'overhang'}. If the value is in another unit (e.g. mm), change the unit in the header (e.g. "Spans [mm]").`);
        }
      }
    }
    info.length = length;

    const loads: ScheduleLoad[] = [];
    for (const lc of columns.loadCases) {
      const w = r.quantity(lc, 'lineLoad');
      if (typeof w === 'number' && w !== 0 && length !== null) {
        loads.push({ case: lc.loadCase!, kind: 'udl', x1: 0, x2: length, w, origin: { sheet: sheet.name, row: rowNumber, column: lc.header } });
      }
    }

    if (r.failed || requiredMissing || length === null) continue;
    info.member = {
      mark: mark as string,
      level: level as string,
      grid: grid as string | null,
      category: category as string,
      material: material as MaterialCode,
      section: section as string | null,
      spans: spans as number[],
      leftOverhang: leftOverhang as number,
      rightOverhang: rightOverhang as number,
      supports: supports as SupportCode,
      E: E as number,
      I: I as number,
      depth: depth as number | null,
      camber: camber as number | null,
      loads,
      reviewerEmail: reviewer as string | null,
      notes: notes as string | null,
      sourceRow: rowNumber,
    };
  }
  return { rows, byMark, dataRows, columns: columns.byKey };
}

function required<T>(r: RowReader, col: BoundColumn | undefined, value: Read<T>, name: string, what: string): Read<T> {
  if (value === null && col) {
    return r.fail('MISSING_VALUE', col, `${name} is empty. Enter ${what} for this member.`);
  }
  return value;
}

function positive(r: RowReader, col: BoundColumn | undefined, value: Read<number>, name: string): Read<number> {
  if (typeof value === 'number' && !(value > 0)) {
    return r.fail('NOT_POSITIVE', col, `${name} must be greater than zero, but it is ${shown(value, col?.unit)}. Enter the actual value.`);
  }
  return value;
}

function nonNegative(r: RowReader, col: BoundColumn | undefined, value: Read<number>, name: string): Read<number> {
  if (typeof value === 'number' && value < 0) {
    return r.fail('NEGATIVE', col, `${name} cannot be negative (${shown(value, col?.unit)}). Enter a positive length, or leave the cell empty for none.`);
  }
  return value;
}

function readLevel(r: RowReader, col: BoundColumn | undefined, levels: Map<string, string> | null): Read<string> {
  const text = required(r, col, r.text(col, 40), 'Level', 'the level (e.g. L3)');
  if (typeof text !== 'string' || !levels) return text;
  const level = levels.get(text.trim().toLowerCase());
  if (level === undefined) {
    return r.fail('UNKNOWN_LEVEL', col, `"${text}" is not a level of this project. Use one of: ${[...levels.values()].join(', ')} (or add the level to the project first).`);
  }
  return level;
}

function readCategory(r: RowReader, col: BoundColumn | undefined, byKey: Map<string, string>, categories: readonly string[]): Read<string> {
  const text = required(r, col, r.text(col), 'Category', 'the limit-set category');
  if (typeof text !== 'string') return text;
  const category = byKey.get(wordKey(text));
  if (category === undefined) {
    return r.fail(
      'UNKNOWN_CATEGORY',
      col,
      categories.length
        ? `"${text}" is not a category of this project's limit set. Allowed: ${categories.join(', ')}.`
        : `"${text}" cannot be used: the project's limit set has no categories. Add categories to the limit set first.`,
    );
  }
  return category;
}

function readEmail(r: RowReader, col: BoundColumn | undefined): Read<string> {
  const text = r.text(col, 254);
  if (typeof text !== 'string') return text;
  const email = text.replace(/^mailto:/i, '').trim().toLowerCase();
  if (!EMAIL.test(email)) {
    return r.fail('BAD_EMAIL', col, `"${text}" is not an e-mail address. Enter the reviewer's address (e.g. name@firm.example), or leave the cell empty.`);
  }
  return email;
}

/** "7.2", 7.2, "6.0+4.5+6.0", "24 ft + 18 ft" → lengths in m. */
function readSpans(r: RowReader, col: BoundColumn | undefined): Read<number[]> {
  if (!col) return null;
  const raw = resolveCell(r.raw(col));
  if (raw.kind === 'number' && raw.fromFormula && /^=?\s*[\d.\s]+(\+\s*[\d.\s]+)+$/.test(raw.fromFormula)) {
    return r.fail(
      'SPANS_FORMULA',
      col,
      `the cell is the formula =${raw.fromFormula.replace(/^=/, '')}, which adds the spans into one (${raw.value}). For continuous spans type the spans as text, e.g. ${raw.fromFormula.replace(/^=/, '').replace(/\s/g, '')} (in Excel start with an apostrophe: '${raw.fromFormula.replace(/^=/, '').replace(/\s/g, '')}).`,
    );
  }
  if (raw.kind === 'text' && raw.text.includes('+')) {
    if (!col.usable || !col.unit) return r.silentFail();
    const parts = raw.text.split('+').map((p) => p.trim());
    if (parts.some((p) => p === '')) {
      return r.fail('NOT_A_NUMBER', col, `"${raw.text}" has an empty span. Write continuous spans as numbers joined by "+", e.g. 6.0+4.5+6.0.`);
    }
    const spans: number[] = [];
    for (const part of parts) {
      const v = r.parseText(col, part, 'length', col.unit);
      if (v === FAIL || v === null) return FAIL;
      spans.push(v);
    }
    return checkSpans(r, col, spans);
  }
  if (raw.kind === 'text' && /^[\d.\s]+([,;/]\s*[\d.]+)+$/.test(raw.text) && !/^\d{1,3}(,\d{3})+(\.\d+)?$/.test(raw.text)) {
    return r.fail('NOT_A_NUMBER', col, `"${raw.text}" is not a span. Join continuous spans with "+", e.g. 6.0+4.5+6.0, and use a point as the decimal separator.`);
  }
  const one = required(r, col, r.quantity(col, 'length'), 'Spans', 'the span');
  if (typeof one !== 'number') return one;
  return checkSpans(r, col, [one]);
}

function checkSpans(r: RowReader, col: BoundColumn, spans: number[]): Read<number[]> {
  const bad = spans.findIndex((s) => !(s > 0));
  if (bad >= 0) {
    const which = spans.length > 1 ? `span ${bad + 1} of ${spans.length}` : 'the span';
    return r.fail('NOT_POSITIVE', col, `${which} is ${shown(spans[bad], col.unit)}; every span must be greater than zero.`);
  }
  return spans;
}

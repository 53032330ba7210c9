import { DIMENSION_LABEL, type UnitSystemId } from '../units';
import { isBlankRow, type SheetData } from './cells';
import { LOAD_CASES, LOAD_KINDS } from './codes';
import { LOAD_COLUMNS } from './columns';
import { readHeader, type BoundColumn } from './header';
import { markKey, type MemberRow } from './parse-members';
import type { ProblemList } from './problems';
import { FAIL, RowReader, shown, type Read } from './read-cells';
import type { ScheduleLoad } from './types';

// A position this close past an end (relative to the length) is the end: unit round-off, not a mistake.
const END_TOLERANCE = 1e-9;

export function parseLoadsSheet(
  sheet: SheetData,
  ctx: { system: UnitSystemId; maxRows: number },
  members: Map<string, MemberRow>,
  problems: ProblemList,
): { dataRows: number } {
  if (sheet.rows.length === 0 || isBlankRow(sheet.rows[0])) {
    // An empty Loads sheet is the same as none, unless rows follow an empty header.
    if (sheet.rows.slice(1).some((row) => !isBlankRow(row))) {
      problems.error('EMPTY_SHEET', { sheet: sheet.name, row: 1 }, `The ${sheet.name} sheet has rows but no headers in row 1. Copy the header row from the template.`);
    }
    return { dataRows: 0 };
  }
  const columns = readHeader(sheet, LOAD_COLUMNS, { system: ctx.system, allowLoadCases: false }, problems);
  const col = (key: string): BoundColumn | undefined => columns.byKey.get(key);
  const requiredMissing = LOAD_COLUMNS.some((d) => d.required && !columns.byKey.has(d.key));

  let dataRows = 0;
  for (let i = 1; i < sheet.rows.length; i++) {
    const cells = sheet.rows[i] ?? [];
    if (isBlankRow(cells)) continue;
    dataRows++;
    const rowNumber = i + 1;
    if (dataRows > ctx.maxRows) {
      problems.error('TOO_MANY_ROWS', { sheet: sheet.name, row: rowNumber }, `The ${sheet.name} sheet has more than ${ctx.maxRows} load rows (row ${rowNumber} is number ${dataRows}). Split the schedule into several files.`);
      break;
    }
    const r = new RowReader(sheet.name, rowNumber, cells, problems);
    const markCol = col('mark');
    const mark = r.text(markCol);
    let member: MemberRow | undefined;
    if (mark === null && markCol) {
      r.fail('EMPTY_MARK', markCol, 'the load has no mark. Enter the mark of the member it acts on, as on the Members sheet.');
    } else if (typeof mark === 'string') {
      r.mark = mark;
      member = members.get(markKey(mark));
      if (!member) {
        r.fail('UNKNOWN_MARK', markCol, `there is no member "${mark}" on the Members sheet. Check the spelling of the mark, or add the member to the Members sheet.`);
      }
    }
    const loadCase = r.code(col('case'), LOAD_CASES, 'UNKNOWN_LOAD_CASE', 'load case');
    if (loadCase === null && col('case')) r.fail('MISSING_VALUE', col('case'), `the load case is empty. Enter one of ${LOAD_CASES.map((c) => c.code).join(', ')}.`);
    const kind = r.code(col('kind'), LOAD_KINDS, 'UNKNOWN_KIND', 'load kind');
    if (kind === null && col('kind')) r.fail('MISSING_VALUE', col('kind'), `the load kind is empty. Enter one of ${LOAD_KINDS.map((k) => k.code).join(', ')}.`);

    const position = r.quantity(col('position'), 'length');
    const from = r.quantity(col('from'), 'length');
    const to = r.quantity(col('to'), 'length');
    const length = member?.length ?? null;
    const where = (x: number, c: BoundColumn | undefined, what: string): Read<number> => {
      if (length === null) return x;
      const tol = END_TOLERANCE * Math.max(1, length);
      if (x < -tol || x > length + tol) {
        return r.fail(
          'LOAD_OUTSIDE',
          c,
          `${what} ${shown(x, c?.unit)} is outside member ${mark as string}, which runs from 0 to ${shown(length, c?.unit)} (measured from its left end, the left overhang included). Enter a position within the member.`,
        );
      }
      return Math.min(Math.max(x, 0), length);
    };

    let load: ScheduleLoad | null = null;
    if (typeof kind === 'string') {
      const valueCol = col('value');
      const dim = kind === 'point' ? 'force' : kind === 'moment' ? 'moment' : 'lineLoad';
      const value = r.quantity(valueCol, dim, valueCol?.valueUnits?.[dim]);
      if (value === null && valueCol) r.fail('MISSING_VALUE', valueCol, `the ${kind} load has no value. Enter the ${DIMENSION_LABEL[dim]} in ${valueCol.valueUnits?.[dim]?.display ?? 'the header unit'}.`);
      const endCol = col('endValue');
      const endValue = r.quantity(endCol, 'lineLoad', endCol?.valueUnits?.lineLoad);
      const origin = { sheet: sheet.name, row: rowNumber };

      if (kind === 'point' || kind === 'moment') {
        if (position === null && col('position')) r.fail('MISSING_VALUE', col('position'), `a ${kind} load needs a Position (distance from the left end of the member).`);
        if (position === null && !col('position')) r.fail('MISSING_VALUE', undefined, `a ${kind} load needs a Position column (distance from the left end of the member). Add a "Position" column to the ${sheet.name} sheet.`);
        if (from !== null || to !== null) r.warn('VALUE_IGNORED', col(from !== null ? 'from' : 'to'), `From and To are ignored for a ${kind} load; it acts at Position.`);
        if (endValue !== null) r.warn('VALUE_IGNORED', endCol, `End value is ignored for a ${kind} load.`);
        const x = typeof position === 'number' ? where(position, col('position'), 'Position') : FAIL;
        if (typeof x === 'number' && typeof value === 'number' && typeof loadCase === 'string') {
          load = kind === 'point' ? { case: loadCase, kind, x, P: value, origin } : { case: loadCase, kind, x, M: value, origin };
        }
      } else {
        if (position !== null) r.warn('VALUE_IGNORED', col('position'), `Position is ignored for a ${kind} load; it acts from From to To.`);
        const x1 = from === null ? 0 : typeof from === 'number' ? where(from, col('from'), 'From') : FAIL;
        const x2 = to === null ? length ?? FAIL : typeof to === 'number' ? where(to, col('to'), 'To') : FAIL;
        if (typeof x1 === 'number' && typeof x2 === 'number' && !(x2 > x1)) {
          r.fail('LOAD_RANGE', col('to') ?? col('from'), `the load must end after it starts, but From is ${shown(x1, col('from')?.unit ?? col('to')?.unit)} and To is ${shown(x2, col('to')?.unit ?? col('from')?.unit)}. Swap them or correct the positions.`);
        }
        let w2: Read<number> = null;
        if (kind === 'udl' && typeof endValue === 'number' && typeof value === 'number' && endValue !== value) {
          r.fail('UDL_END_VALUE', endCol, `a udl has one value, but End value differs from Value. Use kind "linear" for a load that varies along the member, or clear End value.`);
        }
        if (kind === 'linear') {
          w2 = endValue;
          if (endValue === null && endCol) r.fail('MISSING_VALUE', endCol, `a linear load needs an End value (the line load at To).`);
          if (endValue === null && !endCol) r.fail('MISSING_VALUE', undefined, `a linear load needs an End value column (the line load at To). Add an "End value" column to the ${sheet.name} sheet.`);
        }
        if (typeof x1 === 'number' && typeof x2 === 'number' && x2 > x1 && typeof value === 'number' && typeof loadCase === 'string') {
          if (kind === 'udl') load = { case: loadCase, kind, x1, x2, w: value, origin };
          else if (typeof w2 === 'number') load = { case: loadCase, kind, x1, x2, w1: value, w2, origin };
        }
      }
    }
    r.text(col('notes'), LOAD_COLUMNS.find((d) => d.key === 'notes')!.maxLength);

    if (!member) continue;
    if (r.failed || requiredMissing) {
      member.member = null;
      continue;
    }
    if (load && member.member) member.member.loads.push(load);
  }
  return { dataRows };
}

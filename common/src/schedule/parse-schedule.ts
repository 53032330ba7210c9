import { parseLoadsSheet } from './parse-loads';
import { parseMembersSheet } from './parse-members';
import { ProblemList } from './problems';
import type { ParseScheduleInput, ParseScheduleResult, ScheduleMember } from './types';
import { addWarnings } from './warnings';

export const DEFAULT_MAX_ROWS = 5000;

/** A → 1, AA → 27; no column (a whole row) sorts first. */
function letterIndex(letters: string | null): number {
  return letters ? [...letters].reduce((n, c) => n * 26 + c.charCodeAt(0) - 64, 0) : 0;
}
export const DEFAULT_MAX_PROBLEMS = 1000;

/**
 * Reads a member schedule (a Members sheet and an optional Loads sheet, as
 * cell values) into SI members, and lists every problem with sheet, row,
 * column and a message. Pure: no files. Any problem of severity 'error' is
 * fatal for an import; `members` then holds only the rows that were fine
 * (for previews).
 */
export function parseSchedule(input: ParseScheduleInput): ParseScheduleResult {
  const maxRows = input.maxRows ?? DEFAULT_MAX_ROWS;
  const problems = new ProblemList(input.maxProblems ?? DEFAULT_MAX_PROBLEMS);
  const { rows, byMark, dataRows, columns } = parseMembersSheet(
    input.members,
    { system: input.unitSystem, categories: input.categories, levels: input.levels, maxRows },
    problems,
  );
  let loadRows = 0;
  if (input.loads) {
    loadRows = parseLoadsSheet(input.loads, { system: input.unitSystem, maxRows: maxRows * 4 }, byMark, problems).dataRows;
  }
  if (dataRows === 0 && input.members.rows.length > 0 && problems.errors === 0) {
    problems.error('NO_MEMBERS', { sheet: input.members.name, row: 2 }, `The ${input.members.name} sheet has headers but no member rows. Add one row per member below the header.`);
  }
  const members: ScheduleMember[] = rows.flatMap((r) => (r.member ? [r.member] : []));

  addWarnings(input.members, members, { depth: columns.get('depth'), I: columns.get('I'), spans: columns.get('spans') }, problems);

  // Errors first (they block the import), then by sheet, row and column.
  const sheetOrder = [input.members.name, input.loads?.name];
  const list = problems
    .finish(input.members.name)
    .map((p, i) => ({ p, i }))
    .sort(
      (a, b) =>
        Number(a.p.code === 'TOO_MANY_PROBLEMS') - Number(b.p.code === 'TOO_MANY_PROBLEMS') ||
        Number(a.p.severity === 'warning') - Number(b.p.severity === 'warning') ||
        sheetOrder.indexOf(a.p.sheet) - sheetOrder.indexOf(b.p.sheet) ||
        a.p.row - b.p.row ||
        letterIndex(a.p.columnLetter) - letterIndex(b.p.columnLetter) ||
        a.i - b.i,
    )
    .map(({ p }) => p);
  return {
    members,
    problems: list,
    summary: { memberRows: dataRows, loadRows, errors: problems.errors, warnings: problems.warnings },
  };
}

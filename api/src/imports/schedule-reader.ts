import type { ImportFileType, ImportProblem, UnitSystem } from '@sagline/common/api-types';
import { csvSheet, parseSchedule, type ScheduleMember, type ScheduleProblem, type SheetData } from '@sagline/common/schedule';
import { sniffUpload } from './file-kind';
import type { ImportSettings } from './import-settings';
import { readWorkbook } from './workbook-reader';

export interface ReadOptions {
  unitSystem: UnitSystem;
  /** The limit set's categories. */
  categories: readonly string[];
  /** The project's level names (none: any level is accepted). */
  levels: readonly string[];
  /** Team e-mails, lower case: a reviewer not on the team gets a warning. */
  team: ReadonlyMap<string, number>;
}

export interface ReadResult {
  fileType: ImportFileType;
  membersSheet: string;
  members: ScheduleMember[];
  /** Errors first, then warnings; any error is fatal. */
  problems: ImportProblem[];
  memberRows: number;
  loadRows: number;
}

function toImportProblem(p: ScheduleProblem): ImportProblem {
  const out: ImportProblem = { severity: p.severity, code: p.code, sheet: p.sheet, row: p.row, column: p.column, value: p.value, message: p.message };
  if (p.mark !== undefined) out.mark = p.mark;
  return out;
}

/**
 * From the uploaded bytes to SI members and every problem: the type decided
 * by content (file-kind.ts, which also guards against zip bombs), the sheets
 * read (workbook-reader.ts, or the CSV as the Members sheet), then
 * common/src/schedule parseSchedule with the project's unit system, levels
 * and limit-set categories, and the row cap.
 */
export async function readSchedule(bytes: Buffer, fileName: string, options: ReadOptions, settings: ImportSettings): Promise<ReadResult> {
  const sniffed = sniffUpload(bytes, fileName, { maxUnzippedBytes: settings.maxUnzippedBytes, maxRatio: settings.maxZipRatio });
  let members: SheetData | null;
  let loads: SheetData | null = null;
  const problems: ImportProblem[] = [];
  if (sniffed.type === 'xlsx') {
    const read = await readWorkbook(bytes, fileName);
    members = read.members;
    loads = read.loads;
    problems.push(...read.problems);
  } else {
    members = csvSheet(sniffed.text, 'Members');
  }
  if (!members) return { fileType: sniffed.type, membersSheet: 'Members', members: [], problems, memberRows: 0, loadRows: 0 };

  const parsed = parseSchedule({
    members,
    ...(loads ? { loads } : {}),
    unitSystem: options.unitSystem,
    categories: options.categories,
    ...(options.levels.length ? { levels: options.levels } : {}),
    maxRows: settings.maxRows,
  });
  problems.push(...parsed.problems.map(toImportProblem));
  for (const m of parsed.members) {
    if (m.reviewerEmail && !options.team.has(m.reviewerEmail.toLowerCase())) {
      problems.push({
        severity: 'warning',
        code: 'REVIEWER_NOT_ON_TEAM',
        sheet: members.name,
        row: m.sourceRow,
        column: 'Reviewer',
        mark: m.mark,
        value: m.reviewerEmail,
        message: `Reviewer ${m.reviewerEmail} of member ${m.mark} is not on this project's team, so the member is imported without a reviewer. Invite them (Team) or correct the address.`,
      });
    }
  }
  return { fileType: sniffed.type, membersSheet: members.name, members: parsed.members, problems: sortProblems(problems), memberRows: parsed.summary.memberRows, loadRows: parsed.summary.loadRows };
}

/** Errors before warnings; otherwise the order they were found in (sheet, row, column). */
export function sortProblems(list: ImportProblem[]): ImportProblem[] {
  return list.map((p, i) => ({ p, i })).sort((a, b) => Number(a.p.severity === 'warning') - Number(b.p.severity === 'warning') || a.i - b.i).map(({ p }) => p);
}

/**
 * Writes the sample files of samples/ (run from the repository root):
 *   npx tsx samples/scripts/make-samples.ts
 * Deterministic (seeded random numbers, fixed dates): a rerun gives the same
 * bytes. Every file is read back and parsed as an upload would be; the script
 * fails if any has an error.
 */
import { writeFileSync } from 'node:fs';
import { join } from 'node:path';
import ExcelJS from 'exceljs';
import { csvSheet, findSheet, parseSchedule, type ParseScheduleResult } from '../../common/src/schedule';
import type { UnitSystemId } from '../../common/src/units';
import { findCategory } from '../../common/src/limits';
import { DEMO_CATEGORIES, DEMO_LIMIT_SET } from './categories';
import { halvercoteYardSI, halvercoteYardUS, LEVELS, type SampleSchedule } from './halvercote-yard';
import { sheetData } from './read-workbook';
import { membersCsv, workbookBytes, writeSampleWorkbook } from './schedule-workbook';

const OUT = join(__dirname, '..');

async function checkWorkbook(bytes: Buffer, unitSystem: UnitSystemId): Promise<ParseScheduleResult> {
  const wb = new ExcelJS.Workbook();
  await wb.xlsx.load(bytes as unknown as ArrayBuffer);
  const names = wb.worksheets.map((w) => w.name);
  const members = wb.getWorksheet(findSheet(names, 'members')!)!;
  const loadsName = findSheet(names, 'loads');
  return parseSchedule({
    members: sheetData(members),
    ...(loadsName ? { loads: sheetData(wb.getWorksheet(loadsName)!) } : {}),
    unitSystem,
    categories: CATEGORIES,
    levels: LEVELS,
  });
}

function report(file: string, result: ParseScheduleResult, schedule?: SampleSchedule): void {
  const { summary } = result;
  console.log(`${file}: ${summary.memberRows} members, ${summary.loadRows} load rows, ${summary.errors} errors, ${summary.warnings} warnings`);
  for (const p of result.problems.slice(0, 20)) console.log(`  ${p.severity} ${p.code}: ${p.message}`);
  if (schedule) {
    const n = schedule.expectedFailures.length;
    console.log(`  estimated to fail: ${n} of ${schedule.members.length} (${((100 * n) / schedule.members.length).toFixed(1)} %)`);
  }
  if (summary.errors > 0) throw new Error(`${file} does not parse cleanly`);
}

async function writeExample(file: string, unitSystem: UnitSystemId, schedule: SampleSchedule, title: string): Promise<void> {
  const wb = new ExcelJS.Workbook();
  writeSampleWorkbook(wb, { unitSystem, categories: CATEGORIES, categoryLabels: LABELS, members: schedule.members, loads: schedule.loads, title });
  const bytes = await workbookBytes(wb);
  writeFileSync(join(OUT, file), bytes);
  report(file, await checkWorkbook(bytes, unitSystem), schedule);
}

/** The template offers every category of the demo limit set, with its label on the Codes sheet. */
const CATEGORIES: readonly string[] = DEMO_LIMIT_SET.categories;
const LABELS: Record<string, string> = Object.fromEntries(
  DEMO_LIMIT_SET.categories.map((id) => [id, findCategory(id)?.label ?? 'limit-set category']),
);

async function main(): Promise<void> {
  const unknown = DEMO_CATEGORIES.filter((c) => !CATEGORIES.includes(c));
  if (unknown.length) throw new Error(`demo categories not in the limit set "${DEMO_LIMIT_SET.name}": ${unknown.join(', ')}`);
  const si = halvercoteYardSI();
  await writeExample('halvercote-yard.xlsx', 'SI', si, 'Halvercote Yard: member schedule, revision A (invented demo project, SI units)');

  const csv = membersCsv({ unitSystem: 'SI', members: si.members });
  writeFileSync(join(OUT, 'halvercote-yard-members.csv'), csv);
  const csvResult = parseSchedule({ members: csvSheet(csv), unitSystem: 'SI', categories: CATEGORIES, levels: LEVELS });
  // The CSV has no Loads sheet, so the girders' point loads are missing: only errors matter here.
  report('halvercote-yard-members.csv', { ...csvResult, problems: csvResult.problems.filter((p) => p.severity === 'error') });

  const us = halvercoteYardUS();
  await writeExample('halvercote-yard-us.xlsx', 'US', us, 'Halvercote Yard annex: member schedule, revision A (invented demo project, US customary units)');

  const template = new ExcelJS.Workbook();
  writeSampleWorkbook(template, { unitSystem: 'SI', categories: CATEGORIES, categoryLabels: LABELS });
  const templateBytes = await workbookBytes(template);
  writeFileSync(join(OUT, 'member-schedule-template.xlsx'), templateBytes);
  const t = await checkWorkbook(templateBytes, 'SI');
  console.log(`member-schedule-template.xlsx: ${t.problems.map((p) => p.code).join(', ') || 'no problems'} (an empty template reports NO_MEMBERS)`);

  const failures = [...si.expectedFailures].sort((a, b) => b.utilisation - a.utilisation);
  console.log('Estimated failures (SI):', failures.map((f) => `${f.mark} ${f.check} ${f.utilisation}`).join('; '));
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});

import type { CellValue, SheetData } from '../cells';
import { parseSchedule } from '../parse-schedule';
import type { ParseScheduleInput, ScheduleProblem } from '../types';

/** Some category ids of the limit-set presets (common/src/limits MEMBER_CATEGORIES). */
export const CATEGORIES = [
  'floor',
  'roof-plaster-ceiling',
  'roof-nonplaster-ceiling',
  'roof-no-ceiling',
  'supports-masonry',
  'supports-glass',
  'concrete-damage-prone',
  'concrete-not-damage-prone',
];

export const SI_HEADER = [
  'Mark', 'Level', 'Grid', 'Category', 'Material', 'Spans [m]', 'Left overhang [m]', 'Right overhang [m]',
  'Supports', 'E [GPa]', 'I [10^6 mm^4]', 'Depth [mm]', 'Camber [mm]', 'D [kN/m]', 'L [kN/m]', 'Reviewer', 'Notes',
];

/** A valid SI member row keyed by header, with overrides. */
export function siRow(overrides: Record<string, CellValue> = {}): Record<string, CellValue> {
  return {
    Mark: 'L2-B1', Level: 'L2', Grid: 'C/3-4', Category: 'floor', Material: 'steel', 'Spans [m]': 7.2,
    'Supports': 'pinned', 'E [GPa]': 200, 'I [10^6 mm^4]': 186, 'Depth [mm]': 403, 'D [kN/m]': 3.5, 'L [kN/m]': 6,
    Reviewer: 'ines.okafor@halvercote.example',
    ...overrides,
  };
}

/** A sheet from a header and rows keyed by header text (keys not in the header are errors in the test). */
export function sheet(name: string, header: string[], rows: Record<string, CellValue>[]): SheetData {
  return {
    name,
    rows: [
      header,
      ...rows.map((row) => {
        for (const key of Object.keys(row)) if (!header.includes(key)) throw new Error(`test row has "${key}", not in the header`);
        return header.map((h) => row[h] ?? null);
      }),
    ],
  };
}

export const LOADS_HEADER = ['Mark', 'Case', 'Kind', 'Position [m]', 'From [m]', 'To [m]', 'Value [kN, kN/m, kN·m]', 'End value [kN/m]', 'Notes'];

export function parseSI(rows: Record<string, CellValue>[], loads?: Record<string, CellValue>[], extra: Partial<ParseScheduleInput> = {}) {
  return parseSchedule({
    unitSystem: 'SI',
    categories: CATEGORIES,
    members: sheet('Members', SI_HEADER, rows),
    ...(loads ? { loads: sheet('Loads', LOADS_HEADER, loads) } : {}),
    ...extra,
  });
}

export function errors(problems: ScheduleProblem[]): ScheduleProblem[] {
  return problems.filter((p) => p.severity === 'error');
}

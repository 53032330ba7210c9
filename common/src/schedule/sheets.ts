import { wordKey } from './codes';

/** Sheet names of a schedule workbook. Readers match them ignoring case and spaces. */
export const SHEET_NAMES = {
  members: 'Members',
  loads: 'Loads',
  help: 'How to fill in',
  codes: 'Codes',
} as const;

const ALIASES: Record<'members' | 'loads', string[]> = {
  members: ['Members', 'Member schedule', 'Schedule', 'Beams'],
  loads: ['Loads', 'Member loads', 'Point loads'],
};

/**
 * The name of the Members or Loads sheet among a workbook's sheet names, or
 * undefined. A workbook with one sheet (or a CSV) is taken as its Members sheet.
 */
export function findSheet(names: readonly string[], which: 'members' | 'loads'): string | undefined {
  const keys = ALIASES[which].map(wordKey);
  const found = names.find((n) => keys.includes(wordKey(n)));
  if (found !== undefined) return found;
  return which === 'members' && names.length === 1 ? names[0] : undefined;
}

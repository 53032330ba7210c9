import { combinationName } from '@sagline/common/limits';

/**
 * A combination as people write it ("D + L", "0.5D+L", "L", "0.42W") to
 * and from the factors the API keeps ({ D: 0.5, L: 1 }). The written form
 * is common/limits combinationName, so what the form shows is what the
 * checks table and the results workbook show.
 */
export const formatCombination = (c: Record<string, number>): string => combinationName(c);

const TERM = /^([+-]?)(\d+(?:\.\d+)?|\.\d+)?\s*\*?\s*([A-Za-z][A-Za-z0-9]{0,7})$/;

export function parseCombination(text: string): { value: Record<string, number> } | { error: string } {
  const compact = text.replace(/\s+/g, '');
  if (compact === '') return { error: 'Write the load cases with their factors, e.g. "L", "D+L" or "0.5D+L".' };
  const terms = compact.match(/[+-]?[^+-]+/g) ?? [];
  const value: Record<string, number> = {};
  for (const term of terms) {
    const m = TERM.exec(term);
    if (!m) return { error: `"${term.replace(/^[+-]/, '')}" is not a factor and a load case; write e.g. "0.5D" or "L".` };
    const [, sign, factor, label] = m;
    if (label in value) return { error: `${label} appears twice; write each load case once.` };
    const f = (factor === undefined ? 1 : Number(factor)) * (sign === '-' ? -1 : 1);
    value[label] = f;
  }
  return { value };
}

import { fontFamily, palette } from '@/app/theme';

/**
 * Colours and line styles of the member drawing, from the app palette
 * (app/theme.ts) plus a few muted companions. Colour never carries meaning
 * alone: every load lane has its case label, every curve its own dash
 * pattern, a legend entry and named labels.
 */
export const drawingInk = {
  text: palette.ink,
  muted: palette.slateLight,
  member: palette.slate,
  support: palette.slateLight,
  dimension: '#5d6d78',
  axis: '#9aa8b1',
  lane: palette.line,
  background: '#ffffff',
} as const;

export const drawingFont = fontFamily;

/**
 * Load cases that recur on every project keep one colour across members, so
 * a checker learns them; any other case takes the next free colour.
 */
const CASE_COLOURS: Readonly<Record<string, string>> = {
  D: '#55606b',
  L: palette.primary,
  Lr: '#3f8c80',
  S: palette.info,
  W: '#6a4f8f',
  E: '#8a5a3c',
};
const SPARE_CASE_COLOURS = ['#946a1c', '#7a4560', '#3c6e8f', '#5f7a35', '#7f5b3a', '#4b5d94'];

/** A colour for every load case of a member, in order of first appearance. */
export function caseColours(cases: readonly string[]): Map<string, string> {
  const out = new Map<string, string>();
  const taken = new Set<string>();
  for (const c of cases) {
    const fixed = CASE_COLOURS[c];
    if (fixed && !taken.has(fixed)) {
      out.set(c, fixed);
      taken.add(fixed);
    }
  }
  let spare = 0;
  for (const c of cases) {
    if (out.has(c)) continue;
    const free = SPARE_CASE_COLOURS.filter((col) => !taken.has(col));
    const colour = free.length ? free[spare % free.length] : SPARE_CASE_COLOURS[spare % SPARE_CASE_COLOURS.length];
    spare++;
    out.set(c, colour);
    taken.add(colour);
  }
  return out;
}

export interface CurveStyle {
  colour: string;
  /** SVG stroke-dasharray, or undefined for a solid line. */
  dash?: string;
}

/**
 * Curve styles by the combination's position in the drawing. The red of a
 * failing verdict (palette.fail) is left out: a curve is not a verdict.
 */
const CURVE_STYLES: readonly CurveStyle[] = [
  { colour: palette.info },
  { colour: palette.caution, dash: '8 4' },
  { colour: palette.primary, dash: '2 3' },
  { colour: '#6a4f8f', dash: '10 3 2 3' },
  { colour: '#55606b', dash: '4 2' },
  { colour: '#8a5a3c', dash: '12 4' },
];

export function curveStyle(index: number): CurveStyle {
  return CURVE_STYLES[index % CURVE_STYLES.length];
}

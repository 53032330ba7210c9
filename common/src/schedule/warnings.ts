import type { SheetData } from './cells';
import type { BoundColumn } from './header';
import { placeLabel, type ProblemList, type Where } from './problems';
import { shown } from './read-cells';
import type { ScheduleMember } from './types';

/**
 * Plausibility warnings. They never block an import; they point at the usual
 * slips (a value in the wrong unit, a depth in inches under an mm header).
 *
 * - SLENDER: governing length / depth > 40. The governing length is the longest
 *   span, or twice an overhang or a cantilever (the effective length the
 *   checks use, IBC Table 1604.3 footnote on cantilevers). 40 is a rule of
 *   thumb for deflection-governed beams and joists (common practice, no source).
 * - I_OUTLIER: compared with the other members of the same category and
 *   material whose governing length is within a factor 1.25 of this member's
 *   (at least 5 of them), I is more than 10 times above or below their median.
 *   Where depths are given, I / depth³ is compared instead of I, so that a
 *   joist is not measured against the deeper girder it sits on; members with
 *   and without a depth are not mixed (Sagline's own rule).
 */
export const SLENDER_RATIO = 40;
export const I_OUTLIER_FACTOR = 10;
export const I_PEER_LENGTH_RATIO = 1.25;
export const I_MIN_PEERS = 5;

/** Longest span, or twice the longest overhang or cantilever, m. */
export function governingLength(m: ScheduleMember): number {
  if (m.supports === 'cantilever-left' || m.supports === 'cantilever-right') return 2 * m.spans[0];
  return Math.max(...m.spans, 2 * m.leftOverhang, 2 * m.rightOverhang);
}

interface Columns {
  depth?: BoundColumn;
  I?: BoundColumn;
  spans?: BoundColumn;
}

function at(sheet: SheetData, m: ScheduleMember, col: BoundColumn | undefined): Where {
  return {
    sheet: sheet.name,
    row: m.sourceRow,
    column: col ? { letter: col.letter, header: col.header } : null,
    mark: m.mark,
    value: col ? sheet.rows[m.sourceRow - 1]?.[col.index] : undefined,
  };
}

export function addWarnings(sheet: SheetData, members: readonly ScheduleMember[], cols: Columns, problems: ProblemList): void {
  for (const m of members) {
    if (m.loads.length === 0) {
      const w = at(sheet, m, undefined);
      problems.warning('NO_LOADS', w, `${placeLabel(w)}: member ${m.mark} has no loads, so there is nothing to check. Fill in its load columns (D, L, …) or add rows for it on the Loads sheet.`);
    }
    if (m.depth !== null) {
      const g = governingLength(m);
      const ratio = g / m.depth;
      if (ratio > SLENDER_RATIO) {
        const w = at(sheet, m, cols.depth);
        problems.warning(
          'SLENDER',
          w,
          `${placeLabel(w)}: span-to-depth ratio is ${ratio.toFixed(0)} (${shown(g, cols.spans?.unit)} / ${shown(m.depth, cols.depth?.unit)}), above ${SLENDER_RATIO}. Check the span, the depth and the units in their headers.`,
        );
      }
    }
  }
  addInertiaOutliers(sheet, members, cols, problems);
}

/** Index of the first element ≥ v in an ascending array. */
function lowerBound(sorted: number[], v: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (sorted[mid] < v) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Median of an ascending array with one occurrence of `self` left out. */
function medianWithout(sorted: number[], self: number): number {
  const skip = lowerBound(sorted, self);
  const m = sorted.length - 1;
  const at = (rank: number) => sorted[rank < skip ? rank : rank + 1];
  return m % 2 ? at((m - 1) >> 1) : (at(m / 2 - 1) + at(m / 2)) / 2;
}

function addInertiaOutliers(sheet: SheetData, members: readonly ScheduleMember[], cols: Columns, problems: ProblemList): void {
  // Members with a depth are compared by I / depth³ (a shape factor), the others by I;
  // the two kinds are never mixed.
  const groups = new Map<string, { m: ScheduleMember; g: number; k: number }[]>();
  for (const m of members) {
    const key = `${m.category}\u0000${m.material}\u0000${m.depth === null ? 'I' : 'k'}`;
    const list = groups.get(key) ?? [];
    list.push({ m, g: governingLength(m), k: m.depth === null ? m.I : m.I / m.depth ** 3 });
    groups.set(key, list);
  }
  const found: { m: ScheduleMember; message: string }[] = [];
  for (const list of groups.values()) {
    if (list.length <= I_MIN_PEERS) continue;
    list.sort((a, b) => a.g - b.g);
    // The window of similar spans only moves right, so keep its values sorted as it slides.
    const window: number[] = [];
    let lo = 0;
    let hi = -1;
    for (let i = 0; i < list.length; i++) {
      const { m, g, k } = list[i];
      while (hi + 1 < list.length && list[hi + 1].g <= g * I_PEER_LENGTH_RATIO) {
        hi++;
        window.splice(lowerBound(window, list[hi].k), 0, list[hi].k);
      }
      while (list[lo].g < g / I_PEER_LENGTH_RATIO) {
        window.splice(lowerBound(window, list[lo].k), 1);
        lo++;
      }
      const peers = window.length - 1;
      if (peers < I_MIN_PEERS) continue;
      const med = medianWithout(window, k);
      const factor = k > med ? k / med : med / k;
      if (factor <= I_OUTLIER_FACTOR) continue;
      const unit = cols.I?.unit;
      const similar = `${peers} other ${m.category} ${m.material} members of similar span (${shown(list[lo].g, cols.spans?.unit)} to ${shown(list[hi].g, cols.spans?.unit)})`;
      const expected =
        m.depth === null
          ? `than the median I (${shown(med, unit)}) of ${similar}`
          : `than the ${shown(med * m.depth ** 3, unit)} that ${similar} would have at its depth of ${shown(m.depth, cols.depth?.unit)} (median I / depth³)`;
      found.push({
        m,
        message: `I = ${shown(m.I, unit)} is ${factor.toFixed(0)} times ${k > med ? 'larger' : 'smaller'} ${expected}. Check the value and the unit in the I header (e.g. [mm^4] against [10^6 mm^4], or [in^4]).`,
      });
    }
  }
  found.sort((a, b) => a.m.sourceRow - b.m.sourceRow);
  for (const { m, message } of found) {
    const w = at(sheet, m, cols.I);
    problems.warning('I_OUTLIER', w, `${placeLabel(w)}: ${message}`);
  }
}

import type { Check, CheckSegmentResult, PointDeflection, Segment } from './types';

/**
 * Effective length of a segment for a ratio limit, m: the span for a span and
 * TWICE the length for an overhang or cantilever (IBC 2021 Table 1604.3,
 * cantilever footnote, letter from memory; the same rule is note b of IRC
 * Table R301.7, verified — domain.md §2.1).
 */
export function effectiveLength(segment: Segment): number {
  const l = segment.to - segment.from;
  return segment.kind === 'overhang' ? 2 * l : l;
}

/**
 * One check on one segment (calc-contract.md, "Checks"):
 * - allowed = min(effectiveLength / ratio + plus, maxAbs), m; `plus` is the
 *   additive allowance of IBC §1604.3.7 (l/240 + 1/4 in), default 0;
 * - pass when |deflection| ≤ allowed (the sign does not matter: an upward
 *   bulge is checked by its magnitude);
 * - utilization = |deflection| / allowed;
 * - spanRatio = effectiveLength / |deflection|, or null for a deflection of
 *   exactly zero or so small that the ratio overflows (no finite ratio
 *   exists; the check passes) — never Infinity;
 * - requiredI = I·|deflection| / allowed, m^4: deflection is proportional to
 *   1/I for fixed loads, so this I gives utilization 1 (0 when nothing deflects).
 */
export function checkSegment(segment: Segment, extreme: PointDeflection, check: Check, I: number): CheckSegmentResult {
  return checkSegmentAt(segment, extreme.x, extreme.deflection, check, I);
}

/** checkSegment with the extreme given as x (m) and deflection (m, up). */
export function checkSegmentAt(segment: Segment, x: number, d: number, check: Check, I: number): CheckSegmentResult {
  const eff = effectiveLength(segment);
  const plus = check.plus ?? 0;
  const maxAbs = check.maxAbs ?? null;
  const byRatio = eff / check.ratio + plus;
  const governing = maxAbs !== null && maxAbs < byRatio ? 'maxAbs' : 'ratio';
  const allowed = governing === 'maxAbs' ? (maxAbs as number) : byRatio;
  const mag = Math.abs(d);
  const ratio = eff / mag;
  return {
    from: segment.from,
    to: segment.to,
    kind: segment.kind,
    x,
    deflection: d,
    effectiveLength: eff,
    spanRatio: Number.isFinite(ratio) ? ratio : null,
    limitRatio: check.ratio,
    maxAbs,
    plus,
    allowed,
    governing,
    utilization: mag / allowed,
    pass: mag <= allowed,
    requiredI: (I * mag) / allowed,
  };
}

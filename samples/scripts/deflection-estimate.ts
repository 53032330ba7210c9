/**
 * A rough, closed-form deflection estimate used ONLY to size the invented demo
 * members so that most pass and a few fail. It is not the engine and nothing
 * outside samples/scripts may use it.
 *
 * - Span between two supports: treated as simply supported (continuity and
 *   fixity only reduce it), midspan deflection from the unit-load influence
 *   δ(u) = u(3L² − 4u²)/48EI, u ≤ L/2 (AISC Manual 15th ed., Table 3-23 case 8,
 *   deflection at the centre). A full-length uniform load gives 5wL⁴/384EI.
 * - Overhang of length a beyond a support with back span l, loads on the
 *   overhang only (back-span loads lift the tip, so this is on the safe side):
 *   load at s from the support gives s²(3a − s)/6EI + s·l·a/3EI at the tip
 *   (cantilever plus back-span rotation; AISC Table 3-23 cases 25–26).
 * - Cantilever of length L: s²(3L − s)/6EI (Table 3-23 cases 19, 21, 22).
 * Distributed loads are integrated with Simpson's rule; concentrated moments are ignored.
 * All SI (m, N, N/m, Pa).
 */
import type { SupportCode } from '../../common/src/schedule';

export type EstimateLoad =
  | { case: string; kind: 'udl'; x1: number; x2: number; w: number }
  | { case: string; kind: 'point'; x: number; P: number }
  | { case: string; kind: 'linear'; x1: number; x2: number; w1: number; w2: number }
  | { case: string; kind: 'moment'; x: number; M: number };

export interface EstimateMember {
  spans: number[];
  leftOverhang: number;
  rightOverhang: number;
  supports: SupportCode;
  E: number;
  loads: EstimateLoad[];
}

/** A check as the engine takes it: allowed = min(l_eff / ratio + plus, maxAbs). */
export interface EstimateCheck {
  name: string;
  combination: Record<string, number>;
  ratio: number;
  maxAbs?: number | null;
  plus?: number | null;
}

/** Line load intensity of a distributed load at x (0 outside it). */
function intensity(load: EstimateLoad, x: number): number {
  if (load.kind === 'udl') return x >= load.x1 && x <= load.x2 ? load.w : 0;
  if (load.kind === 'linear') return x >= load.x1 && x <= load.x2 ? load.w1 + ((load.w2 - load.w1) * (x - load.x1)) / (load.x2 - load.x1) : 0;
  return 0;
}

/** ∫ w(x) k(x) dx over [a, b] plus Σ P k(x), with the load factors of a combination. */
function integrate(loads: EstimateLoad[], combo: Record<string, number>, a: number, b: number, k: (x: number) => number): number {
  let total = 0;
  for (const load of loads) {
    const f = combo[load.case] ?? 0;
    if (f === 0) continue;
    if (load.kind === 'point') {
      if (load.x >= a && load.x <= b) total += f * load.P * k(load.x);
      continue;
    }
    if (load.kind === 'moment') continue;
    const lo = Math.max(a, load.x1);
    const hi = Math.min(b, load.x2);
    if (hi <= lo) continue;
    const n = 64;
    const h = (hi - lo) / n;
    let sum = 0;
    for (let i = 0; i <= n; i++) {
      const x = lo + i * h;
      const weight = i === 0 || i === n ? 1 : i % 2 ? 4 : 2;
      sum += weight * intensity(load, x) * k(x);
    }
    total += (f * sum * h) / 3;
  }
  return total;
}

export interface SegmentEstimate {
  kind: 'span' | 'overhang';
  from: number;
  to: number;
  effectiveLength: number;
  /** Deflection × I (m⁵): divide by I for the deflection magnitude. */
  deflectionTimesI: number;
}

export function estimateSegments(m: EstimateMember, combo: Record<string, number>): SegmentEstimate[] {
  const out: SegmentEstimate[] = [];
  if (m.supports === 'cantilever-left' || m.supports === 'cantilever-right') {
    const L = m.spans[0];
    const fixedAt = m.supports === 'cantilever-left' ? 0 : L;
    const k = (x: number) => {
      const s = Math.abs(x - fixedAt);
      return (s * s * (3 * L - s)) / 6;
    };
    out.push({ kind: 'overhang', from: 0, to: L, effectiveLength: 2 * L, deflectionTimesI: integrate(m.loads, combo, 0, L, k) / m.E });
    return out;
  }
  let x = m.leftOverhang;
  if (m.leftOverhang > 0) {
    const a = m.leftOverhang;
    const l = m.spans[0];
    const k = (xx: number) => {
      const s = a - xx;
      return (s * s * (3 * a - s)) / 6 + (s * l * a) / 3;
    };
    out.push({ kind: 'overhang', from: 0, to: a, effectiveLength: 2 * a, deflectionTimesI: integrate(m.loads, combo, 0, a, k) / m.E });
  }
  for (const L of m.spans) {
    const left = x;
    const k = (xx: number) => {
      const u0 = xx - left;
      const u = u0 <= L / 2 ? u0 : L - u0;
      return (u * (3 * L * L - 4 * u * u)) / 48;
    };
    out.push({ kind: 'span', from: left, to: left + L, effectiveLength: L, deflectionTimesI: integrate(m.loads, combo, left, left + L, k) / m.E });
    x += L;
  }
  if (m.rightOverhang > 0) {
    const a = m.rightOverhang;
    const l = m.spans[m.spans.length - 1];
    const support = x;
    const k = (xx: number) => {
      const s = xx - support;
      return (s * s * (3 * a - s)) / 6 + (s * l * a) / 3;
    };
    out.push({ kind: 'overhang', from: support, to: support + a, effectiveLength: 2 * a, deflectionTimesI: integrate(m.loads, combo, support, support + a, k) / m.E });
  }
  return out;
}

/** The I (m⁴) at which the estimated worst check just passes. */
export function estimateRequiredI(m: EstimateMember, checks: readonly EstimateCheck[]): number {
  let required = 0;
  for (const check of checks) {
    for (const seg of estimateSegments(m, check.combination)) {
      let allowed = seg.effectiveLength / check.ratio + (check.plus ?? 0);
      if (check.maxAbs != null) allowed = Math.min(allowed, check.maxAbs);
      required = Math.max(required, Math.abs(seg.deflectionTimesI) / allowed);
    }
  }
  return required;
}

/** Estimated deflection (m, magnitude) of the worst segment under one combination. */
export function estimateDeflection(m: EstimateMember, combo: Record<string, number>, I: number): number {
  return Math.max(0, ...estimateSegments(m, combo).map((s) => Math.abs(s.deflectionTimesI) / I));
}

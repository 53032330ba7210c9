/**
 * The JSON shapes of one member's analysis (calc-contract.md). Every number is
 * in SI base units: m, N, N/m, N·m, Pa, m^4.
 *
 * Signs (calc-contract.md, "Units and signs"):
 * - x runs from the left end of the member (x = 0) to the right end (x = length);
 * - forces and distributed loads are positive DOWNWARD (gravity);
 * - a concentrated moment is positive COUNTER-CLOCKWISE (x to the right, y up);
 * - deflection is positive UP: a sagging beam has negative deflection.
 */

/** `pin` restrains vertical movement only; `fixed` restrains movement and rotation. */
export type SupportKind = 'pin' | 'fixed';

export interface Support {
  /** Position from the left end, m, 0 ≤ x ≤ length. */
  x: number;
  kind: SupportKind;
}

/** A concentrated force P (N, positive down) at x (m). */
export interface PointLoad {
  case: string;
  kind: 'point';
  x: number;
  P: number;
}

/** A uniform line load w (N/m, positive down) from x1 to x2 (m), x1 < x2. */
export interface UdlLoad {
  case: string;
  kind: 'udl';
  x1: number;
  x2: number;
  w: number;
}

/** A line load varying linearly from w1 at x1 to w2 at x2 (N/m, positive down), x1 < x2. */
export interface LinearLoad {
  case: string;
  kind: 'linear';
  x1: number;
  x2: number;
  w1: number;
  w2: number;
}

/** A concentrated moment M (N·m, positive counter-clockwise) at x (m). */
export interface MomentLoad {
  case: string;
  kind: 'moment';
  x: number;
  M: number;
}

/** One load, tagged with its load case (any short label: D, L, Lr, S, W, …). */
export type Load = PointLoad | UdlLoad | LinearLoad | MomentLoad;
export type LoadKind = Load['kind'];

/** Factors per load case, e.g. `{ "D": 1, "L": 1 }`. Cases not named have factor 0. */
export type Combination = Record<string, number>;

/**
 * One serviceability check of a combination, applied to every segment.
 * Allowed deflection = min(effectiveLength / ratio + plus, maxAbs).
 */
export interface Check {
  name: string;
  /** Name of a combination of the same BeamInput. */
  combination: string;
  /** The n of l/n, > 0. */
  ratio: number;
  /** Absolute cap, m (> 0), or null/absent for none. */
  maxAbs?: number | null;
  /**
   * Additive allowance, m (≥ 0), default 0: the ratio allowance becomes
   * effectiveLength / ratio + plus (IBC 2018 and later §1604.3.7, l/240 + 1/4 in).
   */
  plus?: number | null;
}

export interface BeamInput {
  /** Member length, m, > 0. */
  length: number;
  /** Young's modulus, Pa, > 0. */
  E: number;
  /** Second moment of area, m^4, > 0. */
  I: number;
  supports: Support[];
  loads: Load[];
  /** Named combinations; names are stable keys of the report. */
  combinations: Record<string, Combination>;
  /** Points (m) where the deflection of every combination is also reported. */
  probes?: number[];
  checks?: Check[];
}

// ---------------------------------------------------------------- report

export type SegmentKind = 'span' | 'overhang';

/** A stretch between two adjacent supports (span) or beyond the outermost support to a free end (overhang). */
export interface Segment {
  from: number;
  to: number;
  kind: SegmentKind;
}

/** A signed deflection (m, positive up) at x (m). */
export interface PointDeflection {
  x: number;
  deflection: number;
}

/** One load's signed share of a combination's deflection at one point. */
export interface Contribution {
  /** Index into BeamInput.loads. */
  load: number;
  case: string;
  /** The combination's factor on this load's case. */
  factor: number;
  /** factor × this load's own deflection at the point, m, positive up. */
  deflection: number;
}

export interface SegmentReport extends Segment {
  /** The largest-magnitude signed deflection within the segment, located as a root of y′ on the exact curve. */
  extreme: PointDeflection;
  /** Every load of the combination's cases, in load order; their deflections sum to extreme.deflection. */
  contributions: Contribution[];
}

/**
 * Support reaction under a combination (added field, not in the minimum contract).
 * force: N, positive UP; moment: N·m, positive counter-clockwise (0 at a pin).
 */
export interface Reaction {
  x: number;
  kind: SupportKind;
  force: number;
  moment: number;
}

export interface CombinationReport {
  probes: PointDeflection[];
  segments: SegmentReport[];
  /** Added field: one reaction per distinct support position, left to right. */
  reactions: Reaction[];
}

export interface CheckSegmentResult extends Segment {
  /** Where the segment's extreme deflection is, m. */
  x: number;
  /** The segment's extreme deflection under the check's combination, m, positive up. */
  deflection: number;
  /** Span length for a span, 2 × length for an overhang (IBC 2021 Table 1604.3 cantilever footnote). */
  effectiveLength: number;
  /** effectiveLength / |deflection|; null when the deflection is exactly zero (never Infinity). */
  spanRatio: number | null;
  limitRatio: number;
  /** The check's absolute cap, m, or null. */
  maxAbs: number | null;
  /** Added: the additive allowance, m (0 when none). */
  plus: number;
  /** Added: the governing allowed deflection magnitude, m = min(effectiveLength/ratio + plus, maxAbs). */
  allowed: number;
  /** Added: which limit governs the allowance ('maxAbs' only when strictly smaller). */
  governing: 'ratio' | 'maxAbs';
  /** |deflection| / allowed. */
  utilization: number;
  pass: boolean;
  /** I (m^4) at which this check would just pass: I·|deflection|/allowed (deflection ∝ 1/I). */
  requiredI: number;
}

export interface CheckReport {
  name: string;
  combination: string;
  segments: CheckSegmentResult[];
  /** Added: every segment passes. */
  pass: boolean;
  /** Added: the largest utilization over the segments. */
  utilization: number;
}

export interface BeamReport {
  segments: Segment[];
  combinations: Record<string, CombinationReport>;
  checks: CheckReport[];
}

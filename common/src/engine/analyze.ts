import * as solutionModule from './beam-solution';
import type { BeamSolution } from './beam-solution';
import * as checksModule from './checks';
import { EngineError } from './engine-error';
import * as polyRootsModule from './poly-roots';
import type {
  BeamInput,
  BeamReport,
  CheckReport,
  CheckSegmentResult,
  Combination,
  CombinationReport,
  Contribution,
  PointDeflection,
  Reaction,
  Segment,
  SegmentReport,
} from './types';
// Imported functions are bound once here: under tsx (esbuild's CommonJS interop) every call
// through an import binding runs an accessor, which also blocks inlining on the hot path.
const { BeamSolution: Solver, PART_MOMENT, PART_POINT, SEG_SPAN } = solutionModule;
const { checkSegmentAt } = checksModule;
const { bernsteinBound, derivativeRootsInUnit, isMonotonic } = polyRootsModule;

type F64 = Float64Array<ArrayBuffer>;

/**
 * The combined (factored, superposed) state of one combination on the solved
 * member: a factor per load, nodal values, and per segment the clamped-end
 * moment and shear of all its load parts. Buffers are reused.
 */
export class CombinedCurve {
  /** The combination's factor on each load (its case's factor, 0 when the case is not named). */
  loadFactor: F64 = new Float64Array(16);
  /** 1 when the combination names the case (contributions list those loads). */
  caseNamed = new Uint8Array(16);
  caseFactor: F64 = new Float64Array(16);
  U: F64 = new Float64Array(32);
  M0: F64 = new Float64Array(16);
  V0: F64 = new Float64Array(16);
  private perLoad: F64 = new Float64Array(16);

  constructor(private readonly sol: BeamSolution) {}

  /** Superposes the loads of `combination` (factors per case; names of cases no load has are ignored). */
  combine(combination: Combination): void {
    const sol = this.sol;
    const nc = sol.cases.length;
    if (this.caseFactor.length < nc) {
      this.caseFactor = new Float64Array(nc * 2);
      this.caseNamed = new Uint8Array(nc * 2);
    }
    this.caseNamed.fill(0, 0, nc);
    this.caseFactor.fill(0, 0, nc);
    // for-in with a keyed read is V8's fast path; a lookup by each case name would be megamorphic.
    for (const name in combination) {
      const f = combination[name];
      for (let c = 0; c < nc; c++) {
        if (sol.cases[c] === name) {
          this.caseNamed[c] = 1;
          this.caseFactor[c] = f;
          break;
        }
      }
    }
    const nl = sol.nLoads;
    if (this.loadFactor.length < nl) {
      this.loadFactor = new Float64Array(nl * 2);
      this.perLoad = new Float64Array(nl * 2);
    }
    const lf = this.loadFactor;
    for (let k = 0; k < nl; k++) lf[k] = this.caseFactor[sol.loadCase[k]];
    const n = sol.nDof;
    if (this.U.length < n) this.U = new Float64Array(n * 2);
    const U = this.U;
    const u = sol.u;
    for (let i = 0; i < n; i++) {
      let s = 0;
      const base = i * nl;
      for (let k = 0; k < nl; k++) s += lf[k] * u[base + k];
      U[i] = s;
    }
    const ns = sol.nSeg;
    if (this.M0.length < ns) {
      this.M0 = new Float64Array(ns * 2);
      this.V0 = new Float64Array(ns * 2);
    }
    this.M0.fill(0, 0, ns);
    this.V0.fill(0, 0, ns);
    for (let p = 0; p < sol.nParts; p++) {
      const f = lf[sol.partLoad[p]];
      if (f === 0) continue;
      const g = sol.partSeg[p];
      this.M0[g] += f * sol.partM0[p];
      this.V0[g] += f * sol.partV0[p];
    }
  }

  /** Combined deflection (m, up) at local t of segment g: the factored sum of each load's own deflection. */
  at(g: number, t: number): number {
    const sol = this.sol;
    sol.loadDeflections(g, t, this.perLoad);
    let y = 0;
    for (let k = 0; k < sol.nLoads; k++) y += this.loadFactor[k] * this.perLoad[k];
    return y;
  }
}

/** Where a segment's extreme is: local t, global x and value. */
interface ExtremeHit {
  t: number;
  x: number;
  y: number;
}

/** Pieces of one segment (between consecutive load points): start t, length h, coefficients in τ ∈ [0, 1]. */
let pieceT: F64 = new Float64Array(32);
let pieceH: F64 = new Float64Array(32);
let pieceC: F64 = new Float64Array(32 * 6);
let pieceBound: F64 = new Float64Array(32);
let active = new Int32Array(32);
const roots = new Float64Array(6);

/**
 * Builds the pieces of segment g under the combined state, sweeping from the
 * segment's origin: the Taylor coefficients c0..c5 of the deflection (m)
 * about the current point start from the nodal part (Hermite cubic on a span,
 * rigid rotation on an overhang) plus M0·t²/2EI + V0·t³/6EI; at each load
 * point a force adds −P/6EI to c3, a couple −M/2EI to c2; c4 = −q/24EI and
 * c5 = −q′/120EI follow the line loads acting there; across a piece the
 * coefficients are Taylor-shifted exactly. Returns the number of pieces.
 */
function buildPieces(sol: BeamSolution, curve: CombinedCurve, g: number): number {
  const le = sol.segLen[g];
  const inv = sol.invEI;
  const U = curve.U;
  const lf = curve.loadFactor;
  const j = sol.segNode[g];
  let c1: number;
  let c2 = (curve.M0[g] * inv) / 2;
  let c3 = (curve.V0[g] * inv) / 6;
  if (sol.segKind[g] === SEG_SPAN) {
    const th1 = U[2 * j + 1];
    const th2 = U[2 * j + 3];
    c1 = th1;
    c2 -= (2 * th1 + th2) / le;
    c3 += (th1 + th2) / (le * le);
  } else c1 = sol.segDir[g] * U[2 * j + 1];
  let c0 = 0;
  let c4 = 0;
  let c5 = 0;
  const e1 = sol.eventStart[g + 1];
  let e = sol.eventStart[g];
  let nActive = 0;
  let count = 0;
  let pos = 0;
  const maxPieces = 2 * (e1 - e) + 1;
  if (pieceT.length < maxPieces) {
    pieceT = new Float64Array(maxPieces * 2);
    pieceH = new Float64Array(maxPieces * 2);
    pieceBound = new Float64Array(maxPieces * 2);
    pieceC = new Float64Array(maxPieces * 12);
  }
  if (active.length < e1 - e) active = new Int32Array(2 * (e1 - e));
  for (;;) {
    // Apply the events at `pos`.
    let lineChanged = false;
    while (e < e1 && sol.eventT[e] <= pos) {
      const p = sol.eventPart[e];
      const f = lf[sol.partLoad[p]];
      if (f !== 0) {
        const kind = sol.partKind[p];
        if (kind === PART_POINT) c3 -= (f * sol.partV1[p] * inv) / 6;
        else if (kind === PART_MOMENT) c2 -= (f * sol.partV1[p] * inv) / 2;
        else if (sol.eventClose[e] === 0) {
          active[nActive++] = p;
          lineChanged = true;
        } else {
          let i = 0;
          while (i < nActive && active[i] !== p) i++;
          if (i < nActive) active[i] = active[--nActive];
          lineChanged = true;
        }
      }
      e++;
    }
    if (lineChanged || nActive > 0) {
      // Intensity and slope of the line loads just right of pos, from their exact ends.
      let q = 0;
      let dq = 0;
      for (let i = 0; i < nActive; i++) {
        const p = active[i];
        const f = lf[sol.partLoad[p]];
        const a = sol.partT1[p];
        const b = sol.partT2[p];
        const wa = sol.partV1[p];
        const wb = sol.partV2[p];
        const s = wb === wa ? 0 : (wb - wa) / (b - a);
        q += f * (pos === a ? wa : wa + s * (pos - a));
        dq += f * s;
      }
      c4 = (-q * inv) / 24;
      c5 = (-dq * inv) / 120;
    }
    // Next load point with a nonzero factor, or the segment end.
    let next = le;
    for (let k = e; k < e1; k++) {
      if (lf[sol.partLoad[sol.eventPart[k]]] !== 0) {
        if (sol.eventT[k] < le) next = sol.eventT[k];
        break;
      }
    }
    const h = next - pos;
    if (h > 0) {
      const o = 6 * count;
      pieceT[count] = pos;
      pieceH[count] = h;
      let hk = h;
      pieceC[o] = c0;
      pieceC[o + 1] = c1 * hk;
      hk *= h;
      pieceC[o + 2] = c2 * hk;
      hk *= h;
      pieceC[o + 3] = c3 * hk;
      hk *= h;
      pieceC[o + 4] = c4 * hk;
      hk *= h;
      pieceC[o + 5] = c5 * hk;
      count++;
      // Taylor shift to `next` (repeated synthetic division, exact for degree 5).
      c4 += h * c5;
      c3 += h * c4;
      c2 += h * c3;
      c1 += h * c2;
      c0 += h * c1;
      c4 += h * c5;
      c3 += h * c4;
      c2 += h * c3;
      c1 += h * c2;
      c4 += h * c5;
      c3 += h * c4;
      c2 += h * c3;
      c4 += h * c5;
      c3 += h * c4;
      c4 += h * c5;
    }
    if (next >= le) break;
    pos = next;
  }
  return count;
}

/**
 * Largest-magnitude deflection of segment g: the values at its ends and
 * load points, then the roots of y′ inside the pieces, taken in order of
 * their Bernstein bound of |y| and stopping once no remaining piece can beat
 * the best so far (domain.md §6: extremes as roots of y′ on the exact curve,
 * no sampling). Ties keep the first found. A segment that does not deflect
 * at all reports its midpoint with deflection 0.
 */
function findExtreme(sol: BeamSolution, curve: CombinedCurve, g: number, hit: ExtremeHit): void {
  const count = buildPieces(sol, curve, g);
  const le = sol.segLen[g];
  let best = -1;
  for (let i = 0; i < count; i++) {
    const y = pieceC[6 * i];
    const m = y < 0 ? -y : y;
    if (m > best) {
      best = m;
      hit.y = y;
      hit.t = pieceT[i];
    }
  }
  if (sol.segKind[g] !== SEG_SPAN) {
    // The free end of an overhang.
    const o = 6 * (count - 1);
    const y = pieceC[o] + pieceC[o + 1] + pieceC[o + 2] + pieceC[o + 3] + pieceC[o + 4] + pieceC[o + 5];
    const m = y < 0 ? -y : y;
    if (m > best) {
      best = m;
      hit.y = y;
      hit.t = le;
    }
  }
  let open = 0;
  for (let i = 0; i < count; i++) {
    if (isMonotonic(pieceC, 6 * i)) {
      pieceBound[i] = -1;
      continue;
    }
    const b = bernsteinBound(pieceC, 6 * i);
    pieceBound[i] = b;
    if (b > best) open++;
  }
  while (open > 0) {
    // Pieces that may hold a stationary point, most promising first.
    let pick = -1;
    let top = best;
    for (let i = 0; i < count; i++) {
      if (pieceBound[i] > top) {
        top = pieceBound[i];
        pick = i;
      }
    }
    if (pick < 0) break;
    pieceBound[pick] = -1;
    open--;
    const o = 6 * pick;
    const nr = derivativeRootsInUnit(pieceC, o, roots);
    for (let r = 0; r < nr; r++) {
      const tau = roots[r];
      const y = pieceC[o] + tau * (pieceC[o + 1] + tau * (pieceC[o + 2] + tau * (pieceC[o + 3] + tau * (pieceC[o + 4] + tau * pieceC[o + 5]))));
      const m = y < 0 ? -y : y;
      if (m > best) {
        best = m;
        hit.y = y;
        hit.t = pieceT[pick] + tau * pieceH[pick];
      }
    }
  }
  if (best === 0) {
    hit.t = le / 2;
    hit.y = 0;
  }
  if (!Number.isFinite(hit.y)) {
    throw new EngineError(
      'NOT_FINITE',
      '',
      'The deflection overflowed the range of numbers: check that length, E, I and the loads are in SI base units (m, Pa, m^4, N, N/m).',
    );
  }
  hit.x = sol.globalX(g, hit.t);
}

/** The segments of the solved member, left to right. */
function segmentsOf(sol: BeamSolution): Segment[] {
  const segments: Segment[] = [];
  for (let g = 0; g < sol.nSeg; g++) {
    segments.push({ from: sol.segFrom[g], to: sol.segTo[g], kind: sol.segKind[g] === SEG_SPAN ? 'span' : 'overhang' });
  }
  return segments;
}

const solution = new Solver();
const curve = new CombinedCurve(solution);
const hit: ExtremeHit = { t: 0, x: 0, y: 0 };
let perLoad: F64 = new Float64Array(32);

/** −0 → 0, so reports compare and print cleanly. */
function clean(v: number): number {
  return v + 0;
}

/**
 * Analyses one member: deflection of every combination by superposition of
 * each load's own exact Euler–Bernoulli response, the extreme of every
 * segment with each load's signed contribution there, probe values, support
 * reactions, and the checks.
 *
 * Units SI (m, N, N/m, N·m, Pa, m^4); loads positive down, moments positive
 * counter-clockwise, deflection positive UP (calc-contract.md). Theory:
 * linear-elastic, small deflections, no shear deformation (domain.md §4);
 * accuracy about 1e-13 relative on ordinary members, no sampling.
 *
 * `input` must be valid (use parseBeamInput on untrusted data); a mechanism
 * still throws EngineError with code MECHANISM, and a result too large for a
 * double throws NOT_FINITE (never a NaN or Infinity in a report).
 *
 * Contributions list the loads whose case the combination names (a factor of
 * 0 included), in load order; loads of other cases are left out.
 */
export function analyzeBeam(input: BeamInput): BeamReport {
  const sol = solution.solve(input);
  const segments = segmentsOf(sol);
  const combinations: Record<string, CombinationReport> = {};
  const probes = input.probes ?? [];
  const nl = sol.nLoads;
  if (perLoad.length < nl) perLoad = new Float64Array(nl * 2);
  for (const name of Object.keys(input.combinations)) {
    curve.combine(input.combinations[name]);
    const segReports: SegmentReport[] = [];
    for (let g = 0; g < segments.length; g++) {
      findExtreme(sol, curve, g, hit);
      const contributions: Contribution[] = [];
      sol.loadDeflections(g, hit.t, perLoad);
      for (let k = 0; k < nl; k++) {
        const c = sol.loadCase[k];
        if (curve.caseNamed[c] === 0) continue;
        const factor = curve.caseFactor[c];
        contributions.push({ load: k, case: sol.cases[c], factor, deflection: factor === 0 ? 0 : clean(factor * perLoad[k]) });
      }
      const seg = segments[g];
      segReports.push({ from: seg.from, to: seg.to, kind: seg.kind, extreme: { x: hit.x, deflection: clean(hit.y) }, contributions });
    }
    const probeReports: PointDeflection[] = [];
    for (let p = 0; p < probes.length; p++) {
      const x = probes[p];
      const g = sol.segmentAt(x);
      probeReports.push({ x, deflection: clean(curve.at(g, sol.localT(g, x))) });
    }
    const reactions: Reaction[] = [];
    for (let j = 0; j < sol.nNodes; j++) {
      let force = 0;
      let moment = 0;
      const rf = 2 * j * nl;
      for (let k = 0; k < nl; k++) {
        const f = curve.loadFactor[k];
        force += f * sol.reactions[rf + k];
        moment += f * sol.reactions[rf + nl + k];
      }
      reactions.push({ x: sol.nodeX[j], kind: sol.nodeKind[j] === 2 ? 'fixed' : 'pin', force: clean(force), moment: clean(moment) });
    }
    combinations[name] = { probes: probeReports, segments: segReports, reactions };
  }

  const checks: CheckReport[] = [];
  const inputChecks = input.checks ?? [];
  for (let c = 0; c < inputChecks.length; c++) {
    const check = inputChecks[c];
    const comb = combinations[check.combination];
    if (comb === undefined) {
      throw new EngineError('UNKNOWN_COMBINATION', `checks[${c}].combination`, `Check "${check.name}" names combination "${check.combination}", which is not defined.`);
    }
    let pass = true;
    let utilization = 0;
    const results: CheckSegmentResult[] = [];
    for (const seg of comb.segments) {
      const r = checkSegmentAt(seg, seg.extreme.x, seg.extreme.deflection, check, input.I);
      if (!r.pass) pass = false;
      if (r.utilization > utilization) utilization = r.utilization;
      results.push(r);
    }
    checks.push({ name: check.name, combination: check.combination, segments: results, pass, utilization });
  }
  return { segments, combinations, checks };
}

let extremeX: F64 = new Float64Array(16);
let extremeY: F64 = new Float64Array(16);
const checkedNames: string[] = [];

/**
 * Fast path for bulk work (imports of whole schedules): only the checks, with
 * exactly the numbers analyzeBeam(input).checks gives, but without building
 * contributions, probes, reactions or combinations that no check uses.
 * Same units, signs and errors as analyzeBeam; `input` must be valid
 * (parseBeamInput). Open the member with analyzeBeam to see each load's share.
 */
export function checkBeam(input: BeamInput): CheckReport[] {
  const checks = input.checks ?? [];
  const sol = solution.solve(input, false);
  const segments = segmentsOf(sol);
  const ns = segments.length;
  if (extremeX.length < ns * checks.length) {
    extremeX = new Float64Array(ns * checks.length * 2);
    extremeY = new Float64Array(ns * checks.length * 2);
  }
  checkedNames.length = 0;
  const out: CheckReport[] = [];
  for (let c = 0; c < checks.length; c++) {
    const check = checks[c];
    let slot = checkedNames.indexOf(check.combination);
    if (slot < 0) {
      const combination = input.combinations[check.combination];
      if (combination === undefined) {
        throw new EngineError('UNKNOWN_COMBINATION', `checks[${c}].combination`, `Check "${check.name}" names combination "${check.combination}", which is not defined.`);
      }
      slot = checkedNames.length;
      checkedNames.push(check.combination);
      curve.combine(combination);
      for (let g = 0; g < ns; g++) {
        findExtreme(sol, curve, g, hit);
        extremeX[slot * ns + g] = hit.x;
        extremeY[slot * ns + g] = clean(hit.y);
      }
    }
    let pass = true;
    let utilization = 0;
    const results: CheckSegmentResult[] = [];
    for (let g = 0; g < ns; g++) {
      const r = checkSegmentAt(segments[g], extremeX[slot * ns + g], extremeY[slot * ns + g], check, input.I);
      if (!r.pass) pass = false;
      if (r.utilization > utilization) utilization = r.utilization;
      results.push(r);
    }
    out.push({ name: check.name, combination: check.combination, segments: results, pass, utilization });
  }
  return out;
}

/** Internal access for the curve sampler (same module state). */
export function solveAndCombine(input: BeamInput, combination: Combination): { sol: BeamSolution; curve: CombinedCurve } {
  solution.solve(input);
  curve.combine(combination);
  return { sol: solution, curve };
}


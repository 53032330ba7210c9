import { BeamSolution } from './beam-solution';
import * as checksModule from './checks';
import { EngineError } from './engine-error';
import * as hermiteModule from './hermite';
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
const { checkSegmentAt } = checksModule;
const { elementCoefficients, elementDeflection } = hermiteModule;
const { bernsteinBound, derivativeRootsInUnit, isMonotonic } = polyRootsModule;

/**
 * The combined (factored, superposed) state of one combination on the solved
 * member: nodal values and the line load on each element. Buffers are reused.
 */
class CombinedCurve {
  factor = new Float64Array(16);
  /** The combination's factor on each load (its case's factor). */
  loadFactor = new Float64Array(16);
  inCombination = new Uint8Array(16);
  U = new Float64Array(256);
  wa = new Float64Array(128);
  wb = new Float64Array(128);

  constructor(private readonly sol: BeamSolution) {}

  /** Superposes the loads of `combination` (factors per case; unknown cases are ignored). */
  combine(combination: Combination): void {
    const sol = this.sol;
    const nc = sol.cases.length;
    if (this.factor.length < nc) {
      this.factor = new Float64Array(nc * 2);
      this.inCombination = new Uint8Array(nc * 2);
    }
    for (let c = 0; c < nc; c++) {
      const f = combination[sol.cases[c]];
      this.inCombination[c] = f === undefined ? 0 : 1;
      this.factor[c] = f === undefined ? 0 : f;
    }
    const n = sol.nDof;
    const ne = sol.nNodes - 1;
    if (this.U.length < n) this.U = new Float64Array(n * 2);
    if (this.wa.length < ne) {
      this.wa = new Float64Array(ne * 2);
      this.wb = new Float64Array(ne * 2);
    }
    const U = this.U;
    const wa = this.wa;
    const wb = this.wb;
    wa.fill(0, 0, ne);
    wb.fill(0, 0, ne);
    const u = sol.u;
    const lineWa = sol.lineWa;
    const lineWb = sol.lineWb;
    const nl = sol.nLoads;
    if (this.loadFactor.length < nl) this.loadFactor = new Float64Array(nl * 2);
    const lf = this.loadFactor;
    for (let k = 0; k < nl; k++) lf[k] = this.factor[sol.loadCase[k]];
    for (let i = 0; i < n; i++) {
      let s = 0;
      const base = i * nl;
      for (let k = 0; k < nl; k++) s += lf[k] * u[base + k];
      U[i] = s;
    }
    for (let k = 0; k < nl; k++) {
      const f = lf[k];
      if (f === 0) continue;
      if (sol.isLineLoad(k)) {
        const lo = k * ne;
        for (let e = sol.loadNode1[k]; e < sol.loadNode2[k]; e++) {
          wa[e] += f * lineWa[lo + e];
          wb[e] += f * lineWb[lo + e];
        }
      }
    }
  }

  /** Combined deflection (m, up) at ξ of element e. */
  at(e: number, xi: number): number {
    const sol = this.sol;
    const U = this.U;
    const o = 2 * e;
    return elementDeflection(xi, sol.nodeX[e + 1] - sol.nodeX[e], U[o], U[o + 1], U[o + 2], U[o + 3], this.wa[e], this.wb[e], sol.invEI);
  }
}

/** Where the extreme of a segment is: element, local coordinate and value. */
interface ExtremeHit {
  e: number;
  xi: number;
  x: number;
  y: number;
}

let coeffs = new Float64Array(6 * 64);
let bounds = new Float64Array(64);
const roots = new Float64Array(6);

/**
 * Largest-magnitude deflection on nodes js..je (a segment): every node value,
 * then the roots of y′ inside the elements, taken in order of their Bernstein
 * bound of |y| and stopping once no remaining element can beat the best so
 * far (domain.md §6: extremes as roots of y′ on the exact curve, no sampling).
 * Ties keep the first found. A segment that does not deflect at all reports
 * its midpoint with deflection 0.
 */
function findExtreme(sol: BeamSolution, curve: CombinedCurve, js: number, je: number, hit: ExtremeHit): void {
  const xs = sol.nodeX;
  const U = curve.U;
  let best = -1;
  for (let j = js; j <= je; j++) {
    const y = U[2 * j];
    const m = y < 0 ? -y : y;
    if (m > best) {
      best = m;
      hit.y = y;
      hit.x = xs[j];
      if (j < je) {
        hit.e = j;
        hit.xi = 0;
      } else {
        hit.e = j - 1;
        hit.xi = 1;
      }
    }
  }
  const count = je - js;
  if (bounds.length < count) {
    bounds = new Float64Array(count * 2);
    coeffs = new Float64Array(count * 12);
  }
  let open = 0;
  for (let i = 0; i < count; i++) {
    const e = js + i;
    const o = 2 * e;
    elementCoefficients(coeffs, 6 * i, xs[e + 1] - xs[e], U[o], U[o + 1], U[o + 2], U[o + 3], curve.wa[e], curve.wb[e], sol.invEI);
    if (isMonotonic(coeffs, 6 * i)) {
      bounds[i] = -1;
      continue;
    }
    const b = bernsteinBound(coeffs, 6 * i);
    bounds[i] = b;
    if (b > best) open++;
  }
  while (open > 0) {
    // Elements that may hold a stationary point, most promising first.
    let pick = -1;
    let top = best;
    for (let i = 0; i < count; i++) {
      if (bounds[i] > top) {
        top = bounds[i];
        pick = i;
      }
    }
    if (pick < 0) break;
    bounds[pick] = -1;
    open--;
    const e = js + pick;
    const nr = derivativeRootsInUnit(coeffs, 6 * pick, roots);
    for (let r = 0; r < nr; r++) {
      const xi = roots[r];
      const y = curve.at(e, xi);
      const m = y < 0 ? -y : y;
      if (m > best) {
        best = m;
        hit.y = y;
        hit.e = e;
        hit.xi = xi;
        hit.x = xs[e] + xi * (xs[e + 1] - xs[e]);
      }
    }
  }
  if (best === 0) {
    const mid = 0.5 * (xs[js] + xs[je]);
    const e = sol.elementAt(mid);
    hit.e = e;
    hit.xi = (mid - xs[e]) / (xs[e + 1] - xs[e]);
    hit.x = mid;
    hit.y = 0;
  }
  if (!Number.isFinite(hit.y)) {
    throw new EngineError(
      'NOT_FINITE',
      '',
      'The deflection overflowed the range of numbers: check that length, E, I and the loads are in SI base units (m, Pa, m^4, N, N/m).',
    );
  }
}

/** Segments of the solved member and the node range of each (`nodeFrom[s]`..`nodeTo[s]`). */
function segmentsOf(sol: BeamSolution, nodeFrom: number[], nodeTo: number[]): Segment[] {
  const xs = sol.nodeX;
  const last = sol.nNodes - 1;
  const sn = sol.supportNodes;
  const ns = sol.nSupports;
  const segments: Segment[] = [];
  nodeFrom.length = 0;
  nodeTo.length = 0;
  if (sn[0] > 0) {
    segments.push({ from: xs[0], to: xs[sn[0]], kind: 'overhang' });
    nodeFrom.push(0);
    nodeTo.push(sn[0]);
  }
  for (let s = 0; s + 1 < ns; s++) {
    segments.push({ from: xs[sn[s]], to: xs[sn[s + 1]], kind: 'span' });
    nodeFrom.push(sn[s]);
    nodeTo.push(sn[s + 1]);
  }
  if (sn[ns - 1] < last) {
    segments.push({ from: xs[sn[ns - 1]], to: xs[last], kind: 'overhang' });
    nodeFrom.push(sn[ns - 1]);
    nodeTo.push(last);
  }
  return segments;
}

const nodeFrom: number[] = [];
const nodeTo: number[] = [];
const solution = new BeamSolution();
const curve = new CombinedCurve(solution);
const hit: ExtremeHit = { e: 0, xi: 0, x: 0, y: 0 };
let perLoad = new Float64Array(32);

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
  const segments = segmentsOf(sol, nodeFrom, nodeTo);
  const combinations: Record<string, CombinationReport> = {};
  const probes = input.probes ?? [];
  for (const name of Object.keys(input.combinations)) {
    curve.combine(input.combinations[name]);
    const segReports: SegmentReport[] = [];
    for (let s = 0; s < segments.length; s++) {
      findExtreme(sol, curve, nodeFrom[s], nodeTo[s], hit);
      const contributions: Contribution[] = [];
      if (perLoad.length < sol.nLoads) perLoad = new Float64Array(sol.nLoads * 2);
      sol.loadDeflections(hit.e, hit.xi, perLoad);
      for (let k = 0; k < sol.nLoads; k++) {
        const c = sol.loadCase[k];
        if (curve.inCombination[c] === 0) continue;
        const factor = curve.factor[c];
        contributions.push({ load: k, case: sol.cases[c], factor, deflection: factor === 0 ? 0 : clean(factor * perLoad[k]) });
      }
      const seg = segments[s];
      segReports.push({
        from: seg.from,
        to: seg.to,
        kind: seg.kind,
        extreme: { x: hit.x, deflection: clean(hit.y) },
        contributions,
      });
    }
    const probeReports: PointDeflection[] = [];
    for (let p = 0; p < probes.length; p++) {
      const x = probes[p];
      const e = sol.elementAt(x);
      const x0 = sol.nodeX[e];
      const x1 = sol.nodeX[e + 1];
      const xi = x === x1 ? 1 : (x - x0) / (x1 - x0);
      probeReports.push({ x, deflection: clean(curve.at(e, xi)) });
    }
    const reactions: Reaction[] = [];
    for (let s = 0; s < sol.nSupports; s++) {
      let force = 0;
      let moment = 0;
      const nl = sol.nLoads;
      const rf = 2 * s * nl;
      for (let k = 0; k < nl; k++) {
        const f = curve.loadFactor[k];
        force += f * sol.reactions[rf + k];
        moment += f * sol.reactions[rf + nl + k];
      }
      const j = sol.supportNodes[s];
      reactions.push({ x: sol.nodeX[j], kind: sol.nodeSupport[j] === 2 ? 'fixed' : 'pin', force: clean(force), moment: clean(moment) });
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

let extremeX = new Float64Array(16);
let extremeY = new Float64Array(16);
const checkedNames: string[] = [];

/**
 * Fast path for bulk work (imports of whole schedules): only the checks, with
 * exactly the numbers analyzeBeam(input).checks gives, but without building
 * contributions, probes, reactions or combinations that no check uses — about
 * a third of the work. Same units, signs and errors as analyzeBeam; `input`
 * must be valid (parseBeamInput). Open the member with analyzeBeam to see
 * each load's share.
 */
export function checkBeam(input: BeamInput): CheckReport[] {
  const checks = input.checks ?? [];
  const sol = solution.solve(input, false);
  const segments = segmentsOf(sol, nodeFrom, nodeTo);
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
      for (let s = 0; s < ns; s++) {
        findExtreme(sol, curve, nodeFrom[s], nodeTo[s], hit);
        extremeX[slot * ns + s] = hit.x;
        extremeY[slot * ns + s] = clean(hit.y);
      }
    }
    let pass = true;
    let utilization = 0;
    const results: CheckSegmentResult[] = [];
    for (let s = 0; s < ns; s++) {
      const r = checkSegmentAt(segments[s], extremeX[slot * ns + s], extremeY[slot * ns + s], check, input.I);
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

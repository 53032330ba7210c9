import * as bandedModule from './banded-ldl';
import * as hermiteModule from './hermite';
import { assertStable } from './stability';
import type { BeamInput, Load } from './types';
// Imported functions are bound once here: under tsx (esbuild's CommonJS interop) every call
// through an import binding runs an accessor, which also blocks inlining on the hot path.
const { factorBand, solveBandMany } = bandedModule;
const { addConsistentLoad, addElementStiffness } = hermiteModule;

/**
 * Direct-stiffness solution of one member, load by load (domain.md §4,
 * "Direct stiffness method with Hermite beam elements"):
 * - nodes at the member ends, the supports, every point load and moment, and
 *   both ends of every distributed load, so each element carries at most one
 *   linearly varying line load per load over its whole length, whose exact
 *   fixed-end actions are the consistent nodal loads;
 * - the stiffness is assembled and factored once; every load's response is
 *   its own back-substitution (all loads side by side, see solveBandMany),
 *   so superposition is exact and each load's share stays visible;
 * - inside an element the exact deflection is the Hermite interpolation of
 *   its nodal values plus the clamped–clamped particular solution of its load
 *   (hermite.ts), a polynomial of degree ≤ 5.
 *
 * The buffers are reused from member to member (the engine is synchronous and
 * single-threaded), so solving many members allocates almost nothing.
 */

const KIND_POINT = 0;
const KIND_MOMENT = 1;
const KIND_LINE = 2;

type F64 = Float64Array<ArrayBuffer>;
type I32 = Int32Array<ArrayBuffer>;

function grow(a: F64, n: number): F64 {
  return a.length >= n ? a : new Float64Array(Math.max(n, a.length * 2));
}
function growInt(a: I32, n: number): I32 {
  return a.length >= n ? a : new Int32Array(Math.max(n, a.length * 2));
}

/** Index of `x` in the sorted array `xs[0..n)`; the value must be present. */
function findNode(xs: F64, n: number, x: number): number {
  let lo = 0;
  let hi = n - 1;
  while (lo < hi) {
    const mid = (lo + hi) >> 1;
    if (xs[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** Intensity (N/m) at x of a line load w1 at x1 → w2 at x2; exact at both ends. */
function lineIntensity(x: number, x1: number, x2: number, w1: number, w2: number): number {
  if (x === x1) return w1;
  if (x === x2) return w2;
  return (w1 * (x2 - x) + w2 * (x - x1)) / (x2 - x1);
}

export class BeamSolution {
  nNodes = 0;
  /** DOF count: 2 per node, v then θ. */
  nDof = 0;
  nLoads = 0;
  length = 0;
  EI = 0;
  invEI = 0;
  /** Node positions, m, ascending, distinct. */
  nodeX: F64 = new Float64Array(64);
  /** Per node: 0 free, 1 pin, 2 fixed. */
  nodeSupport: I32 = new Int32Array(64);
  /** Node indices of the distinct support positions, ascending. */
  supportNodes: I32 = new Int32Array(16);
  nSupports = 0;
  /** Factored stiffness per unit EI (restrained DOFs replaced by identity rows). */
  band: F64 = new Float64Array(256);
  /** Unrestrained stiffness per unit EI, kept for the reactions. */
  bandFull: F64 = new Float64Array(256);
  /** Nodal response per load, interleaved: DOF i (v = 2j, θ = 2j+1 of node j) of load k at [i·nLoads + k]; m and rad. */
  u: F64 = new Float64Array(1024);
  /**
   * Reactions per load, interleaved: support s, component c (0: force, N, up;
   * 1: moment, N·m, counter-clockwise, 0 at a pin) of load k at [(2s + c)·nLoads + k].
   */
  reactions: F64 = new Float64Array(256);
  /** Per load: kind code, case index, node(s), positions and values, normalized. */
  loadKind: I32 = new Int32Array(32);
  loadCase: I32 = new Int32Array(32);
  loadNode1: I32 = new Int32Array(32);
  loadNode2: I32 = new Int32Array(32);
  loadX1: F64 = new Float64Array(32);
  loadX2: F64 = new Float64Array(32);
  loadV1: F64 = new Float64Array(32);
  loadV2: F64 = new Float64Array(32);
  /**
   * Per line load k and element e, at k·(nNodes − 1) + e: intensity (N/m,
   * down) at the element's left and right end; valid for loadNode1 ≤ e < loadNode2.
   */
  lineWa: F64 = new Float64Array(256);
  lineWb: F64 = new Float64Array(256);
  /** Distinct case labels in first-seen order; loadCase indexes this. */
  cases: string[] = [];
  private coords: F64 = new Float64Array(64);

  /**
   * Solves `input` (assumed validated by parseBeamInput, apart from the
   * mechanism check, which is always made). Throws EngineError MECHANISM.
   * `withReactions` false skips the support reactions (the checks-only path).
   */
  solve(input: BeamInput, withReactions = true): this {
    const { length, supports, loads } = input;
    this.length = length;
    this.EI = input.E * input.I;
    this.invEI = 1 / this.EI;
    const nl = loads.length;
    this.nLoads = nl;
    this.prepareLoadArrays(nl);

    // ---- nodes: ends, supports, load points and load ends, sorted and distinct
    let m = 2 + supports.length + 2 * nl;
    const cs = (this.coords = grow(this.coords, m));
    m = 0;
    cs[m++] = 0;
    cs[m++] = length;
    for (let i = 0; i < supports.length; i++) cs[m++] = supports[i].x;
    for (let k = 0; k < nl; k++) {
      const ld = loads[k];
      if (ld.kind === 'point' || ld.kind === 'moment') cs[m++] = ld.x;
      else {
        cs[m++] = ld.x1;
        cs[m++] = ld.x2;
      }
    }
    // Insertion sort: a member has a few dozen coordinates at most.
    for (let i = 1; i < m; i++) {
      const v = cs[i];
      let j = i - 1;
      while (j >= 0 && cs[j] > v) {
        cs[j + 1] = cs[j];
        j--;
      }
      cs[j + 1] = v;
    }
    const xs = (this.nodeX = grow(this.nodeX, m));
    let nn = 0;
    for (let i = 0; i < m; i++) {
      const x = cs[i];
      if (nn === 0 || x !== xs[nn - 1]) xs[nn++] = x + 0; // + 0 turns −0 into 0
    }
    this.nNodes = nn;
    const n = 2 * nn;
    this.nDof = n;

    // ---- supports (several at one position merge; fixed wins)
    const ns = (this.nodeSupport = growInt(this.nodeSupport, nn));
    ns.fill(0, 0, nn);
    let fixedCount = 0;
    for (let i = 0; i < supports.length; i++) {
      const j = findNode(xs, nn, supports[i].x);
      const k = supports[i].kind === 'fixed' ? 2 : 1;
      if (k > ns[j]) ns[j] = k;
      if (k === 2) fixedCount++;
    }
    const sn = (this.supportNodes = growInt(this.supportNodes, nn));
    let nsup = 0;
    for (let j = 0; j < nn; j++) if (ns[j] !== 0) sn[nsup++] = j;
    this.nSupports = nsup;
    if (fixedCount === 0 && nsup < 2) assertStable(supports);

    // ---- stiffness per unit EI, restraints, factorization
    const band = (this.band = grow(this.band, n * 4));
    const bandFull = (this.bandFull = grow(this.bandFull, n * 4));
    band.fill(0, 0, n * 4);
    for (let e = 0; e < nn - 1; e++) addElementStiffness(band, 2 * e, xs[e + 1] - xs[e]);
    for (let i = 0; i < n * 4; i++) bandFull[i] = band[i];
    for (let j = 0; j < nn; j++) {
      if (ns[j] === 0) continue;
      restrain(band, 2 * j, n);
      if (ns[j] === 2) restrain(band, 2 * j + 1, n);
    }
    if (factorBand(band, n) >= 0) {
      assertStable(supports);
      throw new Error('The stiffness matrix is singular although the supports hold the member: please report this member.');
    }

    // ---- load vectors (all loads side by side), one solve, reactions
    const ne = nn - 1;
    this.lineWa = grow(this.lineWa, nl * ne);
    this.lineWb = grow(this.lineWb, nl * ne);
    const u = (this.u = grow(this.u, nl * n));
    u.fill(0, 0, nl * n);
    const cases = this.cases;
    cases.length = 0;
    for (let k = 0; k < nl; k++) {
      const ld = loads[k];
      let ci = 0;
      while (ci < cases.length && cases[ci] !== ld.case) ci++;
      if (ci === cases.length) cases.push(ld.case);
      this.loadCase[k] = ci;
      this.normalizeLoad(k, ld);
      this.loadVector(k);
    }
    // Keep −F at the support DOFs for the reactions, then hold those DOFs at zero.
    const R = (this.reactions = grow(this.reactions, 2 * nsup * nl));
    if (!withReactions) {
      for (let s = 0; s < nsup; s++) {
        const dv = 2 * sn[s] * nl;
        const len = ns[sn[s]] === 2 ? 2 * nl : nl;
        u.fill(0, dv, dv + len);
      }
    }
    for (let s = 0; withReactions && s < nsup; s++) {
      const dv = 2 * sn[s] * nl;
      const fixed = ns[sn[s]] === 2;
      const rv = 2 * s * nl;
      for (let k = 0; k < nl; k++) {
        R[rv + k] = -u[dv + k];
        u[dv + k] = 0;
        if (fixed) {
          R[rv + nl + k] = -u[dv + nl + k];
          u[dv + nl + k] = 0;
        } else R[rv + nl + k] = 0;
      }
    }
    solveBandMany(band, n, u, nl);
    // R = K·(EI u) − F with the unrestrained K (u is still EI times the displacement here).
    for (let s = 0; withReactions && s < nsup; s++) {
      const j = sn[s];
      addRowTimes(bandFull, n, 2 * j, u, nl, R, 2 * s * nl);
      if (ns[j] === 2) addRowTimes(bandFull, n, 2 * j + 1, u, nl, R, (2 * s + 1) * nl);
    }
    const inv = this.invEI;
    for (let i = 0; i < n * nl; i++) u[i] *= inv;
    return this;
  }

  private prepareLoadArrays(nl: number): void {
    if (this.loadKind.length >= nl) return;
    const size = Math.max(nl, this.loadKind.length * 2);
    this.loadKind = new Int32Array(size);
    this.loadCase = new Int32Array(size);
    this.loadNode1 = new Int32Array(size);
    this.loadNode2 = new Int32Array(size);
    this.loadX1 = new Float64Array(size);
    this.loadX2 = new Float64Array(size);
    this.loadV1 = new Float64Array(size);
    this.loadV2 = new Float64Array(size);
  }

  private normalizeLoad(k: number, ld: Load): void {
    const xs = this.nodeX;
    const nn = this.nNodes;
    switch (ld.kind) {
      case 'point':
        this.loadKind[k] = KIND_POINT;
        this.loadX1[k] = this.loadX2[k] = ld.x;
        this.loadV1[k] = this.loadV2[k] = ld.P;
        this.loadNode1[k] = this.loadNode2[k] = findNode(xs, nn, ld.x);
        break;
      case 'moment':
        this.loadKind[k] = KIND_MOMENT;
        this.loadX1[k] = this.loadX2[k] = ld.x;
        this.loadV1[k] = this.loadV2[k] = ld.M;
        this.loadNode1[k] = this.loadNode2[k] = findNode(xs, nn, ld.x);
        break;
      case 'udl':
        this.loadKind[k] = KIND_LINE;
        this.loadX1[k] = ld.x1;
        this.loadX2[k] = ld.x2;
        this.loadV1[k] = this.loadV2[k] = ld.w;
        this.loadNode1[k] = findNode(xs, nn, ld.x1);
        this.loadNode2[k] = findNode(xs, nn, ld.x2);
        break;
      case 'linear':
        this.loadKind[k] = KIND_LINE;
        this.loadX1[k] = ld.x1;
        this.loadX2[k] = ld.x2;
        this.loadV1[k] = ld.w1;
        this.loadV2[k] = ld.w2;
        this.loadNode1[k] = findNode(xs, nn, ld.x1);
        this.loadNode2[k] = findNode(xs, nn, ld.x2);
        break;
    }
  }

  /**
   * Nodal load vector of load k into column k of u: −P at v of a point load
   * (up is positive), +M at θ of a moment, consistent loads of a line load.
   */
  private loadVector(k: number): void {
    const nl = this.nLoads;
    const u = this.u;
    const kind = this.loadKind[k];
    const j1 = this.loadNode1[k];
    if (kind === KIND_POINT) u[2 * j1 * nl + k] = -this.loadV1[k];
    else if (kind === KIND_MOMENT) u[(2 * j1 + 1) * nl + k] = this.loadV1[k];
    else {
      const xs = this.nodeX;
      const x1 = this.loadX1[k];
      const x2 = this.loadX2[k];
      const w1 = this.loadV1[k];
      const w2 = this.loadV2[k];
      const uniform = w1 === w2;
      const lo = k * (this.nNodes - 1);
      for (let e = j1; e < this.loadNode2[k]; e++) {
        const wa = uniform ? w1 : lineIntensity(xs[e], x1, x2, w1, w2);
        const wb = uniform ? w1 : lineIntensity(xs[e + 1], x1, x2, w1, w2);
        this.lineWa[lo + e] = wa;
        this.lineWb[lo + e] = wb;
        addConsistentLoad(u, 2 * e * nl + k, nl, xs[e + 1] - xs[e], wa, wb);
      }
    }
  }

  isLineLoad(k: number): boolean {
    return this.loadKind[k] === KIND_LINE;
  }

  /** Element index containing x (the left one at an interior node), 0 ≤ x ≤ length. */
  elementAt(x: number): number {
    const xs = this.nodeX;
    let lo = 0;
    let hi = this.nNodes - 2;
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1;
      if (xs[mid] < x) lo = mid;
      else hi = mid - 1;
    }
    return lo;
  }

  /**
   * Deflection (m, up) of every load alone at ξ in element e, into out[k]:
   * the Hermite shape values are computed once and applied to each load's
   * nodal values, plus the particular solution of the loads acting on e
   * (the same formulas as hermite.ts elementDeflection).
   */
  loadDeflections(e: number, xi: number, out: Float64Array): void {
    const u = this.u;
    const nl = this.nLoads;
    const le = this.nodeX[e + 1] - this.nodeX[e];
    const xi2 = xi * xi;
    const xi3 = xi2 * xi;
    const n1 = 1 - 3 * xi2 + 2 * xi3;
    const n2 = le * (xi - 2 * xi2 + xi3);
    const n3 = 3 * xi2 - 2 * xi3;
    const n4 = le * (xi3 - xi2);
    const om = 1 - xi;
    const l2 = le * le;
    const pf = -(l2 * l2 * xi2 * om * om * this.invEI) / 120;
    const ga = 3 - xi;
    const gb = 2 + xi;
    const o1 = 2 * e * nl;
    const o2 = o1 + nl;
    const o3 = o2 + nl;
    const o4 = o3 + nl;
    const ne = this.nNodes - 1;
    for (let k = 0; k < nl; k++) {
      let y = n1 * u[o1 + k] + n2 * u[o2 + k] + n3 * u[o3 + k] + n4 * u[o4 + k];
      if (this.loadKind[k] === KIND_LINE && e >= this.loadNode1[k] && e < this.loadNode2[k]) {
        const i = k * ne + e;
        y += pf * (this.lineWb[i] * gb + this.lineWa[i] * ga);
      }
      out[k] = y;
    }
  }
}

/** Replaces DOF r's row and column by the identity (v or θ held at zero). */
function restrain(band: F64, r: number, n: number): void {
  for (let d = 1; d <= 3; d++) {
    if (r + d < n) band[r * 4 + d] = 0;
    if (r - d >= 0) band[(r - d) * 4 + d] = 0;
  }
  band[r * 4] = 1;
}

/** out[o + k] += (K u)_r for every column k of the interleaved u (K symmetric band, upper storage). */
function addRowTimes(bf: F64, n: number, r: number, u: F64, m: number, out: F64, o: number): void {
  for (let d = 0; d <= 3; d++) {
    if (r + d >= n) break;
    const kv = bf[r * 4 + d];
    if (kv === 0) continue;
    const src = (r + d) * m;
    for (let k = 0; k < m; k++) out[o + k] += kv * u[src + k];
  }
  for (let d = 1; d <= 3; d++) {
    if (r - d < 0) break;
    const kv = bf[(r - d) * 4 + d];
    if (kv === 0) continue;
    const src = (r - d) * m;
    for (let k = 0; k < m; k++) out[o + k] += kv * u[src + k];
  }
}

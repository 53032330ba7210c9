import * as bandedModule from './banded-ldl';
import { EngineError } from './engine-error';
import * as hermiteModule from './hermite';
import { MIN_SUPPORT_GAP, assertStable, assertSupportsApart } from './stability';
import type { BeamInput, Load } from './types';
// Imported functions are bound once here: under tsx (esbuild's CommonJS interop) every call
// through an import binding runs an accessor, which also blocks inlining on the hot path.
const { factorBand, solveBandMany } = bandedModule;
const { addElementStiffness, consistentLine, consistentMoment, consistentPoint } = hermiteModule;

/**
 * Direct-stiffness solution of one member, load by load (domain.md §4,
 * "Direct stiffness method with Hermite beam elements"):
 * - nodes at the supports only; each span between two supports is one Hermite
 *   element, and every load acts inside its element at its exact position,
 *   through its exact fixed-end actions (hermite.ts). Nodes at load points
 *   would create arbitrarily short elements whose stiffness (∝ 1/le³) ruins
 *   the precision of the solve (a load 0.1 % of the length from a cantilever
 *   tip lost seven digits); placing loads inside elements avoids that;
 * - an overhang (or a cantilever) adds no stiffness: its loads reach its
 *   support as a statically equivalent force and couple, and it deflects as a
 *   cantilever off its support plus the support's rotation;
 * - the stiffness is assembled and factored once; every load's response is
 *   its own back-substitution (all loads side by side, solveBandMany), so
 *   superposition is exact and each load's share stays visible;
 * - inside a segment the deflection is the Hermite interpolation of the
 *   nodal values (a rigid rotation on an overhang) plus the clamped particular
 *   solution of each load part: y_p = (M0·t²/2 + V0·t³/6 + Macaulay terms)/EI,
 *   with M0, V0 the internal moment and shear at the clamped end (from the
 *   fixed-end actions on a span, from statics on an overhang). Between load
 *   points this is a polynomial of degree ≤ 5.
 *
 * Segments are numbered left to right. Local coordinate t runs from the
 * segment's origin: the left support of a span, the support of an overhang,
 * towards the right (dir = +1) or, on a left overhang, towards the left
 * (dir = −1; loads are mirrored into it, couples change sign).
 *
 * Buffers are reused from member to member (the engine is synchronous and
 * single-threaded), so solving many members allocates almost nothing.
 */

export const SEG_SPAN = 0;
export const SEG_RIGHT = 1;
export const SEG_LEFT = 2;

export const PART_POINT = 0;
export const PART_MOMENT = 1;
export const PART_LINE = 2;

type F64 = Float64Array<ArrayBuffer>;
type I32 = Int32Array<ArrayBuffer>;

function grow(a: F64, n: number): F64 {
  return a.length >= n ? a : new Float64Array(Math.max(n, a.length * 2));
}
function growInt(a: I32, n: number): I32 {
  return a.length >= n ? a : new Int32Array(Math.max(n, a.length * 2));
}

/** Intensity (N/m) at x of a line load w1 at x1 → w2 at x2; exact at both ends. */
function lineIntensity(x: number, x1: number, x2: number, w1: number, w2: number): number {
  if (x === x1) return w1;
  if (x === x2) return w2;
  if (w1 === w2) return w1;
  return (w1 * (x2 - x) + w2 * (x - x1)) / (x2 - x1);
}

const fe = new Float64Array(4);

export class BeamSolution {
  length = 0;
  EI = 0;
  invEI = 0;
  nLoads = 0;
  /** Distinct support positions (m, ascending) and kinds (1 pin, 2 fixed). */
  nNodes = 0;
  nodeX: F64 = new Float64Array(16);
  nodeKind: I32 = new Int32Array(16);
  nDof = 0;
  /** Segments, left to right: kind, node (left node of a span, the support of an overhang), origin, direction, length, global ends. */
  nSeg = 0;
  segKind: I32 = new Int32Array(16);
  segNode: I32 = new Int32Array(16);
  segX0: F64 = new Float64Array(16);
  segDir: F64 = new Float64Array(16);
  segLen: F64 = new Float64Array(16);
  segFrom: F64 = new Float64Array(16);
  segTo: F64 = new Float64Array(16);
  /**
   * Load parts (one load on one segment), grouped by load: load k owns parts
   * partStart[k]..partStart[k+1]. Local positions t1 ≤ t2 (equal for point
   * loads and couples), values v1 (P, M or intensity at t1) and v2
   * (intensity at t2), and the clamped-end moment M0 (N·m) and shear V0 (N).
   */
  nParts = 0;
  partStart: I32 = new Int32Array(32);
  partSeg: I32 = new Int32Array(64);
  partLoad: I32 = new Int32Array(64);
  partKind: I32 = new Int32Array(64);
  partT1: F64 = new Float64Array(64);
  partT2: F64 = new Float64Array(64);
  partV1: F64 = new Float64Array(64);
  partV2: F64 = new Float64Array(64);
  partM0: F64 = new Float64Array(64);
  partV0: F64 = new Float64Array(64);
  /**
   * Events for the sweep along each segment, sorted by (segment, position):
   * part index, position t, and whether it opens (0) or closes (1) a line
   * load (point loads and couples only open). Segment g owns
   * events eventStart[g]..eventStart[g+1].
   */
  nEvents = 0;
  eventStart: I32 = new Int32Array(16);
  eventPart: I32 = new Int32Array(128);
  eventClose: I32 = new Int32Array(128);
  eventT: F64 = new Float64Array(128);
  /** Factored stiffness per unit EI (restrained DOFs replaced by identity rows), and the unrestrained one for reactions. */
  band: F64 = new Float64Array(64);
  bandFull: F64 = new Float64Array(64);
  /** Nodal response per load, interleaved: DOF i (v = 2j, θ = 2j+1 of node j) of load k at [i·nLoads + k]; m and rad. */
  u: F64 = new Float64Array(256);
  /** Reactions per load, interleaved: node j, component c (0 force N up, 1 moment N·m CCW) of load k at [(2j + c)·nLoads + k]. */
  reactions: F64 = new Float64Array(256);
  /** Distinct case labels in first-seen order, and each load's index into it. */
  cases: string[] = [];
  loadCase: I32 = new Int32Array(32);

  /**
   * Solves `input` (assumed validated by parseBeamInput, apart from the
   * support checks, which are always made). Throws EngineError MECHANISM, or
   * OUT_OF_RANGE for two supports too close to tell apart.
   * `withReactions` false skips the support reactions (the checks-only path).
   */
  solve(input: BeamInput, withReactions = true): this {
    const { length, supports, loads } = input;
    this.length = length;
    this.EI = input.E * input.I;
    this.invEI = 1 / this.EI;
    const nl = loads.length;
    this.nLoads = nl;
    this.buildNodes(input);
    this.buildSegments();

    // ---- stiffness of the spans (per unit EI); every v is held, θ too at fixed supports
    const nn = this.nNodes;
    const n = 2 * nn;
    this.nDof = n;
    const band = (this.band = grow(this.band, n * 4));
    const bandFull = (this.bandFull = grow(this.bandFull, n * 4));
    band.fill(0, 0, n * 4);
    const xs = this.nodeX;
    for (let j = 0; j + 1 < nn; j++) addElementStiffness(band, 2 * j, xs[j + 1] - xs[j]);
    for (let i = 0; i < n * 4; i++) bandFull[i] = band[i];
    const kind = this.nodeKind;
    for (let j = 0; j < nn; j++) {
      restrain(band, 2 * j, n);
      if (kind[j] === 2) restrain(band, 2 * j + 1, n);
    }
    if (factorBand(band, n) >= 0) {
      assertStable(supports);
      throw new Error('The stiffness matrix is singular although the supports hold the member: please report this member.');
    }

    // ---- loads: parts per segment, nodal load vectors (all loads side by side)
    const u = (this.u = grow(this.u, nl * n));
    u.fill(0, 0, nl * n);
    this.partStart = growInt(this.partStart, nl + 1);
    this.loadCase = growInt(this.loadCase, nl);
    this.nParts = 0;
    const cases = this.cases;
    cases.length = 0;
    for (let k = 0; k < nl; k++) {
      const ld = loads[k];
      let ci = 0;
      while (ci < cases.length && cases[ci] !== ld.case) ci++;
      if (ci === cases.length) cases.push(ld.case);
      this.loadCase[k] = ci;
      this.partStart[k] = this.nParts;
      this.splitLoad(k, ld);
    }
    this.partStart[nl] = this.nParts;
    this.buildEvents();

    // ---- solve: keep −F at the support DOFs for the reactions, hold those DOFs at zero
    const R = (this.reactions = grow(this.reactions, n * nl));
    for (let j = 0; j < nn; j++) {
      const dv = 2 * j * nl;
      const fixed = kind[j] === 2;
      for (let k = 0; k < nl; k++) {
        if (withReactions) R[dv + k] = -u[dv + k];
        u[dv + k] = 0;
        if (withReactions) R[dv + nl + k] = fixed ? -u[dv + nl + k] : 0;
        if (fixed) u[dv + nl + k] = 0;
      }
    }
    solveBandMany(band, n, u, nl);
    if (withReactions) {
      for (let j = 0; j < nn; j++) {
        addRowTimes(bandFull, n, 2 * j, u, nl, R, 2 * j * nl);
        if (kind[j] === 2) addRowTimes(bandFull, n, 2 * j + 1, u, nl, R, (2 * j + 1) * nl);
      }
    }
    const inv = this.invEI;
    let bad = !(inv > 0 && inv < Infinity);
    for (let i = 0; i < n * nl; i++) {
      const v = u[i] * inv;
      u[i] = v;
      if (v - v !== 0) bad = true; // NaN or ±Infinity
    }
    if (bad) {
      throw new EngineError(
        'NOT_FINITE',
        '',
        `E·I = ${this.EI} N·m² with these loads gives results outside the range of numbers: check that length, E, I and the loads are in SI base units (m, Pa, m^4, N, N/m).`,
      );
    }
    return this;
  }

  /** Distinct support positions; equal x merge (fixed wins); nearly equal x is an error. */
  private buildNodes(input: BeamInput): void {
    const supports = input.supports;
    const ns = supports.length;
    this.nodeX = grow(this.nodeX, ns);
    this.nodeKind = growInt(this.nodeKind, ns);
    const xs = this.nodeX;
    const kind = this.nodeKind;
    let nn = 0;
    let fixed = false;
    // Insertion into the sorted, distinct list: a member has a handful of supports.
    for (let i = 0; i < ns; i++) {
      const x = supports[i].x + 0;
      const k = supports[i].kind === 'fixed' ? 2 : 1;
      if (k === 2) fixed = true;
      let j = 0;
      while (j < nn && xs[j] < x) j++;
      if (j < nn && xs[j] === x) {
        if (k > kind[j]) kind[j] = k;
        continue;
      }
      for (let m = nn; m > j; m--) {
        xs[m] = xs[m - 1];
        kind[m] = kind[m - 1];
      }
      xs[j] = x;
      kind[j] = k;
      nn++;
    }
    this.nNodes = nn;
    if (!fixed && nn < 2) assertStable(supports);
    for (let j = 0; j + 1 < nn; j++) {
      if (xs[j + 1] - xs[j] < MIN_SUPPORT_GAP * input.length) assertSupportsApart(supports, input.length);
    }
  }

  private buildSegments(): void {
    const nn = this.nNodes;
    const xs = this.nodeX;
    const max = nn + 1;
    this.segKind = growInt(this.segKind, max);
    this.segNode = growInt(this.segNode, max);
    this.segX0 = grow(this.segX0, max);
    this.segDir = grow(this.segDir, max);
    this.segLen = grow(this.segLen, max);
    this.segFrom = grow(this.segFrom, max);
    this.segTo = grow(this.segTo, max);
    this.nSeg = 0;
    if (xs[0] > 0) this.addSegment(SEG_LEFT, 0, xs[0], -1, 0, xs[0]);
    for (let j = 0; j + 1 < nn; j++) this.addSegment(SEG_SPAN, j, xs[j], 1, xs[j], xs[j + 1]);
    if (xs[nn - 1] < this.length) this.addSegment(SEG_RIGHT, nn - 1, xs[nn - 1], 1, xs[nn - 1], this.length);
  }

  private addSegment(kind: number, node: number, x0: number, dir: number, from: number, to: number): void {
    const g = this.nSeg++;
    this.segKind[g] = kind;
    this.segNode[g] = node;
    this.segX0[g] = x0;
    this.segDir[g] = dir;
    this.segLen[g] = to - from;
    this.segFrom[g] = from;
    this.segTo[g] = to;
  }

  /** Index of the first segment with x ≤ its right end (a point on a support belongs to the segment on its left, if any). */
  segmentAt(x: number): number {
    const last = this.nSeg - 1;
    for (let g = 0; g < last; g++) if (x <= this.segTo[g]) return g;
    return last;
  }

  /** Local coordinate t of global x in segment g. */
  localT(g: number, x: number): number {
    const t = this.segDir[g] > 0 ? x - this.segX0[g] : this.segX0[g] - x;
    return t < 0 ? 0 : t > this.segLen[g] ? this.segLen[g] : t;
  }

  /** Global x of local t in segment g (the segment's ends exactly at t = 0 and t = length). */
  globalX(g: number, t: number): number {
    if (t === 0) return this.segX0[g];
    if (t === this.segLen[g]) return this.segDir[g] > 0 ? this.segTo[g] : this.segFrom[g];
    return this.segDir[g] > 0 ? this.segX0[g] + t : this.segX0[g] - t;
  }

  private ensureParts(extra: number): void {
    const need = this.nParts + extra;
    if (this.partSeg.length >= need) return;
    const size = Math.max(need, this.partSeg.length * 2);
    const copyI = (a: I32): I32 => {
      const b = new Int32Array(size);
      b.set(a.subarray(0, this.nParts));
      return b;
    };
    const copyF = (a: F64): F64 => {
      const b = new Float64Array(size);
      b.set(a.subarray(0, this.nParts));
      return b;
    };
    this.partSeg = copyI(this.partSeg);
    this.partLoad = copyI(this.partLoad);
    this.partKind = copyI(this.partKind);
    this.partT1 = copyF(this.partT1);
    this.partT2 = copyF(this.partT2);
    this.partV1 = copyF(this.partV1);
    this.partV2 = copyF(this.partV2);
    this.partM0 = copyF(this.partM0);
    this.partV0 = copyF(this.partV0);
  }

  /** Splits load k into parts per segment and adds its nodal loads to column k of u. */
  private splitLoad(k: number, ld: Load): void {
    if (ld.kind === 'point' || ld.kind === 'moment') {
      this.ensureParts(1);
      const g = this.segmentAt(ld.x);
      const t = this.localT(g, ld.x);
      const isPoint = ld.kind === 'point';
      // A couple changes sign when mirrored into a left overhang's coordinate.
      const v = isPoint ? ld.P : this.segDir[g] > 0 ? ld.M : -ld.M;
      this.addPart(k, g, isPoint ? PART_POINT : PART_MOMENT, t, t, v, v);
      return;
    }
    const x1 = ld.x1;
    const x2 = ld.x2;
    const w1 = ld.kind === 'udl' ? ld.w : ld.w1;
    const w2 = ld.kind === 'udl' ? ld.w : ld.w2;
    this.ensureParts(this.nSeg);
    for (let g = 0; g < this.nSeg; g++) {
      const from = this.segFrom[g];
      const to = this.segTo[g];
      if (!(from < x2 && to > x1)) continue;
      const a = x1 > from ? x1 : from;
      const b = x2 < to ? x2 : to;
      const wa = lineIntensity(a, x1, x2, w1, w2);
      const wb = lineIntensity(b, x1, x2, w1, w2);
      if (this.segDir[g] > 0) this.addPart(k, g, PART_LINE, a - this.segX0[g], b - this.segX0[g], wa, wb);
      else this.addPart(k, g, PART_LINE, this.segX0[g] - b, this.segX0[g] - a, wb, wa);
    }
  }

  /**
   * Records one part and its clamped-end actions, and adds its nodal loads:
   * on a span the consistent loads (exact fixed-end actions reversed), on an
   * overhang the statically equivalent force −V0 and couple dir·M0 at its support.
   */
  private addPart(k: number, g: number, kind: number, t1: number, t2: number, v1: number, v2: number): void {
    const p = this.nParts++;
    this.partSeg[p] = g;
    this.partLoad[p] = k;
    this.partKind[p] = kind;
    this.partT1[p] = t1;
    this.partT2[p] = t2;
    this.partV1[p] = v1;
    this.partV2[p] = v2;
    const nl = this.nLoads;
    const u = this.u;
    const node = this.segNode[g];
    if (this.segKind[g] === SEG_SPAN) {
      const le = this.segLen[g];
      if (kind === PART_POINT) consistentPoint(le, t1, v1, fe);
      else if (kind === PART_MOMENT) consistentMoment(le, t1, v1, fe);
      else consistentLine(le, t1, t2, v1, v2, fe);
      // Internal moment and shear just right of the clamped left end: M0 = f_θ1, V0 = −f_v1.
      this.partM0[p] = fe[1];
      this.partV0[p] = -fe[0];
      const o = 2 * node * nl + k;
      u[o] += fe[0];
      u[o + nl] += fe[1];
      u[o + 2 * nl] += fe[2];
      u[o + 3 * nl] += fe[3];
      return;
    }
    // Overhang: statics of the loads beyond the support (local coordinate, t ≥ 0 away from it).
    let M0: number;
    let V0: number;
    if (kind === PART_POINT) {
      V0 = v1;
      M0 = -v1 * t1;
    } else if (kind === PART_MOMENT) {
      V0 = 0;
      M0 = v1;
    } else {
      const d = t2 - t1;
      V0 = ((v1 + v2) / 2) * d;
      M0 = -(d / 6) * (v1 * (2 * t1 + t2) + v2 * (t1 + 2 * t2));
    }
    this.partM0[p] = M0;
    this.partV0[p] = V0;
    const o = 2 * node * nl + k;
    u[o] -= V0;
    u[o + nl] += this.segDir[g] * M0;
  }

  /**
   * Events of every part, grouped by segment (counting sort), then sorted by
   * position within each segment, openings before closings at the same point
   * (insertion sort: a handful per segment).
   */
  private buildEvents(): void {
    const np = this.nParts;
    const ns = this.nSeg;
    const max = 2 * np;
    this.eventPart = growInt(this.eventPart, max);
    this.eventClose = growInt(this.eventClose, max);
    this.eventT = grow(this.eventT, max);
    const start = (this.eventStart = growInt(this.eventStart, ns + 2));
    const ep = this.eventPart;
    const ec = this.eventClose;
    const et = this.eventT;
    // Counting sort by segment: counts at start[g + 2], prefix sums make start[g + 1] the first
    // slot of g; filling advances it to the end of g, which leaves start[g] = first slot of g.
    start.fill(0, 0, ns + 2);
    for (let p = 0; p < np; p++) start[this.partSeg[p] + 2] += this.partKind[p] === PART_LINE ? 2 : 1;
    for (let g = 0; g < ns; g++) start[g + 2] += start[g + 1];
    for (let p = 0; p < np; p++) {
      const g = this.partSeg[p];
      const adds = this.partKind[p] === PART_LINE ? 2 : 1;
      for (let c = 0; c < adds; c++) {
        const slot = start[g + 1]++;
        ep[slot] = p;
        ec[slot] = c;
        et[slot] = c === 0 ? this.partT1[p] : this.partT2[p];
      }
    }
    for (let g = 0; g < ns; g++) {
      const from = start[g];
      const to = start[g + 1];
      for (let i = from + 1; i < to; i++) {
        const p = ep[i];
        const c = ec[i];
        const t = et[i];
        let j = i - 1;
        while (j >= from && (et[j] > t || (et[j] === t && ec[j] > c))) {
          ep[j + 1] = ep[j];
          ec[j + 1] = ec[j];
          et[j + 1] = et[j];
          j--;
        }
        ep[j + 1] = p;
        ec[j + 1] = c;
        et[j + 1] = t;
      }
    }
    this.nEvents = start[ns];
  }

  /**
   * Deflection (m, up) of every load alone at local t of segment g, into
   * out[k] (0 for loads not on the member there): the nodal part (Hermite on a
   * span, rigid rotation on an overhang) plus the clamped particular solution
   * of each of the load's parts on g.
   */
  loadDeflections(g: number, t: number, out: Float64Array): void {
    const nl = this.nLoads;
    const u = this.u;
    const node = this.segNode[g];
    const o = 2 * node * nl;
    if (this.segKind[g] === SEG_SPAN) {
      // v = 0 at both supports: y = θ1·N2 + θ2·N4.
      const le = this.segLen[g];
      const xi = t / le;
      const om = 1 - xi;
      const n2 = le * xi * om * om;
      const n4 = -le * xi * xi * om;
      for (let k = 0; k < nl; k++) out[k] = n2 * u[o + nl + k] + n4 * u[o + 3 * nl + k];
    } else {
      const dir = this.segDir[g];
      for (let k = 0; k < nl; k++) out[k] = dir * t * u[o + nl + k];
    }
    // Each part of g opens exactly one event of g.
    const inv = this.invEI;
    for (let e = this.eventStart[g]; e < this.eventStart[g + 1]; e++) {
      if (this.eventClose[e] !== 0) continue;
      const p = this.eventPart[e];
      out[this.partLoad[p]] += inv * this.particular(p, t);
    }
  }

  /**
   * EI × the clamped particular deflection of part p at local t (N·m³):
   * M0·t²/2 + V0·t³/6 + the Macaulay terms of the load:
   * −P⟨t − a⟩³/6, −M⟨t − a⟩²/2, and for a line load wa → wb on [a, b]
   * −wa⟨t − a⟩⁴/24 − s⟨t − a⟩⁵/120 inside it (s = (wb − wa)/(b − a)) and,
   * beyond it, −(d³μ0 + 3d²μ1 + 3dμ2 + μ3)/6 with d = t − b and the load's
   * moments about b, μk = δ^(k+1)(wb + (k+1)wa)/((k+1)(k+2)), δ = b − a
   * (the same polynomial, written without cancellation).
   */
  particular(p: number, t: number): number {
    // Powers are formed the same way for t and t − a, so a load at the clamped end cancels exactly.
    const t2 = t * t;
    let y = (this.partM0[p] * t2) / 2 + (this.partV0[p] * (t2 * t)) / 6;
    const a = this.partT1[p];
    if (t <= a) return y;
    const kind = this.partKind[p];
    const d = t - a;
    const d2 = d * d;
    if (kind === PART_POINT) return y - (this.partV1[p] * (d2 * d)) / 6;
    if (kind === PART_MOMENT) return y - (this.partV1[p] * d2) / 2;
    const b = this.partT2[p];
    const wa = this.partV1[p];
    const wb = this.partV2[p];
    const delta = b - a;
    if (t <= b) {
      const d4 = d2 * d2;
      y -= (wa * d4) / 24;
      if (wb !== wa) y -= ((wb - wa) / delta) * ((d4 * d) / 120);
      return y;
    }
    const e = t - b;
    const g2 = delta * delta;
    const mu0 = (delta * (wb + wa)) / 2;
    const mu1 = (g2 * (wb + 2 * wa)) / 6;
    const mu2 = (g2 * delta * (wb + 3 * wa)) / 12;
    const mu3 = (g2 * g2 * (wb + 4 * wa)) / 20;
    return y - (e * (e * (e * mu0 + 3 * mu1) + 3 * mu2) + mu3) / 6;
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

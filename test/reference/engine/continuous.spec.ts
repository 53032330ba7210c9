/**
 * Continuous beams on pins against Clapeyron's three-moment equation
 * (domain.md §4: "otherwise Clapeyron's three-moment equation for the support
 * moments, then simple span + end moments"), solved here independently of the
 * engine with a general-purpose library from the registry (mathjs 15:
 * `lusolve` for the support moments, `polynomialRoot` for the zero-slope
 * points). The comparison uses these EXACT derived values to 1e-9; the
 * rounded AISC coefficients (Steel Construction Manual 15th ed., Table 3-23
 * cases 29, 30, 36, as listed in domain.md) are checked only to the figures
 * the table prints.
 */
import { lusolve, polynomialRoot } from 'mathjs';
import { EI, expectRel, pin, solveMember, type CaselessLoad } from './helpers';

type Poly = number[]; // coefficients, low to high

const add = (p: Poly, q: Poly): Poly => Array.from({ length: Math.max(p.length, q.length) }, (_, i) => (p[i] ?? 0) + (q[i] ?? 0));
const scale = (p: Poly, s: number): Poly => p.map((c) => c * s);
const mul = (p: Poly, q: Poly): Poly => {
  const out = new Array(p.length + q.length - 1).fill(0);
  p.forEach((a, i) => q.forEach((b, j) => (out[i + j] += a * b)));
  return out;
};
const evalPoly = (p: Poly, x: number): number => p.reduceRight((s, c) => s * x + c, 0);
const derive = (p: Poly): Poly => p.slice(1).map((c, i) => c * (i + 1));
/** p(L − x) as a polynomial in x. */
const reflect = (p: Poly, L: number): Poly => p.reduceRight((acc: Poly, c) => add(mul(acc, [L, -1]), [c]), [0]);

interface SpanLoads {
  w?: number; // full-span uniform load, N/m down
  points?: { a: number; P: number }[]; // a from the span's left support
}

/** Piecewise deflection polynomials (y up, local x from the span's left support) of a simple span with end moments. */
function spanPieces(L: number, loads: SpanLoads, Ml: number, Mr: number): { from: number; to: number; y: Poly }[] {
  // End moments (sagging positive): y = −x(L − x)[Ml(2L − x) + Mr(L + x)]/(6EIL)
  let base = scale(mul([0, L, -1], [2 * L * Ml + L * Mr, Mr - Ml]), -1 / (6 * EI * L));
  // Uniform load: y = −w x(L³ − 2Lx² + x³)/24EI (AISC 15th Table 3-23 case 1)
  if (loads.w) base = add(base, scale([0, L ** 3, 0, -2 * L, 1], -loads.w / (24 * EI)));
  const cuts = [0, ...(loads.points ?? []).map((p) => p.a).sort((p, q) => p - q), L];
  return cuts.slice(0, -1).map((from, i) => {
    const to = cuts[i + 1];
    let y = base;
    for (const { a, P } of loads.points ?? []) {
      const b = L - a;
      // Point load (AISC case 8 general form): x ≤ a: −Pbx(L² − b² − x²)/6EIL; x ≥ a: the mirror image.
      const left = scale([0, L ** 2 - b ** 2, 0, -1], (-P * b) / (6 * EI * L));
      const right = reflect(scale([0, L ** 2 - a ** 2, 0, -1], (-P * a) / (6 * EI * L)), L);
      y = add(y, to <= a ? left : right);
    }
    return { from, to, y };
  });
}

/** Support moments by the three-moment equation (equal EI, pinned ends), sagging positive. */
function supportMoments(spans: number[], loads: SpanLoads[]): number[] {
  const n = spans.length - 1; // interior supports
  const A: number[][] = [];
  const rhs: number[] = [];
  for (let i = 0; i < n; i++) {
    const L1 = spans[i];
    const L2 = spans[i + 1];
    const row = new Array(n).fill(0);
    if (i > 0) row[i - 1] = L1;
    row[i] = 2 * (L1 + L2);
    if (i < n - 1) row[i + 1] = L2;
    A.push(row);
    let r = -((loads[i].w ?? 0) * L1 ** 3) / 4 - ((loads[i + 1].w ?? 0) * L2 ** 3) / 4;
    // P·d(L² − d²)/L with d measured from the far support of each span
    for (const { a, P } of loads[i].points ?? []) r -= (P * a * (L1 ** 2 - a ** 2)) / L1;
    for (const { a, P } of loads[i + 1].points ?? []) r -= (P * (L2 - a) * (L2 ** 2 - (L2 - a) ** 2)) / L2;
    rhs.push(r);
  }
  const m = lusolve(A, rhs) as number[][];
  return [0, ...m.map((row) => row[0]), 0];
}

/** Largest-magnitude deflection of one span: zero-slope points from mathjs, polished by Newton on the same polynomial. */
function spanExtreme(pieces: { from: number; to: number; y: Poly }[]): { x: number; y: number } {
  let best = { x: 0, y: 0 };
  for (const { from, to, y } of pieces) {
    const d = derive(y);
    const candidates = [from, to];
    const roots = polynomialRoot(...(d.slice(0, 4) as [number, number, number, number])) as unknown[];
    for (const r of roots) {
      if (typeof r !== 'number') continue;
      let x = r;
      for (let k = 0; k < 3; k++) x -= evalPoly(d, x) / evalPoly(derive(d), x);
      if (x > from && x < to) candidates.push(x);
    }
    for (const x of candidates) {
      const v = evalPoly(y, x);
      if (Math.abs(v) > Math.abs(best.y)) best = { x, y: v };
    }
  }
  return best;
}

/** Builds the member and compares every span's extreme (value and location) with the Clapeyron reference. */
function compare(spans: number[], loads: SpanLoads[]): { moments: number[]; extremes: { x: number; y: number }[] } {
  const supports = [0];
  spans.forEach((l) => supports.push(supports[supports.length - 1] + l));
  const engineLoads: CaselessLoad[] = [];
  loads.forEach((sl, i) => {
    const x0 = supports[i];
    if (sl.w) engineLoads.push({ kind: 'udl', x1: x0, x2: supports[i + 1], w: sl.w });
    for (const { a, P } of sl.points ?? []) engineLoads.push({ kind: 'point', x: x0 + a, P });
  });
  const report = solveMember(supports[supports.length - 1], supports.map(pin), engineLoads);
  const moments = supportMoments(spans, loads);
  const extremes = spans.map((L, i) => {
    const ref = spanExtreme(spanPieces(L, loads[i], moments[i], moments[i + 1]));
    const seg = report.combinations.D.segments[i];
    expect(seg.kind).toBe('span');
    expectRel(seg.extreme.deflection, ref.y);
    expectRel(seg.extreme.x - supports[i], ref.x);
    return { x: ref.x, y: ref.y };
  });
  return { moments, extremes };
}

describe('continuous beams, equal spans l (Clapeyron exact; AISC rounded coefficients as printed)', () => {
  const l = 6.4;
  const w = 5300;
  const P = 21000;

  it('two spans, both loaded: M_B = −wl²/8 and each span as the propped case, 0.00541wl⁴/EI at 0.4215l (AISC case 12 via 29)', () => {
    const { moments, extremes } = compare([l, l], [{ w }, { w }]);
    expectRel(moments[1], (-w * l ** 2) / 8);
    // The exact coefficient is 0.0054159…; the table's 0.00541 (≈ 1/185) is rounded down, so compare to 1e-5.
    expect((-extremes[0].y * EI) / (w * l ** 4)).toBeCloseTo(0.00541, 4);
    expectRel(extremes[0].x, (l * (1 + Math.sqrt(33))) / 16);
  });

  it('two spans, one loaded: M_B = −wl²/16; max 0.0092wl⁴/EI at 0.472l (AISC case 29)', () => {
    const { moments, extremes } = compare([l, l], [{ w }, {}]);
    expectRel(moments[1], (-w * l ** 2) / 16);
    expect(((-extremes[0].y * EI) / (w * l ** 4)).toFixed(4)).toBe('0.0092');
    expect((extremes[0].x / l).toFixed(3)).toBe('0.472');
    expect(extremes[1].y).toBeGreaterThan(0); // the unloaded span lifts
  });

  it('two spans, centre point load in one: M_B = −3Pl/32; max 0.015Pl³/EI at 0.480l (AISC case 30)', () => {
    const { moments, extremes } = compare([l, l], [{ points: [{ a: l / 2, P }] }, {}]);
    expectRel(moments[1], (-3 * P * l) / 32);
    expect(((-extremes[0].y * EI) / (P * l ** 3)).toFixed(3)).toBe('0.015');
    expect((extremes[0].x / l).toFixed(2)).toBe('0.48');
  });

  it('three spans, all loaded: M_B = M_C = −wl²/10; end-span max 0.0069wl⁴/EI at 0.446l (AISC case 36)', () => {
    const { moments, extremes } = compare([l, l, l], [{ w }, { w }, { w }]);
    expectRel(moments[1], (-w * l ** 2) / 10);
    expectRel(moments[2], (-w * l ** 2) / 10);
    expect(((-extremes[0].y * EI) / (w * l ** 4)).toFixed(4)).toBe('0.0069');
    expect((extremes[0].x / l).toFixed(3)).toBe('0.446');
  });

  it('three spans, alternate spans loaded (pattern for the largest end-span sag, AISC cases 34–35 pattern)', () => {
    compare([l, l, l], [{ w }, {}, { w }]);
  });
});

describe('continuous beams, unequal spans and mixed loads (Clapeyron exact)', () => {
  it('three unequal spans with uniform and point loads', () => {
    compare([5.2, 7.9, 4.1], [{ w: 3100, points: [{ a: 1.3, P: 12000 }] }, { w: 6400 }, { points: [{ a: 2.9, P: 30000 }, { a: 0.8, P: 7000 }] }]);
  });

  it('four spans, light middle spans that bulge up', () => {
    compare([8.5, 3.0, 3.0, 8.5], [{ w: 9000 }, {}, { w: 500 }, { w: 9000 }]);
  });
});

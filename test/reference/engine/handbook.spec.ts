/**
 * Closed-form beam cases from published handbooks against the engine:
 * - AISC Steel Construction Manual, 15th ed., Table 3-23 "Shears, Moments and
 *   Deflections", case numbers as listed in domain.md §4 (numbers from
 *   memory there; cases 18–21 verified against an older edition with the
 *   same numbering);
 * - Roark's Formulas for Stress and Strain, 7th ed., Table 8.1 (cases 1–3,
 *   a–f end conditions).
 * Values AND locations to 1e-9 relative (calc-contract.md accuracy rule).
 * Signs: the handbooks give downward deflection as a positive magnitude; the
 * engine reports deflection positive UP, so a sag is −Δ.
 */
import { EI, expectRel, extremeOf, fixed, pin, solveMember } from './helpers';

const L = 7.3;
const w = 4250; // N/m
const P = 18300; // N

describe('simple span (pins at both ends)', () => {
  it('uniform load: 5wL⁴/384EI at midspan (AISC 15th Table 3-23 case 1; Roark 7th Table 8.1 case 2e)', () => {
    const r = solveMember(L, [pin(0), pin(L)], [{ kind: 'udl', x1: 0, x2: L, w }], [1.9]);
    const ex = extremeOf(r);
    expectRel(ex.deflection, (-5 * w * L ** 4) / (384 * EI));
    expectRel(ex.x, L / 2);
    // Δx = wx(L³ − 2Lx² + x³)/24EI (AISC case 1)
    const x = 1.9;
    expectRel(r.combinations.D.probes[0].deflection, (-w * x * (L ** 3 - 2 * L * x ** 2 + x ** 3)) / (24 * EI));
  });

  it('centre point load: PL³/48EI at midspan (AISC case 7)', () => {
    const ex = extremeOf(solveMember(L, [pin(0), pin(L)], [{ kind: 'point', x: L / 2, P }]));
    expectRel(ex.deflection, (-P * L ** 3) / (48 * EI));
    expectRel(ex.x, L / 2);
  });

  it('off-centre point load a > b: Pab(a+2b)√(3a(a+2b))/(27EIL) at √(a(a+2b)/3) from the far support, not at midspan (AISC case 8)', () => {
    const a = 5.1;
    const b = L - a;
    const ex = extremeOf(solveMember(L, [pin(0), pin(L)], [{ kind: 'point', x: a, P }]));
    expectRel(ex.deflection, (-P * a * b * (a + 2 * b) * Math.sqrt(3 * a * (a + 2 * b))) / (27 * EI * L));
    expectRel(ex.x, Math.sqrt((a * (a + 2 * b)) / 3));
    expect(Math.abs(ex.x - L / 2)).toBeGreaterThan(0.1);
  });

  it('the same off-centre load mirrored: the maximum is measured from the right-hand support (AISC case 8)', () => {
    const a = 5.1;
    const b = L - a;
    const ex = extremeOf(solveMember(L, [pin(0), pin(L)], [{ kind: 'point', x: b, P }]));
    expectRel(ex.deflection, (-P * a * b * (a + 2 * b) * Math.sqrt(3 * a * (a + 2 * b))) / (27 * EI * L));
    expectRel(ex.x, L - Math.sqrt((a * (a + 2 * b)) / 3));
  });

  it('two symmetric point loads: Pa(3L² − 4a²)/24EI at midspan (AISC case 9)', () => {
    const a = 2.2;
    const ex = extremeOf(solveMember(L, [pin(0), pin(L)], [{ kind: 'point', x: a, P }, { kind: 'point', x: L - a, P }]));
    expectRel(ex.deflection, (-P * a * (3 * L ** 2 - 4 * a ** 2)) / (24 * EI));
    expectRel(ex.x, L / 2);
  });

  it('load increasing uniformly to one end, total W: Wx(3x⁴ − 10L²x² + 7L⁴)/(180EIL²), max ≈ 0.01304WL³/EI at L√(1 − √(8/15)) ≈ 0.5193L (AISC case 2)', () => {
    const w0 = 6100;
    const W = (w0 * L) / 2;
    const ex = extremeOf(solveMember(L, [pin(0), pin(L)], [{ kind: 'linear', x1: 0, x2: L, w1: 0, w2: w0 }]));
    const xm = L * Math.sqrt(1 - Math.sqrt(8 / 15));
    expectRel(ex.x, xm);
    expectRel(ex.deflection, (-W * xm * (3 * xm ** 4 - 10 * L ** 2 * xm ** 2 + 7 * L ** 4)) / (180 * EI * L ** 2));
    // the handbook's rounded coefficient, to its printed 4 significant figures
    expect(((-ex.deflection * EI) / (W * L ** 3)).toFixed(5)).toBe('0.01304');
    expect((ex.x / L).toFixed(4)).toBe('0.5193');
  });

  it('load increasing uniformly to the centre, total W: WL³/60EI at midspan (AISC case 3)', () => {
    const w0 = 6100;
    const W = (w0 * L) / 2;
    const ex = extremeOf(
      solveMember(L, [pin(0), pin(L)], [
        { kind: 'linear', x1: 0, x2: L / 2, w1: 0, w2: w0 },
        { kind: 'linear', x1: L / 2, x2: L, w1: w0, w2: 0 },
      ]),
    );
    expectRel(ex.deflection, (-W * L ** 3) / (60 * EI));
    expectRel(ex.x, L / 2);
  });

  it('partial uniform load = (load from a to the end) − (load from b to the end) (Roark Table 8.1 case 2e superposed)', () => {
    const a = 1.4;
    const b = 4.6;
    // Roark 2e with wa = wl = w over a..L, closed form by Macaulay integration of the simple span:
    // EI·y″ = M(x) = R1·x − (w/2)[⟨x − a⟩² − ⟨x − b⟩²] (sagging positive, y up), so
    // EI·y = R1·x³/6 − (w/24)[⟨x − a⟩⁴ − ⟨x − b⟩⁴] + C1·x, with C1 from y(L) = 0.
    const R1 = (w * (b - a) * (L - (a + b) / 2)) / L;
    const macaulay = (x: number): number => (x > a ? (x - a) ** 4 : 0) - (x > b ? (x - b) ** 4 : 0);
    const C1 = -((R1 * L ** 3) / 6 - (w / 24) * macaulay(L)) / L;
    const y = (x: number): number => ((R1 * x ** 3) / 6 - (w / 24) * macaulay(x) + C1 * x) / EI;
    const probes = [0.7, 2.5, 3.65, 6.1];
    const r = solveMember(L, [pin(0), pin(L)], [{ kind: 'udl', x1: a, x2: b, w }], probes);
    probes.forEach((x, i) => expectRel(r.combinations.D.probes[i].deflection, y(x)));
  });

  it('couple M0 at one support: M0·x(L − x)(2L − x)/(6EIL), max M0L²/(9√3·EI) at 0.4226L, midspan M0L²/16EI (Roark Table 8.1 case 3e)', () => {
    const M0 = 24000; // N·m, counter-clockwise at the left support: the span lifts
    const r = solveMember(L, [pin(0), pin(L)], [{ kind: 'moment', x: 0, M: M0 }], [L / 2]);
    const ex = extremeOf(r);
    expectRel(ex.deflection, (M0 * L ** 2) / (9 * Math.sqrt(3) * EI));
    expectRel(ex.x, L * (1 - 1 / Math.sqrt(3)));
    expectRel(r.combinations.D.probes[0].deflection, (M0 * L ** 2) / (16 * EI));
  });
});

describe('cantilever fixed at x = 0 (an overhang segment)', () => {
  it('tip point load: PL³/3EI (AISC case 22)', () => {
    const ex = extremeOf(solveMember(L, [fixed(0)], [{ kind: 'point', x: L, P }]));
    expect(ex.kind).toBe('overhang');
    expectRel(ex.deflection, (-P * L ** 3) / (3 * EI));
    expect(ex.x).toBe(L);
  });

  it('point load at b from the fixed end: tip Pb²(3L − b)/6EI (AISC case 21)', () => {
    const b = 4.4;
    const ex = extremeOf(solveMember(L, [fixed(0)], [{ kind: 'point', x: b, P }]));
    expectRel(ex.deflection, (-P * b ** 2 * (3 * L - b)) / (6 * EI));
    expect(ex.x).toBe(L);
  });

  it('uniform load: wL⁴/8EI (AISC case 19)', () => {
    const ex = extremeOf(solveMember(L, [fixed(0)], [{ kind: 'udl', x1: 0, x2: L, w }]));
    expectRel(ex.deflection, (-w * L ** 4) / (8 * EI));
  });

  it('partial uniform load from the fixed end over a: tip wa³(4L − a)/24EI (Roark Table 8.1 case 2a, uniform over part)', () => {
    const a = 3.1;
    const ex = extremeOf(solveMember(L, [fixed(0)], [{ kind: 'udl', x1: 0, x2: a, w }]));
    expectRel(ex.deflection, (-w * a ** 3 * (4 * L - a)) / (24 * EI));
    expect(ex.x).toBe(L);
  });

  it('load increasing to the fixed end, total W: WL³/15EI (AISC case 18)', () => {
    const w0 = 5200;
    const ex = extremeOf(solveMember(L, [fixed(0)], [{ kind: 'linear', x1: 0, x2: L, w1: w0, w2: 0 }]));
    expectRel(ex.deflection, (-((w0 * L) / 2) * L ** 3) / (15 * EI));
  });

  it('load increasing to the tip, w0 at the tip: 11w0L⁴/120EI (Roark Table 8.1 case 2a)', () => {
    const w0 = 5200;
    const ex = extremeOf(solveMember(L, [fixed(0)], [{ kind: 'linear', x1: 0, x2: L, w1: 0, w2: w0 }]));
    expectRel(ex.deflection, (-11 * w0 * L ** 4) / (120 * EI));
  });

  it('tip couple: ML²/2EI (Roark Table 8.1 case 3a)', () => {
    const M = -15000; // clockwise at the tip: the tip goes down
    const ex = extremeOf(solveMember(L, [fixed(0)], [{ kind: 'moment', x: L, M }]));
    expectRel(ex.deflection, (M * L ** 2) / (2 * EI));
  });

  it('fixed at the right end instead: the same tip deflection at x = 0 (mirror of AISC case 22)', () => {
    const ex = extremeOf(solveMember(L, [fixed(L)], [{ kind: 'point', x: 0, P }]));
    expectRel(ex.deflection, (-P * L ** 3) / (3 * EI));
    expect(ex.x).toBe(0);
  });
});

describe('beam overhanging one support: span l, overhang a (AISC cases 24–26)', () => {
  const l = 6.2;
  const a = 1.9;

  it('uniform load on the overhang only: tip wa³(4l + 3a)/24EI down; back span bulges UP by wa²l²/(18√3·EI) at l/√3 from the far support (AISC case 25)', () => {
    const r = solveMember(l + a, [pin(0), pin(l)], [{ kind: 'udl', x1: l, x2: l + a, w }]);
    const span = extremeOf(r, 0);
    const tip = extremeOf(r, 1);
    expect(span.kind).toBe('span');
    expect(span.deflection).toBeGreaterThan(0);
    expectRel(span.deflection, (w * a ** 2 * l ** 2) / (18 * Math.sqrt(3) * EI));
    expectRel(span.x, l / Math.sqrt(3));
    expect((span.deflection * EI) / (w * a ** 2 * l ** 2)).toBeCloseTo(0.03208, 5);
    expect(tip.kind).toBe('overhang');
    expectRel(tip.deflection, (-w * a ** 3 * (4 * l + 3 * a)) / (24 * EI));
    expect(tip.x).toBe(l + a);
  });

  it('point load at the tip: tip Pa²(l + a)/3EI; bulge Pal²/(9√3·EI) = 0.06415Pal²/EI at l/√3 (AISC case 26)', () => {
    const r = solveMember(l + a, [pin(0), pin(l)], [{ kind: 'point', x: l + a, P }]);
    expectRel(extremeOf(r, 0).deflection, (P * a * l ** 2) / (9 * Math.sqrt(3) * EI));
    expectRel(extremeOf(r, 0).x, l / Math.sqrt(3));
    expect((extremeOf(r, 0).deflection * EI) / (P * a * l ** 2)).toBeCloseTo(0.06415, 5);
    expectRel(extremeOf(r, 1).deflection, (-P * a ** 2 * (l + a)) / (3 * EI));
  });

  it('uniform load over the whole length: Δx1 = wx1(4a²l − l³ + 6a²x1 − 4ax1² + x1³)/24EI on the overhang; a short overhang tip rises (AISC case 24)', () => {
    const x1s = [0.5, 1.2, a];
    const r = solveMember(l + a, [pin(0), pin(l)], [{ kind: 'udl', x1: 0, x2: l + a, w }], x1s.map((x1) => l + x1));
    const delta = (x1: number): number => (w * x1 * (4 * a ** 2 * l - l ** 3 + 6 * a ** 2 * x1 - 4 * a * x1 ** 2 + x1 ** 3)) / (24 * EI);
    x1s.forEach((x1, i) => expectRel(r.combinations.D.probes[i].deflection, -delta(x1)));
    expect(r.combinations.D.probes[2].deflection).toBeGreaterThan(0); // tip rises: 4a²l < l³ here
  });
});

describe('fixed at both ends', () => {
  it('uniform load: wL⁴/384EI at midspan (AISC case 15)', () => {
    const ex = extremeOf(solveMember(L, [fixed(0), fixed(L)], [{ kind: 'udl', x1: 0, x2: L, w }]));
    expectRel(ex.deflection, (-w * L ** 4) / (384 * EI));
    expectRel(ex.x, L / 2);
  });

  it('centre point load: PL³/192EI (AISC case 16)', () => {
    const ex = extremeOf(solveMember(L, [fixed(0), fixed(L)], [{ kind: 'point', x: L / 2, P }]));
    expectRel(ex.deflection, (-P * L ** 3) / (192 * EI));
    expectRel(ex.x, L / 2);
  });

  it('point load at a > b: 2Pa³b²/(3EI(3a + b)²) at x = 2aL/(3a + b); Pa³b³/(3EIL³) under the load (AISC case 17)', () => {
    const a = 4.9;
    const b = L - a;
    const r = solveMember(L, [fixed(0), fixed(L)], [{ kind: 'point', x: a, P }], [a]);
    const ex = extremeOf(r);
    expectRel(ex.deflection, (-2 * P * a ** 3 * b ** 2) / (3 * EI * (3 * a + b) ** 2));
    expectRel(ex.x, (2 * a * L) / (3 * a + b));
    expectRel(r.combinations.D.probes[0].deflection, (-P * a ** 3 * b ** 3) / (3 * EI * L ** 3));
  });
});

describe('propped: pin at x = 0, fixed at x = L', () => {
  it('uniform load: wx(L³ − 3Lx² + 2x³)/48EI, max ≈ wL⁴/185EI at L(1 + √33)/16 ≈ 0.4215L (AISC case 12)', () => {
    const ex = extremeOf(solveMember(L, [pin(0), fixed(L)], [{ kind: 'udl', x1: 0, x2: L, w }]));
    const xm = (L * (1 + Math.sqrt(33))) / 16;
    expectRel(ex.x, xm);
    expectRel(ex.deflection, (-w * xm * (L ** 3 - 3 * L * xm ** 2 + 2 * xm ** 3)) / (48 * EI));
    expect(Math.round((-w * L ** 4) / (EI * ex.deflection))).toBe(185);
    expect((ex.x / L).toFixed(4)).toBe('0.4215');
  });

  it('centre point load: PL³/(48√5·EI) at L/√5 from the pinned end (AISC case 13)', () => {
    const ex = extremeOf(solveMember(L, [pin(0), fixed(L)], [{ kind: 'point', x: L / 2, P }]));
    expectRel(ex.deflection, (-P * L ** 3) / (48 * Math.sqrt(5) * EI));
    expectRel(ex.x, L / Math.sqrt(5));
  });

  it('point load at a < 0.414L from the pinned end: Pa(L² − a²)³/(3EI(3L² − a²)²) at L(L² + a²)/(3L² − a²) (AISC case 14)', () => {
    const a = 0.3 * L;
    const ex = extremeOf(solveMember(L, [pin(0), fixed(L)], [{ kind: 'point', x: a, P }]));
    expectRel(ex.deflection, (-P * a * (L ** 2 - a ** 2) ** 3) / (3 * EI * (3 * L ** 2 - a ** 2) ** 2));
    expectRel(ex.x, (L * (L ** 2 + a ** 2)) / (3 * L ** 2 - a ** 2));
  });
});

describe('loads and supports very close to each other keep full precision', () => {
  it.each([1e-3, 1e-6, 1e-9, 1e-13])('cantilever, point load %s × L from the tip: Pb²(3L − b)/6EI (AISC case 21)', (gap) => {
    const b = L * (1 - gap);
    const ex = extremeOf(solveMember(L, [fixed(0)], [{ kind: 'point', x: b, P }]));
    expectRel(ex.deflection, (-P * b ** 2 * (3 * L - b)) / (6 * EI), 1e-12);
  });

  it.each([1e-4, 1e-7, 1e-10])('a tiny overhang (%s × l) beyond a pin under a tip load: Pa²(l + a)/3EI (AISC case 26)', (frac) => {
    const l = 6.2;
    const a = l + l * frac - l; // the overhang the member really has once l + a is rounded
    const r = solveMember(l + a, [pin(0), pin(l)], [{ kind: 'point', x: l + a, P }]);
    expectRel(extremeOf(r, 1).deflection, (-P * a ** 2 * (l + a)) / (3 * EI), 1e-9);
    expectRel(extremeOf(r, 0).deflection, (P * a * l ** 2) / (9 * Math.sqrt(3) * EI), 1e-9);
  });

  it('a distributed load ending one rounding step short of the member end is still exact (AISC case 1)', () => {
    const x2 = L - L * Number.EPSILON;
    const ex = extremeOf(solveMember(L, [pin(0), pin(L)], [{ kind: 'udl', x1: 0, x2, w }]));
    expectRel(ex.deflection, (-5 * w * L ** 4) / (384 * EI), 1e-12);
  });
});

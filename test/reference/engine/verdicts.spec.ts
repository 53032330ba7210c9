/**
 * Verdict cases of domain.md §6, each built from a preset rule and a member
 * whose deflection is known in closed form (AISC Steel Construction Manual
 * 15th ed., Table 3-23; case numbers as in domain.md §4), so the verdict is
 * checked against the published limit and the handbook deflection together.
 */
import { analyzeBeam, checkBeam, type BeamInput, type CheckSegmentResult, type Load } from '../../../common/src/engine';
import { ACI_318_19, IBC_2021, aciLambdaDelta, buildBeamInput, checksFor, type MaterialId } from '../../../common/src/limits';
import { expectRel } from './helpers';

const E = 200e9; // steel, AISC Manual notation E = 29,000 ksi ≈ 200,000 MPa

/** A simple span of length L with full-length uniform loads per case. */
function simpleSpan(L: number, w: Record<string, number>): BeamInput['loads'] {
  return Object.entries(w).map(([c, v]) => ({ case: c, kind: 'udl', x1: 0, x2: L, w: v }) as Load);
}

/** 5wL⁴/384EI, the simple-span uniform-load midspan deflection (AISC case 1), m down. */
const udlSag = (w: number, L: number, EI: number): number => (5 * w * L ** 4) / (384 * EI);

function run(input: BeamInput, checkName: string): CheckSegmentResult[] {
  const report = analyzeBeam(input);
  const check = report.checks.find((c) => c.name === checkName);
  if (!check) throw new Error(`no check ${checkName}`);
  // The bulk fast path must agree exactly with the full report.
  expect(checkBeam(input).find((c) => c.name === checkName)).toEqual(check);
  return check.segments;
}

function member(L: number, I: number, supports: BeamInput['supports'], loads: Load[], category: string, material: MaterialId): BeamInput {
  return buildBeamInput({ length: L, E, I, supports, loads }, IBC_2021, category, material);
}

describe('IBC 2021 Table 1604.3 verdicts', () => {
  it('a cantilever passes L/360 only because its effective length is twice its length (cantilever footnote; AISC case 19)', () => {
    const a = 2.0;
    const w = 3000;
    // Choose I so that |Δ| = a/250: it would fail a/360, and passes 2a/360 (= a/180).
    const I = (w * a ** 4) / (8 * E) / (a / 250);
    const input = member(a, I, [{ x: 0, kind: 'fixed' }], [{ case: 'L', kind: 'udl', x1: 0, x2: a, w }], 'floor', 'steel');
    const [seg] = run(input, 'L/360 live');
    expect(seg.kind).toBe('overhang');
    expect(seg.effectiveLength).toBe(2 * a);
    expectRel(-seg.deflection, a / 250);
    expectRel(seg.spanRatio as number, 500);
    expect(a / Math.abs(seg.deflection)).toBeLessThan(360); // on the plain length it would fail
    expect(seg.pass).toBe(true);
  });

  it.each([
    [360.2, true],
    [359.8, false],
  ])('a floor beam with span ratio %s under live load: pass = %s (L/360 live)', (ratio, pass) => {
    const L = 6.0;
    const w = 7000;
    const I = (udlSag(w, L, E) * ratio) / L; // so that L/|Δ| = ratio exactly (AISC case 1)
    const input = member(L, I, [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }], simpleSpan(L, { L: w, D: 2000 }), 'floor', 'steel');
    const [seg] = run(input, 'L/360 live');
    expectRel(seg.spanRatio as number, ratio);
    expect(seg.pass).toBe(pass);
    expectRel(seg.utilization, 360 / ratio);
    expectRel(seg.requiredI, (I * 360) / ratio);
  });

  it('dry wood: the total check uses L + 0.5D (footnote d), which passes where D + L would fail', () => {
    const L = 4.2;
    const Ew = 12.4e9; // an invented sawn-timber modulus
    const wD = 3000;
    const wL = 2000;
    const I = udlSag(wD + wL, L, Ew) / (L / 200); // D + L would sag l/200; L + 0.5D sags 0.7 of that = l/286
    const input = buildBeamInput(
      { length: L, E: Ew, I, supports: [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }], loads: simpleSpan(L, { D: wD, L: wL }) },
      IBC_2021,
      'floor',
      'timber',
    );
    expect(input.checks?.[1]).toMatchObject({ name: 'L/240 total', combination: '0.5D+L' });
    const [seg] = run(input, 'L/240 total');
    const EI = Ew * I;
    expectRel(-seg.deflection, udlSag(0.5 * wD + wL, L, EI));
    expect(seg.pass).toBe(true);
    expect(udlSag(wD + wL, L, EI)).toBeGreaterThan(L / 240); // D + L would have failed
  });

  it('steel: the dead load is dropped from the total check (footnote g)', () => {
    const L = 6.0;
    const input = member(L, 1e-4, [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }], simpleSpan(L, { D: 5000, L: 3000 }), 'floor', 'steel');
    const [seg] = run(input, 'L/240 total');
    expectRel(-seg.deflection, udlSag(3000, L, E * 1e-4));
  });

  it('members supporting masonry: the 0.3 in cap governs over l/600 above 15 ft (TMS 402)', () => {
    const L = 6.0; // l/600 = 10 mm > 7.62 mm
    const I = udlSag(9000, L, E) / 0.008; // |Δ| = 8 mm under D + L = 9000 N/m
    const input = member(L, I, [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }], simpleSpan(L, { D: 6000, L: 3000 }), 'supports-masonry', 'steel');
    const [seg] = run(input, 'L/600 total, 0.3 in max');
    expectRel(-seg.deflection, 0.008);
    expect(seg.governing).toBe('maxAbs');
    expect(seg.allowed).toBeCloseTo(0.00762, 15);
    expect(seg.spanRatio as number).toBeGreaterThan(600); // passes the ratio…
    expect(seg.pass).toBe(false); // …but not the cap
    expectRel(seg.requiredI, (I * 0.008) / 0.00762);
  });

  it('members supporting masonry: below 15 ft l/600 governs', () => {
    const L = 4.0; // l/600 = 6.67 mm < 7.62 mm
    const input = member(L, 5e-5, [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }], simpleSpan(L, { D: 6000, L: 3000 }), 'supports-masonry', 'steel');
    const [seg] = run(input, 'L/600 total, 0.3 in max');
    expect(seg.governing).toBe('ratio');
    expectRel(seg.allowed, L / 600);
  });

  it('glazing per pane: the 3/4 in cap governs over l/175 on a 4 m frame (§2403.3)', () => {
    const L = 4.0; // l/175 = 22.86 mm > 19.05 mm
    const W = 1200;
    const I = udlSag(0.6 * W, L, 70e9) / 0.02; // |Δ| = 20 mm under 0.6W
    const input = buildBeamInput(
      { length: L, E: 70e9, I, supports: [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }], loads: simpleSpan(L, { W }) },
      IBC_2021,
      'glazing-pane',
      'aluminium',
    );
    const [seg] = run(input, 'L/175 wind, 3/4 in max');
    expectRel(-seg.deflection, 0.02);
    expect(seg.governing).toBe('maxAbs');
    expect(seg.allowed).toBeCloseTo(0.01905, 15);
    expect(seg.pass).toBe(false);
  });

  it('framing supporting glass over 13 ft 6 in: l/240 + 1/4 in is additive (§1604.3.7)', () => {
    const L = 5.0;
    const W = 1500;
    const I = udlSag(0.6 * W, L, 70e9) / 0.025; // |Δ| = 25 mm: fails l/240 = 20.8 mm alone, passes 27.18 mm
    const input = buildBeamInput(
      { length: L, E: 70e9, I, supports: [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }], loads: simpleSpan(L, { W }) },
      IBC_2021,
      'supports-glass',
      'aluminium',
    );
    const [seg] = run(input, 'L/240 + 1/4 in wind (over 13 ft 6 in)');
    expectRel(seg.allowed, L / 240 + 0.00635);
    expect(seg.plus).toBeCloseTo(0.00635, 15);
    expect(seg.spanRatio as number).toBeLessThan(240);
    expect(seg.pass).toBe(true);
  });

  it('an overhang whose back-span bulge is upward is checked by its magnitude (AISC case 26)', () => {
    const l = 5.0;
    const a = 2.0;
    const P = 20000;
    const I = 4e-5;
    const input = member(l + a, I, [{ x: 0, kind: 'pin' }, { x: l, kind: 'pin' }], [{ case: 'L', kind: 'point', x: l + a, P }], 'floor', 'steel');
    const [span, overhang] = run(input, 'L/360 live');
    const bulge = (P * a * l ** 2) / (9 * Math.sqrt(3) * E * I);
    expect(span.deflection).toBeGreaterThan(0);
    expectRel(span.deflection, bulge);
    expectRel(span.spanRatio as number, l / bulge);
    expect(span.pass).toBe(l / bulge >= 360);
    expect(overhang.effectiveLength).toBe(2 * a);
    expectRel(-overhang.deflection, (P * a ** 2 * (l + a)) / (3 * E * I));
  });

  it('a continuous beam is checked span by span, each on its own length', () => {
    const spans = [7.0, 3.0];
    const L = spans[0] + spans[1];
    const input = member(
      L,
      1.2e-5,
      [{ x: 0, kind: 'pin' }, { x: 7, kind: 'pin' }, { x: L, kind: 'pin' }],
      [{ case: 'L', kind: 'udl', x1: 0, x2: L, w: 4000 }],
      'floor',
      'steel',
    );
    const results = run(input, 'L/360 live');
    expect(results.map((r) => [r.from, r.to, r.kind, r.effectiveLength])).toEqual([
      [0, 7, 'span', 7],
      [7, 10, 'span', 3],
    ]);
    expect(results[0].pass).toBe(false);
    expect(results[1].pass).toBe(true);
    const report = analyzeBeam(input);
    expect(report.checks[0].pass).toBe(false);
    expect(report.checks[0].utilization).toBe(results[0].utilization);
  });
});

describe('ACI 318-19 Table 24.2.2 verdicts', () => {
  it('λΔ written as combination factors: after-attachment deflection = λΔ·Δ_D + Δ_L (§24.2.4.1.1)', () => {
    const L = 8.0;
    const Ec = 4700 * Math.sqrt(35) * 1e6; // Ec = 4700√f′c MPa, f′c = 35 MPa (§19.2.2.1(b))
    const Ie = 2.1e-3;
    const wD = 18000;
    const wL = 9000;
    const lambda = aciLambdaDelta(2.0, 0.005); // 1.6
    const { combinations, checks } = checksFor(ACI_318_19, 'concrete-damage-prone', 'concrete', { lambdaDelta: lambda });
    const input: BeamInput = {
      length: L,
      E: Ec,
      I: Ie,
      supports: [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }],
      loads: simpleSpan(L, { D: wD, L: wL }),
      combinations,
      checks,
    };
    const [seg] = run(input, 'ℓ/480 after attachment');
    const EI = Ec * Ie;
    expectRel(-seg.deflection, lambda * udlSag(wD, L, EI) + udlSag(wL, L, EI));
    expect(seg.limitRatio).toBe(480);
    expect(seg.pass).toBe(-seg.deflection <= L / 480);
    const contributions = analyzeBeam(input).combinations[checks[0].combination].segments[0].contributions;
    expect(contributions.map((c) => [c.case, c.factor])).toEqual([
      ['D', 1.6],
      ['L', 1],
    ]);
  });
});

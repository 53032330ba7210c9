/**
 * Properties every linear-elastic beam solution has (domain.md §6), checked
 * on random members with fast-check: linearity and superposition, mirror
 * symmetry, Maxwell–Betti reciprocity, equilibrium of the reactions,
 * insensitivity to extra internal nodes, extremes that no point of the curve
 * exceeds, and the bulk fast path agreeing with the full report.
 */
import fc from 'fast-check';
import { analyzeBeam, checkBeam, deflectionCurve, type BeamInput, type BeamReport, type Load, type Support } from '.';

// A fixed seed keeps CI repeatable; FC_SEED=<n> runs another one.
fc.configureGlobal({ seed: Number(process.env.FC_SEED ?? 20261202) });

const RUNS = { numRuns: 120 };

/** Positions on a 1/100 grid of the length, so elements are never absurdly short. */
const grid = (L: number, i: number): number => (i === 100 ? L : (L * i) / 100);

const supportsArb = fc.oneof(
  fc.constantFrom<'left' | 'right'>('left', 'right').map((side) => ({ cantilever: side })),
  fc.record({
    pins: fc.uniqueArray(fc.integer({ min: 0, max: 100 }), { minLength: 2, maxLength: 4 }),
    fixLeft: fc.boolean(),
    fixRight: fc.boolean(),
  }),
);

/** Realistic magnitudes (N, N/m, N·m): whole numbers times a non-round factor, so no subnormal noise. */
const value = (max: number): fc.Arbitrary<number> => fc.integer({ min: -max, max }).map((v) => v * 1.37);

const loadArb = fc.oneof(
  fc.record({ kind: fc.constant('point' as const), at: fc.integer({ min: 0, max: 100 }), v: value(50000) }),
  fc.record({ kind: fc.constant('moment' as const), at: fc.integer({ min: 0, max: 100 }), v: value(40000) }),
  fc.record({
    kind: fc.constant('udl' as const),
    a: fc.integer({ min: 0, max: 99 }),
    len: fc.integer({ min: 1, max: 100 }),
    v: value(20000),
  }),
  fc.record({
    kind: fc.constant('linear' as const),
    a: fc.integer({ min: 0, max: 99 }),
    len: fc.integer({ min: 1, max: 100 }),
    v: value(20000),
    v2: value(20000),
  }),
);

const memberArb = fc
  .record({
    L: fc.double({ min: 1, max: 25, noNaN: true }),
    I: fc.double({ min: 1e-6, max: 1e-3, noNaN: true }),
    supports: supportsArb,
    loads: fc.array(fc.record({ load: loadArb, c: fc.constantFrom('D', 'L', 'W') }), { minLength: 1, maxLength: 6 }),
  })
  .map(({ L, I, supports, loads }): BeamInput => {
    let sup: Support[];
    if ('cantilever' in supports) sup = [{ x: supports.cantilever === 'left' ? 0 : L, kind: 'fixed' }];
    else {
      const xs = [...supports.pins].sort((a, b) => a - b).map((i) => grid(L, i));
      sup = xs.map((x, i) => ({ x, kind: (i === 0 && supports.fixLeft) || (i === xs.length - 1 && supports.fixRight) ? 'fixed' : 'pin' }));
    }
    const ls: Load[] = loads.map(({ load, c }) => {
      switch (load.kind) {
        case 'point':
          return { case: c, kind: 'point', x: grid(L, load.at), P: load.v };
        case 'moment':
          return { case: c, kind: 'moment', x: grid(L, load.at), M: load.v };
        case 'udl': {
          const b = Math.min(100, load.a + load.len);
          return { case: c, kind: 'udl', x1: grid(L, load.a), x2: grid(L, b), w: load.v };
        }
        case 'linear': {
          const b = Math.min(100, load.a + load.len);
          return { case: c, kind: 'linear', x1: grid(L, load.a), x2: grid(L, b), w1: load.v, w2: load.v2 };
        }
      }
    });
    const probes = Array.from({ length: 11 }, (_, i) => grid(L, i * 10 + 3 * (i < 10 ? 1 : 0)));
    return { length: L, E: 200e9, I, supports: sup, loads: ls, combinations: { all: { D: 1, L: 1, W: 1 } }, probes };
  });

/** Largest |deflection| in a report (probes and extremes): the scale for absolute tolerances. */
function scaleOf(r: BeamReport): number {
  let m = 0;
  for (const c of Object.values(r.combinations)) {
    for (const p of c.probes) m = Math.max(m, Math.abs(p.deflection));
    for (const s of c.segments) m = Math.max(m, Math.abs(s.extreme.deflection));
  }
  return m;
}

function expectNear(a: number, b: number, scale: number, tol = 1e-9): void {
  if (!(Math.abs(a - b) <= tol * scale + 1e-300)) throw new Error(`${a} vs ${b} (scale ${scale})`);
}

function withCombinations(input: BeamInput, combinations: BeamInput['combinations']): BeamInput {
  return { ...input, combinations };
}

/**
 * Two evaluations of one curve (the extreme from the combined curve, a
 * contribution from its load's own curve, a sampled point, a rerun with
 * another I) agree to the rounding of the stiffness solution. Random members
 * put nodes on a 1/100 grid, so an element can be 100 times shorter than its
 * neighbour; stiffness terms go as 1/L³, which makes the solution up to ~1e6
 * times worse conditioned than uniform elements. Random runs found 2.6e-12
 * (seed 1435476486) and 6.9e-10 (seed 129) relative; 1e-9 still catches a lost
 * or doubled load, a missed extreme or a wrong power of I.
 */
const ROUNDING_TOL = 1e-9;

describe('linearity and superposition', () => {
  it('a combination equals the factored sum of its cases, point by point', () => {
    fc.assert(
      fc.property(memberArb, fc.double({ min: -3, max: 3, noNaN: true }), fc.double({ min: -3, max: 3, noNaN: true }), (input, a, b) => {
        const r = analyzeBeam(withCombinations(input, { mix: { D: a, L: b, W: 1 }, D: { D: 1 }, L: { L: 1 }, W: { W: 1 } }));
        const cases = new Set(input.loads.map((l) => l.case));
        const part = (name: string, i: number): number => (cases.has(name) ? r.combinations[name].probes[i].deflection : 0);
        const scale = scaleOf(r);
        r.combinations.mix.probes.forEach((p, i) => expectNear(p.deflection, a * part('D', i) + b * part('L', i) + part('W', i), scale));
      }),
      RUNS,
    );
  });

  it('scaling every load by λ scales every deflection by λ; doubling I halves them', () => {
    fc.assert(
      fc.property(memberArb, fc.double({ min: 0.1, max: 10, noNaN: true }), (input, lambda) => {
        const base = analyzeBeam(input);
        const scaled = analyzeBeam({ ...input, combinations: { all: { D: lambda, L: lambda, W: lambda } } });
        const stiffer = analyzeBeam({ ...input, I: 2 * input.I });
        const scale = scaleOf(base) * lambda;
        base.combinations.all.probes.forEach((p, i) => {
          expectNear(scaled.combinations.all.probes[i].deflection, lambda * p.deflection, scale);
          expectNear(stiffer.combinations.all.probes[i].deflection, p.deflection / 2, scale);
        });
      }),
      RUNS,
    );
  });

  it('the contributions at every extreme sum to the extreme deflection', () => {
    fc.assert(
      fc.property(memberArb, (input) => {
        const r = analyzeBeam(input);
        const scale = scaleOf(r);
        for (const seg of r.combinations.all.segments) {
          const sum = seg.contributions.reduce((s, c) => s + c.deflection, 0);
          expectNear(sum, seg.extreme.deflection, scale, ROUNDING_TOL);
          expect(seg.contributions.map((c) => c.load)).toEqual(input.loads.map((_, k) => k));
        }
      }),
      RUNS,
    );
  });
});

describe('the counterexample a random run found (seed 1435476486)', () => {
  it('a cantilever fixed at its right end with a short linear load at the support: contributions sum to the extreme', () => {
    const input: BeamInput = {
      length: 1, E: 200e9, I: 0.000008315166533708599,
      supports: [{ x: 1, kind: 'fixed' }],
      loads: [{ case: 'D', kind: 'linear', x1: 0.98, x2: 1, w1: 0, w2: 131.52 }],
      combinations: { all: { D: 1 } },
    };
    const seg = analyzeBeam(input).combinations.all.segments[0];
    expect(seg.contributions).toHaveLength(1);
    expectNear(seg.contributions[0].deflection, seg.extreme.deflection, Math.abs(seg.extreme.deflection), ROUNDING_TOL);
    // The free end moves down by the point-load cantilever formula
    // Δ = P·b²(3L − b)/(6EI) (b from the fixed end; AISC Steel Construction Manual,
    // 15th ed., Table 3-23, cantilever with a concentrated load at any point)
    // integrated over the triangle w(b) = w·(1 − b/a): Δ = w(L·a³/4 − a⁴/20)/(6EI).
    const w = 131.52, a = 0.02, L = 1, EI = input.E * input.I;
    const expected = -(w * (L * a ** 3 / 4 - a ** 4 / 20)) / (6 * EI);
    expect(seg.extreme.x).toBe(0);
    expectNear(seg.extreme.deflection, expected, Math.abs(expected), 1e-9);
  });
});

describe('mirror symmetry', () => {
  it('mirroring the member (x → L − x, moments change sign) mirrors the curve', () => {
    fc.assert(
      fc.property(memberArb, (input) => {
        const L = input.length;
        const m = (x: number): number => L - x;
        const mirrored: BeamInput = {
          ...input,
          supports: input.supports.map((s) => ({ ...s, x: m(s.x) })),
          loads: input.loads.map((l): Load => {
            switch (l.kind) {
              case 'point':
                return { ...l, x: m(l.x) };
              case 'moment':
                return { ...l, x: m(l.x), M: -l.M };
              case 'udl':
                return { ...l, x1: m(l.x2), x2: m(l.x1) };
              case 'linear':
                return { ...l, x1: m(l.x2), x2: m(l.x1), w1: l.w2, w2: l.w1 };
            }
          }),
          probes: (input.probes ?? []).map(m),
        };
        const a = analyzeBeam(input);
        const b = analyzeBeam(mirrored);
        const scale = scaleOf(a);
        a.combinations.all.probes.forEach((p, i) => expectNear(b.combinations.all.probes[i].deflection, p.deflection, scale, 1e-8));
        // Sizes, not signs: an antisymmetric curve (seed 8: a moment at the middle of a
        // fixed-fixed span) bulges up and down equally, and either side is the extreme.
        const extremes = (r: BeamReport): number[] => r.combinations.all.segments.map((s) => Math.abs(s.extreme.deflection)).reverse();
        extremes(b).forEach((y, i) => expectNear(y, Math.abs(a.combinations.all.segments[i].extreme.deflection), scale, 1e-8));
      }),
      RUNS,
    );
  });
});

describe('Maxwell–Betti reciprocity', () => {
  it('deflection at b under a unit load at a equals deflection at a under a unit load at b', () => {
    fc.assert(
      fc.property(memberArb, fc.integer({ min: 0, max: 100 }), fc.integer({ min: 0, max: 100 }), (input, i, j) => {
        const L = input.length;
        const a = grid(L, i);
        const b = grid(L, j);
        const unit = (x: number, probe: number): number =>
          analyzeBeam({ ...input, loads: [{ case: 'D', kind: 'point', x, P: 1 }], combinations: { D: { D: 1 } }, probes: [probe] }).combinations.D.probes[0]
            .deflection;
        const ab = unit(a, b);
        const ba = unit(b, a);
        expectNear(ab, ba, Math.max(Math.abs(ab), Math.abs(ba), Math.abs(unit(a, a)), Math.abs(unit(b, b))), 1e-9);
      }),
      RUNS,
    );
  });
});

describe('equilibrium of the reactions', () => {
  it('reactions balance the loads in force and in moment about x = 0', () => {
    fc.assert(
      fc.property(memberArb, (input) => {
        const r = analyzeBeam(input);
        let force = 0; // downward load resultant, N
        let moment = 0; // counter-clockwise moment of the loads about x = 0, N·m
        let size = 0;
        for (const l of input.loads) {
          if (l.kind === 'point') {
            force += l.P;
            moment -= l.P * l.x;
            size += Math.abs(l.P) * (1 + l.x);
          } else if (l.kind === 'moment') {
            moment += l.M;
            size += Math.abs(l.M);
          } else {
            const w1 = l.kind === 'udl' ? l.w : l.w1;
            const w2 = l.kind === 'udl' ? l.w : l.w2;
            const len = l.x2 - l.x1;
            const W = ((w1 + w2) / 2) * len;
            const xc = l.x1 + (w1 + w2 === 0 ? len / 2 : (len * (w1 + 2 * w2)) / (3 * (w1 + w2)));
            force += W;
            // ∫ w(x)·x dx over the load, exact for a linear w
            moment -= (len / 6) * (w1 * (2 * l.x1 + l.x2) + w2 * (l.x1 + 2 * l.x2));
            size += (Math.abs(w1) + Math.abs(w2)) * len * (1 + Math.abs(xc));
          }
        }
        const reactions = r.combinations.all.reactions;
        const rf = reactions.reduce((s, x) => s + x.force, 0);
        const rm = reactions.reduce((s, x) => s + x.force * x.x + x.moment, 0);
        const tol = 1e-9 * (size + 1);
        expect(Math.abs(rf - force)).toBeLessThanOrEqual(tol);
        expect(Math.abs(rm + moment)).toBeLessThanOrEqual(tol * (1 + input.length));
        for (const x of reactions) if (x.kind === 'pin') expect(x.moment).toBe(0);
      }),
      RUNS,
    );
  });
});

describe('extra internal nodes change nothing', () => {
  it('splitting distributed loads and adding a zero load (an extra node) leaves probes and extremes unchanged', () => {
    fc.assert(
      fc.property(memberArb, fc.integer({ min: 1, max: 99 }), (input, cut) => {
        const L = input.length;
        const loads: Load[] = [{ case: 'D', kind: 'point', x: grid(L, cut), P: 0 }];
        for (const l of input.loads) {
          if ((l.kind === 'udl' || l.kind === 'linear') && l.x2 - l.x1 > 1e-9 * L) {
            const xm = l.x1 + 0.37 * (l.x2 - l.x1);
            if (l.kind === 'udl') loads.push({ ...l, x2: xm }, { ...l, x1: xm });
            else {
              const wm = (l.w1 * (l.x2 - xm) + l.w2 * (xm - l.x1)) / (l.x2 - l.x1);
              loads.push({ ...l, x2: xm, w2: wm }, { ...l, x1: xm, w1: wm });
            }
          } else loads.push(l);
        }
        const a = analyzeBeam(input);
        const b = analyzeBeam({ ...input, loads });
        const scale = scaleOf(a);
        a.combinations.all.probes.forEach((p, i) => expectNear(b.combinations.all.probes[i].deflection, p.deflection, scale, 1e-8));
        a.combinations.all.segments.forEach((s, i) => expectNear(b.combinations.all.segments[i].extreme.deflection, s.extreme.deflection, scale, 1e-8));
      }),
      RUNS,
    );
  });
});

describe('extremes are the true extremes', () => {
  it('no point of a dense sampling of the curve exceeds a segment extreme, and the extreme lies on the curve', () => {
    fc.assert(
      fc.property(memberArb, (input) => {
        const r = analyzeBeam(input);
        const curve = deflectionCurve(input, 'all', 801);
        const scale = scaleOf(r);
        for (const seg of r.combinations.all.segments) {
          const inside = curve.filter((p) => p.x >= seg.from && p.x <= seg.to);
          const sampledMax = Math.max(...inside.map((p) => Math.abs(p.deflection)));
          expect(Math.abs(seg.extreme.deflection)).toBeGreaterThanOrEqual(sampledMax - ROUNDING_TOL * scale);
          expect(seg.extreme.x).toBeGreaterThanOrEqual(seg.from);
          expect(seg.extreme.x).toBeLessThanOrEqual(seg.to);
          const at = analyzeBeam({ ...input, probes: [seg.extreme.x] }).combinations.all.probes[0].deflection;
          expectNear(at, seg.extreme.deflection, scale, ROUNDING_TOL);
        }
      }),
      RUNS,
    );
  });
});

describe('the bulk fast path', () => {
  it('checkBeam gives exactly analyzeBeam(input).checks', () => {
    fc.assert(
      fc.property(memberArb, fc.integer({ min: 120, max: 600 }), (input, ratio) => {
        const withChecks: BeamInput = {
          ...input,
          combinations: { all: { D: 1, L: 1, W: 1 }, live: { L: 1 } },
          checks: [
            { name: 'total', combination: 'all', ratio, maxAbs: 0.02 },
            { name: 'live', combination: 'live', ratio: 360, plus: 0.001 },
          ],
        };
        if (!input.loads.some((l) => l.case === 'L')) withChecks.loads = [...input.loads, { case: 'L', kind: 'point', x: 0, P: 1 }];
        expect(checkBeam(withChecks)).toEqual(analyzeBeam(withChecks).checks);
      }),
      RUNS,
    );
  });

  it('rerunning with I = requiredI gives utilization 1 (deflection ∝ 1/I)', () => {
    fc.assert(
      fc.property(memberArb, (input) => {
        const withCheck: BeamInput = { ...input, checks: [{ name: 't', combination: 'all', ratio: 360, maxAbs: 0.015 }] };
        // A moment on a fixed support moves nothing in exact arithmetic but leaves
        // its rounding (about 1e-16 of what it would move unrestrained) in the curve;
        // beside a tiny load (seed 129: 41,044 N·m beside 1.37 N/m) that rounding is
        // a visible share of a 1e-12 m deflection, and no relative tolerance holds.
        fc.pre(!input.loads.some((l) => l.kind === 'moment' && input.supports.some((s) => s.kind === 'fixed' && s.x === l.x)));
        const seg = analyzeBeam(withCheck).checks[0].segments[0];
        fc.pre(seg.deflection !== 0);
        const again = analyzeBeam({ ...withCheck, I: seg.requiredI }).checks[0].segments[0];
        expect(Math.abs(again.utilization - 1)).toBeLessThanOrEqual(ROUNDING_TOL);
      }),
      RUNS,
    );
  });
});

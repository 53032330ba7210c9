/**
 * The BeamReport has the shape calc-contract.md fixes (fields may be added,
 * never renamed or dropped), on the contract's own example member.
 */
import { analyzeBeam, parseBeamInput, type BeamReport } from '.';

const example = parseBeamInput({
  length: 9.0,
  E: 200e9,
  I: 120e-6,
  supports: [
    { x: 0, kind: 'pin' },
    { x: 7.2, kind: 'pin' },
  ],
  loads: [
    { case: 'D', kind: 'udl', x1: 0, x2: 9.0, w: 3500 },
    { case: 'L', kind: 'udl', x1: 0, x2: 7.2, w: 6000 },
    { case: 'L', kind: 'point', x: 9.0, P: 5000 },
    { case: 'D', kind: 'linear', x1: 1.0, x2: 4.0, w1: 0, w2: 2000 },
    { case: 'W', kind: 'moment', x: 7.2, M: 1500 },
  ],
  combinations: { live: { L: 1 }, total: { D: 1, L: 1 }, wind: { W: 1 } },
  probes: [3.6, 9.0],
  checks: [
    { name: 'live L/360', combination: 'live', ratio: 360, maxAbs: null },
    { name: 'total L/240', combination: 'total', ratio: 240, maxAbs: 0.025 },
    { name: 'glass support', combination: 'wind', ratio: 240, plus: 0.00635 },
  ],
});

describe('the contract example', () => {
  const report: BeamReport = analyzeBeam(example);

  it('has a span and an overhang', () => {
    expect(report.segments).toEqual([
      { from: 0, to: 7.2, kind: 'span' },
      { from: 7.2, to: 9, kind: 'overhang' },
    ]);
  });

  it('reports every combination with probes, segments (extreme + contributions) and reactions', () => {
    expect(Object.keys(report.combinations)).toEqual(['live', 'total', 'wind']);
    const total = report.combinations.total;
    expect(total.probes.map((p) => p.x)).toEqual([3.6, 9.0]);
    expect(total.segments).toHaveLength(2);
    const span = total.segments[0];
    expect(Object.keys(span)).toEqual(['from', 'to', 'kind', 'extreme', 'contributions']);
    expect(Object.keys(span.extreme)).toEqual(['x', 'deflection']);
    expect(span.extreme.deflection).toBeLessThan(0); // sags
    expect(span.contributions.map((c) => [c.load, c.case, c.factor])).toEqual([
      [0, 'D', 1],
      [1, 'L', 1],
      [2, 'L', 1],
      [3, 'D', 1],
    ]);
    // The overhang point load lifts the span: its share at the span's extreme is upward.
    expect(span.contributions[2].deflection).toBeGreaterThan(0);
    const sum = span.contributions.reduce((s, c) => s + c.deflection, 0);
    expect(sum).toBeCloseTo(span.extreme.deflection, 15);
    expect(total.reactions.map((r) => [r.x, r.kind])).toEqual([
      [0, 'pin'],
      [7.2, 'pin'],
    ]);
  });

  it('reports checks per segment with every contract field', () => {
    expect(report.checks.map((c) => [c.name, c.combination])).toEqual([
      ['live L/360', 'live'],
      ['total L/240', 'total'],
      ['glass support', 'wind'],
    ]);
    const seg = report.checks[1].segments[0];
    for (const key of ['from', 'to', 'kind', 'x', 'deflection', 'effectiveLength', 'spanRatio', 'limitRatio', 'maxAbs', 'utilization', 'pass', 'requiredI']) {
      expect(seg).toHaveProperty(key);
    }
    expect(seg.effectiveLength).toBe(7.2);
    expect(report.checks[1].segments[1].effectiveLength).toBeCloseTo(3.6, 14); // 2 × 1.8 m overhang
    expect(seg.maxAbs).toBe(0.025);
    expect(seg.limitRatio).toBe(240);
    expect(seg.utilization).toBeCloseTo(Math.abs(seg.deflection) / seg.allowed, 15);
    expect(seg.requiredI).toBeCloseTo((120e-6 * Math.abs(seg.deflection)) / seg.allowed, 18);
    expect(report.checks[2].segments[0].plus).toBe(0.00635);
  });

  it('serializes to JSON without NaN or Infinity', () => {
    const text = JSON.stringify(report);
    expect(text).not.toMatch(/NaN|Infinity|null,"limitRatio"/);
    expect(JSON.parse(text)).toEqual(report);
  });
});

describe('zero deflection', () => {
  it('gives spanRatio null (no finite ratio), utilization 0 and a pass', () => {
    const r = analyzeBeam({
      length: 5,
      E: 200e9,
      I: 1e-4,
      supports: [
        { x: 0, kind: 'fixed' },
        { x: 5, kind: 'fixed' },
      ],
      loads: [{ case: 'L', kind: 'point', x: 0, P: 1000 }], // straight into the support
      combinations: { live: { L: 1 } },
      checks: [{ name: 'live', combination: 'live', ratio: 360 }],
    });
    const seg = r.checks[0].segments[0];
    expect(seg.deflection).toBe(0);
    expect(seg.spanRatio).toBeNull();
    expect(seg.utilization).toBe(0);
    expect(seg.requiredI).toBe(0);
    expect(seg.pass).toBe(true);
    expect(r.combinations.live.segments[0].extreme).toEqual({ x: 2.5, deflection: 0 });
    expect(r.combinations.live.reactions[0]).toEqual({ x: 0, kind: 'fixed', force: 1000, moment: 0 });
  });
});

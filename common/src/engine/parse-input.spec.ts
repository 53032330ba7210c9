/**
 * Bad input gets an EngineError with a stable code, the field's path and a
 * message that says what to change; good input comes back as a clean BeamInput.
 */
import { EngineError, analyzeBeam, checkBeam, parseBeamInput, type BeamInput } from '.';

const good = (): Record<string, unknown> => ({
  length: 9,
  E: 200e9,
  I: 120e-6,
  supports: [
    { x: 0, kind: 'pin' },
    { x: 7.2, kind: 'pin' },
  ],
  loads: [
    { case: 'D', kind: 'udl', x1: 0, x2: 9, w: 3500 },
    { case: 'L', kind: 'udl', x1: 0, x2: 7.2, w: 6000 },
    { case: 'L', kind: 'point', x: 9, P: 5000 },
    { case: 'D', kind: 'linear', x1: 1, x2: 4, w1: 0, w2: 2000 },
    { case: 'W', kind: 'moment', x: 7.2, M: 1500 },
  ],
  combinations: { live: { L: 1 }, total: { D: 1, L: 1 }, wind: { W: 1 } },
  probes: [3.6, 9],
  checks: [
    { name: 'live L/360', combination: 'live', ratio: 360, maxAbs: null },
    { name: 'total L/240', combination: 'total', ratio: 240, maxAbs: 0.025 },
    { name: 'glass support', combination: 'wind', ratio: 240, plus: 0.00635 },
  ],
});

function errorOf(raw: unknown): EngineError {
  try {
    parseBeamInput(raw);
  } catch (e) {
    if (e instanceof EngineError) return e;
    throw e;
  }
  throw new Error('expected an EngineError');
}

/** Applies `edit` to a fresh copy of the good input. */
function bad(edit: (o: any) => void): unknown {
  const o = good();
  edit(o);
  return o;
}

describe('parseBeamInput accepts the contract example', () => {
  it('returns the same member with defaults filled in', () => {
    const input = parseBeamInput(good());
    expect(input).toEqual({ ...good(), checks: [...(good().checks as object[]).slice(0, 2), { name: 'glass support', combination: 'wind', ratio: 240, maxAbs: null, plus: 0.00635 }] });
  });

  it('makes one combination per case when combinations are left out, and accepts a label', () => {
    const o = good();
    delete o.combinations;
    delete o.checks;
    o.label = 'B-12, level 3';
    const input = parseBeamInput(o);
    expect(input.combinations).toEqual({ D: { D: 1 }, L: { L: 1 }, W: { W: 1 } });
    expect('label' in input).toBe(false);
  });

  it('lets a member have no loads', () => {
    const input = parseBeamInput({ length: 3, E: 1e10, I: 1e-5, supports: [{ x: 0, kind: 'fixed' }] });
    expect(input.loads).toEqual([]);
    const report = analyzeBeam({ ...input, combinations: { none: {} } });
    expect(report.combinations.none.segments[0].extreme).toEqual({ x: 1.5, deflection: 0 });
  });
});

describe.each<[string, () => unknown, string, string, RegExp]>([
  ['MECHANISM', () => bad((o) => (o.supports = [])), 'MECHANISM', 'supports', /no supports.*Add at least two pins, or one fixed support/],
  ['MECHANISM', () => bad((o) => (o.supports = [{ x: 2, kind: 'pin' }])), 'MECHANISM', 'supports', /pin at x = 2 m.*rotate/],
  [
    'MECHANISM',
    () =>
      bad(
        (o) =>
          (o.supports = [
            { x: 4, kind: 'pin' },
            { x: 4, kind: 'pin' },
          ]),
      ),
    'MECHANISM',
    'supports',
    /Every support is a pin at x = 4 m/,
  ],
  ['NOT_POSITIVE', () => bad((o) => (o.length = 0)), 'NOT_POSITIVE', 'length', /length \(the member length\) must be greater than zero/],
  ['NOT_POSITIVE', () => bad((o) => (o.E = -200e9)), 'NOT_POSITIVE', 'E', /E \(Young's modulus\)/],
  ['NOT_POSITIVE', () => bad((o) => (o.I = 0)), 'NOT_POSITIVE', 'I', /second moment of area/],
  ['NOT_POSITIVE', () => bad((o) => (o.checks[1].ratio = 0)), 'NOT_POSITIVE', 'checks[1].ratio', /span ratio/],
  ['NOT_POSITIVE', () => bad((o) => (o.checks[1].maxAbs = -0.01)), 'NOT_POSITIVE', 'checks[1].maxAbs', /absolute cap/],
  ['NOT_POSITIVE', () => bad((o) => (o.checks[2].plus = -0.001)), 'NOT_POSITIVE', 'checks[2].plus', /zero or more/],
  ['OUT_OF_RANGE', () => bad((o) => (o.loads[2].x = 9.5)), 'OUT_OF_RANGE', 'loads[2].x', /loads\[2\]\.x = 9\.5 m lies outside the member, which runs from x = 0 to x = 9 m/],
  ['OUT_OF_RANGE', () => bad((o) => (o.supports[1].x = -1)), 'OUT_OF_RANGE', 'supports[1].x', /outside the member/],
  ['OUT_OF_RANGE', () => bad((o) => (o.loads[3].x2 = 1)), 'OUT_OF_RANGE', 'loads[3].x2', /must be greater than x1 = 1 m/],
  ['OUT_OF_RANGE', () => bad((o) => (o.probes = [3, 12])), 'OUT_OF_RANGE', 'probes[1]', /probes\[1\] = 12 m lies outside/],
  ['OUT_OF_RANGE', () => bad((o) => (o.supports[1].x = 1e-12)), 'OUT_OF_RANGE', 'supports[1].x', /cannot be told apart/],
  ['NOT_FINITE', () => bad((o) => (o.loads[1].w = Number.NaN)), 'NOT_FINITE', 'loads[1].w', /finite number in N\/m, but it is NaN/],
  ['NOT_FINITE', () => bad((o) => (o.E = Number.POSITIVE_INFINITY)), 'NOT_FINITE', 'E', /Infinity/],
  ['NOT_FINITE', () => bad((o) => (o.combinations.total.D = Number.NaN)), 'NOT_FINITE', 'combinations.total.D', /finite/],
  ['UNKNOWN_KIND', () => bad((o) => (o.loads[4].kind = 'torque')), 'UNKNOWN_KIND', 'loads[4].kind', /one of "point", "udl", "linear", "moment", but it is the text "torque"/],
  ['UNKNOWN_KIND', () => bad((o) => (o.supports[0].kind = 'roller')), 'UNKNOWN_KIND', 'supports[0].kind', /"pin" or "fixed"/],
  ['UNKNOWN_CASE', () => bad((o) => (o.combinations.total.S = 1)), 'UNKNOWN_CASE', 'combinations.total.S', /names load case "S", but no load has that case\. Cases of this member: D, L, W/],
  ['UNKNOWN_CASE', () => bad((o) => (o.combinations['live L/360'] = { l: 1 })), 'UNKNOWN_CASE', 'combinations["live L/360"].l', /case-sensitive/],
  ['UNKNOWN_COMBINATION', () => bad((o) => (o.checks[0].combination = 'Live')), 'UNKNOWN_COMBINATION', 'checks[0].combination', /"Live", which is not defined\. Defined: live, total, wind/],
  ['INVALID_TYPE', () => '{"length": 9', 'INVALID_TYPE', '', /The input must be an object/],
  ['INVALID_TYPE', () => [1, 2], 'INVALID_TYPE', '', /but it is an array/],
  ['INVALID_TYPE', () => bad((o) => (o.length = '9')), 'INVALID_TYPE', 'length', /must be a number in m, but it is the text "9"/],
  ['INVALID_TYPE', () => bad((o) => (o.loads = { a: 1 })), 'INVALID_TYPE', 'loads', /must be an array/],
  ['INVALID_TYPE', () => bad((o) => (o.loads[0] = null)), 'INVALID_TYPE', 'loads[0]', /must be an object.*but it is null/],
  ['INVALID_TYPE', () => bad((o) => delete o.loads[3].x1), 'INVALID_TYPE', 'loads[3].x1', /must be a number in m, but it is missing/],
  ['INVALID_TYPE', () => bad((o) => delete o.loads[2].P), 'INVALID_TYPE', 'loads[2].P', /must be a number in N, but it is missing/],
  ['INVALID_TYPE', () => bad((o) => (o.loads[0].case = '')), 'INVALID_TYPE', 'loads[0].case', /non-empty text/],
  ['INVALID_TYPE', () => bad((o) => (o.checks[1].maxabs = 0.02)), 'INVALID_TYPE', 'checks[1].maxabs', /Unexpected field "maxabs" in checks\[1\]\. Allowed fields: name, combination, ratio, maxAbs, plus/],
  ['INVALID_TYPE', () => bad((o) => (o.spans = [7.2])), 'INVALID_TYPE', 'spans', /Unexpected field "spans"/],
  ['INVALID_TYPE', () => bad((o) => (o.label = 12)), 'INVALID_TYPE', 'label', /text describing the member/],
])('%s', (_title, make, code, path, message) => {
  const raw = make();
  it(`${code} at "${path}"`, () => {
    const e = errorOf(raw);
    expect(e.code).toBe(code);
    expect(e.path).toBe(path);
    expect(e.message).toMatch(message);
    expect(e.toJSON()).toEqual({ code, message: e.message, path });
  });
});

describe('analyzeBeam on unvalidated input still refuses what it cannot solve', () => {
  const base = parseBeamInput(good());

  it('a mechanism', () => {
    expect(() => analyzeBeam({ ...base, supports: [{ x: 3, kind: 'pin' }] })).toThrow(expect.objectContaining({ code: 'MECHANISM', path: 'supports' }));
    expect(() => checkBeam({ ...base, supports: [] })).toThrow(expect.objectContaining({ code: 'MECHANISM' }));
  });

  it('a check naming an unknown combination', () => {
    const input: BeamInput = { ...base, checks: [{ name: 'x', combination: 'nope', ratio: 360 }] };
    expect(() => analyzeBeam(input)).toThrow(expect.objectContaining({ code: 'UNKNOWN_COMBINATION', path: 'checks[0].combination' }));
    expect(() => checkBeam(input)).toThrow(expect.objectContaining({ code: 'UNKNOWN_COMBINATION', path: 'checks[0].combination' }));
  });

  it('results that overflow a double (units mixed up) rather than an Infinity', () => {
    const input: BeamInput = { ...base, E: 1e-300, I: 1e-300 };
    expect(() => analyzeBeam(input)).toThrow(expect.objectContaining({ code: 'NOT_FINITE' }));
  });
});

import {
  ACI_318_19,
  CUSTOM_BLANK,
  IBC_2021,
  LIMIT_SET_PRESETS,
  LimitError,
  MEMBER_CATEGORIES,
  US_IBC_2021_ACI_318_19,
  aciLambdaDelta,
  buildBeamInput,
  checksFor,
  combinationName,
  describeSource,
  evaluateMember,
  findPreset,
  validateLimitSet,
  type LimitSet,
} from '.';

describe('presets carry their sources', () => {
  it.each(LIMIT_SET_PRESETS.map((s) => [s.id, s] as const))('%s is a valid set whose every rule names document, edition, clause and trust', (_id, set) => {
    expect(validateLimitSet(set)).toEqual([]);
    for (const rule of set.rules) {
      expect(rule.source.document).not.toBe('');
      expect(rule.source.edition).not.toBe('');
      expect(rule.source.clause).not.toBe('');
      expect(['verified', 'from memory', 'common practice']).toContain(rule.source.trust);
    }
  });

  it('every category a preset uses is a known member category', () => {
    const ids = MEMBER_CATEGORIES.map((c) => c.id);
    for (const set of LIMIT_SET_PRESETS) for (const c of set.categories) expect(ids).toContain(c);
  });

  it('IBC 2021 table rows say the 2021 text is assumed from the verified 2015/2018 rows', () => {
    const live = IBC_2021.rules.find((r) => r.id === 'floor.live');
    expect(live?.source).toMatchObject({ edition: '2021', trust: 'from memory' });
    expect(live?.source.note).toMatch(/2015\/2018/);
    expect(describeSource(live!.source)).toBe('IBC 2021, Table 1604.3, floor members, L column (from memory)');
  });

  it('the blank custom set has no rules and the combined US set holds both', () => {
    expect(CUSTOM_BLANK.rules).toEqual([]);
    expect(US_IBC_2021_ACI_318_19.rules.length).toBe(IBC_2021.rules.length + ACI_318_19.rules.length);
    expect(findPreset('aci-318-19')).toBe(ACI_318_19);
    expect(findPreset('nope')).toBeUndefined();
  });
});

describe('combinationName: stable keys from the factors', () => {
  it.each([
    [{ L: 1 }, 'L'],
    [{ L: 1, D: 1 }, 'D+L'],
    [{ D: 0.5, L: 1 }, '0.5D+L'],
    [{ W: 0.42 }, '0.42W'],
    [{ D: 2, L: 1 }, '2D+L'],
    [{ W: -0.6, D: 1 }, 'D-0.6W'],
    [{ S: 1, D: 1, Lr: 0 }, 'D+S'],
    [{ X: 1, D: 1, Abc: 2 }, 'D+2Abc+X'],
    [{}, '0'],
  ])('%j → %s', (c, name) => {
    expect(combinationName(c)).toBe(name);
  });
});

describe('checksFor (IBC 2021 Table 1604.3 floor members)', () => {
  it('any material: L/360 under L and L/240 under D + L', () => {
    const r = checksFor(IBC_2021, 'floor', 'concrete');
    expect(r.combinations).toEqual({ L: { L: 1 }, 'D+L': { D: 1, L: 1 } });
    expect(r.checks).toEqual([
      { name: 'L/360 live', combination: 'L', ratio: 360, maxAbs: null, plus: null },
      { name: 'L/240 total', combination: 'D+L', ratio: 240, maxAbs: null, plus: null },
    ]);
    expect(r.rules.map((x) => x.id)).toEqual(['floor.live', 'floor.total']);
  });

  it('steel: the dead load is taken as zero in the D + L column (footnote g)', () => {
    const r = checksFor(IBC_2021, 'floor', 'steel');
    expect(r.checks[1]).toMatchObject({ name: 'L/240 total', combination: 'L' });
    expect(r.rules[1].source.clause).toBe('Table 1604.3, footnote g');
    expect(checksFor(IBC_2021, 'floor', 'cold-formed-steel').checks[1].combination).toBe('L');
  });

  it('dry seasoned wood: L + 0.5D replaces D + L (footnote d)', () => {
    const r = checksFor(IBC_2021, 'floor', 'timber');
    expect(r.combinations['0.5D+L']).toEqual({ D: 0.5, L: 1 });
    expect(r.checks[1].combination).toBe('0.5D+L');
    expect(checksFor(IBC_2021, 'floor', 'engineered-wood').checks[1].combination).toBe('0.5D+L');
  });

  it('no material given: the general variant', () => {
    expect(checksFor(IBC_2021, 'floor').checks[1].combination).toBe('D+L');
  });

  it('roof with plaster ceiling: 360 / 360 / 240 with wind at 0.42 × C&C (footnote f)', () => {
    const r = checksFor(IBC_2021, 'roof-plaster-ceiling', 'steel');
    expect(r.checks.map((c) => [c.name, c.combination, c.ratio])).toEqual([
      ['L/360 roof live', 'Lr', 360],
      ['L/360 snow', 'S', 360],
      ['L/360 wind', '0.42W', 360],
      ['L/240 total (D + Lr)', 'Lr', 240],
      ['L/240 total (D + S)', 'S', 240],
    ]);
  });

  it('drops factors of cases the member does not have, and checks left with none', () => {
    const r = checksFor(IBC_2021, 'floor', 'other', { cases: ['D'] });
    expect(r.checks).toEqual([{ name: 'L/240 total', combination: 'D', ratio: 240, maxAbs: null, plus: null }]);
    expect(r.combinations).toEqual({ D: { D: 1 } });
  });

  it('an unknown category is a LimitError naming the categories', () => {
    expect(() => checksFor(IBC_2021, 'balcony')).toThrow(LimitError);
    try {
      checksFor(IBC_2021, 'balcony');
    } catch (e) {
      expect((e as LimitError).code).toBe('UNKNOWN_CATEGORY');
      expect((e as LimitError).message).toMatch(/floor, roof-plaster-ceiling/);
    }
  });
});

describe('masonry, glass and glazing rules', () => {
  it('members supporting unreinforced masonry: l/600 and 0.3 in = 7.62 mm (TMS 402)', () => {
    const r = checksFor(IBC_2021, 'supports-masonry', 'steel');
    const total = r.checks.find((c) => c.name === 'L/600 total, 0.3 in max');
    expect(total).toEqual({ name: 'L/600 total, 0.3 in max', combination: 'D+L', ratio: 600, maxAbs: 0.3 * 0.0254, plus: null });
    expect(total?.maxAbs).toBeCloseTo(0.00762, 15);
  });

  it('framing supporting glass: l/175 up to 13 ft 6 in, l/240 + 1/4 in beyond (IBC §1604.3.7)', () => {
    expect(checksFor(IBC_2021, 'supports-glass', 'aluminium', { length: 4.0 }).checks).toEqual([
      { name: 'L/175 wind (up to 13 ft 6 in)', combination: '0.6W', ratio: 175, maxAbs: null, plus: null },
    ]);
    expect(checksFor(IBC_2021, 'supports-glass', 'aluminium', { length: 13.5 * 0.3048 }).checks[0].ratio).toBe(175);
    expect(checksFor(IBC_2021, 'supports-glass', 'aluminium', { length: 5.0 }).checks).toEqual([
      { name: 'L/240 + 1/4 in wind (over 13 ft 6 in)', combination: '0.6W', ratio: 240, maxAbs: null, plus: 0.25 * 0.0254 },
    ]);
  });

  it('framing supporting glass without a length: LENGTH_REQUIRED', () => {
    expect(() => checksFor(IBC_2021, 'supports-glass')).toThrow(expect.objectContaining({ code: 'LENGTH_REQUIRED' }));
  });

  it('glazing per pane: l/175 capped at 3/4 in = 19.05 mm (IBC §2403.3)', () => {
    expect(checksFor(IBC_2021, 'glazing-pane').checks[0]).toEqual({
      name: 'L/175 wind, 3/4 in max',
      combination: '0.6W',
      ratio: 175,
      maxAbs: 0.75 * 0.0254,
      plus: null,
    });
  });
});

describe('ACI 318-19 Table 24.2.2', () => {
  it('has its four rows', () => {
    expect(checksFor(ACI_318_19, 'concrete-floor').checks).toEqual([{ name: 'ℓ/360 live', combination: 'L', ratio: 360, maxAbs: null, plus: null }]);
    expect(checksFor(ACI_318_19, 'concrete-flat-roof').checks.map((c) => [c.combination, c.ratio])).toEqual([
      ['Lr', 180],
      ['S', 180],
      ['R', 180],
    ]);
    expect(checksFor(ACI_318_19, 'concrete-damage-prone').checks[0]).toMatchObject({ combination: '2D+L', ratio: 480 });
    expect(checksFor(ACI_318_19, 'concrete-not-damage-prone').checks[0]).toMatchObject({ combination: '2D+L', ratio: 240 });
  });

  it('λΔ = ξ/(1 + 50ρ′) (§24.2.4.1.1) becomes the factor on D', () => {
    expect(aciLambdaDelta(2.0, 0.005)).toBeCloseTo(1.6, 15);
    expect(aciLambdaDelta(1.4, 0)).toBe(1.4);
    expect(() => aciLambdaDelta(0, 0)).toThrow(RangeError);
    const r = checksFor(ACI_318_19, 'concrete-damage-prone', 'concrete', { lambdaDelta: aciLambdaDelta(2.0, 0.005) });
    expect(r.combinations).toEqual({ '1.6D+L': { D: 1.6, L: 1 } });
  });
});

describe('buildBeamInput', () => {
  it('gives a member only the cases it has and the length rules need', () => {
    const input = buildBeamInput(
      { length: 5, E: 70e9, I: 4e-6, supports: [{ x: 0, kind: 'pin' }, { x: 5, kind: 'pin' }], loads: [{ case: 'W', kind: 'udl', x1: 0, x2: 5, w: 900 }] },
      IBC_2021,
      'supports-glass',
      'aluminium',
    );
    expect(input.combinations).toEqual({ '0.6W': { W: 0.6 } });
    expect(input.checks?.[0].plus).toBeCloseTo(0.00635, 15);
  });
});

describe('evaluateMember', () => {
  it('returns each check with the rule and source behind it (IBC 2021 Table 1604.3, footnote g for steel)', () => {
    const L = 6;
    const { checks } = evaluateMember(
      { length: L, E: 200e9, I: 8e-5, supports: [{ x: 0, kind: 'pin' }, { x: L, kind: 'pin' }], loads: [{ case: 'D', kind: 'udl', x1: 0, x2: L, w: 4000 }, { case: 'L', kind: 'udl', x1: 0, x2: L, w: 6000 }] },
      IBC_2021,
      'floor',
      'steel',
    );
    expect(checks.map((c) => [c.name, c.combination, c.rule.source.clause])).toEqual([
      ['L/360 live', 'L', 'Table 1604.3, floor members, L column'],
      ['L/240 total', 'L', 'Table 1604.3, footnote g'],
    ]);
    // 5wL⁴/384EI under L alone (AISC 15th Table 3-23 case 1)
    expect(-checks[0].segments[0].deflection).toBeCloseTo((5 * 6000 * L ** 4) / (384 * 200e9 * 8e-5), 12);
  });
});

describe('validateLimitSet', () => {
  it('lists every problem of an edited set with its path', () => {
    const bad: LimitSet = {
      id: 'x',
      name: '',
      description: '',
      categories: ['floor'],
      notes: [],
      rules: [
        {
          id: 'a',
          category: 'roof',
          check: 'L/0',
          combination: {},
          ratio: 0,
          maxAbs: -1,
          plus: -0.1,
          materials: ['wood' as never],
          lengthRange: null,
          longTermCases: null,
          source: { document: '', edition: '', clause: '', trust: 'verified' },
        },
      ],
    };
    expect(validateLimitSet(bad).map((p) => p.path)).toEqual([
      'name',
      'rules[0].category',
      'rules[0].ratio',
      'rules[0].maxAbs',
      'rules[0].plus',
      'rules[0].combination',
      'rules[0].materials',
      'rules[0].source',
    ]);
  });

  it('flags two rules for the same category, check and material', () => {
    const twice: LimitSet = { ...CUSTOM_BLANK, categories: ['floor'], rules: [IBC_2021.rules[0], IBC_2021.rules[0]] };
    expect(validateLimitSet(twice)).toEqual([{ path: 'rules[1].check', message: 'Another rule already defines "L/360 live" for category "floor".' }]);
  });
});

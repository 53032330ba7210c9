import { toSI } from '../units';
import { CATEGORIES, errors, LOADS_HEADER, parseSI, sheet, siRow } from './__tests__/fixtures';
import { columnHeader, MEMBER_COLUMNS, memberBeamInput, memberLoads, memberSupports, parseSchedule, splitHeader } from './index';

describe('parseSchedule: members in SI', () => {
  it('reads a simple member into SI base units, with its uniform loads over the whole length', () => {
    const { members, problems } = parseSI([siRow()]);
    expect(problems).toEqual([]);
    expect(members).toHaveLength(1);
    const m = members[0];
    expect(m).toMatchObject({
      mark: 'L2-B1', level: 'L2', grid: 'C/3-4', category: 'floor', material: 'steel', section: null,
      spans: [7.2], leftOverhang: 0, rightOverhang: 0, supports: 'pinned', E: 200e9, camber: null,
      reviewerEmail: 'ines.okafor@halvercote.example', notes: null, sourceRow: 2,
    });
    expect(m.I).toBeCloseTo(186e-6, 18);
    expect(m.depth).toBeCloseTo(0.403, 15);
    expect(memberLoads(m)).toEqual([
      { case: 'D', kind: 'udl', x1: 0, x2: 7.2, w: 3500 },
      { case: 'L', kind: 'udl', x1: 0, x2: 7.2, w: 6000 },
    ]);
    expect(m.loads[0].origin).toEqual({ sheet: 'Members', row: 2, column: 'D [kN/m]' });
  });

  it('builds the calc-contract example: 7.2 m span with a 1.8 m right overhang', () => {
    const { members } = parseSI([siRow({ 'Right overhang [m]': 1.8 })]);
    expect(memberSupports(members[0])).toEqual({ length: 9, supports: [{ x: 0, kind: 'pin' }, { x: 7.2, kind: 'pin' }] });
    expect(memberBeamInput(members[0])).toMatchObject({ length: 9, E: 200e9, loads: [{ case: 'D', kind: 'udl', x1: 0, x2: 9, w: 3500 }, { case: 'L', x2: 9 }] });
  });

  it('reads continuous spans "6.0+4.5+6.0" with overhangs; interior supports are pins', () => {
    const { members, problems } = parseSI([
      siRow({ 'Spans [m]': '6.0+4.5+6.0', 'Left overhang [m]': 1.2, 'Right overhang [m]': '0.9', Supports: 'fixed-fixed' }),
    ]);
    expect(errors(problems)).toEqual([]);
    const m = members[0];
    expect(m.spans).toEqual([6, 4.5, 6]);
    const { length, supports } = memberSupports(m);
    expect(length).toBeCloseTo(18.6, 12);
    expect(supports.map((s) => s.kind)).toEqual(['fixed', 'pin', 'pin', 'fixed']);
    expect(supports.map((s) => s.x)).toEqual([1.2, 7.2, 11.7, 17.7].map((x) => expect.closeTo(x, 12)));
  });

  it.each([
    ['pinned', [['pin', 0], ['pin', 7.2]]],
    ['', [['pin', 0], ['pin', 7.2]]],
    ['fixed-pinned', [['fixed', 0], ['pin', 7.2]]],
    ['Pinned - Fixed', [['pin', 0], ['fixed', 7.2]]],
    ['cantilever-left', [['fixed', 0]]],
    ['fixed-free', [['fixed', 0]]],
    ['cantilever-right', [['fixed', 7.2]]],
  ])('supports %j', (code, expected) => {
    const { members, problems } = parseSI([siRow({ Supports: code })]);
    expect(errors(problems)).toEqual([]);
    expect(memberSupports(members[0]).supports).toEqual(expected.map(([kind, x]) => ({ kind, x })));
  });

  it('places end fixity at the outer supports, not at the overhang tips', () => {
    const { members } = parseSI([siRow({ Supports: 'pinned-fixed', 'Spans [m]': '5+4', 'Left overhang [m]': 1.5, 'Right overhang [m]': 1 })]);
    expect(memberSupports(members[0])).toEqual({
      length: 11.5,
      supports: [{ x: 1.5, kind: 'pin' }, { x: 6.5, kind: 'pin' }, { x: 10.5, kind: 'fixed' }],
    });
    expect(memberLoads(members[0])[0]).toEqual({ case: 'D', kind: 'udl', x1: 0, x2: 11.5, w: 3500 });
  });

  it('reads formulas by their cached result, rich text and hyperlinked e-mails', () => {
    const { members, problems } = parseSI([
      siRow({
        Mark: { richText: [{ text: 'L2-' }, { text: 'B7' }] },
        'Spans [m]': { formula: 'B9*2', result: 7.2 },
        'I [10^6 mm^4]': { sharedFormula: 'K2', result: 186 },
        Reviewer: { text: 'Tomas.Brandvik@halvercote.example', hyperlink: 'mailto:Tomas.Brandvik@halvercote.example' },
        Notes: { formula: 'CONCAT("see ", "S-201")', result: 'see S-201' },
      }),
    ]);
    expect(errors(problems)).toEqual([]);
    expect(members[0]).toMatchObject({ mark: 'L2-B7', spans: [7.2], reviewerEmail: 'tomas.brandvik@halvercote.example', notes: 'see S-201' });
    expect(members[0].I).toBeCloseTo(186e-6, 18);
  });

  it('reads CSV text cells, thousands separators and units inside cells', () => {
    const { members, problems } = parseSI([
      siRow({ 'Spans [m]': '7200 mm', 'E [GPa]': '200', 'I [10^6 mm^4]': '186', 'Depth [mm]': '1,200', 'D [kN/m]': ' 3.5 ' }),
    ]);
    expect(errors(problems)).toEqual([]);
    expect(members[0].spans[0]).toBeCloseTo(7.2, 15);
    expect(members[0].depth).toBeCloseTo(1.2, 15);
    expect(members[0].loads[0]).toMatchObject({ w: 3500 });
  });

  it('takes the unit system default for headers without a unit', () => {
    const header = ['Mark', 'Level', 'Category', 'Material', 'Spans', 'E', 'I', 'D'];
    const si = parseSchedule({
      unitSystem: 'SI', categories: CATEGORIES,
      members: sheet('Members', header, [{ Mark: 'B1', Level: 'L1', Category: 'floor', Material: 'steel', Spans: 7.2, E: 200, I: 186, D: 3.5 }]),
    });
    expect(si.members[0]).toMatchObject({ spans: [7.2], E: 200e9, loads: [{ w: 3500 }] });
    const us = parseSchedule({
      unitSystem: 'US', categories: CATEGORIES,
      members: sheet('Members', header, [{ Mark: 'B1', Level: 'L1', Category: 'floor', Material: 'steel', Spans: 24, E: 29000, I: 448, D: 240 }]),
    });
    expect(us.members[0].spans[0]).toBe(toSI(24, 'ft'));
    expect(us.members[0].E).toBe(toSI(29000, 'ksi'));
    expect(us.members[0].I).toBe(toSI(448, 'in^4'));
    expect(us.members[0].loads[0]).toMatchObject({ w: toSI(240, 'plf') });
  });

  it('accepts header aliases and spellings, ignoring case, spaces and punctuation', () => {
    const header = ['member mark', 'FLOOR', 'Gridline', 'category', 'mat', 'Span(s) [ft]', 'left-overhang [in]', 'Overhang Right (ft)', 'End conditions', "Young's modulus [ksi]", 'Ix [in4]', 'h [in]', 'Dead [plf]', 'live (plf)', 'Roof live [klf]', 'Checker', 'Remarks'];
    const { members, problems } = parseSchedule({
      unitSystem: 'SI', categories: CATEGORIES,
      members: sheet('Members', header, [{
        'member mark': '2B1', FLOOR: 'L2', Gridline: 'A/1', category: 'Floor', mat: 'Wood', 'Span(s) [ft]': '12+12', 'left-overhang [in]': 18,
        'Overhang Right (ft)': 2, 'End conditions': 'simple', "Young's modulus [ksi]": 1600, 'Ix [in4]': 178, 'h [in]': 9.25,
        'Dead [plf]': 150, 'live (plf)': 400, 'Roof live [klf]': 0.1, Checker: 'priya.castellanos@halvercote.example', Remarks: 'typ.',
      }]),
    });
    expect(problems).toEqual([]);
    const m = members[0];
    expect(m).toMatchObject({ mark: '2B1', level: 'L2', grid: 'A/1', category: 'floor', material: 'timber', supports: 'pinned', notes: 'typ.' });
    expect(m.spans).toEqual([toSI(12, 'ft'), toSI(12, 'ft')]);
    expect(m.leftOverhang).toBe(toSI(18, 'in'));
    expect(m.rightOverhang).toBe(toSI(2, 'ft'));
    expect(m.E).toBe(toSI(1600, 'ksi'));
    expect(m.loads.map((l) => [l.case, l.kind === 'udl' && l.w])).toEqual([
      ['D', toSI(150, 'plf')],
      ['L', toSI(400, 'plf')],
      ['Lr', toSI(0.1, 'klf')],
    ]);
  });

  it('skips empty rows but reports rows as spreadsheet rows (header = row 1)', () => {
    const { members } = parseSI([siRow({ Mark: 'A' }), {}, siRow({ Mark: 'B' })]);
    expect(members.map((m) => [m.mark, m.sourceRow])).toEqual([['A', 2], ['B', 4]]);
  });

  it('matches levels to the project spelling when levels are given', () => {
    const { members } = parseSI([siRow({ Level: 'l2' })], undefined, { levels: ['L1', 'L2'] });
    expect(members[0].level).toBe('L2');
  });
});

describe('parseSchedule: the Loads sheet', () => {
  it('adds point, partial uniform, linear and moment loads in the engine shape, from the left end', () => {
    const { members, problems } = parseSI(
      [siRow({ 'Spans [m]': 7.2, 'Left overhang [m]': 1.5 })],
      [
        { Mark: 'L2-B1', Case: 'D', Kind: 'point', 'Position [m]': 4.5, 'Value [kN, kN/m, kN·m]': 45 },
        { Mark: 'l2-b1', Case: 'l', Kind: 'udl', 'From [m]': 1.5, 'To [m]': 5, 'Value [kN, kN/m, kN·m]': 2 },
        { Mark: 'L2-B1', Case: 'Lr', Kind: 'triangular', 'From [m]': 0, 'To [m]': 8.7, 'Value [kN, kN/m, kN·m]': 0, 'End value [kN/m]': 4 },
        { Mark: 'L2-B1', Case: 'W', Kind: 'moment', 'Position [m]': 8.7, 'Value [kN, kN/m, kN·m]': '-1.5' },
        { Mark: 'L2-B1', Case: 'S', Kind: 'udl', 'Value [kN, kN/m, kN·m]': 1 },
      ],
    );
    expect(problems).toEqual([]);
    expect(memberLoads(members[0]).slice(2)).toEqual([
      { case: 'D', kind: 'point', x: 4.5, P: 45000 },
      { case: 'L', kind: 'udl', x1: 1.5, x2: 5, w: 2000 },
      { case: 'Lr', kind: 'linear', x1: 0, x2: 8.7, w1: 0, w2: 4000 },
      { case: 'W', kind: 'moment', x: 8.7, M: -1500 },
      { case: 'S', kind: 'udl', x1: 0, x2: 8.7, w: 1000 },
    ]);
    expect(members[0].loads[2].origin).toEqual({ sheet: 'Loads', row: 2 });
  });

  it('reads US units from the Value header list, per load kind', () => {
    const header = ['Mark', 'Case', 'Kind', 'Position [ft]', 'From [ft]', 'To [ft]', 'Value [kip, plf, kip-ft]', 'End value [plf]'];
    const result = parseSchedule({
      unitSystem: 'US', categories: CATEGORIES,
      members: sheet('Members', ['Mark', 'Level', 'Category', 'Material', 'Spans [ft]', 'E [ksi]', 'I [in^4]'], [
        { Mark: '2G1', Level: 'L2', Category: 'floor', Material: 'steel', 'Spans [ft]': 30, 'E [ksi]': 29000, 'I [in^4]': 1330 },
      ]),
      loads: sheet('Loads', header, [
        { Mark: '2G1', Case: 'D', Kind: 'point', 'Position [ft]': 10, 'Value [kip, plf, kip-ft]': 12.5 },
        { Mark: '2G1', Case: 'L', Kind: 'udl', 'From [ft]': 0, 'To [ft]': 15, 'Value [kip, plf, kip-ft]': 500 },
        { Mark: '2G1', Case: 'L', Kind: 'moment', 'Position [ft]': 30, 'Value [kip, plf, kip-ft]': 8 },
      ]),
    });
    expect(result.problems).toEqual([]);
    expect(memberLoads(result.members[0])).toEqual([
      { case: 'D', kind: 'point', x: toSI(10, 'ft'), P: toSI(12.5, 'kip') },
      { case: 'L', kind: 'udl', x1: 0, x2: toSI(15, 'ft'), w: toSI(500, 'plf') },
      { case: 'L', kind: 'moment', x: toSI(30, 'ft'), M: toSI(8, 'kip·ft') },
    ]);
  });

  it('a load at the very end of a member converted from feet is inside it', () => {
    const result = parseSchedule({
      unitSystem: 'US', categories: CATEGORIES,
      members: sheet('Members', ['Mark', 'Level', 'Category', 'Material', 'Spans [ft]', 'Right overhang [in]', 'E [ksi]', 'I [in^4]'], [
        { Mark: 'C1', Level: 'L2', Category: 'floor', Material: 'steel', 'Spans [ft]': '10.1+13.3', 'Right overhang [in]': 31, 'E [ksi]': 29000, 'I [in^4]': 300 },
      ]),
      loads: sheet('Loads', ['Mark', 'Case', 'Kind', 'Position [in]', 'Value [kip]'], [{ Mark: 'C1', Case: 'L', Kind: 'point', 'Position [in]': 311.8, 'Value [kip]': 1 }]),
    });
    expect(errors(result.problems)).toEqual([]);
    const load = memberLoads(result.members[0])[0];
    expect(load.kind === 'point' && load.x).toBe(memberSupports(result.members[0]).length);
  });
});

describe('column definitions', () => {
  it('give template headers with the unit system default units', () => {
    const headers = (system: 'SI' | 'US') => MEMBER_COLUMNS.map((c) => columnHeader(c, system));
    expect(headers('SI')).toEqual([
      'Mark', 'Level', 'Grid', 'Category', 'Material', 'Section', 'Spans [m]', 'Left overhang [m]', 'Right overhang [m]',
      'Supports', 'E [GPa]', 'I [10^6 mm^4]', 'Depth [mm]', 'Camber [mm]', 'Reviewer', 'Notes',
    ]);
    expect(headers('US')).toContain('I [in^4]');
    expect(headers('US')).toContain('E [ksi]');
    expect(LOADS_HEADER).toContain('Value [kN, kN/m, kN·m]');
  });
  it('split a header into name and unit', () => {
    expect(splitHeader('Span [m]')).toEqual({ name: 'Span', unitText: 'm' });
    expect(splitHeader('I (10^6 mm^4)')).toEqual({ name: 'I', unitText: '10^6 mm^4' });
    expect(splitHeader('Span(s)')).toEqual({ name: 'Span(s)' });
  });
});

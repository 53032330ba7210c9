import { CATEGORIES, errors, parseSI, sheet, SI_HEADER, siRow } from './__tests__/fixtures';
import { parseSchedule, type ScheduleProblem } from './index';

/** The one problem with this code, checked to be the only one with it. */
function only(problems: ScheduleProblem[], code: string): ScheduleProblem {
  const found = problems.filter((p) => p.code === code);
  expect(found).toHaveLength(1);
  return found[0];
}

describe('fatal problems (severity error): sheet, row, column and an actionable message', () => {
  it('a missing required column names the header to add and its aliases', () => {
    const header = SI_HEADER.filter((h) => h !== 'Spans [m]');
    const { problems, members } = parseSchedule({ unitSystem: 'SI', categories: CATEGORIES, members: sheet('Members', header, [{ Mark: 'B1' }]) });
    expect(members).toEqual([]);
    expect(only(problems, 'MISSING_COLUMN')).toEqual({
      severity: 'error', code: 'MISSING_COLUMN', sheet: 'Members', row: 1, column: null, columnLetter: null, header: null, value: null,
      message: 'The Members sheet has no Spans column. Add a column headed "Spans [m]" (also accepted: Span, Span(s), Span lengths, Length) to row 1.',
    });
  });

  it('an unknown unit in a header is reported once, on the header', () => {
    const header = SI_HEADER.map((h) => (h === 'Spans [m]' ? 'Spans [furlong]' : h));
    const { problems } = parseSchedule({ unitSystem: 'SI', categories: CATEGORIES, members: sheet('Members', header, [siRow({ 'Spans [furlong]': 7.2 }), siRow({ Mark: 'B2' })].map(({ 'Spans [m]': _s, ...r }) => r)) });
    expect(errors(problems)).toEqual([
      {
        severity: 'error', code: 'UNKNOWN_UNIT', sheet: 'Members', row: 1, column: 'Spans [furlong] (column F)', columnLetter: 'F', header: 'Spans [furlong]', value: 'Spans [furlong]',
        message: 'Members row 1, column F ("Spans [furlong]"): "furlong" is not a unit Sagline knows. For a length use one of m, mm, cm, ft, in, e.g. "Spans [m]".',
      },
    ]);
  });

  it('a header unit of the wrong kind says what the column holds', () => {
    const header = SI_HEADER.map((h) => (h === 'I [10^6 mm^4]' ? 'I [kN]' : h));
    const { problems } = parseSchedule({ unitSystem: 'SI', categories: CATEGORIES, members: sheet('Members', header, []) });
    expect(only(problems, 'WRONG_UNIT')).toMatchObject({
      row: 1, column: 'I [kN] (column K)',
      message: 'Members row 1, column K ("I [kN]"): "kN" is a unit of force, but I holds a moment of inertia (length to the fourth power). Use one of mm^4, cm^4, 10^6 mm^4, m^4, in^4, e.g. "I [10^6 mm^4]".',
    });
  });

  it('text in a numeric cell', () => {
    const { problems, members } = parseSI([siRow({ 'E [GPa]': 'TBD' })]);
    expect(members).toEqual([]);
    expect(only(problems, 'NOT_A_NUMBER')).toEqual({
      severity: 'error', code: 'NOT_A_NUMBER', sheet: 'Members', row: 2, column: 'E [GPa] (column J)', columnLetter: 'J', header: 'E [GPa]', mark: 'L2-B1', value: 'TBD',
      message: `Members row 2, E [GPa] (column J): "TBD" is not a number. Enter a number in GPa (the header's unit), e.g. 200, or leave the cell empty if the column is optional.`,
    });
  });

  it('a date where a number belongs (a spreadsheet turned "6-4" into a date)', () => {
    const { problems } = parseSI([siRow({ 'Spans [m]': new Date(Date.UTC(2024, 3, 6)) })]);
    expect(only(problems, 'NOT_A_NUMBER').message).toBe(
      'Members row 2, Spans [m] (column F): the cell holds a date (2024-04-06) where a number in m is expected; the spreadsheet may have turned the entry into a date. Format the cell as a number and type the value again.',
    );
  });

  it('a decimal comma', () => {
    expect(only(parseSI([siRow({ 'Spans [m]': '7,2' })]).problems, 'NOT_A_NUMBER').message).toContain('use a point as the decimal separator');
    expect(only(parseSI([siRow({ 'E [GPa]': '200,5' })]).problems, 'NOT_A_NUMBER').message).toBe(
      'Members row 2, E [GPa] (column J): "200,5" looks like a decimal comma. Use a point as the decimal separator (e.g. 7.5); commas may only group thousands (1,250).',
    );
  });

  it('an empty mark', () => {
    const { problems } = parseSI([siRow({ Mark: null })]);
    expect(only(problems, 'EMPTY_MARK')).toMatchObject({
      row: 2, column: 'Mark (column A)',
      message: 'Members row 2, Mark (column A): the row has values but no mark. Give the member a mark that is unique in the schedule (e.g. L3-B12), or delete the row.',
    });
  });

  it('a duplicate mark (ignoring case) names the first row', () => {
    const { problems, members } = parseSI([siRow({ Mark: 'L2-B1' }), siRow({ Mark: 'L2-B2' }), siRow({ Mark: 'l2-b1 ' })]);
    expect(only(problems, 'DUPLICATE_MARK')).toMatchObject({
      row: 4, column: 'Mark (column A)', mark: 'l2-b1', value: 'l2-b1 ',
      message: 'Members row 4, Mark (column A): the mark "l2-b1" is already used on row 2. Marks must be unique in the schedule; rename one of the two.',
    });
    expect(members.map((m) => m.mark)).toEqual(['L2-B1', 'L2-B2']);
  });

  it('an unknown category lists the allowed ones', () => {
    const { problems } = parseSI([siRow({ Category: 'flor' })]);
    expect(only(problems, 'UNKNOWN_CATEGORY')).toMatchObject({
      row: 2, column: 'Category (column D)', value: 'flor',
      message: `Members row 2, Category (column D): "flor" is not a category of this project's limit set. Allowed: ${CATEGORIES.join(', ')}.`,
    });
  });

  it('an unknown end-condition code lists the codes', () => {
    const { problems } = parseSI([siRow({ Supports: 'hinged' })]);
    expect(only(problems, 'UNKNOWN_SUPPORT').message).toBe(
      'Members row 2, Supports (column I): "hinged" is not a support code (end condition) Sagline knows. Use one of: pinned, fixed-fixed, fixed-pinned, pinned-fixed, cantilever-left, cantilever-right.',
    );
  });

  it('an unknown material lists the codes', () => {
    const { problems } = parseSI([siRow({ Material: 'unobtainium' })]);
    expect(only(problems, 'UNKNOWN_MATERIAL').message).toContain('Use one of: steel, cold-formed-steel, timber, engineered-wood, concrete, masonry, aluminium, other.');
  });

  it.each([
    ['Spans [m]', 0, 'Members row 2, Spans [m] (column F): the span is 0.00 m; every span must be greater than zero.'],
    ['Spans [m]', '6+0+6', 'Members row 2, Spans [m] (column F): span 2 of 3 is 0.00 m; every span must be greater than zero.'],
    ['Spans [m]', -3, 'Members row 2, Spans [m] (column F): the span is -3.00 m; every span must be greater than zero.'],
    ['E [GPa]', 0, 'Members row 2, E [GPa] (column J): E must be greater than zero, but it is 0 GPa. Enter the actual value.'],
    ['I [10^6 mm^4]', -186, 'Members row 2, I [10^6 mm^4] (column K): I must be greater than zero, but it is -186 ×10⁶ mm⁴. Enter the actual value.'],
  ])('zero or negative %s (%j)', (column, value, message) => {
    const { problems } = parseSI([siRow({ [column]: value })]);
    expect(only(problems, 'NOT_POSITIVE').message).toBe(message);
  });

  it('a negative overhang', () => {
    const { problems } = parseSI([siRow({ 'Left overhang [m]': -1.2 })]);
    expect(only(problems, 'NEGATIVE')).toMatchObject({ column: 'Left overhang [m] (column G)', message: expect.stringContaining('cannot be negative (-1.20 m)') });
  });

  it('a cantilever with several spans or an overhang', () => {
    expect(only(parseSI([siRow({ Supports: 'cantilever-left', 'Spans [m]': '2+2' })]).problems, 'CANTILEVER_LAYOUT').message).toContain('has one length, but Spans holds 2 spans');
    expect(only(parseSI([siRow({ Supports: 'cantilever-right', 'Right overhang [m]': 1 })]).problems, 'CANTILEVER_LAYOUT').column).toBe('Right overhang [m] (column H)');
  });

  it('a formula without a cached result says so', () => {
    const { problems } = parseSI([siRow({ 'I [10^6 mm^4]': { formula: 'K5*1.1' } })]);
    expect(only(problems, 'FORMULA_NO_RESULT')).toMatchObject({
      row: 2, column: 'I [10^6 mm^4] (column K)', value: '=K5*1.1',
      message: 'Members row 2, I [10^6 mm^4] (column K): the formula =K5*1.1 has no saved result (the file was written by a program that does not calculate). Open the file in a spreadsheet program and save it, or type the value instead of the formula.',
    });
  });

  it('a formula that shows an error value', () => {
    const { problems } = parseSI([siRow({ 'I [10^6 mm^4]': { formula: 'K5/0', result: { error: '#DIV/0!' } } })]);
    expect(only(problems, 'CELL_ERROR').message).toContain('the cell shows the error #DIV/0!');
  });

  it('continuous spans typed as a formula (=6+4.5+6) would be one span: refused', () => {
    const { problems } = parseSI([siRow({ 'Spans [m]': { formula: '6+4.5+6', result: 16.5 } })]);
    expect(only(problems, 'SPANS_FORMULA').message).toBe(
      "Members row 2, Spans [m] (column F): the cell is the formula =6+4.5+6, which adds the spans into one (16.5). For continuous spans type the spans as text, e.g. 6+4.5+6 (in Excel start with an apostrophe: '6+4.5+6).",
    );
  });

  it('spans separated by commas', () => {
    expect(only(parseSI([siRow({ 'Spans [m]': '6.0, 4.5' })]).problems, 'NOT_A_NUMBER').message).toContain('Join continuous spans with "+"');
  });

  it('a required value left empty', () => {
    const { problems } = parseSI([siRow({ 'I [10^6 mm^4]': null })]);
    expect(only(problems, 'MISSING_VALUE').message).toBe('Members row 2, I [10^6 mm^4] (column K): I is empty. Enter the moment of inertia for this member.');
  });

  it('a bad reviewer e-mail', () => {
    expect(only(parseSI([siRow({ Reviewer: 'Ines Okafor' })]).problems, 'BAD_EMAIL')).toMatchObject({ column: 'Reviewer (column P)', value: 'Ines Okafor' });
  });

  it('a mark longer than allowed', () => {
    expect(only(parseSI([siRow({ Mark: 'M'.repeat(61) })]).problems, 'TOO_LONG').message).toContain('at most 60 are allowed');
  });

  it('a level the project does not have', () => {
    const { problems } = parseSI([siRow({ Level: 'L9' })], undefined, { levels: ['L1', 'L2', 'Roof'] });
    expect(only(problems, 'UNKNOWN_LEVEL').message).toBe('Members row 2, Level (column B): "L9" is not a level of this project. Use one of: L1, L2, Roof (or add the level to the project first).');
  });

  it('a load column for a case Sagline does not know', () => {
    const header = [...SI_HEADER, 'SD [kN/m]'];
    const { problems } = parseSchedule({ unitSystem: 'SI', categories: CATEGORIES, members: sheet('Members', header, [siRow({ 'SD [kN/m]': 1 })]) });
    expect(only(problems, 'UNKNOWN_LOAD_CASE')).toMatchObject({
      row: 1, column: 'SD [kN/m] (column R)',
      message: 'Members row 1, column R: "SD [kN/m]" looks like a load column, but "SD" is not a load case Sagline knows. Use one of D, L, Lr, S, R, W (put superimposed dead load in D), e.g. "D [kN/m]".',
    });
  });

  it('two columns for the same field or the same load case', () => {
    const header = [...SI_HEADER, 'Span [ft]', 'Dead [kN/m]'];
    const { problems } = parseSchedule({ unitSystem: 'SI', categories: CATEGORIES, members: sheet('Members', header, [siRow()]) });
    expect(problems.filter((p) => p.code === 'DUPLICATE_COLUMN').map((p) => p.message)).toEqual([
      'Members row 1: columns F ("Spans [m]") and R ("Span [ft]") are both the Spans column. Keep one of them.',
      'Members row 1: columns N ("D [kN/m]") and S ("Dead [kN/m]") are both load case D. Add them into one column, or move one to the Loads sheet as a udl.',
    ]);
  });

  it('more rows than maxRows', () => {
    const rows = Array.from({ length: 4 }, (_, i) => siRow({ Mark: `B${i + 1}` }));
    const { problems } = parseSI(rows, undefined, { maxRows: 3 });
    expect(only(problems, 'TOO_MANY_ROWS')).toMatchObject({
      sheet: 'Members', row: 5, column: null,
      message: 'The Members sheet has more than 3 member rows (row 5 is number 4). Split the schedule into several files of at most 3 members.',
    });
  });

  it('an empty sheet, and a header without member rows', () => {
    expect(only(parseSchedule({ unitSystem: 'SI', categories: CATEGORIES, members: { name: 'Members', rows: [] } }).problems, 'EMPTY_SHEET').message).toContain('Row 1 must hold the column headers');
    expect(only(parseSI([]).problems, 'NO_MEMBERS')).toMatchObject({ row: 2, message: 'The Members sheet has headers but no member rows. Add one row per member below the header.' });
  });

  it('caps the list and says how many were left out', () => {
    const rows = Array.from({ length: 30 }, (_, i) => siRow({ Mark: `B${i}`, 'E [GPa]': 'x' }));
    const { problems, summary } = parseSI(rows, undefined, { maxProblems: 10 });
    expect(problems).toHaveLength(11);
    expect(problems[10]).toMatchObject({ code: 'TOO_MANY_PROBLEMS', message: expect.stringMatching(/^20 more problems were found/) });
    expect(summary.errors).toBe(30);
  });

  it('lists errors first, then by row and column', () => {
    const { problems } = parseSI([siRow({ Mark: 'A', 'I [10^6 mm^4]': 'x', Category: 'nope' }), siRow({ Mark: 'B', 'Spans [m]': 'y' })]);
    expect(problems.map((p) => `${p.row}${p.columnLetter}`)).toEqual(['2D', '2K', '3F']);
  });
});

describe('fatal problems on the Loads sheet', () => {
  const loadRow = (o: Record<string, unknown>) => ({ Mark: 'L2-B1', Case: 'D', Kind: 'point', 'Position [m]': 3.6, 'Value [kN, kN/m, kN·m]': 10, ...o }) as never;

  it('a load outside the member, measured from its left end', () => {
    const { problems, members } = parseSI([siRow({ 'Right overhang [m]': 1.8 })], [loadRow({ 'Position [m]': 9.5 })]);
    expect(members).toEqual([]);
    expect(only(problems, 'LOAD_OUTSIDE')).toEqual({
      severity: 'error', code: 'LOAD_OUTSIDE', sheet: 'Loads', row: 2, column: 'Position [m] (column D)', columnLetter: 'D', header: 'Position [m]', mark: 'L2-B1', value: 9.5,
      message: 'Loads row 2, Position [m] (column D): Position 9.50 m is outside member L2-B1, which runs from 0 to 9.00 m (measured from its left end, the left overhang included). Enter a position within the member.',
    });
  });

  it('a partial load that ends past the member, or ends before it starts', () => {
    expect(only(parseSI([siRow()], [loadRow({ Kind: 'udl', 'Position [m]': null, 'From [m]': 2, 'To [m]': 8 })]).problems, 'LOAD_OUTSIDE').column).toBe('To [m] (column F)');
    expect(only(parseSI([siRow()], [loadRow({ Kind: 'udl', 'Position [m]': null, 'From [m]': 5, 'To [m]': 2 })]).problems, 'LOAD_RANGE').message).toBe(
      'Loads row 2, To [m] (column F): the load must end after it starts, but From is 5.00 m and To is 2.00 m. Swap them or correct the positions.',
    );
  });

  it('a Loads row naming an unknown mark', () => {
    const { problems } = parseSI([siRow()], [loadRow({ Mark: 'L2-B9' })]);
    expect(only(problems, 'UNKNOWN_MARK')).toMatchObject({
      sheet: 'Loads', row: 2, column: 'Mark (column A)',
      message: 'Loads row 2, Mark (column A): there is no member "L2-B9" on the Members sheet. Check the spelling of the mark, or add the member to the Members sheet.',
    });
  });

  it('an unknown load case or kind', () => {
    expect(only(parseSI([siRow()], [loadRow({ Case: 'Q' })]).problems, 'UNKNOWN_LOAD_CASE').message).toBe('Loads row 2, Case (column B): "Q" is not a load case Sagline knows. Use one of: D, L, Lr, S, R, W.');
    expect(only(parseSI([siRow()], [loadRow({ Kind: 'ramp' })]).problems, 'UNKNOWN_KIND').message).toContain('Use one of: point, udl, linear, moment.');
  });

  it('a point load without a position, a linear load without an end value', () => {
    expect(only(parseSI([siRow()], [loadRow({ 'Position [m]': null })]).problems, 'MISSING_VALUE').message).toBe('Loads row 2, Position [m] (column D): a point load needs a Position (distance from the left end of the member).');
    expect(only(parseSI([siRow()], [loadRow({ Kind: 'linear', 'Position [m]': null })]).problems, 'MISSING_VALUE').column).toBe('End value [kN/m] (column H)');
  });

  it('a udl with a different end value', () => {
    expect(only(parseSI([siRow()], [loadRow({ Kind: 'udl', 'Position [m]': null, 'End value [kN/m]': 4 })]).problems, 'UDL_END_VALUE').message).toContain('Use kind "linear"');
  });

  it('a value of the wrong kind of unit in the cell', () => {
    expect(only(parseSI([siRow()], [loadRow({ 'Value [kN, kN/m, kN·m]': '10 kN/m' })]).problems, 'WRONG_UNIT').message).toBe(
      'Loads row 2, Value [kN, kN/m, kN·m] (column G): "kN/m" is a unit of line load (force per length), but a force is expected here. Use one of N, kN, lbf, kip.',
    );
  });
});

describe('warnings (never block an import)', () => {
  it('span over 40 × depth', () => {
    const { problems, members } = parseSI([siRow({ 'Spans [m]': 9.2, 'Depth [mm]': 200 })]);
    expect(members).toHaveLength(1);
    expect(problems).toEqual([
      {
        severity: 'warning', code: 'SLENDER', sheet: 'Members', row: 2, column: 'Depth [mm] (column L)', columnLetter: 'L', header: 'Depth [mm]', mark: 'L2-B1', value: 200,
        message: 'Members row 2, Depth [mm] (column L): span-to-depth ratio is 46 (9.20 m / 200 mm), above 40. Check the span, the depth and the units in their headers.',
      },
    ]);
  });

  it('a cantilever counts twice its length against the depth', () => {
    expect(only(parseSI([siRow({ Supports: 'cantilever-left', 'Spans [m]': 2.1, 'Depth [mm]': 100 })]).problems, 'SLENDER').message).toContain('ratio is 42 (4.20 m / 100 mm)');
    expect(parseSI([siRow({ Supports: 'cantilever-left', 'Spans [m]': 1.9, 'Depth [mm]': 100 })]).problems).toEqual([]);
  });

  it('an I ten times off the median of similar members (typical unit slip)', () => {
    const peers = [180, 186, 190, 200, 210, 175].map((I, i) => siRow({ Mark: `B${i}`, 'Spans [m]': 7 + i * 0.1, 'I [10^6 mm^4]': I }));
    const slip = siRow({ Mark: 'B-slip', 'Spans [m]': 7.2, 'I [10^6 mm^4]': 0.000186 * 1e3 });
    const other = siRow({ Mark: 'T1', Material: 'timber', 'Spans [m]': 7.2, 'I [10^6 mm^4]': 5 });
    const { problems } = parseSI([...peers, slip, other]);
    expect(problems).toEqual([
      expect.objectContaining({
        severity: 'warning', code: 'I_OUTLIER', row: 8, column: 'I [10^6 mm^4] (column K)', mark: 'B-slip',
        message: 'Members row 8, I [10^6 mm^4] (column K): I = 0.19 ×10⁶ mm⁴ is 1011 times smaller than the 188 ×10⁶ mm⁴ that 6 other floor steel members of similar span (7.00 m to 7.50 m) would have at its depth of 403 mm (median I / depth³). Check the value and the unit in the I header (e.g. [mm^4] against [10^6 mm^4], or [in^4]).',
      }),
    ]);
    // Without depths, I itself is compared.
    const noDepth = [...peers, slip].map((r) => ({ ...r, 'Depth [mm]': null }));
    expect(only(parseSI(noDepth).problems, 'I_OUTLIER').message).toBe(
      'Members row 8, I [10^6 mm^4] (column K): I = 0.19 ×10⁶ mm⁴ is 1011 times smaller than the median I (188 ×10⁶ mm⁴) of 6 other floor steel members of similar span (7.00 m to 7.50 m). Check the value and the unit in the I header (e.g. [mm^4] against [10^6 mm^4], or [in^4]).',
    );
  });

  it('no I warning with fewer than 5 similar members, or spans far apart', () => {
    const few = [180, 186, 190, 200].map((I, i) => siRow({ Mark: `B${i}`, 'I [10^6 mm^4]': I }));
    expect(parseSI([...few, siRow({ Mark: 'X', 'I [10^6 mm^4]': 1 })]).problems).toEqual([]);
    const far = [180, 186, 190, 200, 210].map((I, i) => siRow({ Mark: `B${i}`, 'Spans [m]': 3, 'I [10^6 mm^4]': I }));
    expect(parseSI([...far, siRow({ Mark: 'X', 'Spans [m]': 12, 'I [10^6 mm^4]': 2500 })]).problems).toEqual([]);
    // A joist and the much deeper girder it sits on: I differs 60 times, I / depth³ less than 5 times.
    const joists = [110, 112, 120, 118, 115].map((I, i) => siRow({ Mark: `J${i}`, 'Spans [m]': 7.2, 'Depth [mm]': 302, 'I [10^6 mm^4]': I }));
    expect(parseSI([...joists, siRow({ Mark: 'G', 'Spans [m]': 9, 'Depth [mm]': 720, 'I [10^6 mm^4]': 6700 })]).problems).toEqual([]);
    const noDepths = [...joists, siRow({ Mark: 'G', 'Spans [m]': 9, 'I [10^6 mm^4]': 6700 })].map((r) => ({ ...r, 'Depth [mm]': null }));
    expect(only(parseSI(noDepths).problems, 'I_OUTLIER').mark).toBe('G');
  });

  it('an unusually long span (probably mm under an m header)', () => {
    expect(only(parseSI([siRow({ 'Spans [m]': 7200, 'Depth [mm]': null })]).problems, 'LONG_SPAN')).toMatchObject({
      severity: 'warning',
      message: 'Members row 2, Spans [m] (column F): 7200.00 m is an unusually long span. If the value is in another unit (e.g. mm), change the unit in the header (e.g. "Spans [mm]").',
    });
  });

  it('a member without loads, an unknown column, a unit on a text column, values ignored on a Loads row', () => {
    const header = [...SI_HEADER, 'Spna', 'Grid [m]'].filter((h) => h !== 'Grid');
    const members = sheet('Members', header, [siRow({ 'D [kN/m]': null, 'L [kN/m]': 0, Grid: undefined })].map(({ Grid: _g, ...r }) => r));
    const loads = sheet('Loads', ['Mark', 'Case', 'Kind', 'Position [m]', 'From [m]', 'Value [kN]'], [{ Mark: 'L2-B1', Case: 'L', Kind: 'point', 'Position [m]': 2, 'From [m]': 1, 'Value [kN]': 0 }]);
    const { problems } = parseSchedule({ unitSystem: 'SI', categories: CATEGORIES, members, loads });
    expect(errors(problems)).toEqual([]);
    expect(problems.map((p) => [p.code, p.sheet, p.row, p.columnLetter])).toEqual([
      ['UNKNOWN_COLUMN', 'Members', 1, 'Q'],
      ['UNIT_IGNORED', 'Members', 1, 'R'],
      ['VALUE_IGNORED', 'Loads', 2, 'E'],
    ]);
    const none = parseSI([siRow({ 'D [kN/m]': null, 'L [kN/m]': 0 })]);
    expect(only(none.problems, 'NO_LOADS').message).toBe('Members row 2: member L2-B1 has no loads, so there is nothing to check. Fill in its load columns (D, L, …) or add rows for it on the Loads sheet.');
  });
});

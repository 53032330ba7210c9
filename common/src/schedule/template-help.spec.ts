import { CATEGORIES } from './__tests__/fixtures';
import { codeTables, columnHelpRows, findSheet, LOAD_COLUMNS, MEMBER_COLUMNS, TEMPLATE_HELP } from './index';

describe('what the template and the web show about the format', () => {
  it('lists every column with the header the parser expects, in the unit system', () => {
    const us = columnHelpRows('US', CATEGORIES);
    expect(us.map((r) => r.header)).toEqual([
      'Mark', 'Level', 'Grid', 'Category', 'Material', 'Section', 'Spans [ft]', 'Left overhang [ft]', 'Right overhang [ft]',
      'Supports', 'E [ksi]', 'I [in^4]', 'Depth [in]', 'Camber [in]', 'D [plf], L [plf], Lr [plf], S [plf], R [plf], W [plf]',
      'Reviewer', 'Notes', 'Mark', 'Case', 'Kind', 'Position [ft]', 'From [ft]', 'To [ft]', 'Value [kip, plf, kip·ft]', 'End value [plf]', 'Notes',
    ]);
    expect(us.find((r) => r.header === 'Category')!.accepted).toBe(CATEGORIES.join(', '));
    expect(us.filter((r) => r.required).map((r) => `${r.sheet}:${r.header}`)).toEqual([
      'Members:Mark', 'Members:Level', 'Members:Category', 'Members:Material', 'Members:Spans [ft]', 'Members:E [ksi]', 'Members:I [in^4]',
      'Loads:Mark', 'Loads:Case', 'Loads:Kind', 'Loads:Value [kip, plf, kip·ft]',
    ]);
  });

  it('gives every column help text, and the help sheet states signs, units and the caution', () => {
    for (const c of [...MEMBER_COLUMNS, ...LOAD_COLUMNS]) expect(c.help.length).toBeGreaterThan(20);
    const text = TEMPLATE_HELP.join('\n');
    expect(text).toContain('positive downward');
    expect(text).toContain('counter-clockwise');
    expect(text).toContain('"Spans [m]"');
    expect(text).toContain('do not replace the judgement of the engineer of record');
  });

  it('has code tables for the drop-down lists, with category labels when given', () => {
    const tables = codeTables(['floor'], { floor: 'Floor members (IBC 2021 Table 1604.3)' });
    expect(tables.map((t) => t.column)).toEqual(['Category', 'Material', 'Supports', 'Case', 'Kind']);
    expect(tables[0].codes).toEqual([{ code: 'floor', help: 'Floor members (IBC 2021 Table 1604.3)' }]);
    expect(tables[2].codes.map((c) => c.code)).toEqual(['pinned', 'fixed-fixed', 'fixed-pinned', 'pinned-fixed', 'cantilever-left', 'cantilever-right']);
  });

  it('finds the Members and Loads sheets by name; a single sheet is the Members sheet', () => {
    expect(findSheet(['How to fill in', 'members', 'LOADS'], 'members')).toBe('members');
    expect(findSheet(['How to fill in', 'members', 'LOADS'], 'loads')).toBe('LOADS');
    expect(findSheet(['Sheet1'], 'members')).toBe('Sheet1');
    expect(findSheet(['Sheet1'], 'loads')).toBeUndefined();
    expect(findSheet(['Sheet1', 'Sheet2'], 'members')).toBeUndefined();
  });
});

import { CATEGORIES, parseSI, sheet, siRow } from './__tests__/fixtures';
import { diffMembers, parseSchedule } from './index';

describe('diffMembers: what the revision preview shows', () => {
  const previous = parseSI(
    [siRow({ Mark: 'L2-B1' }), siRow({ Mark: 'L2-B2', 'I [10^6 mm^4]': 186 }), siRow({ Mark: 'L2-B3' })],
    [{ Mark: 'L2-B1', Case: 'D', Kind: 'point', 'Position [m]': 3.6, 'Value [kN, kN/m, kN·m]': 20 }],
  ).members;

  it('finds added, removed and changed members, field by field in SI', () => {
    const next = parseSI(
      [siRow({ Mark: 'L2-B2', 'I [10^6 mm^4]': 245, 'L [kN/m]': 7 }), siRow({ Mark: 'L2-B1' }), siRow({ Mark: 'L2-B4' })],
      [{ Mark: 'L2-B1', Case: 'D', Kind: 'point', 'Position [m]': 3.6, 'Value [kN, kN/m, kN·m]': 20 }],
    ).members;
    const diff = diffMembers(previous, next);
    expect(diff.added.map((m) => m.mark)).toEqual(['L2-B4']);
    expect(diff.removed.map((m) => m.mark)).toEqual(['L2-B3']);
    expect(diff.unchanged).toBe(1);
    expect(diff.changed).toHaveLength(1);
    expect(diff.changed[0].mark).toBe('L2-B2');
    expect(diff.changed[0].changes).toEqual([
      { field: 'I', before: expect.closeTo(186e-6, 18), after: expect.closeTo(245e-6, 18) },
      { field: 'loads.L', before: [{ case: 'L', kind: 'udl', x1: 0, x2: 7.2, w: 6000 }], after: [{ case: 'L', kind: 'udl', x1: 0, x2: 7.2, w: 7000 }] },
    ]);
  });

  it('moving rows or re-entering the same values in other units is not a change', () => {
    const header = ['Mark', 'Level', 'Grid', 'Category', 'Material', 'Spans [mm]', 'Supports', 'E [MPa]', 'I [mm^4]', 'Depth [m]', 'D [N/mm]', 'L [N/m]', 'Reviewer'];
    const rows = [3, 2, 1].map((n) => ({
      Mark: `L2-B${n}`, Level: 'L2', Grid: 'C/3-4', Category: 'floor', Material: 'steel', 'Spans [mm]': 7200, Supports: 'pinned',
      'E [MPa]': 200000, 'I [mm^4]': 186e6, 'Depth [m]': 0.403, 'D [N/mm]': 3.5, 'L [N/m]': 6000, Reviewer: 'INES.OKAFOR@halvercote.example',
    }));
    const next = parseSchedule({
      unitSystem: 'SI', categories: CATEGORIES, members: sheet('Members', header, rows),
      loads: sheet('Loads', ['Mark', 'Case', 'Kind', 'Position [mm]', 'Value [N]'], [{ Mark: 'L2-B1', Case: 'D', Kind: 'point', 'Position [mm]': 3600, 'Value [N]': 20000 }]),
    }).members;
    const diff = diffMembers(previous, next);
    expect(diff).toMatchObject({ added: [], removed: [], changed: [], unchanged: 3 });
  });

  it('a removed point load shows under its load case; a renamed mark is a removal and an addition', () => {
    const next = parseSI([siRow({ Mark: 'L2-B1' }), siRow({ Mark: 'L2-B2' }), siRow({ Mark: 'L2-B3x' })]).members;
    const diff = diffMembers(previous, next);
    expect(diff.changed.map((c) => [c.mark, c.changes.map((f) => f.field)])).toEqual([['L2-B1', ['loads.D']]]);
    expect(diff.changed[0].changes[0]).toEqual({
      field: 'loads.D',
      before: [{ case: 'D', kind: 'point', x: 3.6, P: 20000 }, { case: 'D', kind: 'udl', x1: 0, x2: 7.2, w: 3500 }],
      after: [{ case: 'D', kind: 'udl', x1: 0, x2: 7.2, w: 3500 }],
    });
    expect(diff.removed.map((m) => m.mark)).toEqual(['L2-B3']);
    expect(diff.added.map((m) => m.mark)).toEqual(['L2-B3x']);
  });

  it('reports span, support and category changes with SI before/after', () => {
    const next = parseSI([siRow({ Mark: 'L2-B1', 'Spans [m]': '4+3.2', Supports: 'fixed-pinned', Category: 'supports-masonry' }), siRow({ Mark: 'L2-B2' }), siRow({ Mark: 'L2-B3' })], [
      { Mark: 'L2-B1', Case: 'D', Kind: 'point', 'Position [m]': 3.6, 'Value [kN, kN/m, kN·m]': 20 },
    ]).members;
    const fields = diffMembers(previous, next).changed[0].changes;
    expect(fields.slice(0, 3)).toEqual([
      { field: 'category', before: 'floor', after: 'supports-masonry' },
      { field: 'spans', before: [7.2], after: [4, 3.2] },
      { field: 'supports', before: 'pinned', after: 'fixed-pinned' },
    ]);
  });
});

import { formatQuantity, parseQuantity, toSI, UNIT_SYSTEMS, UnitError } from './index';

describe('parseQuantity', () => {
  it.each([
    ['7.5 m', 'length', 7.5, 'm'],
    ['24 ft', 'length', 7.3152, 'ft'],
    ["24'", 'length', 7.3152, 'ft'],
    [`24'-6"`, 'length', 7.4676, 'in'],
    ['24 ft 6 in', 'length', 7.4676, 'in'],
    ['1,250 mm', 'length', 1.25, 'mm'],
    ['6 kN/m', 'lineLoad', 6000, 'kN/m'],
    ['-2.5 kN/m', 'lineLoad', -2500, 'kN/m'],
    ['−2.5 kN/m', 'lineLoad', -2500, 'kN/m'],
    ['450 plf', 'lineLoad', toSI(450, 'plf'), 'plf'],
    ['245 ×10⁶ mm⁴', 'inertia', 245e-6, '10^6 mm^4'],
    ['245 x10^6 mm^4', 'inertia', 245e-6, '10^6 mm^4'],
    ['590 in4', 'inertia', toSI(590, 'in^4'), 'in^4'],
    ['29,000 ksi', 'stress', toSI(29000, 'ksi'), 'ksi'],
    ['15 k-ft', 'moment', toSI(15, 'kip·ft'), 'kip·ft'],
    ['1.2e-4 m^4', 'inertia', 1.2e-4, 'm^4'],
    ['.5 in', 'length', 0.0127, 'in'],
  ] as const)('%j as %s', (text, dimension, si, unit) => {
    const q = parseQuantity(text, dimension);
    expect(q.si).toBeCloseTo(si, 12);
    expect(q.unit).toBe(unit);
  });

  it('uses the default unit when the text has none', () => {
    expect(parseQuantity('7.2', 'length', 'm')).toMatchObject({ si: 7.2, unit: 'm' });
    expect(parseQuantity('7.2', 'length', 'ft').si).toBeCloseTo(2.19456, 12);
    expect(parseQuantity('7.2', 'length', 'ft').value.toString()).toBe('7.2');
  });

  function errorOf(fn: () => unknown): UnitError {
    try {
      fn();
    } catch (e) {
      return e as UnitError;
    }
    throw new Error('expected a UnitError');
  }

  it('a unit of the wrong kind says what it is and what to use', () => {
    const e = errorOf(() => parseQuantity('6 kN', 'lineLoad'));
    expect(e).toBeInstanceOf(UnitError);
    expect(e.code).toBe('WRONG_DIMENSION');
    expect(e.message).toBe(
      '"kN" is a unit of force, but a line load (force per length) is expected here. Use one of N/m, kN/m, N/mm, plf, klf, pli.',
    );
  });

  it('an unknown unit lists the units of that dimension', () => {
    const e = errorOf(() => parseQuantity('3 furlongs', 'length'));
    expect(e.code).toBe('UNKNOWN_UNIT');
    expect(e.message).toContain('For a length use one of m, mm, cm, ft, in.');
  });

  it('text that is not a number, a missing unit and a decimal comma are each explained', () => {
    expect(errorOf(() => parseQuantity('TBD', 'length', 'm'))).toMatchObject({
      code: 'NOT_A_NUMBER',
      message: expect.stringContaining('"TBD" does not start with a number'),
    });
    expect(errorOf(() => parseQuantity('7.5', 'length'))).toMatchObject({
      code: 'UNKNOWN_UNIT',
      message: expect.stringContaining('has no unit'),
    });
    expect(errorOf(() => parseQuantity('7,5 m', 'length'))).toMatchObject({
      code: 'NOT_A_NUMBER',
      message: expect.stringContaining('Use a point as the decimal separator'),
    });
    expect(errorOf(() => parseQuantity('', 'length', 'm')).message).toContain('No value given');
  });
});

describe('formatQuantity: ~3 significant figures, clamped to each unit’s decimals', () => {
  it.each([
    [0.0124, 'deflection', 'SI', '12.4 mm'],
    [0.0124, 'deflection', 'US', '0.49 in'],
    [0.00083, 'deflection', 'SI', '0.8 mm'],
    [0.0312, 'deflection', 'SI', '31.2 mm'],
    [7.2, 'span', 'SI', '7.20 m'],
    [12.5, 'span', 'SI', '12.50 m'],
    [toSI(24, 'ft'), 'span', 'US', '24.0 ft'],
    [toSI(6.25, 'ft'), 'span', 'US', '6.25 ft'],
    [245e-6, 'inertia', 'SI', '245 ×10⁶ mm⁴'],
    [3.5e-6, 'inertia', 'SI', '3.50 ×10⁶ mm⁴'],
    [toSI(590, 'in^4'), 'inertia', 'US', '590 in⁴'],
    [6000, 'lineLoad', 'SI', '6.00 kN/m'],
    [toSI(450, 'plf'), 'lineLoad', 'US', '450 plf'],
    [toSI(1250, 'plf'), 'lineLoad', 'US', '1250 plf'],
    [200e9, 'modulus', 'SI', '200 GPa'],
    [toSI(29000, 'ksi'), 'modulus', 'US', '29,000 ksi'],
    [125300, 'moment', 'SI', '125 kN·m'],
    [toSI(12.3, 'kip'), 'force', 'US', '12.3 kip'],
    [-0.0124, 'deflection', 'SI', '-12.4 mm'],
    [-0.00001, 'deflection', 'SI', '0.0 mm'],
    [0, 'span', 'SI', '0.00 m'],
  ] as const)('%d as %s in %s → %j', (si, quantity, system, text) => {
    expect(formatQuantity(si, quantity, system)).toBe(text);
  });

  it('takes a unit instead of a quantity, and options', () => {
    expect(formatQuantity(0.0124, 'in', 'SI')).toBe('0.49 in');
    expect(formatQuantity(0.0124, 'deflection', 'SI', { unit: 'in', decimals: 3 })).toBe('0.488 in');
    expect(formatQuantity(245e-6, 'inertia', 'SI', { unitText: 'symbol' })).toBe('245 10^6 mm^4');
    expect(formatQuantity(245e-6, 'inertia', 'SI', { unitText: 'none' })).toBe('245');
    expect(formatQuantity(toSI(1250, 'plf'), 'lineLoad', 'US', { grouping: true })).toBe('1,250 plf');
  });

  it('has a default unit for every quantity in both systems', () => {
    expect(UNIT_SYSTEMS.SI).toMatchObject({ span: 'm', deflection: 'mm', lineLoad: 'kN/m', force: 'kN', moment: 'kN·m', modulus: 'GPa', inertia: '10^6 mm^4' });
    expect(UNIT_SYSTEMS.US).toMatchObject({ span: 'ft', deflection: 'in', lineLoad: 'plf', force: 'kip', moment: 'kip·ft', modulus: 'ksi', inertia: 'in^4' });
  });
});

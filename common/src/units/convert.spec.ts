import * as math from 'mathjs';
import { Decimal } from './exact';
import {
  convert,
  dimensionOf,
  fromSI,
  fromSIDecimal,
  normalizeUnit,
  SI_BASE_UNIT,
  toSI,
  toSIDecimal,
  UnitError,
  UNITS,
  unitsFor,
  type Dimension,
} from './index';

/**
 * Reference: mathjs 15 (npm "mathjs", a general-purpose unit library) `unit()`.
 * Each of our symbols is written as a mathjs expression. mathjs's own `kip`
 * (4448.2216 N) and `psi` (6894.75729276459 Pa) are rounded definitions, so
 * kip-based units are written as 1000 lbf and psi as lbf/in^2, which mathjs
 * derives from its exact lbf, in and ft (see the last block of tests).
 */
const MATHJS: Record<string, [multiplier: number, expression: string]> = {
  m: [1, 'm'],
  mm: [1, 'mm'],
  cm: [1, 'cm'],
  ft: [1, 'ft'],
  in: [1, 'in'],
  N: [1, 'N'],
  kN: [1, 'kN'],
  lbf: [1, 'lbf'],
  kip: [1000, 'lbf'],
  'N/m': [1, 'N/m'],
  'kN/m': [1, 'kN/m'],
  'N/mm': [1, 'N/mm'],
  plf: [1, 'lbf/ft'],
  klf: [1000, 'lbf/ft'],
  pli: [1, 'lbf/in'],
  'N·m': [1, 'N m'],
  'kN·m': [1, 'kN m'],
  'N·mm': [1, 'N mm'],
  'lbf·ft': [1, 'lbf ft'],
  'lbf·in': [1, 'lbf in'],
  'kip·ft': [1000, 'lbf ft'],
  'kip·in': [1000, 'lbf in'],
  Pa: [1, 'Pa'],
  kPa: [1, 'kPa'],
  MPa: [1, 'MPa'],
  GPa: [1, 'GPa'],
  psi: [1, 'lbf/in^2'],
  ksi: [1000, 'lbf/in^2'],
  psf: [1, 'lbf/ft^2'],
  'mm^4': [1, 'mm^4'],
  'cm^4': [1, 'cm^4'],
  '10^6 mm^4': [1e6, 'mm^4'],
  'm^4': [1, 'm^4'],
  'in^4': [1, 'in^4'],
};

const MATHJS_SI: Record<Dimension, string> = {
  length: 'm',
  force: 'N',
  lineLoad: 'N/m',
  moment: 'N m',
  stress: 'Pa',
  inertia: 'm^4',
};

function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.max(Math.abs(b), Number.MIN_VALUE);
}

describe('conversion to SI agrees with mathjs unit() to 1e-12 relative', () => {
  const values = [1, 7.5, 0.001, 123.456, 24000, 3.3e-5];
  it('covers every unit in the table', () => {
    expect(Object.keys(MATHJS).sort()).toEqual(UNITS.map((u) => u.symbol).sort());
  });
  for (const unit of UNITS) {
    it(`${unit.symbol} → ${SI_BASE_UNIT[unit.dimension]}`, () => {
      const [multiplier, expression] = MATHJS[unit.symbol];
      for (const v of values) {
        const reference = math.unit(v * multiplier, expression).toNumeric(MATHJS_SI[unit.dimension]) as number;
        expect(relErr(toSI(v, unit.symbol), reference)).toBeLessThan(1e-12);
        expect(relErr(fromSI(reference, unit.symbol), v)).toBeLessThan(1e-12);
      }
    });
  }
});

describe('exact factors (domain notes: exact factors; NIST SP 811 (2008) Appendix B, from memory)', () => {
  it('1 ft = 0.3048 m and 1 in = 0.0254 m exactly', () => {
    expect(toSIDecimal(1, 'ft').toString()).toBe('0.3048');
    expect(toSIDecimal(1, 'in').toString()).toBe('0.0254');
  });
  it('1 lbf = 4.4482216152605 N and 1 kip = 4448.2216152605 N exactly', () => {
    expect(toSIDecimal(1, 'lbf').toString()).toBe('4.4482216152605');
    expect(toSIDecimal(1, 'kip').toString()).toBe('4448.2216152605');
  });
  it('1 psi = 1 lbf/in² = 6894.757293168361… Pa (derived, not rounded)', () => {
    // 4.4482216152605 / 0.0254² worked to 50 digits with Python's decimal module.
    const exact = new Decimal('6894.7572931683613367226734453468906937813875627751');
    expect(toSIDecimal(1, 'psi').toSignificantDigits(35).eq(exact.toSignificantDigits(35))).toBe(true);
    expect(toSIDecimal(1, 'psi').toFixed(12)).toBe('6894.757293168361');
    // The double nearest the exact value; the domain note's 6894.757293168361 is within 1 ulp.
    expect(relErr(toSI(1, 'psi'), 6894.757293168361)).toBeLessThan(2e-16);
    expect(toSI(1, 'ksi')).toBe(toSI(1000, 'psi'));
  });
  it('1 in⁴ = 0.0254⁴ m⁴ = 4.162314256e-7 m⁴ exactly', () => {
    expect(toSIDecimal(1, 'in^4').toString()).toBe('4.162314256e-7');
  });
  it('equivalent entries give the same double (12 in = 1 ft, 1000 lbf = 1 kip, 1000 mm = 1 m)', () => {
    expect(toSI(12, 'in')).toBe(toSI(1, 'ft'));
    expect(toSI(1000, 'lbf')).toBe(toSI(1, 'kip'));
    expect(toSI(1000, 'mm')).toBe(1);
    expect(toSI(245, '10^6 mm^4')).toBe(toSI(245e6, 'mm^4'));
    expect(convert(1, 'ft', 'in')).toBe(12);
    expect(convert(1, 'kip·ft', 'lbf·in')).toBe(12000);
  });
  it('SI prefixes: 0.1 mm = 1e-4 m, 6 kN/m = 6000 N/m, 200 GPa = 2e11 Pa', () => {
    expect(toSI(0.1, 'mm')).toBe(1e-4);
    expect(toSI(6, 'kN/m')).toBe(6000);
    expect(toSI(200, 'GPa')).toBe(2e11);
    expect(toSI(29000, 'ksi')).toBeCloseTo(199.947961501e9, -3);
  });
  it('fromSIDecimal of a value entered in a US unit gives back the entry exactly', () => {
    expect(fromSIDecimal(toSIDecimal('24', 'ft'), 'ft').toString()).toBe('24');
    expect(fromSIDecimal(toSIDecimal('450', 'plf'), 'plf').toSignificantDigits(30).toString()).toBe('450');
  });
});

describe('mathjs built-in kip and psi are rounded (why the reference above uses lbf)', () => {
  it('mathjs kip = 4448.2216 N differs from 1000 lbf by about 3.4e-9 relative', () => {
    const mathjsKip = math.unit(1, 'kip').toNumeric('N') as number;
    expect(relErr(mathjsKip, toSI(1, 'kip'))).toBeGreaterThan(1e-9);
    expect(relErr(mathjsKip, toSI(1, 'kip'))).toBeLessThan(1e-8);
  });
  it('mathjs psi = 6894.75729276459 Pa differs from lbf/in² by about 6e-11 relative', () => {
    const mathjsPsi = math.unit(1, 'psi').toNumeric('Pa') as number;
    expect(relErr(mathjsPsi, toSI(1, 'psi'))).toBeLessThan(1e-10);
  });
});

describe('unit names and errors', () => {
  it.each([
    ['kN*m', 'kN·m'],
    ['kNm', 'kN·m'],
    ['kN-m', 'kN·m'],
    ['KN.M'.replace('.', ' '), 'kN·m'],
    ['10^6 mm^4', '10^6 mm^4'],
    ['1e6 mm4', '10^6 mm^4'],
    ['x10^6 mm^4', '10^6 mm^4'],
    ['×10⁶ mm⁴', '10^6 mm^4'],
    ['10⁶ mm⁴', '10^6 mm^4'],
    ['mm4', 'mm^4'],
    ['mm⁴', 'mm^4'],
    ['in4', 'in^4'],
    ['lb', 'lbf'],
    ['lbs', 'lbf'],
    ['kips', 'kip'],
    ['lb/ft', 'plf'],
    ['kip/ft', 'klf'],
    ['k-ft', 'kip·ft'],
    ['kip-ft', 'kip·ft'],
    ['ft-kip', 'kip·ft'],
    ['lb·ft', 'lbf·ft'],
    ['N/mm²', 'MPa'],
    [' mpa ', 'MPa'],
    ['in.', 'in'],
    ["'", 'ft'],
    ['"', 'in'],
    ['feet', 'ft'],
  ])('normalizeUnit(%j) = %j', (text, symbol) => {
    expect(normalizeUnit(text)).toBe(symbol);
  });

  it('an unknown unit throws UnitError UNKNOWN_UNIT listing the accepted units', () => {
    expect(() => toSI(1, 'furlong')).toThrow(UnitError);
    try {
      normalizeUnit('furlong');
    } catch (e) {
      expect(e).toBeInstanceOf(UnitError);
      expect((e as UnitError).code).toBe('UNKNOWN_UNIT');
      expect((e as UnitError).message).toContain('"furlong" is not a unit');
      expect((e as UnitError).message).toContain('length: m, mm, cm, ft, in');
    }
  });

  it('convert between dimensions throws WRONG_DIMENSION', () => {
    expect(() => convert(1, 'kN', 'm')).toThrow(expect.objectContaining({ code: 'WRONG_DIMENSION' }));
  });

  it('a non-number throws NOT_A_NUMBER', () => {
    expect(() => toSI('abc', 'm')).toThrow(expect.objectContaining({ code: 'NOT_A_NUMBER' }));
    expect(() => toSI(Number.NaN, 'm')).toThrow(expect.objectContaining({ code: 'NOT_A_NUMBER' }));
    expect(() => toSI('0x10', 'm')).toThrow(expect.objectContaining({ code: 'NOT_A_NUMBER' }));
    expect(toSI('7.5', 'm')).toBe(7.5);
  });

  it('dimensionOf and unitsFor', () => {
    expect(dimensionOf('plf')).toBe('lineLoad');
    expect(dimensionOf('k-ft')).toBe('moment');
    expect(unitsFor('inertia', 'SI')).toEqual(['mm^4', 'cm^4', '10^6 mm^4', 'm^4']);
    expect(unitsFor('lineLoad', 'US')).toEqual(['plf', 'klf', 'pli']);
  });
});

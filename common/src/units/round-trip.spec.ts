import fc from 'fast-check';
import { convert, formatInUnit, fromSI, fromSIDecimal, parseQuantity, toSI, toSIDecimal, UNITS } from './index';
import { unitKey, unitSpellings } from './unit-table';

const unitArb = fc.constantFrom(...UNITS);
// Magnitudes a schedule can hold, both signs.
const valueArb = fc
  .double({ min: 1e-6, max: 1e9, noNaN: true, noDefaultInfinity: true })
  .chain((v) => fc.constantFrom(v, -v));

function relErr(a: number, b: number): number {
  return Math.abs(a - b) / Math.abs(b);
}

describe('round trips (fast-check)', () => {
  it('fromSI(toSI(v)) returns v within one rounding of each step', () => {
    fc.assert(
      fc.property(unitArb, valueArb, (unit, v) => {
        expect(relErr(fromSI(toSI(v, unit.symbol), unit.symbol), v)).toBeLessThanOrEqual(4.5e-16);
      }),
    );
  });

  it('the Decimal round trip is exact to 30 significant digits', () => {
    fc.assert(
      fc.property(unitArb, valueArb, (unit, v) => {
        const back = fromSIDecimal(toSIDecimal(v, unit.symbol), unit.symbol);
        expect(back.toSignificantDigits(30).toNumber()).toBe(v);
      }),
    );
  });

  it('convert a→b→a returns v, and agrees with toSI then fromSI', () => {
    fc.assert(
      fc.property(unitArb, valueArb, (a, v) => {
        const sameDim = UNITS.filter((u) => u.dimension === a.dimension);
        for (const b of sameDim) {
          const there = convert(v, a.symbol, b.symbol);
          expect(relErr(convert(there, b.symbol, a.symbol), v)).toBeLessThanOrEqual(4.5e-16);
          expect(relErr(there, fromSI(toSI(v, a.symbol), b.symbol))).toBeLessThanOrEqual(4.5e-16);
        }
      }),
      { numRuns: 50 },
    );
  });

  it('a formatted quantity parses back to the number shown', () => {
    fc.assert(
      fc.property(unitArb, valueArb, fc.constantFrom('display', 'symbol') as fc.Arbitrary<'display' | 'symbol'>, (unit, v, unitText) => {
        const text = formatInUnit(v, unit.symbol, { unitText, grouping: true });
        const parsed = parseQuantity(text, unit.dimension);
        expect(parsed.unit).toBe(unit.symbol);
        const shown = text.slice(0, text.indexOf(' ')).replace(/,/g, '');
        expect(parsed.value.toString()).toBe(new (parsed.value.constructor as typeof import('decimal.js').default)(shown).toString());
      }),
    );
  });

  it('every spelling in the table has one key and resolves to its own unit', () => {
    for (const unit of UNITS) {
      for (const spelling of [unit.symbol, unit.display, ...unit.aliases]) {
        expect(unitSpellings().get(unitKey(spelling))).toBe(unit);
      }
    }
  });
});

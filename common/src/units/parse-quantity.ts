import { toDecimal, unitOfDimension, unitsFor } from './convert';
import { DIMENSION_LABEL, type Dimension } from './dimensions';
import type { Decimal } from './exact';
import { UnitError } from './unit-error';

export interface ParsedQuantity {
  /** The SI value (m, N, N/m, N·m, Pa, m^4), rounded once to a double. */
  si: number;
  /** Canonical symbol of the unit the value was written in. */
  unit: string;
  /** The number as written, in `unit`, exactly. */
  value: Decimal;
}

// A leading number: optional sign (also the typographic minus), digits with
// optional comma thousands groups ("1,250"), optional decimals and exponent.
const NUMBER = /^([+\-−]?)\s*((?:\d{1,3}(?:,\d{3})+|\d+)(?:\.\d*)?|\.\d+)(e[+-]?\d+)?/i;
// 24'-6", 24' 6", 24 ft 6 in
const FEET_INCHES = /^([+\-−]?)\s*(\d+(?:\.\d+)?)\s*(?:'|′|ft)\s*-?\s*(\d+(?:\.\d+)?)\s*(?:"|″|in\.?)$/i;

function accepted(dimension: Dimension): string {
  return unitsFor(dimension).join(', ');
}

/**
 * Reads a typed quantity such as "7.5 m", "24 ft", "24'", "24'-6\"", "6 kN/m",
 * "1,250 mm" or "245 ×10⁶ mm⁴". Without a unit the `defaultUnit` applies.
 * Throws UnitError (NOT_A_NUMBER, UNKNOWN_UNIT, WRONG_DIMENSION) with a
 * message that names the accepted units for the dimension.
 */
export function parseQuantity(text: string, dimension: Dimension, defaultUnit?: string): ParsedQuantity {
  const input = String(text).trim();
  const label = DIMENSION_LABEL[dimension];

  if (dimension === 'length') {
    const fi = FEET_INCHES.exec(input);
    if (fi) {
      const negative = fi[1] === '-' || fi[1] === '−';
      const inches = toDecimal(fi[2]).times(12).plus(toDecimal(fi[3]));
      const value = negative ? inches.negated() : inches;
      const def = unitOfDimension('in', 'length');
      return { si: value.times(def.factor).toNumber(), unit: def.symbol, value };
    }
  }

  const match = NUMBER.exec(input);
  if (!match) {
    throw new UnitError(
      'NOT_A_NUMBER',
      input === ''
        ? `No value given. Write a ${label} as a number and a unit, e.g. "${example(dimension)}"; units: ${accepted(dimension)}.`
        : `"${input}" does not start with a number. Write a ${label} as a number and a unit, e.g. "${example(dimension)}"; units: ${accepted(dimension)}.`,
      { input, dimension, accepted: unitsFor(dimension) },
    );
  }
  const rest = input.slice(match[0].length).trim();
  if (/^,\d/.test(rest)) {
    throw new UnitError(
      'NOT_A_NUMBER',
      `"${input}" looks like a decimal comma. Use a point as the decimal separator (e.g. 7.5); commas may only group thousands (1,250).`,
      { input, dimension, accepted: unitsFor(dimension) },
    );
  }
  const sign = match[1] === '-' || match[1] === '−' ? '-' : '';
  const value = toDecimal(sign + match[2].replace(/,/g, '') + (match[3] ?? ''));

  let unitText = rest;
  if (unitText === '') {
    if (!defaultUnit) {
      throw new UnitError(
        'UNKNOWN_UNIT',
        `"${input}" has no unit. Add one of ${accepted(dimension)}, e.g. "${example(dimension)}".`,
        { input, dimension, accepted: unitsFor(dimension) },
      );
    }
    unitText = defaultUnit;
  }
  const def = unitOfDimension(unitText, dimension);
  return { si: value.times(def.factor).toNumber(), unit: def.symbol, value };
}

function example(dimension: Dimension): string {
  switch (dimension) {
    case 'length':
      return '7.5 m';
    case 'force':
      return '12 kN';
    case 'lineLoad':
      return '6 kN/m';
    case 'moment':
      return '15 kN·m';
    case 'stress':
      return '200 GPa';
    case 'inertia':
      return '245 ×10⁶ mm⁴';
  }
}

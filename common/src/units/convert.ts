import { DIMENSION_LABEL, type Dimension } from './dimensions';
import { Decimal, ExactDecimal as D, type DecimalValue } from './exact';
import { findUnit, UNITS, type UnitDef, type UnitSystemId } from './unit-table';
import { UnitError } from './unit-error';

/** Canonical symbols of every unit, grouped by dimension (for messages). */
function acceptedList(dimension?: Dimension): string {
  if (dimension) return unitsFor(dimension).join(', ');
  const groups = new Map<Dimension, string[]>();
  for (const u of UNITS) groups.set(u.dimension, [...(groups.get(u.dimension) ?? []), u.symbol]);
  return [...groups].map(([dim, symbols]) => `${DIMENSION_LABEL[dim]}: ${symbols.join(', ')}`).join('; ');
}

/** The definition of a unit; throws UnitError UNKNOWN_UNIT when we do not know it. */
export function unitInfo(unit: string): UnitDef {
  const def = findUnit(unit);
  if (!def) {
    throw new UnitError(
      'UNKNOWN_UNIT',
      `"${unit}" is not a unit Sagline knows. Accepted units are ${acceptedList()}.`,
      { input: unit, accepted: UNITS.map((u) => u.symbol) },
    );
  }
  return def;
}

/** The canonical symbol of a unit spelling ("kN*m" → "kN·m", "1e6 mm4" → "10^6 mm^4"). */
export function normalizeUnit(text: string): string {
  return unitInfo(text).symbol;
}

/** The dimension a unit measures. */
export function dimensionOf(unit: string): Dimension {
  return unitInfo(unit).dimension;
}

/** Canonical symbols of the units of one dimension, SI first, optionally one system only. */
export function unitsFor(dimension: Dimension, system?: UnitSystemId): string[] {
  return UNITS.filter((u) => u.dimension === dimension && (!system || u.system === system)).map((u) => u.symbol);
}

/** The unit, checked to be of the given dimension (UnitError WRONG_DIMENSION otherwise). */
export function unitOfDimension(unit: string, dimension: Dimension): UnitDef {
  const def = findUnit(unit);
  if (!def) {
    throw new UnitError(
      'UNKNOWN_UNIT',
      `"${unit}" is not a unit Sagline knows. For a ${DIMENSION_LABEL[dimension]} use one of ${acceptedList(dimension)}.`,
      { input: unit, dimension, accepted: unitsFor(dimension) },
    );
  }
  if (def.dimension !== dimension) {
    throw new UnitError(
      'WRONG_DIMENSION',
      `"${unit}" is a unit of ${DIMENSION_LABEL[def.dimension]}, but a ${DIMENSION_LABEL[dimension]} is expected here. Use one of ${acceptedList(dimension)}.`,
      { input: unit, dimension, accepted: unitsFor(dimension) },
    );
  }
  return def;
}

/** A Decimal from a number, a numeric string or a Decimal; UnitError NOT_A_NUMBER otherwise. */
export function toDecimal(value: DecimalValue): Decimal {
  if (typeof value === 'number') {
    if (!Number.isFinite(value)) {
      throw new UnitError('NOT_A_NUMBER', `${value} is not a finite number.`, { input: String(value) });
    }
    return new D(value);
  }
  if (Decimal.isDecimal(value)) {
    if (!value.isFinite()) {
      throw new UnitError('NOT_A_NUMBER', `${value.toString()} is not a finite number.`, { input: value.toString() });
    }
    return new D(value);
  }
  const text = String(value).trim();
  // Plain decimal notation only: decimal.js would also take hex and binary literals.
  if (!/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(text)) {
    throw new UnitError(
      'NOT_A_NUMBER',
      `"${text}" is not a number. Write digits with a point as the decimal separator, e.g. 7.5 or 1250.`,
      { input: text },
    );
  }
  return new D(text);
}

/** The exact SI value of `value` given in `unit`. */
export function toSIDecimal(value: DecimalValue, unit: string): Decimal {
  return toDecimal(value).times(unitInfo(unit).factor);
}

/** The SI value (m, N, N/m, N·m, Pa, m^4) of `value` given in `unit`, rounded once to a double. */
export function toSI(value: DecimalValue, unit: string): number {
  return toSIDecimal(value, unit).toNumber();
}

/** The exact value in `unit` of an SI value. */
export function fromSIDecimal(si: DecimalValue, unit: string): Decimal {
  return toDecimal(si).div(unitInfo(unit).factor);
}

/** The value in `unit` of an SI value, rounded once to a double. */
export function fromSI(si: DecimalValue, unit: string): number {
  return fromSIDecimal(si, unit).toNumber();
}

/** `value` in `fromUnit` expressed in `toUnit` (same dimension, else UnitError WRONG_DIMENSION). */
export function convertDecimal(value: DecimalValue, fromUnit: string, toUnit: string): Decimal {
  const from = unitInfo(fromUnit);
  const to = unitOfDimension(toUnit, from.dimension);
  return toDecimal(value).times(from.factor).div(to.factor);
}

export function convert(value: DecimalValue, fromUnit: string, toUnit: string): number {
  return convertDecimal(value, fromUnit, toUnit).toNumber();
}

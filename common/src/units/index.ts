/**
 * Quantities and exact unit conversion. The engine works only in SI base
 * units (m, N, N/m, N·m, Pa, m^4); imports and screens convert here, at the
 * edges, with decimal.js so that no factor is rounded before the final double.
 */
export { DIMENSIONS, DIMENSION_LABEL, SI_BASE_UNIT, isDimension, type Dimension } from './dimensions';
export { UnitError, type UnitErrorCode } from './unit-error';
export { UNITS, findUnit, unitKey, type UnitDef, type UnitSystemId } from './unit-table';
export {
  convert,
  convertDecimal,
  dimensionOf,
  fromSI,
  fromSIDecimal,
  normalizeUnit,
  toDecimal,
  toSI,
  toSIDecimal,
  unitInfo,
  unitOfDimension,
  unitsFor,
} from './convert';
export { parseQuantity, type ParsedQuantity } from './parse-quantity';
export { QUANTITIES, UNIT_SYSTEMS, UNIT_SYSTEM_LABEL, defaultUnit, isQuantity, type Quantity } from './unit-systems';
export { displayDecimals, formatInUnit, formatQuantity, type FormatOptions } from './format';
export { Decimal, ExactDecimal, type DecimalValue } from './exact';

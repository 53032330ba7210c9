import Decimal from 'decimal.js';

/**
 * The Decimal constructor every conversion uses. 40 significant digits keep
 * derived factors such as lbf/ft (a repeating decimal) far below the
 * resolution of a double, so `toSI` returns the correctly rounded double of the
 * exact product.
 */
export const ExactDecimal = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_EVEN });

export type DecimalValue = number | string | Decimal;

export { Decimal };

import { fromSIDecimal, unitInfo } from './convert';
import { Decimal } from './exact';
import type { UnitSystemId } from './unit-table';
import { defaultUnit, isQuantity, type Quantity } from './unit-systems';

export interface FormatOptions {
  /** Show in this unit instead of the system default. */
  unit?: string;
  /** Significant figures aimed at (default 3). */
  significant?: number;
  /** Exact number of decimals; overrides the significant-figure rule. */
  decimals?: number;
  /**
   * Thousands separators: 'auto' (default) groups integer parts of five digits
   * or more ("29,000 ksi", but "1250 plf"), true always, false never.
   */
  grouping?: boolean | 'auto';
  /** 'display' (default: "kN·m", "×10⁶ mm⁴"), 'symbol' ("10^6 mm^4") or 'none'. */
  unitText?: 'display' | 'symbol' | 'none';
}

/**
 * Decimals for a value shown in a unit. The rule: aim at `significant`
 * figures (3), then clamp to the unit's minimum and maximum decimals, so that
 * spans keep centimetres ("7.20 m", "12.50 m"), feet keep a tenth ("24.0 ft"),
 * millimetres stop at a tenth ("0.8 mm") and inches at a hundredth ("0.49 in").
 */
export function displayDecimals(value: Decimal.Value, unit: string, significant = 3): number {
  const def = unitInfo(unit);
  const v = new Decimal(value).abs();
  if (v.isZero()) return def.minDecimals;
  const magnitude = Math.floor(Math.log10(v.toNumber()));
  const wanted = significant - 1 - magnitude;
  return Math.min(def.maxDecimals, Math.max(def.minDecimals, wanted));
}

function group(integerPart: string, grouping: boolean | 'auto'): string {
  if (grouping === false || (grouping === 'auto' && integerPart.length < 5)) return integerPart;
  return integerPart.replace(/\B(?=(\d{3})+(?!\d))/g, ',');
}

/** A number in a unit, rounded half away from zero, with the unit after it. */
export function formatInUnit(value: Decimal.Value, unit: string, opts: FormatOptions = {}): string {
  const def = unitInfo(unit);
  const v = new Decimal(value);
  const decimals = opts.decimals ?? displayDecimals(v, def.symbol, opts.significant ?? 3);
  const rounded = v.toDecimalPlaces(decimals, Decimal.ROUND_HALF_UP);
  const [intPart, fracPart] = rounded.abs().toFixed(decimals).split('.');
  const sign = rounded.isNegative() && !rounded.isZero() ? '-' : '';
  const number = sign + group(intPart, opts.grouping ?? 'auto') + (fracPart ? '.' + fracPart : '');
  const unitText = opts.unitText ?? 'display';
  if (unitText === 'none') return number;
  return `${number} ${unitText === 'symbol' ? def.symbol : def.display}`;
}

/**
 * An SI value for a person: in the unit system's default unit for the
 * quantity (or in `what` when it is a unit, or in `opts.unit`), with the
 * precision rule of `displayDecimals`.
 * Examples: deflection 0.0124 → "12.4 mm" / "0.49 in"; span 7.2 → "7.20 m";
 * I 2.45e-4 → "245 ×10⁶ mm⁴".
 */
export function formatQuantity(si: number, what: Quantity | string, system: UnitSystemId, opts: FormatOptions = {}): string {
  const unit = opts.unit ?? (isQuantity(what) ? defaultUnit(what as Quantity, system) : what);
  return formatInUnit(fromSIDecimal(si, unit), unit, opts);
}

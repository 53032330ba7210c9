import type { CSSProperties } from 'react';
import { formatQuantity, type FormatOptions, type Quantity as QuantityName, type UnitSystemId } from '@sagline/common/units';

const cache = new Map<string, string>();
const CACHE_MAX = 5000;

/**
 * formatQuantity, remembered: exact conversion (decimal.js, 40 digits) is
 * not free, and a page of 500 members repeats the same spans and sections.
 */
export function formatQuantityCached(si: number, quantity: QuantityName, system: UnitSystemId, options?: FormatOptions): string {
  const key = `${si}|${quantity}|${system}|${options ? JSON.stringify(options) : ''}`;
  let text = cache.get(key);
  if (text === undefined) {
    text = formatQuantity(si, quantity, system, options);
    if (cache.size >= CACHE_MAX) cache.clear();
    cache.set(key, text);
  }
  return text;
}

/**
 * An SI value from the API shown in the project's units ("7.20 m",
 * "24.0 ft", "245 ×10⁶ mm⁴"), with tabular figures so columns line up.
 * The one way screens print a physical quantity (units/README.md).
 */
export function Quantity({
  si,
  quantity,
  system,
  options,
  style,
}: {
  si: number | null | undefined;
  quantity: QuantityName;
  system: UnitSystemId;
  options?: FormatOptions;
  style?: CSSProperties;
}) {
  if (si === null || si === undefined || !Number.isFinite(si)) return <span style={{ color: '#8c8c8c' }}>—</span>;
  return (
    <span style={{ fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap', ...style }}>
      {formatQuantityCached(si, quantity, system, options)}
    </span>
  );
}

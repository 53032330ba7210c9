import type { CSSProperties } from 'react';
import { formatQuantity, type FormatOptions, type Quantity as QuantityName, type UnitSystemId } from '@sagline/common/units';

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
      {formatQuantity(si, quantity, system, options)}
    </span>
  );
}

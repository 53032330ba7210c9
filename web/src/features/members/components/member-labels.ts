import type { MemberRow } from '@sagline/common/api-types';
import { findCategory } from '@sagline/common/limits/categories';
import { MATERIALS, SUPPORT_CODES } from '@sagline/common/schedule/codes';
import { defaultUnit, unitInfo, type Quantity, type UnitSystemId } from '@sagline/common/units';
import { formatQuantityCached as formatQuantity } from '@/components/quantity';

/** Words for the codes the API sends (category ids, material and support codes of the schedule). */
export function categoryLabel(id: string): string {
  return findCategory(id)?.label ?? id;
}

export function materialLabel(code: string): string {
  return MATERIALS.find((m) => m.code === code)?.label ?? code;
}

export function supportsLabel(code: string): string {
  return SUPPORT_CODES.find((s) => s.code === code)?.label ?? code;
}

/**
 * The spans of a member as the schedule writes them, in the project's units:
 * "6.00 + 4.50 m", then any overhang: "6.00 m, overhang left 1.20 m".
 */
export function spansText(m: Pick<MemberRow, 'spans' | 'leftOverhang' | 'rightOverhang'>, system: UnitSystemId): string {
  const bare = (v: number) => formatQuantity(v, 'span', system, { unitText: 'none' });
  const unit = unitText('span', system);
  const parts = [`${m.spans.map(bare).join(' + ')} ${unit}`];
  if (m.leftOverhang > 0) parts.push(`overhang left ${formatQuantity(m.leftOverhang, 'span', system)}`);
  if (m.rightOverhang > 0) parts.push(`overhang right ${formatQuantity(m.rightOverhang, 'span', system)}`);
  return parts.join(', ');
}

/** The display unit of a quantity in a unit system: "mm", "in", "×10⁶ mm⁴". */
export function unitText(quantity: Quantity, system: UnitSystemId): string {
  return unitInfo(defaultUnit(quantity, system)).display;
}

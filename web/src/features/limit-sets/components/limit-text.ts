import { formatQuantity, type UnitSystemId } from '@sagline/common/units';
import type { LimitSetRuleView } from '@sagline/common/api-types';

/** The limit of a rule in words: "span/360", "span/600, at most 7.62 mm", "span/240 + 6.35 mm". */
export function limitText(rule: Pick<LimitSetRuleView, 'ratio' | 'maxAbs' | 'plus'>, system: UnitSystemId): string {
  let text = `span/${rule.ratio}`;
  if (rule.plus) text += ` + ${formatQuantity(rule.plus, 'deflection', system)}`;
  if (rule.maxAbs !== null) text += `, at most ${formatQuantity(rule.maxAbs, 'deflection', system)}`;
  return text;
}

/** Where a rule applies by length, or null: "members up to 4.11 m". */
export function lengthText(rule: Pick<LimitSetRuleView, 'lengthRange'>, system: UnitSystemId): string | null {
  const r = rule.lengthRange;
  if (!r) return null;
  const parts: string[] = [];
  if (r.min !== undefined) parts.push(`longer than ${formatQuantity(r.min, 'length', system)}`);
  if (r.max !== undefined) parts.push(`up to ${formatQuantity(r.max, 'length', system)}`);
  return parts.length ? `members ${parts.join(' and ')}` : null;
}

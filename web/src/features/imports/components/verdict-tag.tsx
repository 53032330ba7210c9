import { Tag, Typography } from 'antd';
import type { Verdict } from '@sagline/common/api-types';

/** Pass / fail as a tag; a member without any check says so rather than passing. */
export function VerdictTag({ verdict }: { verdict: Verdict | null }) {
  if (verdict === 'pass') return <Tag color="green">Pass</Tag>;
  if (verdict === 'fail') return <Tag color="red">Fail</Tag>;
  return <Tag>No check</Tag>;
}

/** Largest utilisation of a member's checks: 1.00 is at the limit. */
export function Utilisation({ value }: { value: number | null }) {
  if (value === null) return <Typography.Text type="secondary">—</Typography.Text>;
  return <Typography.Text type={value > 1 ? 'danger' : undefined}>{value.toFixed(2)}</Typography.Text>;
}

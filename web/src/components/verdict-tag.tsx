import { Tag } from 'antd';
import type { Verdict } from '@sagline/common/api-types';

/** Pass / fail as a tag; a member without any check says so rather than passing. */
export function VerdictTag({ verdict }: { verdict: Verdict | null }) {
  if (verdict === 'pass') return <Tag color="success">Pass</Tag>;
  if (verdict === 'fail') return <Tag color="error">Fail</Tag>;
  return <Tag>No check</Tag>;
}

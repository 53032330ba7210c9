import { Alert, Descriptions, Tag, Typography } from 'antd';
import { Link } from 'react-router-dom';
import type { Flag } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { CautionNote } from '@/components/caution-note';
import { formatDateTime } from '@/lib/format';
import { DueDate } from './due-date';
import { FlagStatusTag } from './flag-status-tag';

function Verdict({ verdict }: { verdict: 'pass' | 'fail' | null }) {
  if (verdict === 'pass') return <Tag color="green">Pass</Tag>;
  if (verdict === 'fail') return <Tag color="red">Fail</Tag>;
  return <Tag>No check</Tag>;
}

/** The member as the latest revision has it, or a notice that it left the schedule. */
export function FlagMemberFacts({ flag }: { flag: Flag }) {
  const m = flag.member;
  if (!m) {
    return (
      <Alert
        type="warning"
        showIcon
        title={`${flag.mark} is no longer in the latest revision`}
        description="The member left the schedule; the flag keeps its history. Close or waive it if nothing is left to do."
      />
    );
  }
  return (
    <>
      <Descriptions size="small" column={{ xs: 1, sm: 2 }} aria-label="The member">
        <Descriptions.Item label="Mark">
          <Link to={paths.projectMember.getHref(flag.projectId, flag.mark)}>{flag.mark}</Link>
        </Descriptions.Item>
        <Descriptions.Item label="Level">{m.level.name}</Descriptions.Item>
        <Descriptions.Item label="Category">{m.category}</Descriptions.Item>
        <Descriptions.Item label="Verdict">
          <Verdict verdict={m.verdict} />
        </Descriptions.Item>
        <Descriptions.Item label="Governing check">{m.governingCheck ?? '—'}</Descriptions.Item>
        <Descriptions.Item label="Utilisation">
          {m.maxUtilization === null ? (
            '—'
          ) : (
            <Typography.Text type={m.maxUtilization > 1 ? 'danger' : undefined}>{m.maxUtilization.toFixed(2)}</Typography.Text>
          )}
        </Descriptions.Item>
        <Descriptions.Item label="Reviewer">{m.reviewer?.name ?? '—'}</Descriptions.Item>
      </Descriptions>
      <CautionNote />
    </>
  );
}

/** Who raised it, for whom, when, on which check and revision. */
export function FlagFacts({ flag }: { flag: Flag }) {
  return (
    <Descriptions size="small" column={{ xs: 1, sm: 2 }} aria-label="The flag">
      <Descriptions.Item label="Status">
        <FlagStatusTag status={flag.status} />
      </Descriptions.Item>
      <Descriptions.Item label="Check">{flag.checkName ?? 'The member as a whole'}</Descriptions.Item>
      <Descriptions.Item label="Assignee">{flag.assignee?.name ?? 'Nobody yet'}</Descriptions.Item>
      <Descriptions.Item label="Due">
        <DueDate date={flag.dueDate} overdue={flag.overdue} />
      </Descriptions.Item>
      <Descriptions.Item label="Raised by">{flag.raisedBy?.name ?? '—'}</Descriptions.Item>
      <Descriptions.Item label="Raised">
        {formatDateTime(flag.createdAt)}
        {flag.raisedInRevision && ` (revision ${flag.raisedInRevision.number})`}
      </Descriptions.Item>
      {flag.waiveReason && (
        <Descriptions.Item label="Waived because" span={2}>
          {flag.waiveReason}
        </Descriptions.Item>
      )}
    </Descriptions>
  );
}

import { Tag } from 'antd';
import type { FlagStatus } from '@sagline/common/api-types';

export const FLAG_STATUS_LABELS: Record<FlagStatus, string> = {
  open: 'Open',
  answered: 'Answered',
  closed: 'Closed',
  waived: 'Waived',
};

/** What each status asks of whom, for tooltips and the board's column heads. */
export const FLAG_STATUS_HINTS: Record<FlagStatus, string> = {
  open: 'waiting for the engineer’s answer',
  answered: 'waiting for the checker to close or reopen it',
  closed: 'resolved',
  waived: 'accepted as it is, with a reason',
};

const COLORS: Record<FlagStatus, string> = {
  open: 'orange',
  answered: 'blue',
  closed: 'green',
  waived: 'default',
};

export function FlagStatusTag({ status }: { status: FlagStatus }) {
  return <Tag color={COLORS[status]}>{FLAG_STATUS_LABELS[status]}</Tag>;
}

import { Typography } from 'antd';

const dateOnly = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' });

/** "18 Dec 2026" from a calendar date "2026-12-18" (read as UTC, as the server decides "overdue"). */
export function formatDueDate(date: string): string {
  const d = new Date(`${date}T00:00:00Z`);
  return Number.isNaN(d.getTime()) ? date : dateOnly.format(d);
}

/** A flag's due date; overdue ones say so in red. */
export function DueDate({ date, overdue }: { date: string | null; overdue: boolean }) {
  if (!date) return <Typography.Text type="secondary">—</Typography.Text>;
  return overdue ? (
    <Typography.Text type="danger">
      {formatDueDate(date)} (overdue)
    </Typography.Text>
  ) : (
    <>{formatDueDate(date)}</>
  );
}

/** Today as "YYYY-MM-DD" in UTC (the server's reading of "overdue"). */
export const todayUtc = () => new Date().toISOString().slice(0, 10);

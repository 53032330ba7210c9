import { Table, Tag, Typography } from 'antd';

/**
 * A problem of an upload as both the 422 `details` (ImportProblemDetail) and
 * a preview's or revision's report (ImportProblem) carry it.
 */
export interface ScheduleProblem {
  severity: 'error' | 'warning';
  code: string;
  sheet: string;
  row: number;
  column?: string | null;
  mark?: string;
  value: string | number | boolean | null;
  message: string;
}

const SEVERITY_ORDER = { error: 0, warning: 1 } as const;

function cellText(value: ScheduleProblem['value']): string {
  if (value === null || value === '') return '';
  return String(value);
}

/** Where each problem is (sheet, row, column), the cell as read and what to do; errors first. */
export function ProblemsTable({ problems, label }: { problems: ScheduleProblem[]; label: string }) {
  const rows = problems.map((p, i) => ({ ...p, key: i }));
  const hasErrors = problems.some((p) => p.severity === 'error');
  return (
    <Table
      aria-label={label}
      size="small"
      dataSource={rows}
      pagination={rows.length > 50 ? { pageSize: 50, showSizeChanger: true } : false}
      scroll={{ x: 960 }}
      locale={{ emptyText: 'No problems.' }}
      columns={[
        {
          title: 'Severity',
          dataIndex: 'severity',
          width: 110,
          filters: hasErrors
            ? [
                { text: 'Errors', value: 'error' },
                { text: 'Warnings', value: 'warning' },
              ]
            : undefined,
          onFilter: (value, p) => p.severity === value,
          sorter: (a, b) => SEVERITY_ORDER[a.severity] - SEVERITY_ORDER[b.severity],
          render: (_v, p) => (p.severity === 'error' ? <Tag color="red">Error</Tag> : <Tag color="gold">Warning</Tag>),
        },
        { title: 'Sheet', dataIndex: 'sheet', width: 100 },
        { title: 'Row', dataIndex: 'row', width: 70, align: 'right', sorter: (a, b) => a.row - b.row },
        {
          title: 'Column',
          dataIndex: 'column',
          width: 190,
          render: (_v, p) => p.column ?? <Typography.Text type="secondary">whole row</Typography.Text>,
        },
        { title: 'Mark', dataIndex: 'mark', width: 100, render: (_v, p) => p.mark ?? '' },
        {
          title: 'Value',
          dataIndex: 'value',
          width: 140,
          ellipsis: true,
          render: (_v, p) => (cellText(p.value) ? <Typography.Text code>{cellText(p.value)}</Typography.Text> : null),
        },
        { title: 'What is wrong and how to fix it', dataIndex: 'message' },
      ]}
    />
  );
}

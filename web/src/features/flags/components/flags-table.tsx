import { Link } from 'react-router-dom';
import { Table, Typography } from 'antd';
import type { SorterResult } from 'antd/es/table/interface';
import type { Flag, FlagPage, FlagSort } from '@sagline/common/api-types';
import { paths } from '@/app/paths';
import { formatDateTime } from '@/lib/format';
import { DueDate } from './due-date';
import { FLAG_PAGE_SIZES, withFlagFilters, type FlagsView } from './flag-query';
import { FlagStatusTag } from './flag-status-tag';

/** Columns the server sorts by (FLAG_SORTS), by column key. */
const SORTABLE: Record<string, 'created' | 'updated' | 'due' | 'mark' | 'status'> = {
  mark: 'mark',
  status: 'status',
  due: 'due',
  updated: 'updated',
  id: 'created',
};

/**
 * The flags of the view, one page, sorted and paged by the server. With
 * `selectedIds`, rows can be chosen (for bulk assign).
 */
export function FlagsTable({
  projectId,
  page,
  loading,
  view,
  onChange,
  selectedIds,
  onSelect,
}: {
  projectId: number;
  page: FlagPage | undefined;
  loading: boolean;
  view: FlagsView;
  onChange: (next: FlagsView) => void;
  selectedIds?: number[];
  onSelect?: (ids: number[]) => void;
}) {
  const sortField = view.sort.replace(/^-/, '');
  const sortOrder = view.sort.startsWith('-') ? ('descend' as const) : ('ascend' as const);
  const orderOf = (key: string) => (SORTABLE[key] === sortField ? sortOrder : null);

  return (
    <Table<Flag>
      aria-label="Flags"
      rowKey="id"
      size="small"
      loading={loading}
      dataSource={page?.items ?? []}
      scroll={{ x: 980 }}
      locale={{ emptyText: 'No flag matches these filters.' }}
      rowSelection={
        selectedIds && onSelect
          ? {
              selectedRowKeys: selectedIds,
              onChange: (keys) => onSelect(keys.map(Number)),
              getCheckboxProps: (f) => ({
                disabled: f.status === 'closed' || f.status === 'waived',
                'aria-label': `Select flag ${f.id} (${f.mark})`,
              }),
            }
          : undefined
      }
      pagination={{
        current: page?.page ?? view.page,
        pageSize: view.pageSize,
        total: page?.total ?? 0,
        showSizeChanger: true,
        pageSizeOptions: FLAG_PAGE_SIZES.map(String),
        showTotal: (total) => `${total} flag${total === 1 ? '' : 's'}`,
      }}
      onChange={(pagination, _filters, sorter, extra) => {
        if (extra.action === 'sort') {
          const s = (Array.isArray(sorter) ? sorter[0] : sorter) as SorterResult<Flag>;
          const field = SORTABLE[String(s.columnKey)];
          const sort: FlagSort = !s.order || !field ? '-updated' : ((s.order === 'descend' ? `-${field}` : field) as FlagSort);
          onChange(withFlagFilters(view, { sort }));
          return;
        }
        const pageSize = pagination.pageSize ?? view.pageSize;
        onChange({ ...view, page: pageSize !== view.pageSize ? 1 : (pagination.current ?? 1), pageSize });
      }}
      columns={[
        {
          key: 'id',
          title: '#',
          dataIndex: 'id',
          width: 70,
          sorter: true,
          sortOrder: orderOf('id'),
          render: (_v, f) => <Link to={paths.projectFlag.getHref(projectId, f.id)}>{f.id}</Link>,
        },
        {
          key: 'mark',
          title: 'Mark',
          dataIndex: 'mark',
          width: 110,
          sorter: true,
          sortOrder: orderOf('mark'),
          render: (_v, f) => <Link to={paths.projectMember.getHref(projectId, f.mark)}>{f.mark}</Link>,
        },
        {
          key: 'title',
          title: 'Flag',
          dataIndex: 'title',
          render: (_v, f) => (
            <>
              <Link to={paths.projectFlag.getHref(projectId, f.id)}>{f.title}</Link>
              {!f.member && (
                <Typography.Text type="warning" style={{ fontSize: 12 }}>
                  {' '}
                  (no longer in the schedule)
                </Typography.Text>
              )}
            </>
          ),
        },
        { key: 'check', title: 'Check', dataIndex: 'checkName', width: 130, render: (v: string | null) => v ?? <Typography.Text type="secondary">whole member</Typography.Text> },
        { key: 'level', title: 'Level', width: 80, render: (_v, f) => f.member?.level.name ?? '—' },
        {
          key: 'status',
          title: 'Status',
          dataIndex: 'status',
          width: 110,
          sorter: true,
          sortOrder: orderOf('status'),
          render: (_v, f) => <FlagStatusTag status={f.status} />,
        },
        {
          key: 'assignee',
          title: 'Assignee',
          width: 150,
          ellipsis: true,
          render: (_v, f) => f.assignee?.name ?? <Typography.Text type="secondary">nobody</Typography.Text>,
        },
        {
          key: 'due',
          title: 'Due',
          dataIndex: 'dueDate',
          width: 150,
          sorter: true,
          sortOrder: orderOf('due'),
          render: (_v, f) => <DueDate date={f.dueDate} overdue={f.overdue} />,
        },
        {
          key: 'updated',
          title: 'Updated',
          dataIndex: 'updatedAt',
          width: 160,
          sorter: true,
          sortOrder: orderOf('updated'),
          render: (v: string) => <Typography.Text type="secondary">{formatDateTime(v)}</Typography.Text>,
        },
      ]}
    />
  );
}

import { Link, useLocation } from 'react-router-dom';
import { memo, useMemo } from 'react';
import { Table, Tag } from 'antd';
import type { ColumnType, SortOrder, TableRowSelection } from 'antd/es/table/interface';
import type { MemberRow, MemberSort, MembersPage } from '@sagline/common/api-types';
import type { UnitSystemId } from '@sagline/common/units';
import { paths } from '@/app/paths';
import { Quantity } from '@/components/quantity';
import { UtilisationBar } from '@/components/utilisation-bar';
import { VerdictTag } from '@/components/verdict-tag';
import type { MemberColumnKey } from './member-columns';
import { categoryLabel, materialLabel, spansText, supportsLabel } from './member-labels';
import { PAGE_SIZES, type MembersView } from './member-query';

/** The list's sort fields by column (members.ts MEMBER_SORTS). */
const SORT_FIELD: Partial<Record<MemberColumnKey, string>> = {
  mark: 'mark',
  level: 'level',
  category: 'category',
  material: 'material',
  utilization: 'utilization',
  verdict: 'verdict',
  reviewer: 'reviewer',
};

/** Plain spans in cells: a page may hold 500 rows, and antd's Typography costs more per cell. */
const MUTED = { color: 'rgba(29, 39, 48, 0.45)' } as const;
const DASH = <span style={MUTED}>—</span>;

/** A mark opening its member page; the page's "back" link returns to this very view (filters, page). */
function MarkLink({ to, mark }: { to: string; mark: string }) {
  const { pathname, search } = useLocation();
  return (
    <Link to={to} state={{ from: pathname + search }} style={{ fontWeight: 600 }}>
      {mark}
    </Link>
  );
}

function sortOrderOf(sort: MemberSort, key: MemberColumnKey): SortOrder {
  const field = SORT_FIELD[key];
  if (!field) return null;
  if (sort === field) return 'ascend';
  if (sort === `-${field}`) return 'descend';
  return null;
}

/**
 * One page of members as the server sorted and paged it (nothing is filtered
 * or sorted here: a 10,000-member revision stays one page of rows). Sorting
 * and paging go back to the page as a new view, which puts it in the URL.
 */
export const MembersTable = memo(function MembersTable({
  projectId,
  page,
  loading,
  view,
  columns,
  unitSystem,
  onChange,
  selectedIds,
  onSelect,
}: {
  projectId: number;
  page: MembersPage | undefined;
  loading: boolean;
  view: MembersView;
  columns: MemberColumnKey[];
  unitSystem: UnitSystemId;
  onChange: (next: MembersView) => void;
  /** Ticks on the rows (managers assigning reviewers); without them the table has no checkboxes. */
  selectedIds?: number[];
  onSelect?: (ids: number[]) => void;
}) {
  const shown = useMemo(() => {
    const memberHref = (mark: string) => {
      const href = paths.projectMember.getHref(projectId, mark);
      return view.revision ? `${href}?revision=${view.revision}` : href;
    };
    const all: Record<MemberColumnKey, ColumnType<MemberRow>> = {
      mark: {
        title: 'Mark',
        dataIndex: 'mark',
        fixed: 'left',
        width: 100,
        render: (_v, m) => <MarkLink to={memberHref(m.mark)} mark={m.mark} />,
      },
      level: { title: 'Level', dataIndex: ['level', 'name'], width: 70, ellipsis: { showTitle: true } },
      grid: {
        title: 'Grid',
        dataIndex: 'grid',
        width: 95,
        ellipsis: { showTitle: true },
        render: (_v, m) => m.grid ?? DASH,
      },
      category: {
        title: 'Category',
        dataIndex: 'category',
        width: 140,
        ellipsis: { showTitle: true },
        render: (_v, m) => categoryLabel(m.category),
      },
      material: { title: 'Material', dataIndex: 'material', width: 130, ellipsis: { showTitle: true }, render: (_v, m) => materialLabel(m.material) },
      section: {
        title: 'Section',
        dataIndex: 'section',
        width: 120,
        ellipsis: { showTitle: true },
        render: (_v, m) => m.section ?? DASH,
      },
      supports: { title: 'Supports', dataIndex: 'supports', width: 160, ellipsis: { showTitle: true }, render: (_v, m) => supportsLabel(m.supports) },
      spans: { title: 'Spans', key: 'spans', width: 115, ellipsis: { showTitle: true }, render: (_v, m) => spansText(m, unitSystem) },
      length: {
        title: 'Length',
        dataIndex: 'length',
        width: 90,
        align: 'right',
        render: (_v, m) => <Quantity si={m.length} quantity="span" system={unitSystem} />,
      },
      governingCheck: {
        title: 'Governing check',
        dataIndex: 'governingCheck',
        width: 130,
        ellipsis: { showTitle: true },
        render: (_v, m) => m.governingCheck ?? DASH,
      },
      utilization: {
        title: 'Utilisation',
        dataIndex: 'maxUtilization',
        width: 140,
        sortDirections: ['descend', 'ascend'],
        render: (_v, m) => <UtilisationBar value={m.maxUtilization} width={80} />,
      },
      verdict: { title: 'Verdict', dataIndex: 'verdict', width: 90, render: (_v, m) => <VerdictTag verdict={m.verdict} /> },
      I: {
        title: 'I',
        dataIndex: 'I',
        width: 120,
        align: 'right',
        render: (_v, m) => <Quantity si={m.I} quantity="inertia" system={unitSystem} />,
      },
      requiredI: {
        title: 'I required',
        dataIndex: 'requiredI',
        width: 125,
        align: 'right',
        render: (_v, m) =>
          m.requiredI === null ? (
            DASH
          ) : (
            <Quantity
              si={m.requiredI}
              quantity="inertia"
              system={unitSystem}
              style={m.verdict === 'fail' ? { fontWeight: 600 } : { color: '#6b7a85' }}
            />
          ),
      },
      reviewer: {
        title: 'Reviewer',
        dataIndex: 'reviewer',
        width: 130,
        ellipsis: { showTitle: true },
        render: (_v, m) =>
          m.reviewer ? (
            m.reviewer.name
          ) : m.reviewerEmail ? (
            <span style={MUTED} title="Named in the schedule, not on the project's team">
              {m.reviewerEmail}
            </span>
          ) : (
            DASH
          ),
      },
      flags: {
        title: 'Open flags',
        dataIndex: 'openFlagCount',
        width: 90,
        align: 'right',
        render: (_v, m) => (m.openFlagCount > 0 ? <Tag color="warning">{m.openFlagCount}</Tag> : <span style={MUTED}>0</span>),
      },
    };

    return columns.map((key) => ({
      ...all[key],
      key,
      sorter: SORT_FIELD[key] ? true : undefined,
      sortOrder: SORT_FIELD[key] ? sortOrderOf(view.sort, key) : undefined,
      sortDirections: all[key].sortDirections ?? (SORT_FIELD[key] ? (['ascend', 'descend'] as SortOrder[]) : undefined),
      showSorterTooltip: false,
    }));
    // Only the sort and the revision shape the columns: a filter change keeps them, so rows on screen are not redrawn.
  }, [columns, view.sort, view.revision, unitSystem, projectId]);
  const width = shown.reduce((sum, c) => sum + (typeof c.width === 'number' ? c.width : 120), 0) + (onSelect ? 32 : 0);
  const rowSelection = useMemo<TableRowSelection<MemberRow> | undefined>(
    () =>
      selectedIds && onSelect
        ? {
            selectedRowKeys: selectedIds,
            onChange: (keys) => onSelect(keys.map(Number)),
            fixed: 'left',
            columnWidth: 32,
            getCheckboxProps: (m) => ({ 'aria-label': `Select ${m.mark}` }),
          }
        : undefined,
    [selectedIds, onSelect],
  );

  return (
    <Table<MemberRow>
      aria-label="Members"
      rowKey="id"
      size="small"
      loading={loading}
      dataSource={page?.items ?? []}
      columns={shown}
      rowSelection={rowSelection}
      scroll={{ x: width }}
      locale={{ emptyText: page?.revision === null ? 'No revision yet: upload the member schedule on the Imports screen.' : 'No member matches these filters.' }}
      onChange={(pagination, _filters, sorter, extra) => {
        if (extra.action === 'sort') {
          const s = Array.isArray(sorter) ? sorter[0] : sorter;
          const field = s?.order ? SORT_FIELD[s.columnKey as MemberColumnKey] : undefined;
          const sort = (field ? (s.order === 'descend' ? `-${field}` : field) : 'mark') as MemberSort;
          onChange({ ...view, sort, page: 1 });
        } else if (extra.action === 'paginate') {
          const pageSize = pagination.pageSize ?? view.pageSize;
          onChange({ ...view, pageSize, page: pageSize !== view.pageSize ? 1 : (pagination.current ?? 1) });
        }
      }}
      pagination={{
        current: view.page,
        pageSize: view.pageSize,
        total: page?.total ?? 0,
        showSizeChanger: true,
        pageSizeOptions: PAGE_SIZES.map(String),
        showTotal: (total, [from, to]) => `${from}–${to} of ${total.toLocaleString('en-GB')}`,
      }}
    />
  );
});

import { useCallback, useEffect, useMemo, useState } from 'react';
import { Link, useSearchParams } from 'react-router-dom';
import { Card, Flex, Segmented, Space, Typography } from 'antd';
import { AppstoreOutlined, TableOutlined } from '@ant-design/icons';
import { paths } from '@/app/paths';
import { LoadError } from '@/components/load-error';
import { RegionBoundary } from '@/components/region-boundary';
import { useCurrentProject } from '@/lib/current-project';
import { can } from '@/lib/roles';
import { useFlagSummary } from '../api/get-flag-summary';
import { useFlags } from '../api/get-flags';
import { BulkAssignButton } from '../components/bulk-assign-button';
import { flagsSearchParams, readFlagsView, toFlagListQuery, type FlagsView } from '../components/flag-query';
import { FlagsBoard } from '../components/flags-board';
import { FlagsFilters } from '../components/flags-filters';
import { FlagsTable } from '../components/flags-table';

/** Counts of the whole project by status, each a link to that status. */
function SummaryLine({ projectId }: { projectId: number }) {
  const { data } = useFlagSummary(projectId);
  if (!data) return null;
  const link = (query: Record<string, string>, text: string) => <Link to={paths.projectFlags.getHref(projectId, query)}>{text}</Link>;
  return (
    <Typography.Text type="secondary" aria-label="Flag counts">
      {data.total} flag{data.total === 1 ? '' : 's'}: {link({ status: 'open' }, `${data.byStatus.open} open`)},{' '}
      {link({ status: 'answered' }, `${data.byStatus.answered} answered`)}, {link({ status: 'closed' }, `${data.byStatus.closed} closed`)},{' '}
      {link({ status: 'waived' }, `${data.byStatus.waived} waived`)}
      {data.overdue > 0 && (
        <>
          {' · '}
          <Link to={paths.projectFlags.getHref(projectId, { overdue: 'true' })} style={{ color: '#cf1322' }}>
            {data.overdue} overdue
          </Link>
        </>
      )}
    </Typography.Text>
  );
}

/**
 * Flags (journeys 2 and 3): a table with filters (in the address, with the
 * API's names) and a board by status. Checkers and managers assign selected
 * flags in bulk.
 */
export function FlagsPage() {
  const project = useCurrentProject();
  const [params, setParams] = useSearchParams();
  const view = useMemo(() => readFlagsView(params), [params]);
  const query = useMemo(() => (view.board ? null : toFlagListQuery(view)), [view]);
  const flags = useFlags(project.id, query);
  const manages = can.manageFlags(project.myRole);
  const [selected, setSelected] = useState<number[]>([]);

  const onChange = useCallback((next: FlagsView) => setParams(flagsSearchParams(next)), [setParams]);
  // A new filter or page is a new list: what was selected may no longer be on it.
  const listKey = params.toString();
  useEffect(() => setSelected([]), [listKey]);

  return (
    <Flex vertical gap={16}>
      <Card
        size="small"
        title={
          <Space size={12} wrap>
            <span>Flags</span>
            <SummaryLine projectId={project.id} />
          </Space>
        }
        extra={
          <Segmented
            aria-label="View"
            value={view.board ? 'board' : 'table'}
            onChange={(v) => onChange({ ...view, board: v === 'board', page: 1 })}
            options={[
              { value: 'table', label: 'Table', icon: <TableOutlined /> },
              { value: 'board', label: 'Board by status', icon: <AppstoreOutlined /> },
            ]}
          />
        }
      >
        <Flex vertical gap={12}>
          <RegionBoundary region="the filters">
            <FlagsFilters projectId={project.id} levels={project.levels} view={view} onChange={onChange} />
          </RegionBoundary>
          {!view.board && manages && (
            <Flex gap={8} align="center" wrap>
              <BulkAssignButton projectId={project.id} flagIds={selected} onDone={() => setSelected([])} />
              <Typography.Text type="secondary" style={{ fontSize: 13 }}>
                Choose flags in the table to assign them to an engineer at once (closed and waived ones cannot be chosen).
              </Typography.Text>
            </Flex>
          )}
        </Flex>
      </Card>
      {view.board ? (
        <RegionBoundary region="the status board">
          <FlagsBoard projectId={project.id} view={view} />
        </RegionBoundary>
      ) : (
        <Card size="small" styles={{ body: { padding: 0 } }}>
          <RegionBoundary region="the flags table">
            {flags.error ? (
              <div style={{ padding: 16 }}>
                <LoadError error={flags.error} what="the flags" onRetry={() => void flags.mutate()} />
              </div>
            ) : (
              <FlagsTable
                projectId={project.id}
                page={flags.data}
                loading={flags.isLoading || flags.isValidating}
                view={view}
                onChange={onChange}
                selectedIds={manages ? selected : undefined}
                onSelect={manages ? setSelected : undefined}
              />
            )}
          </RegionBoundary>
        </Card>
      )}
    </Flex>
  );
}

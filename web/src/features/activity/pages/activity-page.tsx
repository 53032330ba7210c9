import { Card, Flex, Typography } from 'antd';
import { useSearchParams } from 'react-router-dom';
import { LoadError } from '@/components/load-error';
import { RegionBoundary } from '@/components/region-boundary';
import { FlagsWorkbookLink } from '@/features/exports/components/flags-workbook-link';
import { useCurrentProject } from '@/lib/current-project';
import { useActivity } from '../api/get-activity';
import { useActivityPeople } from '../api/get-activity-people';
import { ActivityFilters } from '../components/activity-filters';
import { ActivityTable } from '../components/activity-table';
import { activityViewQuery, DEFAULT_ACTIVITY_VIEW, isFiltered, readActivityView, type ActivityView } from '../components/activity-view';

/**
 * Who did what, when, in this project: imports, flag changes, reviewer
 * assignments, sign-offs, limit-set changes, team and settings. The filters
 * live in the address, so a view can be shared or bookmarked.
 */
export function ActivityPage() {
  const project = useCurrentProject();
  const [params, setParams] = useSearchParams();
  const view = readActivityView(params);
  const badRange = view.from !== '' && view.to !== '' && view.from > view.to;
  // An impossible day range is said on screen, not sent (the API would refuse it).
  const asked = badRange ? { ...view, to: '' } : view;
  const { data, error, isLoading, isValidating, mutate } = useActivity(project.id, asked);
  const { data: people } = useActivityPeople(project.id);

  const go = (next: ActivityView) => setParams(new URLSearchParams(activityViewQuery(next)));
  const change = (c: Partial<ActivityView>) => go({ ...view, ...c, page: 1 });
  const clear = () => go({ ...DEFAULT_ACTIVITY_VIEW, pageSize: view.pageSize });

  return (
    <Flex vertical gap={16}>
      <Card
        size="small"
        title="Activity"
        extra={
          <Flex gap={12} align="center">
            <Typography.Text type="secondary" style={{ fontSize: 13 }}>
              Every flag as a spreadsheet:
            </Typography.Text>
            <FlagsWorkbookLink projectId={project.id} size="small" />
          </Flex>
        }
      >
        <ActivityFilters view={view} people={people ?? []} onChange={change} onClear={clear} />
      </Card>
      <Card size="small" styles={{ body: { padding: 0 } }}>
        <RegionBoundary region="the activity list">
          {error ? (
            <div style={{ padding: 16 }}>
              <LoadError error={error} what="the activity" onRetry={() => void mutate()} />
            </div>
          ) : (
            <ActivityTable
              projectId={project.id}
              page={data}
              loading={isLoading || (isValidating && !data)}
              emptyText={isFiltered(view) ? 'No entry matches these filters.' : 'Nothing has happened in this project yet.'}
              onPage={(page, pageSize) => go({ ...view, page: pageSize !== view.pageSize ? 1 : page, pageSize })}
              onPerson={(actorId) => change({ actorId })}
            />
          )}
        </RegionBoundary>
      </Card>
    </Flex>
  );
}

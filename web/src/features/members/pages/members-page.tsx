import { useCallback, useEffect, useMemo, useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { Button, Card, Flex, Select, Space, Typography } from 'antd';
import { DownloadOutlined } from '@ant-design/icons';
import type { MembersPage as MembersPageData, RevisionSummary } from '@sagline/common/api-types';
import { CautionNote } from '@/components/caution-note';
import { LoadError } from '@/components/load-error';
import { RegionBoundary } from '@/components/region-boundary';
import { BulkRaiseButton } from '@/features/flags/components/bulk-raise-button';
import { AssignReviewerButton } from '@/features/overview/components/assign-reviewer-button';
import { useCurrentProject } from '@/lib/current-project';
import { formatDateTime } from '@/lib/format';
import { can } from '@/lib/roles';
import { useMemberFacets } from '../api/get-member-facets';
import { membersKey, useMembers } from '../api/get-members';
import { useRevisions } from '../api/get-revisions';
import { resultsWorkbookHref } from '../api/member-urls';
import { ColumnChooser } from '../components/column-chooser';
import { useMemberColumns } from '../components/member-columns';
import { hasFilters, membersSearchParams, readMembersView, toMemberListQuery, withFilters, type MembersView } from '../components/member-query';
import { MembersFilters } from '../components/members-filters';
import { MembersTable } from '../components/members-table';

/**
 * Journey 2: every member of a revision (the latest unless the address says
 * otherwise), filtered, sorted and paged by the server. The address holds the
 * whole view with the API's own parameter names, so a view can be shared and
 * other screens link straight to, say, the failing members of one level.
 */
export function MembersPage() {
  const project = useCurrentProject();
  const [params, setParams] = useSearchParams();
  const view = useMemo(() => readMembersView(params), [params]);
  const [columns, setColumns] = useMemberColumns();

  const members = useMembers(project.id, view);
  const facets = useMemberFacets(project.id, view.revision);
  const revisions = useRevisions(project.id);
  const latest = revisions.data?.[0];
  const isLatest = !view.revision || (latest !== undefined && String(latest.id) === view.revision);
  // How many of the filtered members fail: one counted row, for the bulk raise (checkers, latest revision).
  const mayRaise = can.raiseFlags(project.myRole) && isLatest;
  const failingView = useMemo<MembersView>(() => ({ ...view, verdict: ['fail'], sort: 'mark', page: 1, pageSize: 1 }), [view]);
  const failing = useMembers(project.id, mayRaise ? failingView : null);
  // Managers and admins select members of the page on screen and give them a reviewer of their own
  // (the API takes the latest revision's marks). As on the Flags screen, a new filter or page clears the selection.
  const mayAssign = (project.myRole === 'manager' || project.myRole === 'admin') && isLatest;
  const [selected, setSelected] = useState<number[]>([]);
  const listKey = membersKey(project.id, view);
  useEffect(() => setSelected([]), [listKey]);
  const clearSelected = useCallback(() => setSelected([]), []);

  const onChange = useCallback(
    (next: MembersView) => setParams(membersSearchParams(next), { replace: false }),
    [setParams],
  );

  const page = members.data;
  const shownRevision = page?.revision ?? facets.data?.revision ?? null;
  const failingCount = failing.data?.total;
  const selectedMarks = useMemo(() => {
    const ids = new Set(selected);
    return (page?.items ?? []).filter((m) => ids.has(m.id)).map((m) => m.mark);
  }, [selected, page]);

  return (
    <Flex vertical gap={16}>
      <Card
        size="small"
        title="Members"
        extra={
          <Space wrap>
            <RevisionSelect
              revisions={revisions.data}
              value={view.revision}
              onChange={(revision) => onChange(withFilters(view, { revision }))}
            />
            {shownRevision && (
              <Button
                icon={<DownloadOutlined />}
                href={resultsWorkbookHref(project.id, shownRevision.id)}
                download
                aria-label={`Results workbook of revision ${shownRevision.number}`}
              >
                Results workbook
              </Button>
            )}
            <ColumnChooser value={columns} onChange={setColumns} />
          </Space>
        }
      >
        <Flex vertical gap={12}>
          <RegionBoundary region="the filters">
            <MembersFilters view={view} facets={facets.data} onChange={onChange} />
          </RegionBoundary>
          <Flex justify="space-between" align="center" wrap gap={8}>
            <Summary page={page} facetsTotal={facets.data?.total} facetsFail={facets.data?.verdicts.fail} filtered={hasFilters(view)} />
            {mayRaise && failingCount !== undefined && page?.revision && (
              <BulkRaiseButton projectId={project.id} query={toMemberListQuery(view)} failingCount={failingCount} />
            )}
            {mayAssign && page?.revision && (
              <Space>
                {selectedMarks.length > 0 && (
                  <Button type="link" size="small" onClick={clearSelected}>
                    Clear selection
                  </Button>
                )}
                <AssignReviewerButton
                  projectId={project.id}
                  marks={selectedMarks}
                  label={assignLabel(selectedMarks.length)}
                  tooltip={
                    selectedMarks.length
                      ? `Give ${selectedMarks.length === 1 ? selectedMarks[0] : `these ${selectedMarks.length} members`} a reviewer of their own; it beats their level’s and the schedule’s.`
                      : 'Choose members in the table first (the box in the header chooses the whole page), then give them a reviewer of their own.'
                  }
                  onDone={clearSelected}
                />
              </Space>
            )}
          </Flex>
          <CautionNote />
        </Flex>
      </Card>

      <Card size="small" styles={{ body: { padding: 0 } }}>
        <RegionBoundary region="the members table">
          {members.error ? (
            <div style={{ padding: 16 }}>
              <LoadError error={members.error} what="the members" onRetry={() => void members.mutate()} />
            </div>
          ) : (
            <MembersTable
              projectId={project.id}
              page={page}
              loading={members.isLoading}
              view={view}
              columns={columns}
              unitSystem={project.unitSystem}
              onChange={onChange}
              selectedIds={mayAssign ? selected : undefined}
              onSelect={mayAssign ? setSelected : undefined}
            />
          )}
        </RegionBoundary>
      </Card>
    </Flex>
  );
}

/** "Assign reviewer to selected members" (none yet), "… to 1 selected member", "… to 3 selected members". */
const assignLabel = (n: number) =>
  n === 0 ? 'Assign reviewer to selected members' : `Assign reviewer to ${n} selected member${n === 1 ? '' : 's'}`;

function Summary({
  page,
  facetsTotal,
  facetsFail,
  filtered,
}: {
  page: MembersPageData | undefined;
  facetsTotal: number | undefined;
  facetsFail: number | undefined;
  filtered: boolean;
}) {
  if (!page) return <span />;
  if (!page.revision) {
    return <Typography.Text type="secondary">No revision yet: upload the member schedule on the Imports screen.</Typography.Text>;
  }
  const r = page.revision;
  const n = (v: number) => v.toLocaleString('en-GB');
  return (
    <Typography.Text aria-live="polite">
      <Typography.Text strong>
        Revision {r.number}
        {r.label ? `, “${r.label}”` : ''}
      </Typography.Text>
      <Typography.Text type="secondary"> of {formatDateTime(r.createdAt)}</Typography.Text>
      {facetsTotal !== undefined && (
        <>
          {' · '}
          {n(facetsTotal)} members, <Typography.Text type={facetsFail ? 'danger' : undefined}>{n(facetsFail ?? 0)} failing</Typography.Text>
        </>
      )}
      {filtered && (
        <>
          {' · '}
          <Typography.Text strong>{n(page.total)}</Typography.Text> match the filters
        </>
      )}
    </Typography.Text>
  );
}

/** Which revision the list shows: the latest (the default) or an earlier one. */
function RevisionSelect({
  revisions,
  value,
  onChange,
}: {
  revisions: RevisionSummary[] | undefined;
  value: string | null;
  onChange: (revision: string | null) => void;
}) {
  if (!revisions || revisions.length < 2) return null;
  const latestId = String(revisions[0].id);
  return (
    <Select<string>
      aria-label="Revision"
      style={{ width: 260 }}
      value={value ?? latestId}
      onChange={(v) => onChange(v === latestId ? null : v)}
      popupMatchSelectWidth={false}
      options={revisions.map((r, i) => ({
        value: String(r.id),
        label: `Revision ${r.number}${r.label ? `, ${r.label}` : ''}${i === 0 ? ' (current)' : ''}`,
      }))}
    />
  );
}

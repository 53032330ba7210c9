import { useMemo, useState, type ReactNode } from 'react';
import { Link, useLocation, useParams, useSearchParams } from 'react-router-dom';
import { Alert, Button, Card, Flex, Result, Select, Space, Typography } from 'antd';
import { ArrowLeftOutlined } from '@ant-design/icons';
import type { MemberDetail, MemberResultView } from '@sagline/common/api-types';
import { isApiError } from '@/app/api-error';
import { paths, safeReturnPath } from '@/app/paths';
import { CautionNote } from '@/components/caution-note';
import { LoadError } from '@/components/load-error';
import { MissingSupport } from '@/components/missing-support';
import { PageLoading } from '@/components/page-loading';
import { RegionBoundary } from '@/components/region-boundary';
import { UtilisationBar } from '@/components/utilisation-bar';
import { VerdictTag } from '@/components/verdict-tag';
import { MemberFlags } from '@/features/flags/components/member-flags';
import { useReviewerAssignments } from '@/features/overview/api/get-reviewer-assignments';
import { AssignReviewerButton } from '@/features/overview/components/assign-reviewer-button';
import { useCurrentProject } from '@/lib/current-project';
import { useMember } from '../api/get-member';
import { ChecksTable, governingResult, resultKey } from '../components/checks-table';
import { ContributionsTable } from '../components/contributions-table';
import { MemberDrawing } from '../components/member-drawing-card';
import { MemberFacts, reviewerSource } from '../components/member-facts';
import { MemberHistory } from '../components/member-history';
import { categoryLabel } from '../components/member-labels';
import { segmentName } from '../components/member-words';

/**
 * Journey 2: one member explained. The drawing to scale with its loads and
 * elastic curves; each check with its limit's source; each load's signed
 * share of the governing deflection, summed like a hand calculation; the
 * member's flags and its history across revisions.
 */
export function MemberPage() {
  const project = useCurrentProject();
  const { mark = '' } = useParams();
  const [params] = useSearchParams();
  const location = useLocation();
  const revisionParam = params.get('revision');
  const revision = revisionParam && /^[1-9]\d{0,9}$/.test(revisionParam) ? revisionParam : null;
  const { data, error, isLoading, mutate } = useMember(project.id, mark, revision);

  // Back to the list the member was opened from, filters and all.
  const from = (location.state as { from?: unknown } | null)?.from;
  const listHref = (typeof from === 'string' && safeReturnPath(from)) || paths.projectMembers.getHref(project.id);
  const back = (
    <Link to={listHref}>
      <ArrowLeftOutlined /> Members
    </Link>
  );

  if (isLoading) return <PageLoading label={`Opening ${mark}…`} />;
  if (error) {
    if (isApiError(error) && error.statusCode === 404) {
      return (
        <Card>
          <Result
            icon={<MissingSupport />}
            title={`${mark} not found`}
            subTitle={error.message}
            extra={
              <Link to={listHref}>
                <Button type="primary">Back to the members</Button>
              </Link>
            }
          />
        </Card>
      );
    }
    return (
      <Flex vertical gap={12}>
        {back}
        <LoadError error={error} what={mark} onRetry={() => void mutate()} />
      </Flex>
    );
  }
  if (!data) return null;
  return <MemberView key={`${data.revision.id}-${data.member.mark}`} detail={data} back={back} />;
}

function MemberView({ detail, back }: { detail: MemberDetail; back: ReactNode }) {
  const project = useCurrentProject();
  const m = detail.member;
  const governing = useMemo(() => governingResult(detail.results), [detail.results]);
  const [selectedKey, setSelectedKey] = useState<string | null>(governing ? resultKey(governing) : null);
  const selected = detail.results.find((r) => resultKey(r) === selectedKey) ?? governing;
  const checks = [...new Set(detail.results.map((r) => r.checkName))];
  const segments = detail.report.segments;
  const describe = (r: MemberResultView) =>
    `${r.checkName}, ${segmentName({ kind: r.segmentKind, from: r.segmentFrom }, r.segmentIndex, segments)}${
      governing && resultKey(r) === resultKey(governing) ? ' (governing)' : ''
    }`;
  const latest = detail.history.filter((h) => h.present).at(-1);
  // Managers and admins give the member a reviewer of its own (the latest revision's members only).
  const mayAssign = (project.myRole === 'manager' || project.myRole === 'admin') && detail.isLatest;
  // …and see where its reviewer comes from (its own assignment, its level's, the schedule).
  const assignments = useReviewerAssignments(project.id, mayAssign);

  return (
    <Flex vertical gap={16}>
      <Flex vertical gap={4}>
        {back}
        <Flex align="center" gap={12} wrap>
          <Typography.Title level={3} style={{ margin: 0 }}>
            {m.mark}
          </Typography.Title>
          <VerdictTag verdict={m.verdict} />
          <UtilisationBar value={m.maxUtilization} width={120} />
          <Typography.Text type="secondary">
            {m.level.name}
            {m.grid ? ` · grid ${m.grid}` : ''} · {categoryLabel(m.category)}
            {m.governingCheck ? ` · governed by ${m.governingCheck}` : ''}
          </Typography.Text>
        </Flex>
        <Typography.Text type="secondary">
          Revision {detail.revision.number}
          {detail.revision.label ? `, “${detail.revision.label}”` : ''}
          {detail.isLatest ? ' (current)' : ''}
        </Typography.Text>
      </Flex>

      {!detail.isLatest && (
        <Alert
          type="info"
          showIcon
          title={`This is ${m.mark} as it was in revision ${detail.revision.number}.`}
          description={
            latest && latest.revision.id !== detail.revision.id ? (
              <Link to={paths.projectMember.getHref(project.id, m.mark)}>Open it in the current revision</Link>
            ) : (
              `${m.mark} is not in the current revision.`
            )
          }
        />
      )}

      <Card
        size="small"
        title="Member"
        extra={
          mayAssign ? (
            <AssignReviewerButton
              projectId={project.id}
              marks={[m.mark]}
              size="small"
              tooltip={`Give ${m.mark} a reviewer of its own (it beats its level’s and the schedule’s), or let it follow theirs again.`}
            />
          ) : undefined
        }
      >
        <MemberFacts detail={detail} reviewerFrom={mayAssign ? reviewerSource(detail, assignments.data) : null} />
      </Card>

      <Card size="small" title="Drawing">
        <RegionBoundary region="the drawing">
          <MemberDrawing detail={detail} />
        </RegionBoundary>
      </Card>

      <Card size="small" title="Checks">
        <RegionBoundary region="the checks">
          <Flex vertical gap={8}>
            <ChecksTable detail={detail} selected={selected ? resultKey(selected) : null} onSelect={(r) => setSelectedKey(resultKey(r))} />
            <CautionNote />
          </Flex>
        </RegionBoundary>
      </Card>

      <Card
        size="small"
        title="Contributions at the governing point"
        extra={
          detail.results.length > 1 && selected ? (
            <Space>
              <Typography.Text type="secondary">Check</Typography.Text>
              <Select<string>
                aria-label="Contributions of"
                size="small"
                style={{ minWidth: 260 }}
                popupMatchSelectWidth={false}
                value={resultKey(selected)}
                onChange={setSelectedKey}
                options={detail.results.map((r) => ({ value: resultKey(r), label: describe(r) }))}
              />
            </Space>
          ) : undefined
        }
      >
        <RegionBoundary region="the contributions">
          {selected ? (
            <ContributionsTable detail={detail} result={selected} />
          ) : (
            <Typography.Text type="secondary">No check applies to this member, so there is no governing point.</Typography.Text>
          )}
        </RegionBoundary>
      </Card>

      <Card size="small" title="Flags">
        <section aria-label={`Flags of ${m.mark}`}>
          <RegionBoundary region="the flags">
            <MemberFlags projectId={project.id} mark={m.mark} checks={checks} />
          </RegionBoundary>
        </section>
      </Card>

      <Card size="small" title="History across revisions">
        <RegionBoundary region="the history">
          <MemberHistory projectId={project.id} mark={m.mark} history={detail.history} shownRevisionId={detail.revision.id} />
        </RegionBoundary>
      </Card>

    </Flex>
  );
}

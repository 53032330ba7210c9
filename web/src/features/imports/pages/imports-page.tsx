import { useCallback, useRef, useState } from 'react';
import { Alert, App, Card, Flex, Typography } from 'antd';
import type { ImportPreview, Me, Project, RevisionSummary } from '@sagline/common/api-types';
import { UNIT_SYSTEM_LABEL } from '@sagline/common/units/unit-systems';
import { errorMessage } from '@/app/api-error';
import { LoadError } from '@/components/load-error';
import { RegionBoundary } from '@/components/region-boundary';
import { useCurrentProject } from '@/lib/current-project';
import { useCurrentUser } from '@/lib/current-user';
import { discardImport } from '../api/discard-import';
import { useRevisions } from '../api/get-revisions';
import { uploadSchedule } from '../api/upload-schedule';
import { CommitPanel } from '../components/commit-panel';
import { DraftSummary } from '../components/draft-summary';
import { ImportDiff } from '../components/import-diff';
import { ProblemsTable } from '../components/problems-table';
import { RevisionDrawer } from '../components/revision-drawer';
import { RevisionsTable } from '../components/revisions-table';
import { ScheduleUpload, type UploadInProgress } from '../components/schedule-upload';
import { TemplateDownloads } from '../components/template-downloads';
import { UploadRejected } from '../components/upload-rejected';

/** Engineers and managers upload and commit (admins count as managers); everyone else reads revisions. */
const canUpload = (me: Me, myRole: Project['myRole']) =>
  me.isAdmin || myRole === 'admin' || myRole === 'manager' || myRole === 'engineer';

/** Where the upload stands: nothing yet, on its way, refused, a draft to review, or committed. */
type Stage =
  | { kind: 'idle' }
  | { kind: 'uploading'; upload: UploadInProgress }
  | { kind: 'rejected'; fileName: string; error: unknown }
  | { kind: 'preview'; preview: ImportPreview }
  | { kind: 'committed'; revision: RevisionSummary }
  | { kind: 'discarded'; fileName: string };

/** Journey 1: template, upload, validation report, diff against the current revision, commit; the revisions. */
export function ImportsPage() {
  const me = useCurrentUser();
  const project = useCurrentProject();
  const { message } = App.useApp();
  const uploads = canUpload(me, project.myRole);
  const revisions = useRevisions(project.id);
  const [stage, setStage] = useState<Stage>({ kind: 'idle' });
  const [discarding, setDiscarding] = useState(false);
  const [open, setOpen] = useState<RevisionSummary | null>(null);
  const abort = useRef<AbortController | null>(null);

  const onFile = async (file: File) => {
    // A draft still on screen is replaced: let the server drop it now rather than at its expiry.
    if (stage.kind === 'preview') void discardImport(project.id, stage.preview.draftId).catch(() => undefined);
    const controller = new AbortController();
    abort.current = controller;
    setStage({ kind: 'uploading', upload: { fileName: file.name, fileSize: file.size, startedAt: Date.now() } });
    try {
      const preview = await uploadSchedule(project.id, file, controller.signal);
      setStage({ kind: 'preview', preview });
    } catch (e) {
      if ((e as { name?: unknown }).name === 'AbortError') setStage({ kind: 'idle' });
      else setStage({ kind: 'rejected', fileName: file.name, error: e });
    } finally {
      if (abort.current === controller) abort.current = null;
    }
  };

  const onDiscard = async (draft: ImportPreview) => {
    setDiscarding(true);
    try {
      await discardImport(project.id, draft.draftId);
      setStage({ kind: 'discarded', fileName: draft.fileName });
    } catch (e) {
      void message.error(errorMessage(e));
    } finally {
      setDiscarding(false);
    }
  };

  const { mutate: refreshRevisions } = revisions;
  const onCommitted = useCallback(
    (revision: RevisionSummary) => {
      setStage({ kind: 'committed', revision });
      void refreshRevisions();
    },
    [refreshRevisions],
  );

  return (
    <Flex vertical gap={16}>
      {uploads ? (
        <Card title="New revision" size="small" extra={<TemplateDownloads projectId={project.id} />}>
          <RegionBoundary region="the upload">
            <Flex vertical gap={12}>
              <Typography.Text type="secondary">
                Start from the template ({UNIT_SYSTEM_LABEL[project.unitSystem]} units, as the project); any accepted unit
                may replace a header's unit.
              </Typography.Text>
              <ScheduleUpload
                uploading={stage.kind === 'uploading' ? stage.upload : null}
                onFile={(f) => void onFile(f)}
                onCancel={() => abort.current?.abort()}
              />
              {stage.kind === 'rejected' && <UploadRejected fileName={stage.fileName} error={stage.error} />}
              {stage.kind === 'committed' && (
                <Alert
                  type="success"
                  showIcon
                  closable={{ onClose: () => setStage({ kind: 'idle' }) }}
                  title={`Revision ${stage.revision.number} committed${stage.revision.label ? `: ${stage.revision.label}` : ''}.`}
                  description={`${stage.revision.memberCount} members, ${stage.revision.failCount} failing. It is now the current revision.`}
                />
              )}
              {stage.kind === 'discarded' && (
                <Alert
                  type="info"
                  showIcon
                  closable={{ onClose: () => setStage({ kind: 'idle' }) }}
                  title="The upload was discarded; no revision was made."
                  description={`${stage.fileName} is not stored. The current revision stays as it was.`}
                />
              )}
            </Flex>
          </RegionBoundary>
        </Card>
      ) : (
        <Card
          title="Schedule template"
          size="small"
          extra={
            <Typography.Text type="secondary" style={{ fontSize: 13 }}>
              Engineers and managers upload new revisions.
            </Typography.Text>
          }
        >
          <TemplateDownloads projectId={project.id} />
        </Card>
      )}

      {stage.kind === 'preview' && (
        <RegionBoundary region="the preview">
          <PreviewCards
            projectId={project.id}
            preview={stage.preview}
            discarding={discarding}
            onCommitted={onCommitted}
            onDiscard={() => void onDiscard(stage.preview)}
          />
        </RegionBoundary>
      )}

      <Card title="Revisions" size="small" styles={{ body: { padding: 0 } }}>
        <RegionBoundary region="the revisions">
          {revisions.error ? (
            <div style={{ padding: 16 }}>
              <LoadError error={revisions.error} what="the revisions" onRetry={() => void revisions.mutate()} />
            </div>
          ) : (
            <RevisionsTable
              projectId={project.id}
              revisions={revisions.data ?? []}
              loading={revisions.isLoading}
              onOpen={setOpen}
            />
          )}
        </RegionBoundary>
      </Card>
      <RevisionDrawer projectId={project.id} revision={open} onClose={() => setOpen(null)} />
    </Flex>
  );
}

function PreviewCards({
  projectId,
  preview,
  discarding,
  onCommitted,
  onDiscard,
}: {
  projectId: number | string;
  preview: ImportPreview;
  discarding: boolean;
  onCommitted: (revision: RevisionSummary) => void;
  onDiscard: () => void;
}) {
  const warnings = preview.problems.length;
  return (
    <Flex vertical gap={16}>
      <Card
        title={`Preview of ${preview.fileName}`}
        size="small"
        extra={<Typography.Text type="secondary">Every row passed the checks; nothing is stored until you commit.</Typography.Text>}
      >
        <DraftSummary preview={preview} />
      </Card>
      {warnings > 0 && (
        <Card title={`Warnings (${warnings})`} size="small">
          <Flex vertical gap={12}>
            <Typography.Text type="secondary">The schedule was read; check these before you commit.</Typography.Text>
            <ProblemsTable problems={preview.problems} label="Warnings of the upload" />
          </Flex>
        </Card>
      )}
      <Card title="What changes" size="small">
        <ImportDiff diff={preview.diff} />
      </Card>
      <Card title="Commit" size="small">
        <CommitPanel
          key={preview.draftId}
          projectId={projectId}
          preview={preview}
          discarding={discarding}
          onCommitted={onCommitted}
          onDiscard={onDiscard}
        />
      </Card>
    </Flex>
  );
}

import { useCallback, useState, type ReactNode } from 'react';
import { Alert, App, Button, Card, Collapse, Empty, Flex, Select, Space, Tag, Typography } from 'antd';
import type {
  LimitPresetView,
  LimitSetChangeResponse,
  LimitSetJobStatus,
  LimitSetResultsState,
  LimitSetsOverview,
  ProjectLimitSetView,
  UpdateLimitSetRequest,
} from '@sagline/common/api-types';
import type { UnitSystemId } from '@sagline/common/units';
import { Link } from 'react-router-dom';
import { errorMessage } from '@/app/api-error';
import { paths } from '@/app/paths';
import { CautionNote } from '@/components/caution-note';
import { JobProgress, type JobProgressWords } from '@/components/job-progress';
import { LoadError } from '@/components/load-error';
import { PageLoading } from '@/components/page-loading';
import { useCurrentProject } from '@/lib/current-project';
import { applyLimitSet } from '../api/apply-limit-set';
import { copyLimitSet } from '../api/copy-limit-set';
import { deleteLimitSet } from '../api/delete-limit-set';
import { useLimitSetJob } from '../api/get-limit-set-job';
import { useLimitSets } from '../api/get-limit-sets';
import { isLimitSetJob, updateLimitSet, type LimitSetChangeOutcome } from '../api/update-limit-set';
import { RulesEditor } from '../components/rules-editor';
import { RulesTable } from '../components/rules-table';

/** Flipped members named in the notice after a change; the Members screen lists them all. */
const FLIPS_SHOWN = 10;

const RECOMPUTE_JOB_WORDS: JobProgressWords = {
  what: 'the progress of the recompute',
  barLabel: 'Recompute progress',
  running: (step) => `Recomputing the results: ${step ?? 'starting'}…`,
  completed: 'Recomputed.',
  failedTitle: 'The change was not applied; nothing was stored',
  failedFallback: 'The background job failed. Try again.',
};

/** What the last change did, shown until dismissed. */
interface Done {
  title: string;
  description: ReactNode;
}

/**
 * The Limit sets screen: the set the project's verdicts follow, with every
 * rule's source; the project's other sets; the presets to browse. Managers
 * and admins copy a preset (or a set) into the project, edit its rules, and
 * choose the set in use, which recomputes the latest revision's verdicts
 * (after a confirmation; with a progress bar on a large project).
 */
export function LimitSetsPage() {
  const project = useCurrentProject();
  const { data, error, isLoading, mutate } = useLimitSets(project.id);
  const { message, modal } = App.useApp();
  const [editing, setEditing] = useState<number | null>(null);
  const [saving, setSaving] = useState(false);
  const [busySet, setBusySet] = useState<number | null>(null);
  const [jobId, setJobId] = useState<string | null>(null);
  const [done, setDone] = useState<Done | null>(null);
  const [presetId, setPresetId] = useState<string | null>(null);
  // A change of the set in use on a large project runs as a background job, polled about once a second.
  const runningJob = jobId ?? data?.openJob?.jobId ?? null;
  const recomputeJob = useLimitSetJob(project.id, runningJob);

  const confirm = (title: string, content: ReactNode, okText: string) =>
    new Promise<boolean>((resolve) => {
      modal.confirm({ title, content, okText, cancelText: 'Cancel', onOk: () => resolve(true), onCancel: () => resolve(false), width: 520 });
    });

  const afterChange = useCallback(
    (name: string, result: LimitSetChangeResponse) => {
      const r = result.recompute;
      const shown = r ? r.flipped.slice(0, FLIPS_SHOWN) : [];
      setDone({
        title: r ? `Revision ${r.revisionNumber} now follows "${name}".` : `"${name}" is saved.`,
        description: r ? (
          <Flex vertical gap={4}>
            <span>
              {r.memberCount} members recomputed: {r.before.fail} → {r.after.fail} failing, {r.flippedCount}{' '}
              {r.flippedCount === 1 ? 'verdict' : 'verdicts'} flipped
              {shown.length > 0 &&
                `: ${shown.map((f) => `${f.mark} ${f.from ?? 'unchecked'} → ${f.to ?? 'unchecked'}`).join(', ')}${r.flippedCount > shown.length ? ` and ${r.flippedCount - shown.length} more` : ''}`}
              .
            </span>
            {r.flagsNoted > 0 && (
              <span>
                {r.flagsNoted} {r.flagsNoted === 1 ? 'flag on a flipped member got a note' : 'flags on flipped members got a note'}; their assignees are
                e-mailed.
              </span>
            )}
            {r.signOffsVoided.length > 0 && (
              <span>
                Sign-off voided on {r.signOffsVoided.join(', ')}: {r.signOffsVoided.length === 1 ? 'that level needs' : 'those levels need'} signing off again.
              </span>
            )}
            <Link to={paths.projectMembers.getHref(project.id, { verdict: 'fail' })}>See the failing members</Link>
          </Flex>
        ) : result.set.active ? (
          'The project has no revision yet: the next upload is checked against it.'
        ) : (
          'It is not in use, so no verdict changed. Choose "Use this set" to check the project against it.'
        ),
      });
      void mutate();
    },
    [mutate, project.id],
  );

  const outcome = (name: string, o: LimitSetChangeOutcome) => {
    if (isLimitSetJob(o)) {
      setJobId(o.jobId);
      void mutate();
    } else afterChange(name, o);
  };

  const onJobDone = useCallback(
    ({ result }: LimitSetJobStatus) => {
      if (!result) return;
      setJobId(null);
      afterChange(result.set.name, result);
    },
    [afterChange],
  );
  const onJobFailed = useCallback(
    (job: LimitSetJobStatus) => {
      void message.error(job.error?.message ?? 'The change was not applied.');
      void mutate();
    },
    [message, mutate],
  );

  if (isLoading) return <PageLoading label="Loading the limit sets…" />;
  if (error || !data) return <LoadError error={error} what="the limit sets" onRetry={() => void mutate()} />;

  const active = data.projectSets.find((s) => s.active) ?? data.projectSets[0];
  const others = data.projectSets.filter((s) => !s.active);
  const preset = data.presets.find((p) => p.id === presetId) ?? data.presets[0];
  const system = project.unitSystem;

  const copy = async (body: { fromPreset?: string; fromSetId?: number }, what: string) => {
    try {
      const set = await copyLimitSet(project.id, body);
      setDone({ title: `Copied ${what} into the project as "${set.name}".`, description: 'It is not in use yet: edit its rules, then choose "Use this set".' });
      await mutate();
      setEditing(set.id);
    } catch (e) {
      void message.error(errorMessage(e));
    }
  };

  const recomputeNote = (results: LimitSetResultsState | null) =>
    results
      ? `The verdicts of revision ${results.revisionNumber} (${results.memberCount} members) will be recomputed under its rules. Every screen then shows the new verdicts; earlier revisions keep theirs.`
      : 'The project has no revision yet, so no verdict changes now; the next upload is checked against it.';

  const save = async (set: ProjectLimitSetView, body: UpdateLimitSetRequest) => {
    if (set.active && !(await confirm(`Save and recompute "${body.name}"?`, recomputeNote(data.results), 'Save and recompute'))) return;
    setSaving(true);
    try {
      const o = await updateLimitSet(project.id, set.id, body);
      setEditing(null);
      outcome(body.name, o);
    } finally {
      setSaving(false);
    }
  };

  const use = async (set: ProjectLimitSetView) => {
    if (!(await confirm(`Use "${set.name}" for this project?`, recomputeNote(data.results), 'Use this set and recompute'))) return;
    setBusySet(set.id);
    try {
      outcome(set.name, await applyLimitSet(project.id, set.id, { version: set.version }));
    } catch (e) {
      void message.error(errorMessage(e));
    } finally {
      setBusySet(null);
    }
  };

  const remove = async (set: ProjectLimitSetView) => {
    const sure = await confirm(
      `Delete "${set.name}"?`,
      'The project does not use it, so no verdict changes. Revisions checked against it keep their own copy of its rules.',
      'Delete the set',
    );
    if (!sure) return;
    setBusySet(set.id);
    try {
      await deleteLimitSet(project.id, set.id);
      setDone({ title: `Deleted "${set.name}".`, description: 'No verdict changed.' });
      await mutate();
    } catch (e) {
      void message.error(errorMessage(e));
    } finally {
      setBusySet(null);
    }
  };

  const body = (set: ProjectLimitSetView) =>
    editing === set.id ? (
      <RulesEditor key={`${set.id}-${set.version}`} set={set} system={system} saving={saving} onSave={(b) => save(set, b)} onCancel={() => setEditing(null)} />
    ) : (
      <SetBody set={set} system={system} />
    );

  const setActions = (set: ProjectLimitSetView) =>
    data.canEdit && editing !== set.id ? (
      <Space wrap onClick={(e) => e.stopPropagation()}>
        {!set.active && (
          <Button type="primary" size="small" loading={busySet === set.id} disabled={runningJob !== null} onClick={() => void use(set)}>
            Use this set
          </Button>
        )}
        <Button size="small" disabled={set.active && runningJob !== null} onClick={() => setEditing(set.id)}>
          Edit rules
        </Button>
        <Button size="small" onClick={() => void copy({ fromSetId: set.id }, `"${set.name}"`)}>
          Copy
        </Button>
        {!set.active && (
          <Button size="small" danger disabled={busySet === set.id || runningJob !== null} onClick={() => void remove(set)}>
            Delete
          </Button>
        )}
      </Space>
    ) : null;

  return (
    <Flex vertical gap={16}>
      <Alert
        type="info"
        showIcon
        title="Every verdict traces to a published limit"
        description={
          <Flex vertical gap={4}>
            <span>Each rule names its source: document, edition, and table or clause, with how far it was checked. The adopted code edition and local amendments govern.</span>
            <CautionNote />
          </Flex>
        }
      />
      {done && <Alert type="success" showIcon closable={{ onClose: () => setDone(null) }} title={done.title} description={done.description} />}
      {runningJob && (
        <Card size="small">
          <JobProgress
            poll={recomputeJob}
            words={RECOMPUTE_JOB_WORDS}
            onCompleted={onJobDone}
            onFailed={onJobFailed}
            note={
              <Typography.Text type="secondary" style={{ fontSize: 12 }}>
                The verdicts on every screen change all at once when it completes; until then they follow the set as it was.
              </Typography.Text>
            }
          />
        </Card>
      )}

      <Card
        title={
          <Space wrap>
            <span>In use: {active.name}</span>
            <Tag color="blue">version {active.version}</Tag>
          </Space>
        }
        extra={setActions(active)}
      >
        <Flex vertical gap={12}>
          <ResultsState results={data.results} active={active} />
          {!data.canEdit && (
            <Typography.Text type="secondary">Managers and admins copy, edit, choose and delete limit sets; you can read them and their sources.</Typography.Text>
          )}
          {body(active)}
        </Flex>
      </Card>

      <Card title="The project's other sets" size="small">
        {others.length === 0 ? (
          <Empty image={Empty.PRESENTED_IMAGE_SIMPLE} description={data.canEdit ? 'None yet. Copy a preset below to make one.' : 'None.'} />
        ) : (
          <Collapse
            activeKey={editing !== null && others.some((s) => s.id === editing) ? [String(editing)] : undefined}
            items={others.map((s) => ({
              key: String(s.id),
              label: (
                <Space wrap>
                  <Typography.Text strong>{s.name}</Typography.Text>
                  <Typography.Text type="secondary">
                    version {s.version}
                    {s.sourcePresetId ? `, from the preset ${s.sourcePresetId}` : ''}, {s.rules.length} rules
                  </Typography.Text>
                </Space>
              ),
              extra: setActions(s),
              children: body(s),
            }))}
          />
        )}
      </Card>

      <Card
        title="Presets"
        size="small"
        extra={
          <Space wrap>
            <Select
              aria-label="Preset"
              value={preset.id}
              style={{ minWidth: 320 }}
              options={data.presets.map((p) => ({ value: p.id, label: p.name }))}
              onChange={setPresetId}
            />
            {data.canEdit && (
              <Button type="primary" onClick={() => void copy({ fromPreset: preset.id }, `the preset "${preset.name}"`)}>
                Copy into project
              </Button>
            )}
          </Space>
        }
      >
        <PresetBody preset={preset} system={system} />
      </Card>
      <CautionNote />
    </Flex>
  );
}

function ResultsState({ results, active }: { results: LimitSetsOverview['results']; active: ProjectLimitSetView }) {
  if (!results) return <Typography.Text type="secondary">No revision yet: the first upload is checked against this set.</Typography.Text>;
  const line = `Revision ${results.revisionNumber}: ${results.memberCount} members, ${results.passCount} passing, ${results.failCount} failing, computed with "${results.limitSetName}".`;
  return (
    <Space wrap>
      <Typography.Text>{line}</Typography.Text>
      {results.upToDate && results.limitSetId === active.id ? (
        <Tag color="green">verdicts follow this set</Tag>
      ) : (
        <Tag color="orange">verdicts not yet recomputed under this set</Tag>
      )}
    </Space>
  );
}

function SetBody({ set, system }: { set: ProjectLimitSetView; system: UnitSystemId }) {
  return (
    <Flex vertical gap={8}>
      {set.description && <Typography.Paragraph type="secondary" style={{ margin: 0 }}>{set.description}</Typography.Paragraph>}
      <RulesTable rules={set.rules} categories={set.categories} system={system} label={`Rules of ${set.name}`} />
      <Notes notes={set.notes} />
    </Flex>
  );
}

function PresetBody({ preset, system }: { preset: LimitPresetView; system: UnitSystemId }) {
  return (
    <Flex vertical gap={8}>
      <Typography.Paragraph type="secondary" style={{ margin: 0 }}>{preset.description}</Typography.Paragraph>
      <RulesTable rules={preset.rules} categories={preset.categories} system={system} label={`Rules of the preset ${preset.name}`} />
      <Notes notes={preset.notes} />
    </Flex>
  );
}

function Notes({ notes }: { notes: { text: string; sourceText: string }[] }) {
  if (notes.length === 0) return null;
  return (
    <Flex vertical gap={4}>
      <Typography.Text strong>Notes of the set</Typography.Text>
      <ul style={{ margin: 0, paddingInlineStart: 18 }}>
        {notes.map((n) => (
          <li key={n.text}>
            <Typography.Text>{n.text}</Typography.Text> <Typography.Text type="secondary">({n.sourceText})</Typography.Text>
          </li>
        ))}
      </ul>
    </Flex>
  );
}

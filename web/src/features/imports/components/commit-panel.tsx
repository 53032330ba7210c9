import { useCallback, useState } from 'react';
import { Alert, Button, Flex, Form, Input, Popconfirm, Typography } from 'antd';
import { IMPORT_LIMITS, type ImportJobStatus, type ImportPreview, type RevisionSummary } from '@sagline/common/api-types';
import { errorMessage, isApiError } from '@/app/api-error';
import { JobProgress, type JobProgressWords } from '@/components/job-progress';
import { formatDateTime } from '@/lib/format';
import { isJobAccepted, useCommitImport } from '../api/commit-import';
import { useImportJob } from '../api/get-import-job';

interface CommitValues {
  label?: string;
}

const COMMIT_JOB_WORDS: JobProgressWords = {
  what: 'the progress of the commit',
  barLabel: 'Commit progress',
  running: (step) => step ?? 'Committing…',
  completed: 'Committed.',
  failedTitle: 'The commit did not finish; nothing was stored',
  failedFallback: 'The background job failed. Upload the schedule again.',
};

/**
 * Commit the draft as the next revision (with an optional label) or discard
 * it. A large draft commits as a background job: its progress shows here.
 */
export function CommitPanel({
  projectId,
  preview,
  onCommitted,
  onDiscard,
  discarding,
}: {
  projectId: number | string;
  preview: ImportPreview;
  onCommitted: (revision: RevisionSummary) => void;
  onDiscard: () => void;
  discarding: boolean;
}) {
  const [form] = Form.useForm<CommitValues>();
  const { trigger, isMutating } = useCommitImport(projectId);
  const [jobId, setJobId] = useState<string | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const next = (preview.diff.against?.number ?? 0) + 1;
  // A background commit (202): polled about once a second until it completes or fails.
  const commitJob = useImportJob(projectId, jobId);
  const jobCompleted = useCallback(
    (done: ImportJobStatus) => {
      if (done.result?.revision) onCommitted(done.result.revision);
    },
    [onCommitted],
  );

  const commit = async (values: CommitValues) => {
    setProblem(null);
    try {
      const outcome = await trigger({ draftId: preview.draftId, label: values.label?.trim() || undefined });
      if (isJobAccepted(outcome)) setJobId(outcome.jobId);
      else onCommitted(outcome.revision);
    } catch (e) {
      // 404: the draft expired or was committed elsewhere; 409: the limit set changed. Both: upload again.
      setProblem(
        isApiError(e) && (e.statusCode === 404 || e.statusCode === 409)
          ? `${e.message} Upload the file again to get a fresh preview.`
          : errorMessage(e),
      );
    }
  };

  if (jobId) {
    return (
      <JobProgress
        poll={commitJob}
        words={COMMIT_JOB_WORDS}
        onCompleted={jobCompleted}
        note={
          commitJob.data && commitJob.data.attempts > 1 && (
            <Typography.Text type="secondary">Started again after an interruption (attempt {commitJob.data.attempts}).</Typography.Text>
          )
        }
      />
    );
  }

  return (
    <Form
      form={form}
      layout="vertical"
      requiredMark={false}
      onFinish={commit}
      disabled={isMutating || discarding}
      aria-label="Commit the draft"
    >
      <Form.Item
        label="Revision label (optional)"
        name="label"
        rules={[{ max: IMPORT_LIMITS.labelMax, message: `A label has at most ${IMPORT_LIMITS.labelMax} characters.` }]}
        style={{ marginBottom: 12, maxWidth: 560 }}
      >
        <Input placeholder="e.g. Rev C, issued for permit" maxLength={IMPORT_LIMITS.labelMax} showCount />
      </Form.Item>
      <Flex gap={8} wrap align="center">
        <Button type="primary" htmlType="submit" loading={isMutating}>
          Commit as revision {next}
        </Button>
        <Popconfirm
          title="Discard this upload?"
          description="The draft is thrown away; no revision is made."
          okText="Discard"
          okButtonProps={{ danger: true }}
          onConfirm={onDiscard}
        >
          <Button loading={discarding}>Discard</Button>
        </Popconfirm>
        <Typography.Text type="secondary">
          Not a revision yet. The draft waits until {formatDateTime(preview.expiresAt)}.
        </Typography.Text>
      </Flex>
      {problem && <Alert style={{ marginTop: 12 }} type="error" showIcon title={problem} />}
    </Form>
  );
}

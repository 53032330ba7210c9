import { useEffect } from 'react';
import { Alert, Flex, Progress, Typography } from 'antd';
import type { RevisionSummary } from '@sagline/common/api-types';
import { LoadError } from '@/components/load-error';
import { isJobFinished, useImportJob } from '../api/get-import-job';

/**
 * A background commit (202): polls the job about once a second and shows its
 * progress until it completes (then `onDone` with the new revision) or fails.
 */
export function JobProgress({
  projectId,
  jobId,
  onDone,
}: {
  projectId: number | string;
  jobId: string;
  onDone: (revision: RevisionSummary) => void;
}) {
  const { data: job, error, mutate } = useImportJob(projectId, jobId);
  const revision = job?.state === 'completed' ? job.result?.revision : undefined;

  useEffect(() => {
    if (revision) onDone(revision);
  }, [revision, onDone]);

  if (error && !job) return <LoadError error={error} what="the progress of the commit" onRetry={() => void mutate()} />;
  if (job?.state === 'failed') {
    return (
      <Alert
        type="error"
        showIcon
        title="The commit did not finish; nothing was stored"
        description={job.error?.message ?? 'The background job failed. Upload the schedule again.'}
      />
    );
  }
  const percent = Math.round((job?.progress ?? 0) * 100);
  return (
    <Flex vertical gap={4} role="status" aria-live="polite">
      <Typography.Text>
        {isJobFinished(job) ? 'Committed.' : job?.state === 'queued' ? 'Waiting for its turn…' : (job?.step ?? 'Committing…')}
      </Typography.Text>
      <Progress
        percent={percent}
        status={job?.state === 'completed' ? 'success' : 'active'}
        aria-label="Commit progress"
      />
      {job && job.attempts > 1 && (
        <Typography.Text type="secondary">Started again after an interruption (attempt {job.attempts}).</Typography.Text>
      )}
    </Flex>
  );
}

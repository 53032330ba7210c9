import { useEffect } from 'react';
import { Alert, Flex, Progress, Typography } from 'antd';
import type { LimitSetChangeResponse, LimitSetJobStatus } from '@sagline/common/api-types';
import { LoadError } from '@/components/load-error';
import { isLimitSetJobFinished, useLimitSetJob } from '../api/get-limit-set-job';

/**
 * A change of the set in use on a large project runs as a background job:
 * polls it about once a second and shows its progress until it completes
 * (then `onDone` with the change) or fails (nothing of it was stored).
 */
export function RecomputeProgress({
  projectId,
  jobId,
  onDone,
  onFailed,
}: {
  projectId: number | string;
  jobId: string;
  onDone: (result: LimitSetChangeResponse) => void;
  onFailed: (job: LimitSetJobStatus) => void;
}) {
  const { data: job, error, mutate } = useLimitSetJob(projectId, jobId);
  const result = job?.state === 'completed' ? job.result : undefined;
  const failed = job?.state === 'failed' ? job : undefined;

  useEffect(() => {
    if (result) onDone(result);
  }, [result, onDone]);
  useEffect(() => {
    if (failed) onFailed(failed);
  }, [failed, onFailed]);

  if (error && !job) return <LoadError error={error} what="the progress of the recompute" onRetry={() => void mutate()} />;
  if (failed) {
    return (
      <Alert
        type="error"
        showIcon
        title="The change was not applied; nothing was stored"
        description={failed.error?.message ?? 'The background job failed. Try again.'}
      />
    );
  }
  const percent = Math.round((job?.progress ?? 0) * 100);
  return (
    <Flex vertical gap={4} role="status" aria-live="polite">
      <Typography.Text>
        {isLimitSetJobFinished(job) ? 'Recomputed.' : job?.state === 'queued' ? 'Waiting for its turn…' : `Recomputing the results: ${job?.step ?? 'starting'}…`}
      </Typography.Text>
      <Progress percent={percent} status={job?.state === 'completed' ? 'success' : 'active'} aria-label="Recompute progress" />
      <Typography.Text type="secondary" style={{ fontSize: 12 }}>
        The verdicts on every screen change all at once when it completes; until then they follow the set as it was.
      </Typography.Text>
    </Flex>
  );
}

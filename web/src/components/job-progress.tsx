import { useEffect, type ReactNode } from 'react';
import { Alert, Flex, Progress, Typography } from 'antd';
import { LoadError } from '@/components/load-error';

/** What every background job's status says (import commit, limit-set recompute…). */
export interface BackgroundJob {
  state: 'queued' | 'running' | 'completed' | 'failed';
  /** 0..1 */
  progress: number;
  /** What the work is doing now, for a person. */
  step: string | null;
  error?: { message: string };
}

/** The caller's poll of the job's status (an SWR response). */
export interface JobPoll<J extends BackgroundJob> {
  data?: J;
  /** Shown only while there is no status yet. */
  error?: unknown;
  /** Polls again now (the "Try again" of a failed load). */
  mutate: () => unknown;
}

/** The words one kind of job is shown with. */
export interface JobProgressWords {
  /** Completes "Could not load …" when the status cannot be fetched. */
  what: string;
  /** The progress bar's accessible name. */
  barLabel: string;
  /** Said while it runs (or before its first status arrives), from its current step. */
  running: (step: string | null | undefined) => ReactNode;
  /** Said once it has completed. */
  completed: ReactNode;
  /** The error's title when it failed. */
  failedTitle: string;
  /** The error's text when the failed job did not say why. */
  failedFallback: string;
}

/**
 * The progress of a background job the caller polls (about once a second):
 * "Waiting for its turn…" while queued, its step and a percent bar while it
 * runs, its words and a full bar once completed, an error with the job's own
 * message when it failed. `onCompleted` / `onFailed` run once when it gets
 * there (pass stable callbacks). `note` goes under the bar.
 */
export function JobProgress<J extends BackgroundJob>({
  poll: { data: job, error, mutate },
  words,
  note,
  onCompleted,
  onFailed,
}: {
  poll: JobPoll<J>;
  words: JobProgressWords;
  note?: ReactNode;
  onCompleted?: (job: J) => void;
  onFailed?: (job: J) => void;
}) {
  const completed = job?.state === 'completed' ? job : undefined;
  const failed = job?.state === 'failed' ? job : undefined;

  useEffect(() => {
    if (completed) onCompleted?.(completed);
  }, [completed, onCompleted]);
  useEffect(() => {
    if (failed) onFailed?.(failed);
  }, [failed, onFailed]);

  if (error && !job) return <LoadError error={error} what={words.what} onRetry={() => void mutate()} />;
  if (failed) {
    return <Alert type="error" showIcon title={words.failedTitle} description={failed.error?.message ?? words.failedFallback} />;
  }
  const percent = Math.round((job?.progress ?? 0) * 100);
  return (
    <Flex vertical gap={4} role="status" aria-live="polite">
      <Typography.Text>{completed ? words.completed : job?.state === 'queued' ? 'Waiting for its turn…' : words.running(job?.step)}</Typography.Text>
      <Progress percent={percent} status={completed ? 'success' : 'active'} aria-label={words.barLabel} />
      {note}
    </Flex>
  );
}

import { render, screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { ApiError } from '@/app/api-error';
import { JobProgress, type BackgroundJob, type JobProgressWords } from './job-progress';

const words: JobProgressWords = {
  what: 'the progress of the export',
  barLabel: 'Export progress',
  running: (step) => `Exporting: ${step ?? 'starting'}…`,
  completed: 'Exported.',
  failedTitle: 'The export did not finish',
  failedFallback: 'The background job failed. Try again.',
};

type Job = BackgroundJob & { id: string };
const job = (over: Partial<Job> = {}): Job => ({ id: 'job-1', state: 'running', progress: 0.4, step: 'Writing rows', ...over });

/** The component with the poll's answer so far (`job`, `error`) and spies for what it calls. */
function show({ job, error, note }: { job?: Job; error?: unknown; note?: React.ReactNode } = {}) {
  const mutate = jest.fn();
  const onCompleted = jest.fn();
  const onFailed = jest.fn();
  const ui = () => <JobProgress<Job> poll={{ data: job, error, mutate }} words={words} note={note} onCompleted={onCompleted} onFailed={onFailed} />;
  const view = render(ui());
  return { ...view, rerenderSame: () => view.rerender(ui()), mutate, onCompleted, onFailed };
}

describe('JobProgress', () => {
  it('says a queued job waits for its turn, with an empty bar', () => {
    const { onCompleted, onFailed } = show({ job: job({ state: 'queued', progress: 0, step: null }) });
    expect(screen.getByRole('status')).toHaveTextContent('Waiting for its turn…');
    expect(screen.getByRole('progressbar', { name: 'Export progress' })).toHaveAttribute('aria-valuenow', '0');
    expect(onCompleted).not.toHaveBeenCalled();
    expect(onFailed).not.toHaveBeenCalled();
  });

  it('shows a running job with its step and the percent done, and the note under the bar', () => {
    show({ job: job({ progress: 0.426 }), note: <span>Verdicts change all at once.</span> });
    expect(screen.getByText('Exporting: Writing rows…')).toBeInTheDocument();
    expect(screen.getByRole('progressbar', { name: 'Export progress' })).toHaveAttribute('aria-valuenow', '43');
    expect(screen.getByText('43%')).toBeInTheDocument();
    expect(screen.getByText('Verdicts change all at once.')).toBeInTheDocument();
  });

  it('shows the running words at 0% before the first status arrives', () => {
    show({ job: undefined });
    expect(screen.getByText('Exporting: starting…')).toBeInTheDocument();
    expect(screen.getByRole('progressbar', { name: 'Export progress' })).toHaveAttribute('aria-valuenow', '0');
  });

  it('says a completed job is done with a full bar and tells the caller once', () => {
    const done = job({ state: 'completed', progress: 1, step: null });
    const { onCompleted, onFailed, rerenderSame } = show({ job: done });
    expect(screen.getByRole('status')).toHaveTextContent('Exported.');
    expect(screen.getByRole('progressbar', { name: 'Export progress' })).toHaveAttribute('aria-valuenow', '100');
    expect(onCompleted).toHaveBeenCalledTimes(1);
    expect(onCompleted).toHaveBeenCalledWith(done);
    rerenderSame();
    expect(onCompleted).toHaveBeenCalledTimes(1);
    expect(onFailed).not.toHaveBeenCalled();
  });

  it("shows a failed job's own message, no bar, and tells the caller", () => {
    const failed = job({ state: 'failed', error: { message: 'Member B12 has no span.' } });
    const { onCompleted, onFailed } = show({ job: failed });
    const alert = screen.getByRole('alert');
    expect(alert).toHaveTextContent('The export did not finish');
    expect(alert).toHaveTextContent('Member B12 has no span.');
    expect(screen.queryByRole('progressbar')).not.toBeInTheDocument();
    expect(onFailed).toHaveBeenCalledWith(failed);
    expect(onCompleted).not.toHaveBeenCalled();
  });

  it('says the job failed in general words when it gave no message', () => {
    show({ job: job({ state: 'failed' }) });
    expect(screen.getByRole('alert')).toHaveTextContent('The background job failed. Try again.');
  });

  it('says the status could not be loaded and polls again on Try again', async () => {
    const { mutate } = show({ error: new ApiError({ statusCode: 500, error: 'Internal Server Error', code: 'INTERNAL', message: 'The server could not answer.' }) });
    expect(screen.getByText('Could not load the progress of the export')).toBeInTheDocument();
    expect(screen.getByText('The server could not answer.')).toBeInTheDocument();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Try again' }));
    expect(mutate).toHaveBeenCalledTimes(1);
  });

  it('keeps showing the last status when a later poll fails', () => {
    show({ job: job(), error: new Error('network') });
    expect(screen.getByText('Exporting: Writing rows…')).toBeInTheDocument();
    expect(screen.queryByText('Could not load the progress of the export')).not.toBeInTheDocument();
  });
});

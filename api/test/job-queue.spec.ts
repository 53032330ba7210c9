import type { AppConfig } from '../src/config/app-config';
import { JobQueue } from '../src/jobs/job-queue';
import type { JobSettings } from '../src/jobs/job-settings';

/**
 * The worker keeps trying to start while the database is not reachable (the api must come up
 * anyway), but once the app shuts down it must stop trying: a later attempt would open
 * connections from a process that is going away (and, in tests, after the test has ended).
 */
describe('the job queue after a failed start', () => {
  const config = { databaseUrl: 'postgres://nobody@127.0.0.1:1/nothing' } as AppConfig;
  const settings = { worker: true, pollSeconds: 1, maintenanceSeconds: 60 } as unknown as JobSettings;

  it('schedules another attempt, and makes none once shut down', async () => {
    const queue = new JobQueue(config, settings);
    (queue as unknown as { logger: { error(): void } }).logger = { error: () => undefined };
    const timers = jest.spyOn(global, 'setTimeout');
    const attempts = jest.spyOn(queue as unknown as { startWorker(): Promise<void> }, 'startWorker');
    try {
      await queue.onApplicationBootstrap();
      // The first attempt fails (nothing listens on port 1) and schedules the next in 10 s.
      let retry: (() => void) | undefined;
      for (let i = 0; i < 200 && !retry; i++) {
        retry = timers.mock.calls.find(([, ms]) => ms === 10_000)?.[0] as (() => void) | undefined;
        if (!retry) await new Promise((r) => setImmediate(r));
        if (!retry) await new Promise((r) => setTimeout(r, 25));
      }
      expect(retry).toBeDefined();
      expect(attempts).toHaveBeenCalledTimes(1);

      await queue.onApplicationShutdown();
      // The timer, had it not been cleared, fires after the shutdown: no new attempt.
      retry!();
      await new Promise((r) => setTimeout(r, 50));
      expect(attempts).toHaveBeenCalledTimes(1);
    } finally {
      timers.mockRestore();
    }
  });
});

/**
 * When the daily digest goes out, read once at start (beside JOBS_* in
 * jobs/job-settings.ts, to move into config/app-config.ts with the rest):
 * - DIGEST_CRON (`0 7 * * *`, every day at 07:00 UTC): a five-field cron
 *   expression in UTC (minute hour day-of-month month day-of-week), or `off`
 *   for no scheduled digest (POST /api/digests/send and `cli.js send-digest`
 *   still work).
 */
export interface DigestSettings {
  /** Null: not scheduled. */
  cron: string | null;
}

const FIELD = /^(\*|\d{1,2}(-\d{1,2})?)(\/\d{1,2})?(,(\*|\d{1,2}(-\d{1,2})?)(\/\d{1,2})?)*$/;

export function parseDigestSettings(env: Record<string, string | undefined>): DigestSettings {
  const raw = (env.DIGEST_CRON ?? '').trim();
  if (raw === '') return { cron: '0 7 * * *' };
  if (raw.toLowerCase() === 'off') return { cron: null };
  const fields = raw.split(/\s+/);
  if (fields.length !== 5 || !fields.every((f) => FIELD.test(f))) {
    throw new Error(
      `The api cannot start; fix these environment variables:\n  - DIGEST_CRON "${raw}" is not a five-field cron expression in UTC such as "0 7 * * *" (07:00 every day) or "30 6 * * 1-5", nor "off"`,
    );
  }
  return { cron: fields.join(' ') };
}

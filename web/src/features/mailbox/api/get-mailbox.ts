import useSWR from 'swr';
import type { MailboxMessage } from '@sagline/common/api-types';
import { apiFetch } from '@/app/fetcher';

export const mailboxKey = () => '/api/dev/mailbox';

/**
 * What the app has sent, caught by the local fake SMTP server (development
 * only; the API answers 404 in production). A 401 is shown on the page
 * rather than redirecting: an invitee reads their invitation here before
 * they have an account.
 */
export const getMailbox = () => apiFetch<MailboxMessage[]>(mailboxKey(), { redirectOn401: false });

/** The messages, refreshed every few seconds so new mail shows up by itself. */
export function useMailbox() {
  return useSWR(mailboxKey(), getMailbox, { refreshInterval: 3000, shouldRetryOnError: false });
}

/** Whether the mailbox exists here, for showing its link: only a 200 counts. */
export function useMailboxAvailable(): boolean {
  const { data } = useSWR(mailboxKey(), getMailbox, { shouldRetryOnError: false, revalidateOnFocus: false });
  return data !== undefined;
}

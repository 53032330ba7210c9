import type { FlagStatus } from '@sagline/common/api-types';
import { ApiError } from '../common/api-error';

/**
 * The status machine of a flag (product.md "Flag": open → answered → closed,
 * or waived with a reason). Our decisions where the brief left room:
 * - a checker may close an open flag that was never answered (they found the
 *   answer themselves, or the new revision fixed it);
 * - only an open flag can be answered (an answered one takes comments; a
 *   closed or waived one must be reopened first);
 * - reopening is for closed and waived flags, and lands on open.
 * Assignee and due date change only while the flag needs action.
 */
export type FlagAction = 'answer' | 'close' | 'reopen' | 'waive' | 'edit';

export const ALLOWED_FROM: Record<FlagAction, readonly FlagStatus[]> = {
  answer: ['open'],
  close: ['open', 'answered'],
  reopen: ['closed', 'waived'],
  waive: ['open', 'answered'],
  edit: ['open', 'answered'],
};

export const TARGET: Record<Exclude<FlagAction, 'edit'>, FlagStatus> = {
  answer: 'answered',
  close: 'closed',
  reopen: 'open',
  waive: 'waived',
};

/** 409 CONFLICT with what to do instead, when `action` is not allowed from `status`. */
export function assertTransition(action: FlagAction, status: FlagStatus, flagId: number): void {
  if (ALLOWED_FROM[action].includes(status)) return;
  throw new ApiError('CONFLICT', refusal(action, status, flagId));
}

function refusal(action: FlagAction, status: FlagStatus, id: number): string {
  const is = `Flag ${id} is ${status}`;
  switch (action) {
    case 'answer':
      return status === 'answered'
        ? `${is} already; add a comment to say more, or wait for a checker to close or reopen it.`
        : `${is}; a checker must reopen it before it can be answered.`;
    case 'close':
      return status === 'closed' ? `${is} already.` : `${is}; reopen it first if it needs closing instead.`;
    case 'reopen':
      return `${is}, not closed or waived: there is nothing to reopen.`;
    case 'waive':
      return status === 'waived' ? `${is} already.` : `${is}; reopen it first if it should be waived instead.`;
    case 'edit':
      return `${is}; reopen it before changing its assignee or due date.`;
  }
}

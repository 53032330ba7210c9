import type { Verdict } from '@sagline/common/api-types';

/**
 * What a committed revision did to one member, as the import's diff knows
 * it: changed (fields and verdicts before and after) or removed. Members
 * whose fields did not change but whose verdict flipped (the limit set
 * changed) belong here too.
 */
export interface RevisionMemberChange {
  mark: string;
  verdictBefore: Verdict | null;
  verdictAfter: Verdict | null;
  removed: boolean;
  /** Labels of the changed fields ("Spans", "I", "Loads L"), when known. */
  changedFields?: string[];
}

/** What onRevisionCommitted did: the flags that got a note, and the e-mails to send after the commit. */
export interface RevisionNotesResult {
  notedFlagIds: number[];
  mailIds: number[];
}

const word = (v: Verdict | null) => v ?? 'unchecked';

/**
 * The automatic note on a flag: "Revision 3 changed this member (Spans, I):
 * verdict fail → pass", "…: verdict still fail", or "Member no longer in revision 3".
 */
export function revisionNote(revisionNumber: number, c: RevisionMemberChange): string {
  if (c.removed) return `Member no longer in revision ${revisionNumber}`;
  const fields = c.changedFields?.length ? ` (${c.changedFields.join(', ')})` : '';
  const verdict = c.verdictBefore === c.verdictAfter ? `verdict still ${word(c.verdictAfter)}` : `verdict ${word(c.verdictBefore)} → ${word(c.verdictAfter)}`;
  return `Revision ${revisionNumber} changed this member${fields}: ${verdict}`;
}

/** One entry per mark (ignoring case): a member named twice is removed if either says so, its fields joined. */
export function mergeChanges(changes: readonly RevisionMemberChange[]): Map<string, RevisionMemberChange> {
  const byKey = new Map<string, RevisionMemberChange>();
  for (const c of changes) {
    const key = c.mark.trim().toLowerCase();
    const seen = byKey.get(key);
    if (!seen) {
      byKey.set(key, { ...c, changedFields: c.changedFields ? [...c.changedFields] : undefined });
      continue;
    }
    const fields = [...new Set([...(seen.changedFields ?? []), ...(c.changedFields ?? [])])];
    byKey.set(key, { ...seen, removed: seen.removed || c.removed, verdictAfter: c.verdictAfter, changedFields: fields.length ? fields : undefined });
  }
  return byKey;
}

/** What changed the project's limit set: another set chosen, or the set in use edited. */
export interface LimitSetCause {
  kind: 'applied' | 'edited';
  limitSetId: number;
  limitSetName: string;
  /** Who made the change (the manager); null when unknown. */
  actorId: number | null;
}

/** A member of the latest revision whose verdict a recompute under a new limit set changed. */
export interface RecomputedMemberFlip {
  mark: string;
  verdictBefore: Verdict | null;
  verdictAfter: Verdict | null;
  /** The governing check and its utilisation under the new set (null for an unchecked member). */
  governingCheck: string | null;
  utilization: number | null;
}

/** "Limit set changed to "X"" or "Limit set "X" edited": the first words of a recompute's notes. */
export function limitSetChangeWords(cause: LimitSetCause): string {
  return cause.kind === 'applied' ? `Limit set changed to "${cause.limitSetName}"` : `Limit set "${cause.limitSetName}" edited`;
}

/**
 * The automatic note on a flag when a change of the limit set flipped its
 * member's verdict: `Limit set changed to "X": verdict pass → fail (L/360 live 1.12)`.
 */
export function limitSetNote(cause: LimitSetCause, f: RecomputedMemberFlip): string {
  const governing = f.governingCheck !== null && f.utilization !== null ? ` (${f.governingCheck} ${f.utilization.toFixed(2)})` : '';
  return `${limitSetChangeWords(cause)}: verdict ${word(f.verdictBefore)} → ${word(f.verdictAfter)}${governing}`;
}

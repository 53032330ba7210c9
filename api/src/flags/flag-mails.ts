import type { OutgoingMail } from '../mail/mail.transport';

/**
 * The flag e-mails: short plain text, each with the link to the flag
 * (`${PUBLIC_URL}/projects/:projectId/flags/:flagId`) so the reader lands on
 * it. No HTML: these are notices, and plain text reads the same everywhere.
 */

export interface FlagRef {
  id: number;
  mark: string;
  title: string;
  dueDate: string | null;
  link: string;
}

function line(f: FlagRef): string {
  return `${f.mark}: ${f.title}${f.dueDate ? ` (due ${f.dueDate})` : ''}\n  ${f.link}`;
}

/** To the assignee of one flag (raised for them, or given to them). */
export function flagAssignedMail(m: { to: string; actorName: string; projectName: string; flag: FlagRef; raised: boolean }): OutgoingMail {
  const verb = m.raised ? 'raised a flag on' : 'assigned you the flag on';
  const text = [
    `${m.actorName} ${verb} ${m.flag.mark} in ${m.projectName}${m.raised ? ' and assigned it to you' : ''}.`,
    '',
    line(m.flag),
    '',
    'Answer it on the flag page once the member is resolved.',
  ].join('\n');
  return { to: m.to, subject: `Flag on ${m.flag.mark} assigned to you (${m.projectName})`, text, html: null };
}

/** To the assignee of several flags at once (bulk raise, bulk assign): one e-mail, not one per flag. */
export function flagsAssignedMail(m: { to: string; actorName: string; projectName: string; flags: FlagRef[]; raised: boolean }): OutgoingMail {
  if (m.flags.length === 1) return flagAssignedMail({ ...m, flag: m.flags[0] });
  const n = m.flags.length;
  const text = [
    `${m.actorName} ${m.raised ? 'raised' : 'assigned you'} ${n} flags in ${m.projectName}${m.raised ? ' and assigned them to you' : ''}:`,
    '',
    ...m.flags.map(line),
  ].join('\n');
  return { to: m.to, subject: `${n} flags assigned to you (${m.projectName})`, text, html: null };
}

/** To the raiser: the assignee (or an engineer) answered. */
export function flagAnsweredMail(m: { to: string; actorName: string; projectName: string; flag: FlagRef; answer: string }): OutgoingMail {
  const text = [
    `${m.actorName} answered the flag on ${m.flag.mark} in ${m.projectName}:`,
    '',
    quote(m.answer),
    '',
    line(m.flag),
    '',
    'Close it, or reopen the discussion with a comment.',
  ].join('\n');
  return { to: m.to, subject: `Flag on ${m.flag.mark} answered (${m.projectName})`, text, html: null };
}

const STATUS_WORDS = { closed: 'closed', reopened: 'reopened', waived: 'waived' } as const;

/** To the assignee: a checker closed or reopened the flag, or it was waived. */
export function flagStatusMail(m: { to: string; actorName: string; projectName: string; flag: FlagRef; what: keyof typeof STATUS_WORDS; note: string | null }): OutgoingMail {
  const word = STATUS_WORDS[m.what];
  const text = [
    `${m.actorName} ${word} the flag on ${m.flag.mark} in ${m.projectName}${m.note ? ':' : '.'}`,
    ...(m.note ? ['', quote(m.note)] : []),
    '',
    line(m.flag),
  ].join('\n');
  return { to: m.to, subject: `Flag on ${m.flag.mark} ${word} (${m.projectName})`, text, html: null };
}

/** To the assignee: a new revision changed (or dropped) members their flags are on. */
export function flagsRevisionMail(m: { to: string; projectName: string; revisionNumber: number; notes: { flag: FlagRef; note: string }[] }): OutgoingMail {
  const text = [
    `Revision ${m.revisionNumber} of ${m.projectName} changed members that flags assigned to you are on:`,
    '',
    ...m.notes.map((n) => `${line(n.flag)}\n  ${n.note}`),
    '',
    'Check whether each flag can be answered now.',
  ].join('\n');
  return { to: m.to, subject: `Revision ${m.revisionNumber} changed flagged members (${m.projectName})`, text, html: null };
}

/** To an assignee, when a change of the project's limit set flipped the verdicts of members their flags are on. */
export function flagsLimitSetMail(m: { to: string; projectName: string; change: string; notes: { flag: FlagRef; note: string }[] }): OutgoingMail {
  const text = [
    `${m.change} in ${m.projectName}: the verdicts of members that flags assigned to you are on have changed:`,
    '',
    ...m.notes.map((n) => `${line(n.flag)}\n  ${n.note}`),
    '',
    'Check whether each flag still stands.',
  ].join('\n');
  return { to: m.to, subject: `Limit set change flipped flagged members (${m.projectName})`, text, html: null };
}

function quote(text: string): string {
  return text.split('\n').map((l) => `> ${l}`).join('\n');
}

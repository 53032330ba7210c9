import type { OutgoingMail } from '../mail.transport';
import type { WaitingFlag } from './digest.repository';

/**
 * The daily digest: one plain-text e-mail per person listing what waits on
 * them across their projects, overdue first, then open flags assigned to
 * them, then answers they have to close or reopen; each line with the flag's
 * link. Plain text, like the other flag notices.
 */
export interface DigestMailInput {
  to: string;
  name: string;
  day: string;
  publicUrl: string;
  items: WaitingFlag[];
}

function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

function itemLine(i: WaitingFlag, m: DigestMailInput): string {
  const due = i.due_date ? (i.overdue ? `due ${i.due_date}, ${plural(daysBetween(i.due_date, m.day), 'day')} overdue` : `due ${i.due_date}`) : 'no due date';
  const what = i.why === 'assigned' ? 'assigned to you, open' : `answered${i.answered_by ? ` by ${i.answered_by}` : ''}, waiting for you to close or reopen`;
  return `- ${i.project_name} · ${i.mark}: ${i.title} (${due}; ${what})\n  ${m.publicUrl}/projects/${i.project_id}/flags/${i.flag_id}`;
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

export function digestMail(m: DigestMailInput): OutgoingMail {
  const overdue = m.items.filter((i) => i.overdue);
  const assigned = m.items.filter((i) => !i.overdue && i.why === 'assigned');
  const toClose = m.items.filter((i) => !i.overdue && i.why === 'to_close');
  const section = (title: string, list: WaitingFlag[]) => (list.length ? [`${title} (${list.length})`, ...list.map((i) => itemLine(i, m)), ''] : []);
  const first = m.name.split(/\s+/)[0] || m.name;
  const text = [
    `Hello ${first},`,
    '',
    `${plural(m.items.length, 'flag')} wait${m.items.length === 1 ? 's' : ''} on you on Sagline today (${m.day})${overdue.length ? `, ${overdue.length} overdue` : ''}.`,
    '',
    ...section('Overdue', overdue),
    ...section('Assigned to you: answer once the member is resolved', assigned),
    ...section('Answered: close or reopen', toClose),
    `You get this digest each day something waits on you. Turn it off on your Account page: ${m.publicUrl}/account`,
  ].join('\n');
  const subject = `${plural(m.items.length, 'flag')} wait${m.items.length === 1 ? 's' : ''} on you${overdue.length ? ` (${overdue.length} overdue)` : ''}: Sagline digest ${m.day}`;
  return { to: m.to, subject, text, html: null };
}

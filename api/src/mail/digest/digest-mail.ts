import type { OutgoingMail } from '../mail.transport';
import type { WaitingFlag } from './digest.repository';

/**
 * The daily digest: one plain-text e-mail per person listing what waits on
 * them across their projects: overdue first, then open flags assigned to
 * them, then answers they have to close or reopen, each line with the flag's
 * link; for managers, then the overdue flags of the projects they manage (at
 * most MANAGED_SHOWN per project, with a link to the rest). Plain text, like
 * the other flag notices.
 */
export interface DigestMailInput {
  to: string;
  name: string;
  day: string;
  publicUrl: string;
  items: WaitingFlag[];
}

export const MANAGED_SHOWN = 10;

function daysBetween(from: string, to: string): number {
  return Math.round((Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / 86_400_000);
}

function plural(n: number, word: string): string {
  return `${n} ${word}${n === 1 ? '' : 's'}`;
}

function due(i: WaitingFlag, day: string): string {
  if (!i.due_date) return 'no due date';
  return i.overdue ? `due ${i.due_date}, ${plural(daysBetween(i.due_date, day), 'day')} overdue` : `due ${i.due_date}`;
}

function itemLine(i: WaitingFlag, m: DigestMailInput): string {
  const what =
    i.why === 'assigned'
      ? 'assigned to you, open'
      : i.why === 'to_close'
        ? `answered${i.answered_by ? ` by ${i.answered_by}` : ''}, waiting for you to close or reopen`
        : `${i.assignee_name ? `with ${i.assignee_name}` : 'unassigned'}, ${i.answered_by ? `answered by ${i.answered_by}` : 'not answered'}`;
  return `- ${i.project_name} · ${i.mark}: ${i.title} (${due(i, m.day)}; ${what})\n  ${m.publicUrl}/projects/${i.project_id}/flags/${i.flag_id}`;
}

function managedSection(list: WaitingFlag[], m: DigestMailInput): string[] {
  if (!list.length) return [];
  const byProject = new Map<number, WaitingFlag[]>();
  for (const i of list) byProject.set(i.project_id, [...(byProject.get(i.project_id) ?? []), i]);
  const lines = [`Overdue in projects you manage (${list.length})`];
  for (const [projectId, items] of byProject) {
    lines.push(...items.slice(0, MANAGED_SHOWN).map((i) => itemLine(i, m)));
    if (items.length > MANAGED_SHOWN) {
      lines.push(`- … ${items.length - MANAGED_SHOWN} more overdue in ${items[0].project_name}: ${m.publicUrl}/projects/${projectId}/flags?overdue=true`);
    }
  }
  return [...lines, ''];
}

export function digestMail(m: DigestMailInput): OutgoingMail {
  const mine = m.items.filter((i) => i.why !== 'managed');
  const managed = m.items.filter((i) => i.why === 'managed');
  const overdue = mine.filter((i) => i.overdue);
  const assigned = mine.filter((i) => !i.overdue && i.why === 'assigned');
  const toClose = mine.filter((i) => !i.overdue && i.why === 'to_close');
  const section = (title: string, list: WaitingFlag[]) => (list.length ? [`${title} (${list.length})`, ...list.map((i) => itemLine(i, m)), ''] : []);
  const first = m.name.split(/\s+/)[0] || m.name;
  const waits = mine.length
    ? `${plural(mine.length, 'flag')} wait${mine.length === 1 ? 's' : ''} on you on Sagline today (${m.day})${overdue.length ? `, ${overdue.length} overdue` : ''}${managed.length ? `; ${plural(managed.length, 'flag')} ${managed.length === 1 ? 'is' : 'are'} overdue in projects you manage` : ''}.`
    : `${plural(managed.length, 'flag')} ${managed.length === 1 ? 'is' : 'are'} overdue in projects you manage on Sagline today (${m.day}).`;
  const text = [
    `Hello ${first},`,
    '',
    waits,
    '',
    ...section('Overdue', overdue),
    ...section('Assigned to you: answer once the member is resolved', assigned),
    ...section('Answered: close or reopen', toClose),
    ...managedSection(managed, m),
    `You get this digest each day something waits on you. Turn it off on your Account page: ${m.publicUrl}/account`,
  ].join('\n');
  const subject = mine.length
    ? `${plural(mine.length, 'flag')} wait${mine.length === 1 ? 's' : ''} on you${overdue.length ? ` (${overdue.length} overdue)` : ''}: Sagline digest ${m.day}`
    : `${plural(managed.length, 'overdue flag')} in projects you manage: Sagline digest ${m.day}`;
  return { to: m.to, subject, text, html: null };
}

import type { ProjectRole } from '@sagline/common/api-types';
import type { OutgoingMail } from './mail.transport';

const ROLE_WORDS: Record<ProjectRole, string> = {
  manager: 'manager (assigns reviewers, tracks closure)',
  engineer: 'engineer (uploads schedules, answers flags)',
  checker: 'checker (reviews members, raises and closes flags)',
  viewer: 'viewer (read-only)',
};

function escapeHtml(s: string): string {
  return s.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

function paragraphs(lines: string[]): string {
  return lines.map((l) => `<p>${l}</p>`).join('\n');
}

export interface InvitationMailInput {
  to: string;
  inviterName: string;
  projectName: string | null;
  role: ProjectRole | null;
  link: string;
  expiresAt: Date;
}

/** The invitation with its one-time link. */
export function invitationMail(m: InvitationMailInput): OutgoingMail {
  const where = m.projectName && m.role ? ` to the project ${m.projectName} as ${ROLE_WORDS[m.role]}` : '';
  const expires = m.expiresAt.toISOString().replace('T', ' ').slice(0, 16) + ' UTC';
  const subject = m.projectName ? `${m.inviterName} invited you to ${m.projectName} on Sagline` : `${m.inviterName} invited you to Sagline`;
  const text = [
    `${m.inviterName} invited you${where} on Sagline.`,
    '',
    `Open this link to choose your name and password (it works once, until ${expires}):`,
    m.link,
    '',
    'If you did not expect this invitation, ignore this e-mail.',
  ].join('\n');
  const html = paragraphs([
    `${escapeHtml(m.inviterName)} invited you${escapeHtml(where)} on Sagline.`,
    `<a href="${escapeHtml(m.link)}">Accept the invitation</a> to choose your name and password. The link works once, until ${escapeHtml(expires)}.`,
    'If you did not expect this invitation, ignore this e-mail.',
  ]);
  return { to: m.to, subject, text, html };
}

export interface AddedMailInput {
  to: string;
  inviterName: string;
  projectName: string;
  role: ProjectRole;
  link: string;
}

/** A notice to someone who already has an account. */
export function addedToProjectMail(m: AddedMailInput): OutgoingMail {
  const subject = `You were added to ${m.projectName} on Sagline`;
  const text = [`${m.inviterName} added you to the project ${m.projectName} as ${ROLE_WORDS[m.role]}.`, '', `Open it: ${m.link}`].join('\n');
  const html = paragraphs([
    `${escapeHtml(m.inviterName)} added you to the project ${escapeHtml(m.projectName)} as ${escapeHtml(ROLE_WORDS[m.role])}.`,
    `<a href="${escapeHtml(m.link)}">Open ${escapeHtml(m.projectName)}</a>`,
  ]);
  return { to: m.to, subject, text, html };
}

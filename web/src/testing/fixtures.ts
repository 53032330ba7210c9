import type { InvitationResponse, MailboxMessage, Me, Project, ProjectSummary, TeamMember } from '@sagline/common/api-types';

/** People and projects of the invented demo scenario (product.md). No real people. */
export const admin: Me = { id: 1, email: 'ada.brennick@halvercote.example', name: 'Ada Brennick', isAdmin: true };
export const manager: Me = { id: 2, email: 'tomas.okafor@halvercote.example', name: 'Tomas Okafor', isAdmin: false };
export const checker: Me = { id: 3, email: 'ilse.varga@halvercote.example', name: 'Ilse Varga', isAdmin: false };

export const halvercoteSummary = (myRole: ProjectSummary['myRole']): ProjectSummary => ({
  id: 7,
  name: 'Halvercote Yard',
  number: 'HY-2041',
  unitSystem: 'SI',
  myRole,
  createdAt: '2025-03-04T09:30:00.000Z',
});

export const halvercote = (myRole: ProjectSummary['myRole']): Project => ({
  ...halvercoteSummary(myRole),
  levels: ['L1', 'L2', 'L3', 'L4', 'L5', 'Roof'].map((name, position) => ({ id: 100 + position, name, position })),
});

export const team: TeamMember[] = [
  { userId: 2, name: 'Tomas Okafor', email: manager.email, role: 'manager', status: 'active' },
  { userId: 3, name: 'Ilse Varga', email: checker.email, role: 'checker', status: 'active' },
  { userId: 4, name: 'Rafe Lindqvist', email: 'rafe.lindqvist@halvercote.example', role: 'engineer', status: 'active' },
  { userId: 5, name: '', email: 'new.checker@halvercote.example', role: 'checker', status: 'invited' },
];

export const invitation: InvitationResponse = {
  email: 'rafe.lindqvist@halvercote.example',
  name: 'Rafe Lindqvist',
  projectId: 7,
  projectName: 'Halvercote Yard',
  role: 'engineer',
  expiresAt: '2025-03-07T09:30:00.000Z',
};

export const invitationMail: MailboxMessage = {
  id: 'm-1',
  receivedAt: '2025-03-04T09:31:00.000Z',
  from: 'Sagline <no-reply@sagline.example>',
  to: ['rafe.lindqvist@halvercote.example'],
  subject: 'You are invited to Halvercote Yard',
  text:
    'Tomas Okafor invited you to Halvercote Yard as engineer.\n\n' +
    'Set your password here: http://127.0.0.1:4100/invitations/tok-123.\n\n' +
    'Questions about Sagline: https://help.example.org/start\n',
  html: null,
};

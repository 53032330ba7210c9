import type { Flag, FlagDetail, FlagEvent, FlagPage, FlagSummary, Me, TeamMember } from '@sagline/common/api-types';
import { checker, manager, team } from '@/testing/fixtures';

/** People of the invented demo scenario, as the flag screens see them. */
export const engineer: Me = { id: 4, email: 'rafe.lindqvist@halvercote.example', name: 'Rafe Lindqvist', isAdmin: false };
export const engineer2: Me = { id: 6, email: 'noor.achterberg@halvercote.example', name: 'Noor Achterberg', isAdmin: false };
export const viewer: Me = { id: 8, email: 'ola.brandt@halvercote.example', name: 'Ola Brandt', isAdmin: false };

export const flagTeam: TeamMember[] = [
  ...team,
  { userId: 6, name: 'Noor Achterberg', email: engineer2.email, role: 'engineer', status: 'active' },
  { userId: 8, name: 'Ola Brandt', email: viewer.email, role: 'viewer', status: 'active' },
];

const ilse = { id: checker.id, name: checker.name };
const rafe = { id: engineer.id, name: engineer.name };
const tomas = { id: manager.id, name: manager.name };

export function flag(over: Partial<Flag> = {}): Flag {
  return {
    id: 12,
    projectId: 7,
    mark: 'L3-B07',
    checkName: 'L/360 live',
    title: 'L3-B07 fails L/360 live (utilisation 1.24)',
    comment: 'Please check the section against the new slab load.',
    status: 'open',
    assignee: rafe,
    raisedBy: ilse,
    dueDate: '2026-12-18',
    overdue: false,
    waiveReason: null,
    raisedInRevision: { id: 31, number: 1 },
    member: {
      level: { id: 102, name: 'L3' },
      category: 'floor-beam',
      verdict: 'fail',
      governingCheck: 'L/360 live',
      maxUtilization: 1.24,
      reviewer: ilse,
    },
    version: 1,
    createdAt: '2026-11-30T09:00:00.000Z',
    updatedAt: '2026-11-30T09:00:00.000Z',
    ...over,
  };
}

const raised: FlagEvent = {
  id: 101,
  kind: 'status',
  actor: ilse,
  fromStatus: null,
  toStatus: 'open',
  body: 'Please check the section against the new slab load.',
  data: { revisionId: 31 },
  createdAt: '2026-11-30T09:00:00.000Z',
};

export const answeredEvent: FlagEvent = {
  id: 102,
  kind: 'status',
  actor: rafe,
  fromStatus: 'open',
  toStatus: 'answered',
  body: 'Changed to a W12x26; I is now 204 ×10⁶ mm⁴.',
  data: {},
  createdAt: '2026-12-01T10:15:00.000Z',
};

export const waivedEvent: FlagEvent = {
  id: 103,
  kind: 'status',
  actor: tomas,
  fromStatus: 'answered',
  toStatus: 'waived',
  body: 'Accepted by the engineer of record for this bay.',
  data: {},
  createdAt: '2026-12-02T08:00:00.000Z',
};

export const revisionEvent: FlagEvent = {
  id: 104,
  kind: 'revision',
  actor: null,
  fromStatus: null,
  toStatus: null,
  body: 'Revision 2 changed this member (I): verdict fail → pass',
  data: { revisionId: 32, revisionNumber: 2, verdictBefore: 'fail', verdictAfter: 'pass', removed: false, changedFields: ['I'] },
  createdAt: '2026-12-01T12:00:00.000Z',
};

export const openFlag: FlagDetail = { ...flag(), events: [raised] };

export const answeredFlag: FlagDetail = {
  ...flag({ status: 'answered', version: 3, updatedAt: '2026-12-01T12:00:00.000Z' }),
  events: [raised, answeredEvent, revisionEvent],
};

/** The same flag after a manager waived it (version 4). */
export const waivedFlag: FlagDetail = {
  ...flag({ status: 'waived', version: 4, waiveReason: 'Accepted by the engineer of record for this bay.', updatedAt: '2026-12-02T08:00:00.000Z' }),
  events: [raised, answeredEvent, revisionEvent, waivedEvent],
};

export const flagList: Flag[] = [
  flag(),
  flag({ id: 13, mark: 'L2-B11', title: 'L2-B11 fails L/240 total (utilisation 1.08)', checkName: 'L/240 total', status: 'answered', overdue: false, dueDate: null }),
  flag({ id: 14, mark: 'L1-B03', title: 'L1-B03 needs a look', checkName: null, status: 'closed', assignee: null }),
  flag({ id: 15, mark: 'R-J22', title: 'R-J22 fails L/240 total (utilisation 1.02)', status: 'waived', waiveReason: 'Finishes allow it.' }),
  flag({ id: 16, mark: 'L4-B02', title: 'L4-B02 fails L/360 live (utilisation 1.31)', dueDate: '2026-11-20', overdue: true }),
];

export const page = (items: Flag[]): FlagPage => ({ items, total: items.length, page: 1, pageSize: 50 });

export const summary: FlagSummary = {
  total: 5,
  byStatus: { open: 2, answered: 1, closed: 1, waived: 1 },
  overdue: 1,
  byLevel: [],
  byAssignee: [
    { assignee: null, overdue: 0, open: 0, answered: 0, closed: 1, waived: 0 },
    { assignee: rafe, overdue: 1, open: 2, answered: 1, closed: 0, waived: 1 },
  ],
};

import type { FlagStatus, Me, ProjectSummary } from '@sagline/common/api-types';
import { can } from '@/lib/roles';
import { openFlag } from '../pages/flags-fixtures';
import { allowedActions, type FlagActionKey } from './flag-actions';

/**
 * The screens' reading of the role × route matrix (api/test/flags-roles.spec.ts):
 * a control is shown exactly to the roles the API lets through, so nobody is
 * offered a button that answers 403. Admins count as managers.
 */
type Role = ProjectSummary['myRole'];
const ROLES: Role[] = ['manager', 'engineer', 'checker', 'viewer', 'admin'];
const me = (id: number): Me => ({ id, email: `p${id}@halvercote.example`, name: `Person ${id}`, isAdmin: false });
/** The flag is assigned to person 4 (an engineer); the callers below are someone else. */
const other = me(99);

const flagIn = (status: FlagStatus) => ({ ...openFlag, status });

describe('who is offered what on a flag (same as the API)', () => {
  const ROUTES: { route: string; allowed: Role[]; offered: (role: Role) => boolean }[] = [
    { route: 'POST flags (raise)', allowed: ['checker'], offered: (r) => can.raiseFlags(r) },
    { route: 'POST flags/bulk', allowed: ['checker'], offered: (r) => can.raiseFlags(r) },
    { route: 'POST flags/bulk-assign', allowed: ['checker', 'manager', 'admin'], offered: (r) => can.manageFlags(r) },
    { route: 'PATCH flags/:id', allowed: ['checker', 'manager', 'admin'], offered: (r) => allowedActions(flagIn('open'), other, r).includes('assign') },
    { route: 'POST flags/:id/answer', allowed: ['engineer'], offered: (r) => allowedActions(flagIn('open'), other, r).includes('answer') },
    { route: 'POST flags/:id/close', allowed: ['checker'], offered: (r) => allowedActions(flagIn('open'), other, r).includes('close') },
    { route: 'POST flags/:id/reopen', allowed: ['checker'], offered: (r) => allowedActions(flagIn('closed'), other, r).includes('reopen') },
    { route: 'POST flags/:id/waive', allowed: ['checker', 'manager', 'admin'], offered: (r) => allowedActions(flagIn('open'), other, r).includes('waive') },
    { route: 'POST flags/:id/comments', allowed: ['manager', 'engineer', 'checker', 'admin'], offered: (r) => can.commentOnFlags(r) },
  ];

  for (const { route, allowed, offered } of ROUTES) {
    it(`${route}: offered to ${allowed.join(', ')} only`, () => {
      expect(ROLES.filter(offered)).toEqual(ROLES.filter((r) => allowed.includes(r)));
    });
  }

  it('the assignee answers whatever their role now is, but never as a viewer', () => {
    const assignee = me(4);
    expect(allowedActions(flagIn('open'), assignee, 'checker')).toContain('answer');
    expect(allowedActions(flagIn('open'), assignee, 'manager')).toContain('answer');
    expect(allowedActions(flagIn('open'), assignee, 'viewer')).toEqual([]);
  });

  it('follows the status machine: answer only while open, close/waive/assign while open or answered, reopen once closed or waived', () => {
    const byStatus = (role: Role, who = other) =>
      Object.fromEntries((['open', 'answered', 'closed', 'waived'] as const).map((s) => [s, allowedActions(flagIn(s), who, role)]));
    expect(byStatus('checker')).toEqual<Record<FlagStatus, FlagActionKey[]>>({
      open: ['close', 'waive', 'assign'],
      answered: ['close', 'waive', 'assign'],
      closed: ['reopen'],
      waived: ['reopen'],
    });
    expect(byStatus('engineer')).toEqual({ open: ['answer'], answered: [], closed: [], waived: [] });
    expect(byStatus('manager')).toEqual({ open: ['waive', 'assign'], answered: ['waive', 'assign'], closed: [], waived: [] });
    expect(byStatus('viewer')).toEqual({ open: [], answered: [], closed: [], waived: [] });
  });
});

import { LIMITS } from '@sagline/common/api-types';
import { ApiClient } from './support/api-client';
import { expectError } from './support/expect-error';
import { Factories, PASSWORD, type TestProject, type TestUser } from './support/factories';
import { linkIn, TestApp, TEST_PUBLIC_URL } from './support/test-app';

describe('inviting people and accepting invitations', () => {
  let t: TestApp;
  let make: Factories;
  let manager: TestUser;
  let project: TestProject;
  let c: ApiClient;

  beforeAll(async () => {
    t = await TestApp.start();
    make = new Factories(t.knex);
    manager = await make.user({ name: 'Mireille Fontaine' });
    project = await make.project({ name: 'Halvercote Yard', team: [[manager, 'manager']] });
    c = await ApiClient.signedIn(t.http, manager.email, PASSWORD);
  });
  afterAll(() => t.close());

  /** Invites a new e-mail and returns the token from the e-mailed link. */
  async function inviteNew(email: string, role = 'checker' as const, name?: string): Promise<string> {
    const res = await c.post(`/api/projects/${project.id}/invitations`, { email, role, ...(name ? { name } : {}) });
    expect(res.status).toBe(201);
    const mail = (await t.mailbox()).find((m) => m.to.includes(email.toLowerCase()));
    if (!mail) throw new Error(`no e-mail to ${email}`);
    return linkIn(mail, '/invitations/').split('/').pop()!;
  }

  it('invites a new e-mail: an invited account, the role, an e-mail with a one-time link', async () => {
    const res = await c.post(`/api/projects/${project.id}/invitations`, { email: 'Priya.Castellanos@Firm.example', role: 'checker', name: 'Priya Castellanos' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ userId: expect.any(Number), name: 'Priya Castellanos', email: 'priya.castellanos@firm.example', role: 'checker', status: 'invited' });

    const mails = (await t.mailbox()).filter((m) => m.to.includes('priya.castellanos@firm.example'));
    expect(mails).toHaveLength(1);
    expect(mails[0]).toMatchObject({
      subject: 'Mireille Fontaine invited you to Halvercote Yard on Sagline',
      from: expect.stringContaining('Sagline'),
      html: expect.stringContaining('Accept the invitation'),
    });
    const link = linkIn(mails[0], '/invitations/');
    expect(link).toMatch(new RegExp(`^${TEST_PUBLIC_URL}/invitations/[A-Za-z0-9_-]{43}$`));
    const token = link.split('/').pop()!;

    // Only the token's hash is stored.
    const stored = await t.knex('invitations').where({ email: 'priya.castellanos@firm.example' }).first();
    expect(stored.token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(stored)).not.toContain(token);
    expect(await t.knex('outbound_mail').where({ to: 'priya.castellanos@firm.example' }).select('status', 'attempts')).toEqual([{ status: 'sent', attempts: 1 }]);

    const team = await c.get(`/api/projects/${project.id}/team`);
    expect(team.body).toContainEqual(res.body);

    const anon = await ApiClient.anonymous(t.http);
    const info = await anon.get(`/api/invitations/${token}`);
    expect(info.status).toBe(200);
    expect(info.body).toEqual({ email: 'priya.castellanos@firm.example', name: 'Priya Castellanos', projectId: project.id, projectName: 'Halvercote Yard', role: 'checker', expiresAt: expect.any(String) });
    const hours = (Date.parse(info.body.expiresAt) - Date.now()) / 3_600_000;
    expect(hours).toBeGreaterThan(LIMITS.invitationHours - 0.1);
    expect(hours).toBeLessThanOrEqual(LIMITS.invitationHours);

    // The invitee cannot sign in before accepting.
    expectError(await anon.post('/api/auth/sign-in', { email: 'priya.castellanos@firm.example', password: 'priya chose this' }), 401, 'BAD_CREDENTIALS');

    const accepted = await anon.post(`/api/invitations/${token}/accept`, { name: 'Priya Castellanos-Ruiz', password: 'priya chose this' });
    expect(accepted.status).toBe(204);
    const signedIn = await anon.post('/api/auth/sign-in', { email: 'priya.castellanos@firm.example', password: 'priya chose this' });
    expect(signedIn.status).toBe(200);
    expect(signedIn.body.user).toEqual({ id: res.body.userId, email: 'priya.castellanos@firm.example', name: 'Priya Castellanos-Ruiz', isAdmin: false });
    const projects = await anon.get('/api/projects');
    expect(projects.body).toEqual([expect.objectContaining({ id: project.id, myRole: 'checker' })]);

    // One time only.
    const again = await new ApiClient(t.http).get(`/api/invitations/${token}`);
    expectError(again, 410, 'INVITATION_USED');
    const reuse = await (await ApiClient.anonymous(t.http)).post(`/api/invitations/${token}/accept`, { name: 'Someone Else', password: 'taking over the account' });
    expectError(reuse, 410, 'INVITATION_USED', /used already/);
    expect((await anon.post('/api/auth/sign-in', { email: 'priya.castellanos@firm.example', password: 'priya chose this' })).status).toBe(200);

    const actions = await t.knex('activity').where({ project_id: project.id }).orderBy('id').pluck('action');
    expect(actions).toEqual(['team.invited', 'account.password_set']);
    const team2 = await c.get(`/api/projects/${project.id}/team`);
    expect(team2.body).toContainEqual({ ...res.body, name: 'Priya Castellanos-Ruiz', status: 'active' });
  });

  it('refuses an expired invitation with 410 INVITATION_EXPIRED', async () => {
    const token = await inviteNew('late.comer@firm.example');
    await t.knex('invitations').where({ email: 'late.comer@firm.example' }).update({ expires_at: t.knex.raw(`now() - interval '1 minute'`) });
    const anon = await ApiClient.anonymous(t.http);
    expectError(await anon.get(`/api/invitations/${token}`), 410, 'INVITATION_EXPIRED', /expired on \d{4}-\d{2}-\d{2}; ask a project manager to invite you again\./);
    expectError(await anon.post(`/api/invitations/${token}/accept`, { name: 'Late Comer', password: 'long enough password' }), 410, 'INVITATION_EXPIRED');
    expect(await t.knex('users').where({ email: 'late.comer@firm.example' }).first('password_hash')).toEqual({ password_hash: null });
  });

  it('answers an unknown or mangled token with 404 INVITATION_INVALID', async () => {
    const anon = await ApiClient.anonymous(t.http);
    for (const token of ['A'.repeat(43), 'short', 'not/even']) {
      const res = await anon.get(`/api/invitations/${encodeURIComponent(token)}`);
      expectError(res, 404, 'INVITATION_INVALID', /not valid/);
    }
    expectError(await anon.post(`/api/invitations/${'B'.repeat(43)}/accept`, { name: 'X Y', password: 'long enough password' }), 404, 'INVITATION_INVALID');
  });

  it('checks the accept body (name, password length) before using the invitation', async () => {
    const token = await inviteNew('careful.person@firm.example');
    const anon = await ApiClient.anonymous(t.http);
    const before = await t.counts();
    const res = await anon.post(`/api/invitations/${token}/accept`, { name: '', password: 'short' });
    const body = expectError(res, 400, 'VALIDATION_FAILED');
    expect(body.details).toEqual([
      { path: 'body.name', message: 'is required: the name colleagues will see' },
      { path: 'body.password', message: `must be at least ${LIMITS.passwordMin} characters` },
    ]);
    expect(await t.counts()).toEqual(before);
    expect((await anon.post(`/api/invitations/${token}/accept`, { name: 'Careful Person', password: 'long enough password' })).status).toBe(204);
  });

  it('adds a person who has an account at once and e-mails them a notice instead of an invitation', async () => {
    const existing = await make.user({ name: 'Kasimir Oduya' });
    const res = await c.post(`/api/projects/${project.id}/invitations`, { email: existing.email.toUpperCase(), role: 'engineer' });
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ userId: existing.id, name: 'Kasimir Oduya', email: existing.email, role: 'engineer', status: 'active' });
    const mail = (await t.mailbox()).find((m) => m.to.includes(existing.email))!;
    expect(mail.subject).toBe('You were added to Halvercote Yard on Sagline');
    expect(linkIn(mail, '/projects/')).toBe(`${TEST_PUBLIC_URL}/projects/${project.id}`);
    expect(await t.knex('invitations').where({ user_id: existing.id }).count('* as n').first()).toEqual({ n: '0' });

    const again = await c.post(`/api/projects/${project.id}/invitations`, { email: existing.email, role: 'viewer' });
    expectError(again, 409, 'CONFLICT', `${existing.email} is on this team already, as engineer; change their role instead.`);
  });

  it('changes roles and removes people, keeping at least one manager', async () => {
    const engineer = await make.user({ name: 'Tomas Brandvik' });
    await make.role(project.id, engineer, 'engineer');
    const changed = await c.patch(`/api/projects/${project.id}/team/${engineer.id}`, { role: 'checker' });
    expect(changed.status).toBe(200);
    expect(changed.body).toEqual({ userId: engineer.id, name: 'Tomas Brandvik', email: engineer.email, role: 'checker', status: 'active' });

    expectError(await c.patch(`/api/projects/${project.id}/team/${manager.id}`, { role: 'viewer' }), 409, 'CONFLICT', /only manager of this project/);
    expectError(await c.delete(`/api/projects/${project.id}/team/${manager.id}`), 409, 'CONFLICT', /only manager of this project/);
    expectError(await c.patch(`/api/projects/${project.id}/team/${engineer.id}`, { role: 'boss' }), 400, 'VALIDATION_FAILED', /body\.role: must be one of manager, engineer, checker, viewer/);
    expectError(await c.patch(`/api/projects/${project.id}/team/987654`, { role: 'viewer' }), 404, 'NOT_FOUND', 'Person 987654 is not on this project\'s team.');
    expectError(await c.delete(`/api/projects/${project.id}/team/x1`), 400, 'VALIDATION_FAILED', /params\.userId: must be a positive whole number/);

    const removed = await c.delete(`/api/projects/${project.id}/team/${engineer.id}`);
    expect(removed.status).toBe(204);
    const team = await c.get(`/api/projects/${project.id}/team`);
    expect(team.body.map((m: { userId: number }) => m.userId)).not.toContain(engineer.id);
    // The removed person no longer sees the project at all.
    const them = await ApiClient.signedIn(t.http, engineer.email, PASSWORD);
    expectError(await them.get(`/api/projects/${project.id}`), 404, 'NOT_FOUND');

    const summaries = await t.knex('activity').where({ project_id: project.id }).whereIn('action', ['team.role_changed', 'team.removed']).orderBy('id').pluck('summary');
    expect(summaries).toEqual([
      "Mireille Fontaine changed Tomas Brandvik's role from engineer to checker",
      'Mireille Fontaine removed Tomas Brandvik (checker) from the team',
    ]);
  });

  it('withdraws a pending invitation when the invitee is removed from the team', async () => {
    const token = await inviteNew('changed.mind@firm.example');
    const member = await t.knex('users').where({ email: 'changed.mind@firm.example' }).first('id');
    expect((await c.delete(`/api/projects/${project.id}/team/${member.id}`)).status).toBe(204);
    expectError(await new ApiClient(t.http).get(`/api/invitations/${token}`), 404, 'INVITATION_INVALID');
  });

  it('refuses bad invitations with details and writes nothing (no account, no role, no e-mail)', async () => {
    const before = await t.counts();
    const res = await c.post(`/api/projects/${project.id}/invitations`, { email: 'not-an-address', role: 'admin', team: 'all' });
    const body = expectError(res, 400, 'VALIDATION_FAILED');
    expect(body.details).toEqual([
      { path: 'body.team', message: 'is not a field of this request; remove it' },
      { path: 'body.email', message: 'must be an e-mail address, e.g. name@firm.example' },
      { path: 'body.role', message: 'must be one of manager, engineer, checker, viewer' },
    ]);
    expectError(await c.post(`/api/projects/${project.id}/invitations`, { role: 'viewer' }), 400, 'VALIDATION_FAILED', 'Some fields need fixing: body.email: is required');
    expect(await t.counts()).toEqual(before);
  });
});

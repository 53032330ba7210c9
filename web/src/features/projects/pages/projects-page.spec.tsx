import { screen, waitFor, within } from '@testing-library/react';
import { stubFetch } from '@/testing/fetch-stub';
import { admin, halvercote, halvercoteSummary, manager } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';

describe('Projects', () => {
  it('lists my projects with number, units and my role, without "New project" for a non-admin', async () => {
    stubFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/projects': { body: [halvercoteSummary('manager')] },
    });
    renderApp('/projects');
    const row = (await screen.findByText('Halvercote Yard')).closest('tr') as HTMLElement;
    expect(within(row).getByText('HY-2041')).toBeInTheDocument();
    expect(within(row).getByText('SI')).toBeInTheDocument();
    expect(within(row).getByText('Manager')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /New project/ })).not.toBeInTheDocument();
  });

  it('tells a person with no projects how they get one', async () => {
    stubFetch({ 'GET /api/auth/me': { body: { user: manager } }, 'GET /api/projects': { body: [] } });
    renderApp('/projects');
    expect(await screen.findByText(/A project manager adds you by invitation/)).toBeInTheDocument();
  });

  it('lets an admin create a project with the default levels, lowest first', async () => {
    const api = stubFetch({
      'GET /api/auth/me': { body: { user: admin } },
      'GET /api/projects': { body: [] },
      'POST /api/projects': { status: 201, body: { ...halvercote('admin'), id: 8, name: 'Tarnmoor Depot' } },
      'GET /api/projects/8': { body: { ...halvercote('admin'), id: 8, name: 'Tarnmoor Depot' } },
      'GET /api/projects/8/team': { body: [] },
    });
    const { user, router } = renderApp('/projects');
    await user.click((await screen.findAllByRole('button', { name: /New project/ }))[0]);

    const dialog = await screen.findByRole('dialog');
    // Drawn top of the building first.
    const levelInputs = within(dialog).getAllByRole('textbox', { name: /^Level \d+ name$/ });
    expect(levelInputs.map((i) => (i as HTMLInputElement).value)).toEqual(['Roof', 'L5', 'L4', 'L3', 'L2', 'L1']);

    await user.click(within(dialog).getByRole('button', { name: 'Create project' }));
    expect(await within(dialog).findByText('Name the project.')).toBeInTheDocument();
    expect(api.calls('POST /api/projects')).toHaveLength(0);

    await user.type(within(dialog).getByLabelText('Project name'), 'Tarnmoor Depot');
    await user.type(within(dialog).getByLabelText('Project number'), 'TD-118');
    await user.click(within(dialog).getByRole('radio', { name: /US customary/ }));
    await user.click(within(dialog).getByRole('button', { name: 'Create project' }));

    await waitFor(() => expect(api.calls('POST /api/projects')).toHaveLength(1));
    expect(api.calls('POST /api/projects')[0].body).toEqual({
      name: 'Tarnmoor Depot',
      number: 'TD-118',
      unitSystem: 'US',
      levels: ['L1', 'L2', 'L3', 'L4', 'L5', 'Roof'],
    });
    await waitFor(() => expect(router.state.location.pathname).toBe('/projects/8/team'));
  });

  it('refuses two levels with the same name', async () => {
    const api = stubFetch({ 'GET /api/auth/me': { body: { user: admin } }, 'GET /api/projects': { body: [] } });
    const { user } = renderApp('/projects');
    await user.click((await screen.findAllByRole('button', { name: /New project/ }))[0]);
    const dialog = await screen.findByRole('dialog');
    await user.type(within(dialog).getByLabelText('Project name'), 'Tarnmoor Depot');
    await user.type(within(dialog).getByLabelText('Project number'), 'TD-118');
    const l2 = within(dialog).getByRole('textbox', { name: 'Level 2 name' });
    await user.clear(l2);
    await user.type(l2, 'l1');
    await user.click(within(dialog).getByRole('button', { name: 'Create project' }));
    expect((await within(dialog).findAllByText('Two levels have this name; level names must differ.')).length).toBeGreaterThan(0);
    expect(api.calls('POST /api/projects')).toHaveLength(0);
  });
});

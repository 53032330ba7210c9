import { screen, waitFor, within } from '@testing-library/react';
import { stubFetch } from '@/testing/fetch-stub';
import { checker, halvercote, manager, team } from '@/testing/fixtures';
import { renderApp, setCsrfCookie } from '@/testing/render';

function teamApi(me: typeof manager, myRole: Parameters<typeof halvercote>[0]) {
  return stubFetch({
    'GET /api/auth/me': { body: { user: me } },
    'GET /api/projects/7': { body: halvercote(myRole) },
    'GET /api/projects/7/team': { body: team },
    'POST /api/projects/7/invitations': (req) => ({
      status: 201,
      body: { userId: 9, name: '', email: (req.body as { email: string }).email, role: 'checker', status: 'invited' },
    }),
  });
}

describe('Team', () => {
  it('shows a checker the team read-only: no invite form, no role selects, no remove', async () => {
    teamApi(checker, 'checker');
    renderApp('/projects/7/team');
    const table = await screen.findByRole('table');
    expect(await within(table).findByText('Rafe Lindqvist')).toBeInTheDocument();
    expect(within(table).getByText('Invited')).toBeInTheDocument();
    expect(within(table).getByText('new.checker@halvercote.example')).toBeInTheDocument();

    expect(screen.queryByRole('form', { name: 'Invite someone' })).not.toBeInTheDocument();
    expect(screen.queryByRole('combobox')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Remove' })).not.toBeInTheDocument();
    expect(screen.getByText('Managers invite people and change roles.')).toBeInTheDocument();
  });

  it('gives a manager the invite form and a role select per other person', async () => {
    setCsrfCookie('csrf-7');
    const api = teamApi(manager, 'manager');
    const { user } = renderApp('/projects/7/team');

    const form = await screen.findByRole('form', { name: 'Invite someone' });
    expect(await screen.findByRole('combobox', { name: 'Role of Rafe Lindqvist' })).toBeInTheDocument();
    expect(screen.getByRole('combobox', { name: 'Role of Ilse Varga' })).toBeInTheDocument();
    // Not on their own row: a manager cannot lock themselves out by accident.
    expect(screen.queryByRole('combobox', { name: 'Role of Tomas Okafor' })).not.toBeInTheDocument();
    expect(screen.getAllByRole('button', { name: 'Remove' })).toHaveLength(team.length - 1);

    await user.type(within(form).getByLabelText('E-mail'), 'marit.holm@halvercote.example');
    await user.click(within(form).getByRole('button', { name: 'Invite' }));

    expect(await screen.findByText('Invitation sent to marit.holm@halvercote.example.')).toBeInTheDocument();
    const [sent] = api.calls('POST /api/projects/7/invitations');
    expect(sent.body).toEqual({ email: 'marit.holm@halvercote.example', role: 'engineer' });
    expect(sent.headers['x-csrf-token']).toBe('csrf-7');
    // The list is fetched again, so the invited person shows up.
    await waitFor(() => expect(api.calls('GET /api/projects/7/team').length).toBeGreaterThan(1));
  });

  it('treats an admin without a project role as a manager', async () => {
    teamApi({ ...checker, isAdmin: true }, 'admin');
    renderApp('/projects/7/team');
    expect(await screen.findByRole('form', { name: 'Invite someone' })).toBeInTheDocument();
  });
});

import { screen, waitFor, within } from '@testing-library/react';
import type { Me } from '@sagline/common/api-types';
import { apiError, stubFetch, type StubRoutes } from '@/testing/fetch-stub';
import { checker, halvercote, manager } from '@/testing/fixtures';
import { renderApp, setCsrfCookie } from '@/testing/render';
import { answeredFlag, engineer, engineer2, flagTeam, openFlag, revisionEvent, viewer, waivedFlag } from './flags-fixtures';

function flagApi(me: Me, myRole: Parameters<typeof halvercote>[0], more: StubRoutes = {}) {
  return stubFetch({
    'GET /api/auth/me': { body: { user: me } },
    'GET /api/projects/7': { body: halvercote(myRole) },
    'GET /api/projects/7/team': { body: flagTeam },
    'GET /api/projects/7/flags/12': { body: answeredFlag },
    ...more,
  });
}

describe('Flag page', () => {
  it('shows the member, the thread with who and when, and the automatic revision note', async () => {
    flagApi(checker, 'checker');
    renderApp('/projects/7/flags/12');
    expect(await screen.findByRole('heading', { name: /Flag 12: L3-B07 fails L\/360 live/ })).toBeInTheDocument();
    const member = screen.getByLabelText('The member');
    expect(within(member).getByRole('link', { name: 'L3-B07' })).toHaveAttribute('href', '/projects/7/members/L3-B07');
    expect(within(member).getByText('1.24')).toBeInTheDocument();
    expect(within(member.parentElement as HTMLElement).getByText(/does not replace the engineer of record's judgement/)).toBeInTheDocument();

    const history = screen.getByLabelText('History of the flag');
    expect(within(history).getByText('Ilse Varga')).toBeInTheDocument();
    expect(within(history).getByText(/raised the flag/)).toBeInTheDocument();
    expect(within(history).getByText('Changed to a W12x26; I is now 204 ×10⁶ mm⁴.')).toBeInTheDocument();
    expect(within(history).getByText('Automatic note, revision 2')).toBeInTheDocument();
    expect(within(history).getByText('Revision 2 changed this member (I): verdict fail → pass')).toBeInTheDocument();
  });

  it('a checker closing a flag someone waived meanwhile gets a notice and sees the CURRENT flag, not an overwrite', async () => {
    setCsrfCookie('csrf-7');
    const api = flagApi(checker, 'checker', {
      'POST /api/projects/7/flags/12/close': apiError(409, 'STALE_WRITE', 'Flag 12 changed since you loaded it (version 4, you sent 3).', {
        details: [{ path: 'body.version', message: 'is 4 now', value: waivedFlag }],
      }),
    });
    const { user } = renderApp('/projects/7/flags/12');
    const form = await screen.findByRole('form', { name: 'Close the flag' });
    await user.type(within(form).getByLabelText('Comment (optional)'), 'Section checked, fine now.');
    await user.click(within(form).getByRole('button', { name: 'Close flag' }));

    const notice = await screen.findByText(/Someone changed this flag before your closing was saved; it was not saved\./);
    const alert = notice.closest('[role="alert"]') as HTMLElement;
    expect(within(alert).getByText(/You were looking at version 3; it is now version 4, status waived\./)).toBeInTheDocument();
    expect(within(alert).getByText(/Latest change: Tomas Okafor waived the flag/)).toBeInTheDocument();
    // What the checker wrote is kept, although the close form is gone.
    expect(within(alert).getByText('Section checked, fine now.')).toBeInTheDocument();

    const [close] = api.calls('POST /api/projects/7/flags/12/close');
    expect(close.body).toEqual({ version: 3, body: 'Section checked, fine now.' });
    expect(close.headers['x-csrf-token']).toBe('csrf-7');

    // The page shows the flag as it is now: waived with the reason, and the waiver in the history.
    const facts = screen.getByLabelText('The flag');
    expect(within(facts).getByText('Waived')).toBeInTheDocument();
    expect(within(facts).getByText('Accepted by the engineer of record for this bay.')).toBeInTheDocument();
    expect(within(screen.getByLabelText('History of the flag')).getByText(/waived the flag/)).toBeInTheDocument();
    // A waived flag can only be reopened now; closing is gone.
    expect(screen.queryByRole('form', { name: 'Close the flag' })).not.toBeInTheDocument();
    expect(screen.getByRole('tab', { name: 'Reopen' })).toBeInTheDocument();
  });

  it('shows a viewer no action and no comment box', async () => {
    const api = flagApi(viewer, 'viewer');
    renderApp('/projects/7/flags/12');
    expect(await screen.findByRole('heading', { name: /Flag 12/ })).toBeInTheDocument();
    expect(screen.getByText('You can read this flag; viewers do not change flags.')).toBeInTheDocument();
    expect(screen.queryByRole('tab')).not.toBeInTheDocument();
    expect(screen.queryByRole('form')).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Close|Reopen|Waive|Answer|Add comment|Save/ })).not.toBeInTheDocument();
    expect(api.requests.filter((r) => r.method !== 'GET')).toHaveLength(0);
  });

  it('gives each role only its actions: checker close/waive/assign, manager waive/assign, engineer answer', async () => {
    flagApi(checker, 'checker', { 'GET /api/projects/7/flags/12': { body: openFlag } });
    const first = renderApp('/projects/7/flags/12');
    await screen.findByRole('heading', { name: /Flag 12/ });
    expect(screen.getAllByRole('tab').map((t) => t.textContent)).toEqual(['Close', 'Waive', 'Assignee and due date']);
    first.unmount();

    flagApi(manager, 'manager', { 'GET /api/projects/7/flags/12': { body: openFlag } });
    const second = renderApp('/projects/7/flags/12');
    await screen.findByRole('heading', { name: /Flag 12/ });
    expect(screen.getAllByRole('tab').map((t) => t.textContent)).toEqual(['Waive', 'Assignee and due date']);
    second.unmount();

    // Any engineer answers (not only the assignee), but never closes.
    flagApi(engineer2, 'engineer', { 'GET /api/projects/7/flags/12': { body: openFlag } });
    renderApp('/projects/7/flags/12');
    await screen.findByRole('heading', { name: /Flag 12/ });
    expect(screen.getAllByRole('tab').map((t) => t.textContent)).toEqual(['Answer']);
    expect(screen.getByRole('form', { name: 'Add a comment' })).toBeInTheDocument();
  });

  it('the assignee answers with the version seen; an empty answer is refused in the form', async () => {
    setCsrfCookie('csrf-7');
    const api = flagApi(engineer, 'engineer', {
      'GET /api/projects/7/flags/12': { body: openFlag },
      'POST /api/projects/7/flags/12/answer': { body: { ...answeredFlag, version: 2 } },
    });
    const { user } = renderApp('/projects/7/flags/12');
    const form = await screen.findByRole('form', { name: 'Answer the flag' });
    await user.click(within(form).getByRole('button', { name: 'Send answer' }));
    expect(await within(form).findByText('Write your answer: what was changed, or why the member is fine.')).toBeInTheDocument();
    expect(api.calls('POST /api/projects/7/flags/12/answer')).toHaveLength(0);

    await user.type(within(form).getByLabelText('Answer'), 'Changed to a W12x26; I is now 204 ×10⁶ mm⁴.');
    await user.click(within(form).getByRole('button', { name: 'Send answer' }));
    await waitFor(() => expect(api.calls('POST /api/projects/7/flags/12/answer')).toHaveLength(1));
    expect(api.calls('POST /api/projects/7/flags/12/answer')[0].body).toEqual({ version: 1, body: 'Changed to a W12x26; I is now 204 ×10⁶ mm⁴.' });
    expect(await within(screen.getByLabelText('The flag')).findByText('Answered')).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Answer the flag' })).not.toBeInTheDocument();
  });

  it('says so when the member left the schedule, with the automatic note', async () => {
    const left = {
      ...openFlag,
      member: null,
      version: 2,
      events: [
        ...openFlag.events,
        { ...revisionEvent, body: 'Member no longer in revision 2', data: { ...revisionEvent.data, removed: true, verdictAfter: null, changedFields: [] } },
      ],
    };
    flagApi(checker, 'checker', { 'GET /api/projects/7/flags/12': { body: left } });
    renderApp('/projects/7/flags/12');
    expect(await screen.findByText('L3-B07 is no longer in the latest revision')).toBeInTheDocument();
    expect(within(screen.getByLabelText('History of the flag')).getByText('Member no longer in revision 2')).toBeInTheDocument();
    // It can still be closed or waived.
    expect(screen.getByRole('tab', { name: 'Close' })).toBeInTheDocument();
  });

  it('says so when the flag does not exist', async () => {
    flagApi(checker, 'checker', { 'GET /api/projects/7/flags/99': apiError(404, 'NOT_FOUND', 'No flag 99 in this project.') });
    renderApp('/projects/7/flags/99');
    expect(await screen.findByText('Flag not found')).toBeInTheDocument();
  });
});

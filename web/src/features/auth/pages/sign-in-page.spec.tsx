import { screen, waitFor } from '@testing-library/react';
import { apiError, stubFetch } from '@/testing/fetch-stub';
import { manager, halvercote, halvercoteSummary } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';

const signedOut = { 'GET /api/auth/me': apiError(401, 'UNAUTHENTICATED', 'Not signed in.') };

describe('Sign in', () => {
  it('checks the form before sending anything', async () => {
    const api = stubFetch(signedOut);
    const { user } = renderApp('/sign-in');
    await user.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter your e-mail address.')).toBeInTheDocument();
    expect(screen.getByText('Enter your password.')).toBeInTheDocument();

    await user.type(screen.getByLabelText('E-mail'), 'tomas.okafor');
    expect(await screen.findByText('This is not an e-mail address (name@example.com).')).toBeInTheDocument();
    expect(api.calls('POST /api/auth/sign-in')).toHaveLength(0);
  });

  it("shows the server's message on bad credentials and stays on the page", async () => {
    const api = stubFetch({
      ...signedOut,
      'POST /api/auth/sign-in': apiError(401, 'BAD_CREDENTIALS', 'That e-mail and password do not match an account.'),
    });
    const { user, router } = renderApp('/sign-in');
    await user.type(await screen.findByLabelText('E-mail'), manager.email);
    await user.type(screen.getByLabelText('Password'), 'not-the-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    expect(await screen.findByText('That e-mail and password do not match an account.')).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(api.calls('POST /api/auth/sign-in')[0].body).toEqual({ email: manager.email, password: 'not-the-password' });
  });

  it('says how long to wait when sign-in is rate limited', async () => {
    stubFetch({
      ...signedOut,
      'POST /api/auth/sign-in': apiError(429, 'RATE_LIMITED', 'Too many sign-in attempts.', {
        headers: { 'Retry-After': '840' },
      }),
    });
    const { user } = renderApp('/sign-in');
    await user.type(await screen.findByLabelText('E-mail'), manager.email);
    await user.type(screen.getByLabelText('Password'), 'whatever-it-is');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Too many sign-in attempts. Try again in 14 minutes.')).toBeInTheDocument();
  });

  it("keeps the server's own wait time when its message gives one", async () => {
    const said = 'Too many failed sign-ins for this e-mail from your address. Wait about 12 minutes and try again.';
    stubFetch({ ...signedOut, 'POST /api/auth/sign-in': apiError(429, 'RATE_LIMITED', said, { headers: { 'Retry-After': '700' } }) });
    const { user } = renderApp('/sign-in');
    await user.type(await screen.findByLabelText('E-mail'), manager.email);
    await user.type(screen.getByLabelText('Password'), 'whatever-it-is');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText(said)).toBeInTheDocument();
  });

  it('when a session ends, sends the person to sign in and back to where they were', async () => {
    let signedIn = true;
    const api = stubFetch({
      'GET /api/auth/me': () => (signedIn ? { body: { user: manager } } : signedOut['GET /api/auth/me']),
      'GET /api/projects/7': { body: halvercote('manager') },
      // The session ended on the server between the me check and this call.
      'GET /api/projects/7/team': () => {
        signedIn = false;
        return apiError(401, 'UNAUTHENTICATED', 'Your session has ended; sign in again.');
      },
      'POST /api/auth/sign-in': () => {
        signedIn = true;
        return { body: { user: manager } };
      },
      'GET /api/projects': { body: [halvercoteSummary('manager')] },
    });
    const { user, router } = renderApp('/projects/7/team');

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(router.state.location.search).toBe('?next=%2Fprojects%2F7%2Fteam');
    expect(await screen.findByText('Sign in to continue where you were.')).toBeInTheDocument();

    api.set({ 'GET /api/projects/7/team': { body: [] } });
    await user.type(screen.getByLabelText('E-mail'), manager.email);
    await user.type(screen.getByLabelText('Password'), 'correct horse battery');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));

    await waitFor(() => expect(router.state.location.pathname).toBe('/projects/7/team'));
    expect(await screen.findByRole('heading', { name: 'Halvercote Yard' })).toBeInTheDocument();
  });

  it('pre-fills the e-mail from the link and ignores a return path to another site', async () => {
    stubFetch({
      ...signedOut,
      'POST /api/auth/sign-in': { body: { user: manager } },
      'GET /api/projects': { body: [] },
    });
    const { user, router } = renderApp(`/sign-in?email=${encodeURIComponent(manager.email)}&next=//evil.example/x`);
    expect(await screen.findByLabelText('E-mail')).toHaveValue(manager.email);
    await user.type(screen.getByLabelText('Password'), 'correct horse battery');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/projects'));
  });
});

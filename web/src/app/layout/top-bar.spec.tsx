import { screen, waitFor } from '@testing-library/react';
import { apiError, stubFetch } from '@/testing/fetch-stub';
import { manager } from '@/testing/fixtures';
import { renderApp, setCsrfCookie } from '@/testing/render';

describe('Top bar', () => {
  it('shows who is signed in, and signing out ends at the sign-in page with nothing of the session left', async () => {
    setCsrfCookie('csrf-9');
    let signedIn = true;
    const api = stubFetch({
      'GET /api/auth/me': () => (signedIn ? { body: { user: manager } } : apiError(401, 'UNAUTHENTICATED', 'Not signed in.')),
      'GET /api/projects': { body: [] },
      'POST /api/auth/sign-out': () => {
        signedIn = false;
        return { status: 204 };
      },
    });
    const { user, router } = renderApp('/account');
    expect(await screen.findByText(manager.email)).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Account menu for Tomas Okafor' }));
    await user.click(await screen.findByText('Sign out'));

    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(await screen.findByRole('button', { name: 'Sign in' })).toBeInTheDocument();
    expect(api.calls('POST /api/auth/sign-out')[0].headers['x-csrf-token']).toBe('csrf-9');
    expect(screen.queryByText('Tomas Okafor')).not.toBeInTheDocument();
  });
});

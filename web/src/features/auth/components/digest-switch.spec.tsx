import { screen, waitFor } from '@testing-library/react';
import { stubFetch } from '@/testing/fetch-stub';
import { manager } from '@/testing/fixtures';
import { renderApp, setCsrfCookie } from '@/testing/render';

describe('the digest switch on the Account page', () => {
  it('shows the saved preference and turns the daily digest off and on again', async () => {
    setCsrfCookie('csrf-9');
    let digest = true;
    const api = stubFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/me/preferences': () => ({ body: { digest } }),
      'PATCH /api/me/preferences': (req) => {
        digest = (req.body as { digest: boolean }).digest;
        return { body: { digest } };
      },
    });
    const { user } = renderApp('/account');
    const toggle = await screen.findByRole('switch', { name: 'Daily digest' });
    await waitFor(() => expect(toggle).toBeChecked());

    await user.click(toggle);
    expect(await screen.findByText(/The daily digest is off/)).toBeInTheDocument();
    await waitFor(() => expect(toggle).not.toBeChecked());
    expect(api.calls('PATCH /api/me/preferences')[0].body).toEqual({ digest: false });
    expect(api.calls('PATCH /api/me/preferences')[0].headers['x-csrf-token']).toBe('csrf-9');

    await user.click(toggle);
    expect(await screen.findByText('You will get the daily digest.')).toBeInTheDocument();
    await waitFor(() => expect(toggle).toBeChecked());
    expect(api.calls('PATCH /api/me/preferences')[1].body).toEqual({ digest: true });
  });

  it('leaves the switch as it was and says why when saving fails', async () => {
    stubFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'GET /api/me/preferences': { body: { digest: false } },
      'PATCH /api/me/preferences': { status: 500, body: { statusCode: 500, error: 'Internal Server Error', code: 'INTERNAL', message: 'The database did not answer; try again in a minute.' } },
    });
    const { user } = renderApp('/account');
    const toggle = await screen.findByRole('switch', { name: 'Daily digest' });
    await user.click(toggle);
    expect(await screen.findByText('The database did not answer; try again in a minute.')).toBeInTheDocument();
    expect(toggle).not.toBeChecked();
  });
});

import { screen, waitFor } from '@testing-library/react';
import { apiError, stubFetch } from '@/testing/fetch-stub';
import { manager } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';

describe('Account', () => {
  it('shows a wrong current password under that field, then confirms a change', async () => {
    let attempts = 0;
    const api = stubFetch({
      'GET /api/auth/me': { body: { user: manager } },
      'POST /api/auth/password': () =>
        ++attempts === 1
          ? apiError(400, 'VALIDATION_FAILED', 'body.currentPassword: is not your current password; type it again', {
              details: [{ path: 'body.currentPassword', message: 'is not your current password; type it again' }],
            })
          : { status: 204 },
    });
    const { user } = renderApp('/account');
    expect(await screen.findByText(manager.email)).toBeInTheDocument();

    await user.type(screen.getByLabelText('Current password'), 'not-it-at-all');
    await user.type(screen.getByLabelText('New password'), 'timber joists 2');
    await user.type(screen.getByLabelText('Confirm new password'), 'timber joists 2');
    await user.click(screen.getByRole('button', { name: 'Change password' }));
    expect(await screen.findByText('Is not your current password; type it again')).toBeInTheDocument();

    await user.clear(screen.getByLabelText('Current password'));
    await user.type(screen.getByLabelText('Current password'), 'the-real-one-1');
    await user.click(screen.getByRole('button', { name: 'Change password' }));
    expect(await screen.findByText(/Password changed/)).toBeInTheDocument();
    await waitFor(() => expect(api.calls('POST /api/auth/password')).toHaveLength(2));
    expect(api.calls('POST /api/auth/password')[1].body).toEqual({ currentPassword: 'the-real-one-1', newPassword: 'timber joists 2' });
  });
});

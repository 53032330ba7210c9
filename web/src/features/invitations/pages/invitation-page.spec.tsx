import { screen } from '@testing-library/react';
import { apiError, stubFetch } from '@/testing/fetch-stub';
import { invitation } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';

const signedOut = { 'GET /api/auth/me': apiError(401, 'UNAUTHENTICATED', 'Not signed in.') };

describe('Invitation', () => {
  it('says plainly that an expired link has expired, and offers no form', async () => {
    stubFetch({
      ...signedOut,
      'GET /api/invitations/:token': apiError(410, 'INVITATION_EXPIRED', 'This invitation expired on 7 March.'),
    });
    renderApp('/invitations/old-token');
    expect(await screen.findByText('This invitation has expired')).toBeInTheDocument();
    expect(screen.getByText(/Ask the person who invited you to send a new one/)).toBeInTheDocument();
    expect(screen.queryByLabelText('Password')).not.toBeInTheDocument();
  });

  it('sends a used link to sign in, and says so for an unknown one', async () => {
    stubFetch({
      ...signedOut,
      'GET /api/invitations/used': apiError(410, 'INVITATION_USED', 'Already used.'),
      'GET /api/invitations/nope': apiError(404, 'INVITATION_INVALID', 'Unknown invitation.'),
    });
    const { unmount } = renderApp('/invitations/used');
    expect(await screen.findByText('This invitation has already been used')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to sign in' })).toHaveAttribute('href', '/sign-in');
    unmount();
    renderApp('/invitations/nope');
    expect(await screen.findByText('This invitation link is not valid')).toBeInTheDocument();
  });

  it('shows the project and role, checks the passwords match, then links to sign in with the e-mail', async () => {
    const api = stubFetch({
      ...signedOut,
      'GET /api/invitations/:token': { body: invitation },
      'POST /api/invitations/:token/accept': { status: 204 },
    });
    const { user } = renderApp('/invitations/tok-123');
    expect(await screen.findByText('Halvercote Yard')).toBeInTheDocument();
    expect(screen.getByText('Engineer')).toBeInTheDocument();
    expect(screen.getByLabelText('Your name')).toHaveValue('Rafe Lindqvist');

    await user.type(screen.getByLabelText('Password'), 'short');
    await user.type(screen.getByLabelText('Confirm password'), 'shorter');
    await user.click(screen.getByRole('button', { name: 'Set password' }));
    expect(await screen.findByText('Use at least 10 characters.')).toBeInTheDocument();
    expect(await screen.findByText('The two passwords are not the same.')).toBeInTheDocument();
    expect(api.calls('POST /api/invitations/:token/accept')).toHaveLength(0);

    await user.clear(screen.getByLabelText('Password'));
    await user.type(screen.getByLabelText('Password'), 'steel and timber');
    await user.clear(screen.getByLabelText('Confirm password'));
    await user.type(screen.getByLabelText('Confirm password'), 'steel and timber');
    await user.click(screen.getByRole('button', { name: 'Set password' }));

    expect(await screen.findByText('Password set — sign in')).toBeInTheDocument();
    expect(api.calls('POST /api/invitations/:token/accept')[0].body).toEqual({ name: 'Rafe Lindqvist', password: 'steel and timber' });
    expect(screen.getByRole('link', { name: 'Sign in' })).toHaveAttribute(
      'href',
      '/sign-in?email=rafe.lindqvist%40halvercote.example',
    );
  });
});

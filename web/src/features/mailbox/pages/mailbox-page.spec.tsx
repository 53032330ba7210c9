import { screen, waitFor } from '@testing-library/react';
import { apiError, stubFetch } from '@/testing/fetch-stub';
import { invitation, invitationMail } from '@/testing/fixtures';
import { renderApp } from '@/testing/render';

describe('Mailbox', () => {
  it('turns links into anchors, and an invitation link opens the invitation inside the app', async () => {
    stubFetch({
      'GET /api/auth/me': apiError(401, 'UNAUTHENTICATED', 'Not signed in.'),
      'GET /api/dev/mailbox': { body: [invitationMail] },
      'GET /api/invitations/:token': { body: invitation },
    });
    const { user, router } = renderApp('/dev/mailbox');

    expect(await screen.findByRole('heading', { name: 'You are invited to Halvercote Yard' })).toBeInTheDocument();
    const invite = screen.getByRole('link', { name: 'http://127.0.0.1:4100/invitations/tok-123' });
    // The sentence's full stop is not part of the link.
    expect(invite).toHaveAttribute('href', 'http://127.0.0.1:4100/invitations/tok-123');
    const external = screen.getByRole('link', { name: 'https://help.example.org/start' });
    expect(external).toHaveAttribute('target', '_blank');
    expect(external).toHaveAttribute('rel', 'noopener noreferrer');

    await user.click(invite);
    await waitFor(() => expect(router.state.location.pathname).toBe('/invitations/tok-123'));
    expect(await screen.findByRole('button', { name: 'Set password' })).toBeInTheDocument();
  });

  it('shows a Mailbox link only where the mailbox answers (development)', async () => {
    const api = stubFetch({
      'GET /api/auth/me': apiError(401, 'UNAUTHENTICATED', 'Not signed in.'),
      'GET /api/dev/mailbox': { body: [] },
    });
    const { unmount } = renderApp('/dev/mailbox');
    expect(await screen.findByText(/Nothing sent yet/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Mailbox' })).toBeInTheDocument();
    unmount();

    api.set({ 'GET /api/dev/mailbox': apiError(404, 'NOT_FOUND', 'Not found.') });
    renderApp('/no-such-page');
    expect(await screen.findByText('Page not found')).toBeInTheDocument();
    expect(screen.queryByRole('link', { name: 'Mailbox' })).not.toBeInTheDocument();
  });
});

import { screen, waitFor } from '@testing-library/react';
import type { ReviewerAssignments } from '@sagline/common/api-types';
import { apiError, stubFetch } from '@/testing/fetch-stub';
import { renderWithProviders, setCsrfCookie } from '@/testing/render';
import { AssignReviewerButton } from './assign-reviewer-button';

const assignments: ReviewerAssignments = {
  levels: [],
  members: [],
  candidates: [{ id: 3, name: 'Ilse Varga', email: 'ilse.varga@halvercote.example' }, { id: 8, name: 'Noor Haddad', email: 'noor.haddad@halvercote.example' }],
};

describe('AssignReviewerButton', () => {
  it('gives the members a checker of their own, then says so', async () => {
    setCsrfCookie('csrf-7');
    const api = stubFetch({
      'GET /api/projects/7/reviewer-assignments': { body: assignments },
      'PUT /api/projects/7/reviewer-assignments/members': (req) => ({ body: { marks: (req.body as { marks: string[] }).marks, reviewer: { id: 8, name: 'Noor Haddad' } } }),
    });
    const { user } = renderWithProviders(<AssignReviewerButton projectId={7} marks={['B1', 'B2']} />);
    await user.click(screen.getByRole('button', { name: /Assign reviewer/ }));
    await user.click(await screen.findByRole('combobox', { name: 'Reviewer of 2 members' }));
    await user.click(await screen.findByTitle('Noor Haddad'));
    await user.click(screen.getByRole('button', { name: 'Assign' }));
    expect(await screen.findByText('Noor Haddad now reviews 2 members.')).toBeInTheDocument();
    const [put] = api.calls('PUT /api/projects/7/reviewer-assignments/members');
    expect(put.body).toEqual({ marks: ['B1', 'B2'], reviewerId: 8 });
    expect(put.headers['x-csrf-token']).toBe('csrf-7');
  });

  it("shows the server's refusal in the dialogue", async () => {
    stubFetch({
      'GET /api/projects/7/reviewer-assignments': { body: assignments },
      'PUT /api/projects/7/reviewer-assignments/members': apiError(400, 'VALIDATION_FAILED', 'Some marks are not in revision 3: Z9. Nothing was assigned; correct or remove them.'),
    });
    const { user } = renderWithProviders(<AssignReviewerButton projectId={7} marks={['Z9']} />);
    await user.click(screen.getByRole('button', { name: /Assign reviewer/ }));
    await waitFor(() => expect(screen.getByRole('combobox', { name: 'Reviewer of Z9' })).toBeInTheDocument());
    await user.click(screen.getByRole('button', { name: 'Assign' }));
    expect(await screen.findByText('Some marks are not in revision 3: Z9. Nothing was assigned; correct or remove them.')).toBeInTheDocument();
  });
});

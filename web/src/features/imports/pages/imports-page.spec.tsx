import { screen, waitFor, within } from '@testing-library/react';
import type { Me } from '@sagline/common/api-types';
import { apiError, stubFetch, type StubRoutes } from '@/testing/fetch-stub';
import { checker, halvercote } from '@/testing/fixtures';
import { renderApp, setCsrfCookie } from '@/testing/render';
import { job, preview, revision1, revision1Detail, revision2, rowsInvalidDetails } from './imports-fixtures';

const engineer: Me = { id: 4, email: 'rafe.lindqvist@halvercote.example', name: 'Rafe Lindqvist', isAdmin: false };
const viewer: Me = { ...checker, id: 8, email: 'ola.brandt@halvercote.example', name: 'Ola Brandt' };

function importsApi(me: Me, myRole: Parameters<typeof halvercote>[0], more: StubRoutes = {}) {
  return stubFetch({
    'GET /api/auth/me': { body: { user: me } },
    'GET /api/projects/7': { body: halvercote(myRole) },
    'GET /api/projects/7/revisions': { body: [revision1] },
    'GET /api/projects/7/revisions/31': { body: revision1Detail },
    ...more,
  });
}

/**
 * A chosen file. Node's File, not jsdom's: the test window's FormData is
 * Node's (testing/jsdom-environment.cjs) and takes only its own Blobs, as a
 * browser's FormData takes the browser's files.
 */
const NodeFile = jest.requireActual<{ File: typeof File }>('node:buffer').File;
const xlsx = (name = 'halvercote-yard-rev-b.xlsx') =>
  new NodeFile(['PK fake workbook bytes'], name, {
    type: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet',
  });

/** The file input inside the drop zone. */
async function fileInput(): Promise<HTMLInputElement> {
  await screen.findByText('Drop the member schedule here, or click to choose it');
  return document.querySelector('input[type="file"]') as HTMLInputElement;
}

/** The body the page gave fetch for one request (the stub only reads JSON bodies). */
function sentBody(index: number): unknown {
  return (globalThis.fetch as jest.Mock).mock.calls[index][1]?.body;
}

describe('Imports', () => {
  it('posts the file as multipart with the CSRF header, and on a 422 lists every problem and says nothing was stored', async () => {
    setCsrfCookie('csrf-7');
    const api = importsApi(engineer, 'engineer', {
      'POST /api/projects/7/imports': apiError(422, 'IMPORT_ROWS_INVALID', 'The schedule has 2 errors; nothing was stored.', {
        error: 'Unprocessable Entity',
        details: rowsInvalidDetails,
      }),
    });
    const { user } = renderApp('/projects/7/imports');
    await user.upload(await fileInput(), xlsx());

    expect(await screen.findByText('Nothing was stored')).toBeInTheDocument();
    expect(screen.getByText('halvercote-yard-rev-b.xlsx: 2 errors, 1 warning, listed below.')).toBeInTheDocument();

    const [post] = api.calls('POST /api/projects/7/imports');
    expect(post.headers['x-csrf-token']).toBe('csrf-7');
    expect(post.headers['content-type']).toBeUndefined();
    const body = sentBody(api.requests.indexOf(post));
    expect(body).toBeInstanceOf(FormData);
    expect(((body as FormData).get('file') as File).name).toBe('halvercote-yard-rev-b.xlsx');

    const table = screen.getByRole('table', { name: 'Problems of the upload' });
    const row = within(table).getByText('about 180').closest('tr') as HTMLElement;
    expect(within(row).getByText('Error')).toBeInTheDocument();
    expect(within(row).getByText('Members')).toBeInTheDocument();
    expect(within(row).getByText('14')).toBeInTheDocument();
    expect(within(row).getByText('I [10^6 mm^4] (column L)')).toBeInTheDocument();
    expect(within(row).getByText('I must be a number (e.g. 186); write the value without words.')).toBeInTheDocument();
    const loads = within(table).getByText(/beyond the 7\.2 m member/).closest('tr') as HTMLElement;
    expect(within(loads).getByText('Loads')).toBeInTheDocument();
    expect(within(loads).getByText('Position [m] (column D)')).toBeInTheDocument();
    const warning = within(table).getByText(/Camber is given/).closest('tr') as HTMLElement;
    expect(within(warning).getByText('Warning')).toBeInTheDocument();
    expect(within(warning).getByText('whole row')).toBeInTheDocument();
    // Nothing to commit: no preview appeared.
    expect(screen.queryByRole('button', { name: /Commit as revision/ })).not.toBeInTheDocument();

    // Only the warnings, by the severity filter.
    await user.click(within(table).getByRole('button', { name: /filter/i }));
    await user.click(await screen.findByText('Warnings'));
    await user.click(screen.getByRole('button', { name: 'OK' }));
    await waitFor(() => expect(within(table).queryByText('about 180')).not.toBeInTheDocument());
    expect(within(table).getByText(/Camber is given/)).toBeInTheDocument();
  });

  it('explains a file that is too large in the words of the server', async () => {
    importsApi(engineer, 'engineer', {
      'POST /api/projects/7/imports': {
        status: 413,
        body: {
          statusCode: 413,
          error: 'Payload Too Large',
          code: 'PAYLOAD_TOO_LARGE',
          message: 'The file is larger than the 20 MB upload limit. Remove sheets other than Members and Loads.',
        },
      },
    });
    const { user } = renderApp('/projects/7/imports');
    await user.upload(await fileInput(), xlsx('huge.xlsx'));
    expect(await screen.findByText('The file is too large')).toBeInTheDocument();
    expect(screen.getByText(/larger than the 20 MB upload limit/)).toBeInTheDocument();
    expect(screen.getByText('huge.xlsx: nothing was stored.')).toBeInTheDocument();
  });

  it('previews the draft: counts, the flip pass → fail, field changes; commits with a label to the draft route', async () => {
    setCsrfCookie('csrf-7');
    const api = importsApi(engineer, 'engineer', {
      'POST /api/projects/7/imports': { status: 201, body: preview },
      'POST /api/projects/7/imports/:draftId/commit': { status: 201, body: { revision: revision2 } },
    });
    const { user } = renderApp('/projects/7/imports');
    await user.upload(await fileInput(), xlsx());

    const verdicts = await screen.findByRole('group', { name: 'Verdicts of the draft' });
    expect(within(verdicts).getByText('376')).toBeInTheDocument();
    expect(within(verdicts).getByText('15')).toBeInTheDocument();
    expect(screen.getAllByText(/does not replace the engineer of record's judgement or the local building code/).length).toBeGreaterThan(1);
    expect(screen.getByText(/Against revision 1, “Rev A, scheme design”: 0 added, 0 removed, 1 changed, 390 unchanged/)).toBeInTheDocument();
    expect(screen.getByText('1 now fails.')).toBeInTheDocument();

    // Opens on the flips.
    const flips = screen.getByRole('table', { name: 'Verdicts that flip' });
    const flip = within(flips).getByText('L1-B03').closest('tr') as HTMLElement;
    expect(within(flip).getByText('Pass → Fail (now fails)')).toBeInTheDocument();
    expect(within(flip).getByText('L/240 total')).toBeInTheDocument();
    // The utilisation as a number alone (no bar here), with its words for a screen reader.
    expect(within(flip).getByText('8.60')).toBeInTheDocument();
    expect(within(flip).getByRole('img', { name: 'utilisation 8.60, over the limit' })).toBeInTheDocument();
    expect(within(flip).queryByTestId('utilisation-bar')).not.toBeInTheDocument();
    expect(screen.getByRole('tab', { name: 'Verdicts that flip (1)' })).toBeInTheDocument();

    await user.click(screen.getByRole('tab', { name: 'Changed (1)' }));
    const changed = await screen.findByRole('table', { name: 'Changed members' });
    expect(within(changed).getByText(/186 ×10⁶ mm⁴ → 18\.6 ×10⁶ mm⁴/)).toBeInTheDocument();
    const changedRow = within(changed).getByText('L1-B03').closest('tr') as HTMLElement;
    expect(within(changedRow).getByText('Pass')).toBeInTheDocument();
    expect(within(changedRow).getByText('Fail')).toBeInTheDocument();
    await user.click(screen.getByRole('tab', { name: 'Added (0)' }));
    expect(await screen.findByText('No member added.')).toBeInTheDocument();

    await user.type(screen.getByLabelText('Revision label (optional)'), 'Rev B, issued for permit');
    await user.click(screen.getByRole('button', { name: 'Commit as revision 2' }));

    expect(await screen.findByText('Revision 2 committed: Rev B, issued for permit.')).toBeInTheDocument();
    const [commit] = api.calls('POST /api/projects/7/imports/:draftId/commit');
    expect(commit.path).toBe('/api/projects/7/imports/draft-9f2/commit');
    expect(commit.body).toEqual({ label: 'Rev B, issued for permit' });
    expect(commit.headers['x-csrf-token']).toBe('csrf-7');
    // The preview is gone and the revisions are fetched again.
    expect(screen.queryByRole('button', { name: /Commit as revision/ })).not.toBeInTheDocument();
    await waitFor(() => expect(api.calls('GET /api/projects/7/revisions').length).toBeGreaterThan(1));
  });

  it('discards a draft on request: DELETE to its route, and the preview goes', async () => {
    setCsrfCookie('csrf-7');
    const api = importsApi(engineer, 'engineer', {
      'POST /api/projects/7/imports': { status: 201, body: preview },
      'DELETE /api/projects/7/imports/:draftId': { status: 204 },
    });
    const { user } = renderApp('/projects/7/imports');
    await user.upload(await fileInput(), xlsx());
    await user.click(await screen.findByRole('button', { name: 'Discard' }));
    await user.click(within(await screen.findByRole('tooltip')).getByRole('button', { name: 'Discard' }));

    expect(await screen.findByText('The upload was discarded; no revision was made.')).toBeInTheDocument();
    const [discard] = api.calls('DELETE /api/projects/7/imports/:draftId');
    expect(discard.path).toBe('/api/projects/7/imports/draft-9f2');
    expect(discard.headers['x-csrf-token']).toBe('csrf-7');
    expect(screen.queryByRole('button', { name: /Commit as revision/ })).not.toBeInTheDocument();
    expect(api.calls('POST /api/projects/7/imports/:draftId/commit')).toHaveLength(0);
  });

  it('polls a background commit about once a second and shows its progress until it is done', async () => {
    let polls = 0;
    const api = importsApi(engineer, 'manager', {
      'POST /api/projects/7/imports': { status: 201, body: preview },
      'POST /api/projects/7/imports/:draftId/commit': { status: 202, body: { jobId: 'job-5' } },
      'GET /api/projects/7/imports/jobs/:jobId': () => {
        polls += 1;
        return { body: polls === 1 ? job({}) : job({ state: 'completed', progress: 1, step: null, result: { revision: revision2 } }) };
      },
    });
    const { user } = renderApp('/projects/7/imports');
    await user.upload(await fileInput(), xlsx());
    await user.click(await screen.findByRole('button', { name: 'Commit as revision 2' }));

    const bar = await screen.findByRole('progressbar', { name: 'Commit progress' });
    expect(bar).toHaveAttribute('aria-valuenow', '40');
    expect(screen.getByText('Writing results')).toBeInTheDocument();
    api.set({ 'GET /api/projects/7/revisions': { body: [revision2, revision1] } });

    expect(await screen.findByText('Revision 2 committed: Rev B, issued for permit.')).toBeInTheDocument();
    expect(api.calls('GET /api/projects/7/imports/jobs/:jobId')[0].path).toBe('/api/projects/7/imports/jobs/job-5');
    expect(polls).toBe(2);
    const list = screen.getByRole('table', { name: 'Revisions' });
    const newest = (await within(list).findByText('Rev B, issued for permit')).closest('tr') as HTMLElement;
    expect(within(newest).getByText('Current')).toBeInTheDocument();
  });

  it('shows a queued commit waiting, a restarted one with its attempt, and a failed one with its message', async () => {
    let polls = 0;
    importsApi(engineer, 'manager', {
      'POST /api/projects/7/imports': { status: 201, body: preview },
      'POST /api/projects/7/imports/:draftId/commit': { status: 202, body: { jobId: 'job-5' } },
      'GET /api/projects/7/imports/jobs/:jobId': () => {
        polls += 1;
        if (polls === 1) return { body: job({ state: 'queued', progress: 0, step: null }) };
        if (polls === 2) return { body: job({ step: null, progress: 0.1, attempts: 2 }) };
        return {
          body: job({ state: 'failed', attempts: 2, error: { statusCode: 409, code: 'CONFLICT', message: 'The limit set changed while the commit ran. Upload the file again.' } }),
        };
      },
    });
    const { user } = renderApp('/projects/7/imports');
    await user.upload(await fileInput(), xlsx());
    await user.click(await screen.findByRole('button', { name: 'Commit as revision 2' }));

    expect(await screen.findByText('Waiting for its turn…', {}, { timeout: 4000 })).toBeInTheDocument();
    expect(screen.getByRole('progressbar', { name: 'Commit progress' })).toHaveAttribute('aria-valuenow', '0');
    expect(await screen.findByText('Committing…', {}, { timeout: 4000 })).toBeInTheDocument();
    expect(screen.getByRole('progressbar', { name: 'Commit progress' })).toHaveAttribute('aria-valuenow', '10');
    expect(screen.getByText('Started again after an interruption (attempt 2).')).toBeInTheDocument();

    expect(await screen.findByText('The commit did not finish; nothing was stored', {}, { timeout: 4000 })).toBeInTheDocument();
    expect(screen.getByText('The limit set changed while the commit ran. Upload the file again.')).toBeInTheDocument();
    expect(screen.queryByRole('progressbar', { name: 'Commit progress' })).not.toBeInTheDocument();
    expect(screen.queryByText(/Revision 2 committed/)).not.toBeInTheDocument();
  });

  it('shows a viewer the revisions read-only: no upload area, downloads and the parse report', async () => {
    importsApi(viewer, 'viewer');
    const { user } = renderApp('/projects/7/imports');
    const list = await screen.findByRole('table', { name: 'Revisions' });
    const row = (await within(list).findByText('Rev A, scheme design')).closest('tr') as HTMLElement;

    expect(screen.queryByText('Drop the member schedule here, or click to choose it')).not.toBeInTheDocument();
    expect(document.querySelector('input[type="file"]')).toBeNull();
    expect(screen.getByText('Engineers and managers upload new revisions.')).toBeInTheDocument();

    expect(within(row).getByText('Kasimir Oduya')).toBeInTheDocument();
    expect(within(row).getByText('391')).toBeInTheDocument();
    expect(within(row).getByText('14')).toBeInTheDocument();
    expect(within(row).getByText('Current')).toBeInTheDocument();
    expect(within(row).getByRole('link', { name: 'Original file of revision 1' })).toHaveAttribute('href', '/api/projects/7/revisions/31/file');
    expect(within(row).getByRole('link', { name: 'Results workbook of revision 1' })).toHaveAttribute(
      'href',
      '/api/projects/7/revisions/31/results.xlsx',
    );
    expect(screen.getByRole('link', { name: 'Download blank template' })).toHaveAttribute('href', '/api/projects/7/imports/template');

    await user.click(within(row).getByRole('button', { name: 'Details of revision 1' }));
    const drawer = await screen.findByRole('dialog');
    expect(await within(drawer).findByText(/old\.reviewer@halvercote\.example is not on the team/)).toBeInTheDocument();
    expect(within(drawer).getByText('The first revision of the project.')).toBeInTheDocument();
  });
});

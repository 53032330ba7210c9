import { screen, waitFor, within } from '@testing-library/react';
import type { Me } from '@sagline/common/api-types';
import { apiError, stubFetch, type StubRoutes } from '@/testing/fetch-stub';
import { halvercote, manager } from '@/testing/fixtures';
import { renderApp, setCsrfCookie } from '@/testing/render';
import { activeSet, overview, stricterSet } from './limit-sets-fixtures';

// Whole-app renders with antd forms: slow on a shared machine.
jest.setTimeout(45_000);

const viewer: Me = { id: 8, email: 'ola.brandt@halvercote.example', name: 'Ola Brandt', isAdmin: false };

function limitSetsApi(me: Me, myRole: Parameters<typeof halvercote>[0], canEdit: boolean, more: StubRoutes = {}) {
  return stubFetch({
    'GET /api/auth/me': { body: { user: me } },
    'GET /api/projects/7': { body: halvercote(myRole) },
    'GET /api/projects/7/limit-sets': { body: overview(canEdit) },
    ...more,
  });
}

const activeCard = async () => (await screen.findByText(`In use: ${activeSet.name}`)).closest('.ant-card') as HTMLElement;

describe('Limit sets', () => {
  it('shows a viewer the set in use with the source of every rule and the caution, and no way to change anything', async () => {
    limitSetsApi(viewer, 'viewer', false);
    renderApp('/projects/7/limit-sets');
    const card = await activeCard();
    const table = within(card).getByRole('table', { name: `Rules of ${activeSet.name}` });
    const live = within(table).getByText('L/360 live').closest('tr') as HTMLElement;
    expect(within(live).getByText('span/360')).toBeInTheDocument();
    expect(within(live).getByText('International Building Code (IBC), 2021')).toBeInTheDocument();
    expect(within(live).getByText('Table 1604.3, floor members, L column')).toBeInTheDocument();
    expect(within(live).getByText('from memory')).toBeInTheDocument();
    // The cap in the project's units (SI): 0.3 in = 7.62 mm.
    const masonry = within(table).getByText('L/600 total, 0.3 in max').closest('tr') as HTMLElement;
    expect(within(masonry).getByText(/span\/600, at most 7\.6 mm/)).toBeInTheDocument();
    expect(within(card).getByText('verdicts follow this set')).toBeInTheDocument();
    expect(screen.getAllByText(/does not replace the engineer of record's judgement or the local building code/).length).toBeGreaterThan(0);

    expect(screen.queryByRole('button', { name: 'Edit rules' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Use this set' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Copy into project' })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: 'Copy' })).not.toBeInTheDocument();
    expect(screen.getByText(/Managers and admins copy, edit, choose and delete limit sets/)).toBeInTheDocument();
    // The presets are there to browse.
    expect(screen.getByRole('table', { name: /Rules of the preset IBC 2021/ })).toBeInTheDocument();
  });

  it('validates an edit in the form (nothing sent), then puts the server\'s problems next to their fields', async () => {
    setCsrfCookie('csrf-7');
    const api = limitSetsApi(manager, 'manager', true, {
      'PUT /api/projects/7/limit-sets/:setId': apiError(400, 'VALIDATION_FAILED', 'The limit set was not saved: one problem, first body.rules[1].source.clause: is required: the clause the limit comes from', {
        details: [{ path: 'body.rules[1].source.clause', message: 'is required: the clause the limit comes from' }],
      }),
    });
    const { user } = renderApp('/projects/7/limit-sets');
    const card = await activeCard();
    await user.click(within(card).getByRole('button', { name: 'Edit rules' }));
    const form = await screen.findByRole('form', { name: `Edit ${activeSet.name}` });

    const ratio = within(form).getByRole('spinbutton', { name: 'Ratio of rule 1' });
    await user.clear(ratio);
    const combination = within(form).getByRole('textbox', { name: 'Combination of rule 2' });
    await user.clear(combination);
    await user.type(combination, 'D+L/2');
    const document = within(form).getByRole('textbox', { name: 'Source document of rule 3' });
    await user.clear(document);
    await user.click(within(form).getByRole('button', { name: 'Save and recompute' }));

    expect(await within(form).findByText('Give n of span/n, e.g. 360.')).toBeInTheDocument();
    expect(within(form).getByText('"L/2" is not a factor and a load case; write e.g. "0.5D" or "L".')).toBeInTheDocument();
    expect(within(form).getByText('Name the document the limit comes from.')).toBeInTheDocument();
    expect(api.calls('PUT /api/projects/7/limit-sets/:setId')).toHaveLength(0);

    await user.type(ratio, '-5');
    await user.click(within(form).getByRole('button', { name: 'Save and recompute' }));
    expect(await within(form).findByText('The ratio must be above zero.')).toBeInTheDocument();
    expect(api.calls('PUT /api/projects/7/limit-sets/:setId')).toHaveLength(0);

    // Fixed: the confirmation says the verdicts will be recomputed; the server's problem lands on its field.
    await user.clear(ratio);
    await user.type(ratio, '480');
    // An allowance added to span/n (as IBC §1604.3.7's l/240 + 1/4 in), in the project's millimetres.
    await user.type(within(form).getByRole('spinbutton', { name: 'Allowance of rule 1' }), '6.35');
    await user.clear(combination);
    await user.type(combination, 'L');
    await user.type(document, 'Halvercote Yard basis of design');
    await user.click(within(form).getByRole('button', { name: 'Save and recompute' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getByText(/verdicts of revision 1 \(391 members\) will be recomputed/)).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Save and recompute' }));

    expect(await within(form).findByText('Is required: the clause the limit comes from')).toBeInTheDocument();
    const [put] = api.calls('PUT /api/projects/7/limit-sets/:setId');
    expect(put.path).toBe('/api/projects/7/limit-sets/11');
    expect(put.headers['x-csrf-token']).toBe('csrf-7');
    const sent = put.body as { version: number; rules: { id: string; ratio: number; combination: Record<string, number>; maxAbs: number | null; source: { document: string } }[] };
    expect(sent.version).toBe(1);
    expect(sent.rules[0]).toMatchObject({ id: 'floor.live', ratio: 480, combination: { L: 1 } });
    expect(sent.rules[2]).toMatchObject({ id: 'supports-masonry.total', source: { document: 'Halvercote Yard basis of design' } });
    // The cap went back in metres, as it came.
    expect(sent.rules[2].maxAbs).toBeCloseTo(0.00762, 12);
    const plus = (sent.rules as unknown as { plus: number | null }[]).map((r) => r.plus);
    expect(plus[0]).toBeCloseTo(0.00635, 12);
    expect(plus.slice(1).every((p) => p === null)).toBe(true);
    // Typing into many antd fields is slow on a shared machine.
  }, 45_000);

  it('uses another set after a confirmation, follows the background job, and says which verdicts flipped', async () => {
    setCsrfCookie('csrf-7');
    let polls = 0;
    const api = limitSetsApi(manager, 'manager', true, {
      'POST /api/projects/7/limit-sets/:setId/use': { status: 202, body: { jobId: '6f1c1f0e-2b7a-4c55-9a57-1d3f3b8f0a11' } },
      'GET /api/projects/7/limit-sets/jobs/:jobId': () => {
        polls++;
        const base = { jobId: '6f1c1f0e-2b7a-4c55-9a57-1d3f3b8f0a11', kind: 'use', limitSetId: 12, attempts: 1, createdAt: '2026-12-02T10:00:00Z', updatedAt: '2026-12-02T10:00:01Z' };
        if (polls === 1) return { body: { ...base, state: 'running', progress: 0.4, step: 'Checking members' } };
        return {
          body: {
            ...base,
            state: 'completed',
            progress: 1,
            step: 'Done',
            result: {
              set: { ...stricterSet, active: true },
              recompute: { revisionId: 31, revisionNumber: 1, memberCount: 391, before: { pass: 363, fail: 28 }, after: { pass: 361, fail: 30, unchecked: 0 }, flipped: [{ mark: 'B12', level: 'L3', from: 'pass', to: 'fail' }, { mark: 'B14', level: 'L3', from: 'pass', to: 'fail' }], flippedCount: 2, signOffsVoided: ['L3'], flagsNoted: 1 },
            },
          },
        };
      },
    });
    const { user } = renderApp('/projects/7/limit-sets');
    await activeCard();
    await user.click(screen.getByRole('button', { name: 'Use this set' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getAllByText(`Use "${stricterSet.name}" for this project?`).length).toBeGreaterThan(0);
    await user.click(within(dialog).getByRole('button', { name: 'Use this set and recompute' }));

    expect(await screen.findByText('Recomputing the results: Checking members…')).toBeInTheDocument();
    expect(screen.getByRole('progressbar', { name: 'Recompute progress' })).toBeInTheDocument();
    expect(await screen.findByText(`Revision 1 now follows "${stricterSet.name}".`, {}, { timeout: 4000 })).toBeInTheDocument();
    expect(screen.getByText(/391 members recomputed: 28 → 30 failing, 2 verdicts flipped: B12 pass → fail, B14 pass → fail/)).toBeInTheDocument();
    expect(screen.getByText('1 flag on a flipped member got a note; their assignees are e-mailed.')).toBeInTheDocument();
    expect(screen.getByText('Sign-off voided on L3: that level needs signing off again.')).toBeInTheDocument();
    const [use] = api.calls('POST /api/projects/7/limit-sets/:setId/use');
    expect(use.path).toBe('/api/projects/7/limit-sets/12/use');
    expect(use.body).toEqual({ version: 2 });
    await waitFor(() => expect(api.calls('GET /api/projects/7/limit-sets').length).toBeGreaterThan(1));
  });

  it('follows a change already running when the page opens, and says so when it fails', async () => {
    let polls = 0;
    const jobId = '0b6d2a7e-5c1f-4e8a-9d3b-7f2e1c4a5b60';
    const base = { jobId, kind: 'edit', limitSetId: 12, attempts: 1, createdAt: '2026-12-02T10:00:00Z', updatedAt: '2026-12-02T10:00:01Z' };
    const api = limitSetsApi(manager, 'manager', true, {
      'GET /api/projects/7/limit-sets': { body: { ...overview(true), openJob: { ...base, state: 'queued', progress: 0, step: null } } },
      'GET /api/projects/7/limit-sets/jobs/:jobId': () => {
        polls++;
        if (polls === 1) return { body: { ...base, state: 'queued', progress: 0, step: null } };
        return { body: { ...base, state: 'failed', progress: 0.2, step: null, error: { statusCode: 500, code: 'INTERNAL', message: 'The recompute stopped at member B12.' } } };
      },
    });
    renderApp('/projects/7/limit-sets');

    expect(await screen.findByText('Waiting for its turn…', {}, { timeout: 4000 })).toBeInTheDocument();
    expect(screen.getByRole('progressbar', { name: 'Recompute progress' })).toHaveAttribute('aria-valuenow', '0');
    expect(screen.getByText('The verdicts on every screen change all at once when it completes; until then they follow the set as it was.')).toBeInTheDocument();

    expect(await screen.findByText('The change was not applied; nothing was stored', {}, { timeout: 4000 })).toBeInTheDocument();
    // Said in the failed card and again in a message.
    expect((await screen.findAllByText('The recompute stopped at member B12.')).length).toBeGreaterThanOrEqual(1);
    expect(screen.queryByRole('progressbar', { name: 'Recompute progress' })).not.toBeInTheDocument();
    expect(api.calls('GET /api/projects/7/limit-sets/jobs/:jobId')[0].path).toBe(`/api/projects/7/limit-sets/jobs/${jobId}`);
    // The page reloads the sets after a failure.
    await waitFor(() => expect(api.calls('GET /api/projects/7/limit-sets').length).toBeGreaterThan(1));
  });

  it('copies a preset into the project and opens it for editing', async () => {
    setCsrfCookie('csrf-7');
    const copy = { ...stricterSet, id: 13, name: 'IBC 2021 (Table 1604.3, glass, masonry) (project copy)', version: 1 };
    let copied = false;
    const api = limitSetsApi(manager, 'manager', true, {
      'POST /api/projects/7/limit-sets': () => {
        copied = true;
        return { status: 201, body: copy };
      },
      'GET /api/projects/7/limit-sets': () => ({ body: copied ? { ...overview(true), projectSets: [activeSet, stricterSet, copy] } : overview(true) }),
    });
    const { user } = renderApp('/projects/7/limit-sets');
    await activeCard();
    await user.click(screen.getByRole('button', { name: 'Copy into project' }));
    expect(await screen.findByText(`Copied the preset "IBC 2021 (Table 1604.3, glass, masonry)" into the project as "${copy.name}".`)).toBeInTheDocument();
    expect(api.calls('POST /api/projects/7/limit-sets')[0].body).toEqual({ fromPreset: 'ibc-2021' });
    expect(await screen.findByRole('form', { name: `Edit ${copy.name}` })).toBeInTheDocument();
  });

  it('deletes a set the project does not use after a confirmation; the set in use has no Delete', async () => {
    setCsrfCookie('csrf-7');
    let deleted = false;
    const api = limitSetsApi(manager, 'manager', true, {
      'DELETE /api/projects/7/limit-sets/:setId': () => {
        deleted = true;
        return { status: 204 };
      },
      'GET /api/projects/7/limit-sets': () => ({ body: deleted ? { ...overview(true), projectSets: [activeSet] } : overview(true) }),
    });
    const { user } = renderApp('/projects/7/limit-sets');
    const card = await activeCard();
    expect(within(card).queryByRole('button', { name: 'Delete' })).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Delete' }));
    const dialog = await screen.findByRole('dialog');
    expect(within(dialog).getAllByText(`Delete "${stricterSet.name}"?`).length).toBeGreaterThan(0);
    expect(within(dialog).getByText(/Revisions checked against it keep their own copy of its rules/)).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Delete the set' }));
    expect(await screen.findByText(`Deleted "${stricterSet.name}".`)).toBeInTheDocument();
    expect(api.calls('DELETE /api/projects/7/limit-sets/:setId')[0].path).toBe(`/api/projects/7/limit-sets/${stricterSet.id}`);
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Delete' })).not.toBeInTheDocument());
  });

  it('says why the server refused a delete', async () => {
    setCsrfCookie('csrf-7');
    limitSetsApi(manager, 'manager', true, {
      'DELETE /api/projects/7/limit-sets/:setId': apiError(409, 'CONFLICT', `A change to "${stricterSet.name}" is being applied right now; wait for it to finish, then delete the set if you still want to.`),
    });
    const { user } = renderApp('/projects/7/limit-sets');
    await activeCard();
    await user.click(screen.getByRole('button', { name: 'Delete' }));
    await user.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Delete the set' }));
    expect(await screen.findByText(/is being applied right now; wait for it to finish/)).toBeInTheDocument();
  });
});

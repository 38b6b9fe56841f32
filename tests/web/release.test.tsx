/**
 * Releasing a model revision against a fake API: a lead releases with a note and withdraws after a
 * confirmation from the revision timeline; roles without models:release see no controls; the
 * released badge (icon and the word) on the timeline and on the fit-run page.
 */
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { permissionsOf, type Role } from '../../api/auth/permissions';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

vi.mock('plotly.js-dist-min', () => ({ default: {} }));
vi.mock('react-plotly.js/factory', () => ({ default: () => () => <div data-testid="plotly" /> }));

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const me = (role: Role) => ({
  user: { id: 3, email: `${role}@example.org`, displayName: `A ${role}`, role },
  permissions: permissionsOf(role), // the API's own table (api/auth/permissions.ts)
});

// Invented pulsar and revisions in the shapes of docs/api-workflow.md.
const PULSAR = {
  id: 4, name: 'J0444+4444', raHms: '04:44:44.4', decDms: '+44:44:44', toaCount: 10, firstMjd: '57000.125', lastMjd: '59000.5',
  observatories: ['obs-a'], createdAt: '2026-11-01T00:00:00Z', revisionCount: 2, latestFit: null,
};
interface RevisionRow {
  id: number; pulsarId: number; parentId: number | null; author: { id: number; displayName: string } | null; message: string; createdAt: string;
  releasedAt: string | null; releasedBy: { id: number; displayName: string } | null; releaseNote: string | null;
}
const revisions = (): RevisionRow[] => [
  { id: 9, pulsarId: 4, parentId: 8, author: { id: 5, displayName: 'Ana Analyst' }, message: 'Fit spin-down', createdAt: '2026-11-25T09:00:00Z', releasedAt: null, releasedBy: null, releaseNote: null },
  { id: 8, pulsarId: 4, parentId: null, author: { id: 5, displayName: 'Ana Analyst' }, message: 'First model', createdAt: '2026-11-21T09:00:00Z', releasedAt: '2026-11-22T09:00:00Z', releasedBy: { id: 3, displayName: 'Lee Lead' }, releaseNote: 'good start' },
];

function pulsarRoutes(role: Role, rows: RevisionRow[], extra: Parameters<typeof mockApi>[0] = {}) {
  return {
    'GET /api/auth/me': ok(me(role)),
    'GET /api/auth/csrf': ok({ token: 'tok' }),
    'GET /api/pulsars/:id': ok(PULSAR),
    'GET /api/pulsars/:id/toa-batches': ok([]),
    'GET /api/pulsars/:id/revisions': () => ok(rows),
    'GET /api/pulsars/:id/fit-runs': ok([]),
    'GET /api/pulsars/:id/comparisons': ok([]),
    'GET /api/notifications': ok({ pulsarIds: [], campaignIds: [] }),
    ...extra,
  };
}

async function timelineEntries() {
  const timeline = await screen.findByRole('list', { name: 'Model revisions' });
  return within(timeline).getAllByRole('listitem');
}

describe('releasing a revision', () => {
  it('lets a lead release a revision with a note, then shows it released with who, when and the note', async () => {
    const rows = revisions();
    const server = mockApi(
      pulsarRoutes('lead', rows, {
        'POST /api/revisions/:id/release': (call, params) => {
          const row = rows.find((r) => String(r.id) === params.id)!;
          Object.assign(row, { releasedAt: '2026-12-01T14:00:00Z', releasedBy: { id: 3, displayName: 'Lee Lead' }, releaseNote: (call.body as { note: string }).note });
          return ok(row);
        },
      }),
    );
    const { user } = renderApp('/pulsars/4');
    let [newest] = await timelineEntries();
    expect(within(newest).queryByText('released')).toBeNull();
    await user.click(within(newest).getByRole('button', { name: 'Release #9…' }));
    const form = within(newest).getByRole('form', { name: 'Release revision #9' });
    await user.click(within(form).getByRole('button', { name: 'Release revision #9' }));
    expect(within(form).getByText(/Release note: say in a few words/)).toBeTruthy();
    expect(server.callsTo('POST', '/api/revisions/9/release')).toHaveLength(0);

    await user.type(within(form).getByLabelText('Release note'), ' ready for the campaign ');
    await user.click(within(form).getByRole('button', { name: 'Release revision #9' }));
    await waitFor(() => expect(server.callsTo('POST', '/api/revisions/9/release')).toHaveLength(1));
    const call = server.callsTo('POST', '/api/revisions/9/release')[0];
    expect(call.body).toEqual({ note: 'ready for the campaign' });
    expect(call.headers['x-csrf-token']).toBe('tok');

    await waitFor(async () => {
      [newest] = await timelineEntries();
      expect(within(newest).getByText('released')).toBeTruthy();
    });
    expect(newest.textContent).toContain('Released 1 Dec 2026, 14:00 UTC by Lee Lead: “ready for the campaign”');
    expect(within(newest).queryByRole('form')).toBeNull();
    expect(within(newest).queryByRole('group', { name: /Withdraw the release/ })).toBeNull(); // the panel closed, not swapped
    expect(within(newest).getByRole('button', { name: 'Withdraw release of #9…' })).toBeTruthy();
  });

  it('withdraws a release only after a confirmation, and can be talked out of it', async () => {
    const rows = revisions();
    const server = mockApi(
      pulsarRoutes('admin', rows, {
        'POST /api/revisions/:id/withdraw-release': (_call, params) => {
          const row = rows.find((r) => String(r.id) === params.id)!;
          Object.assign(row, { releasedAt: null, releasedBy: null, releaseNote: null });
          return ok(row);
        },
      }),
    );
    const { user } = renderApp('/pulsars/4');
    let [, older] = await timelineEntries();
    expect(within(older).getByText('released').getAttribute('title')).toBe('good start');
    expect(older.textContent).toContain('Released 22 Nov 2026, 09:00 UTC by Lee Lead: “good start”');

    await user.click(within(older).getByRole('button', { name: 'Withdraw release of #8…' }));
    await user.click(within(older).getByRole('button', { name: 'Keep it released' }));
    expect(server.callsTo('POST', '/api/revisions/8/withdraw-release')).toHaveLength(0);

    await user.click(within(older).getByRole('button', { name: 'Withdraw release of #8…' }));
    const confirm = within(older).getByRole('group', { name: 'Withdraw the release of revision #8' });
    expect(confirm.textContent).toContain('The revision itself stays unchanged.');
    await user.click(within(confirm).getByRole('button', { name: 'Withdraw release' }));
    await waitFor(async () => {
      [, older] = await timelineEntries();
      expect(within(older).queryByText('released')).toBeNull();
    });
    expect(server.callsTo('POST', '/api/revisions/8/withdraw-release')).toHaveLength(1);
    expect(within(older).getByRole('button', { name: 'Release #8…' })).toBeTruthy();
  });

  it('shows the API’s refusal (already released) and releases nothing', async () => {
    mockApi(pulsarRoutes('lead', revisions(), { 'POST /api/revisions/:id/release': fail(409, 'conflict', 'revision 9 is already released') }));
    const { user } = renderApp('/pulsars/4');
    const [newest] = await timelineEntries();
    await user.click(within(newest).getByRole('button', { name: 'Release #9…' }));
    await user.type(within(newest).getByLabelText('Release note'), 'again');
    await user.click(within(newest).getByRole('button', { name: 'Release revision #9' }));
    expect((await within(newest).findByRole('alert')).textContent).toBe('revision 9 is already released');
    expect(within(newest).queryByText('released')).toBeNull();
  });

  it.each(['viewer', 'analyst'] as const)('role %s: sees the released badge but no release or withdraw controls', async (role) => {
    mockApi(pulsarRoutes(role, revisions()));
    renderApp('/pulsars/4');
    const [newest, older] = await timelineEntries();
    expect(within(older).getByText('released')).toBeTruthy();
    expect(within(newest).queryByRole('button', { name: /Release|Withdraw/ })).toBeNull();
    expect(within(older).queryByRole('button', { name: /Release|Withdraw/ })).toBeNull();
  });
});

describe('released badge on the fit-run page', () => {
  const run = {
    id: 31, pulsarId: 4, revisionId: 8, campaignId: null, inputsHash: 'h31', status: 'failed', progress: { percent: 100, stage: 'failed' },
    settings: { ephemeris: 'DE405' }, toaCount: 10, excludedCount: 0, requestedBy: null, queuedAt: '2026-12-01T11:00:00Z', startedAt: null,
    finishedAt: '2026-12-01T11:00:05Z', durationMs: 10, errorMessage: 'no TOAs', result: null,
  };

  it('marks the run whose revision is released, with the note as its hover text', async () => {
    mockApi({ 'GET /api/auth/me': ok(me('viewer')), 'GET /api/fit-runs/:id': ok(run), 'GET /api/revisions/:id': ok({ ...revisions()[1], model: {} }) });
    renderApp('/fit-runs/31');
    const badge = await screen.findByText('released');
    expect(badge.getAttribute('title')).toBe('Released 22 Nov 2026, 09:00 UTC by Lee Lead: “good start”');
  });

  it('shows no badge for an unreleased revision', async () => {
    const server = mockApi({ 'GET /api/auth/me': ok(me('viewer')), 'GET /api/fit-runs/:id': ok({ ...run, revisionId: 9 }), 'GET /api/revisions/:id': ok({ ...revisions()[0], model: {} }) });
    renderApp('/fit-runs/31');
    await screen.findByRole('heading', { name: 'Fit run #31' });
    await waitFor(() => expect(server.callsTo('GET', '/api/revisions/9')).toHaveLength(1));
    await new Promise((resolve) => setTimeout(resolve, 50));
    expect(screen.queryByText('released')).toBeNull();
  });
});

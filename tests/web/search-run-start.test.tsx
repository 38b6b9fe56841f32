import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

vi.mock('plotly.js-dist-min', () => ({ default: {} }));
vi.mock('react-plotly.js/factory', () => ({ default: () => () => <div data-testid="plotly" /> }));

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Role "analyst" with the permissions api/auth/permissions.ts gives it.
const ANALYST_ME = {
  user: { id: 3, email: 'ana@example.org', displayName: 'Ana Analyst', role: 'analyst' },
  permissions: ['observatories:read', 'pulsars:read', 'pulsars:create', 'jobs:start', 'jobs:read', 'toas:upload', 'toas:exclude', 'models:edit', 'fits:run', 'searches:run'],
};

// Invented demo data in the shapes of api/contracts/search-runs.ts and docs/api-workflow.md.
const PULSAR = {
  id: 4, name: 'J0444+4444', raHms: '04:44:44.4', decDms: '+44:44:44', toaCount: 1300, firstMjd: '57000.125', lastMjd: '59000.5',
  observatories: ['obs-a'], createdAt: '2026-11-01T00:00:00Z', revisionCount: 2, latestFit: null,
};
const REVISIONS = [
  { id: 9, pulsarId: 4, parentId: 8, author: { id: 3, displayName: 'Ana Analyst' }, message: 'Fit spin-down', createdAt: '2026-11-25T09:00:00Z', releasedAt: null, releasedBy: null, releaseNote: null },
  { id: 8, pulsarId: 4, parentId: null, author: { id: 3, displayName: 'Ana Analyst' }, message: 'First model', createdAt: '2026-11-21T09:00:00Z', releasedAt: null, releasedBy: null, releaseNote: null },
];
const OPTIONS = { minPeriodDays: null, maxPeriodDays: null, maxCompanions: 3, falseAlarmThreshold: 0.001, assumedPulsarMassSolar: 1.4 };
const run = (id: number, status: string, extra: Record<string, unknown> = {}) => ({
  id, pulsarId: 4, revisionId: 9, status, progress: { percent: status === 'running' ? 30 : 100, stage: status === 'running' ? 'round 1: periodogram' : status },
  inputsHash: `s${id}`, options: OPTIONS, settings: {}, toaCount: 1300, excludedCount: 0, requestedBy: { id: 3, displayName: 'Ana Analyst' },
  queuedAt: '2026-12-01T11:00:00Z', startedAt: '2026-12-01T11:00:01Z', finishedAt: status === 'running' ? null : '2026-12-01T11:00:09Z',
  durationMs: 8000, errorMessage: null, savedRevisionId: null, result: null, ...extra,
});
const summaryResult = {
  peaks: [], companionsFound: 2, stopReason: 'false-alarm-above-threshold', warnings: [], engineSettings: {},
  finalFit: { chi2: 1300, dof: 1280, reducedChi2: 1.02, weightedRmsUs: 2.1, converged: true, iterations: 4 },
  searchSettings: { minPeriodDays: 2, maxPeriodDays: 2000, maxCompanions: 3, falseAlarmThreshold: 0.001, eccentricityThreshold: 0.01, pulsarMassSolar: 1.4, oversampling: 10, frequencyCount: 1000, spanDays: 2000 },
  candidates: [
    { round: 1, name: 'b', status: 'accepted' },
    { round: 2, name: 'c', status: 'accepted' },
    { round: 3, name: 'd', status: 'degenerate' },
  ],
};
const RUNS = [run(42, 'running'), run(41, 'succeeded', { result: summaryResult })];

function routes(overrides: Record<string, Parameters<typeof mockApi>[0][string]> = {}) {
  return {
    'GET /api/auth/me': ok(ANALYST_ME),
    'GET /api/auth/csrf': ok({ token: 'tok' }),
    'GET /api/pulsars/:id': ok(PULSAR),
    'GET /api/pulsars/:id/toa-batches': ok([]),
    'GET /api/pulsars/:id/revisions': ok(REVISIONS),
    'GET /api/pulsars/:id/fit-runs': ok([]),
    'GET /api/pulsars/:id/search-runs': ok(RUNS),
    'GET /api/notifications': ok({ pulsarIds: [], campaignIds: [] }),
    ...overrides,
  };
}

async function openForm() {
  const view = renderApp('/pulsars/4');
  const form = await screen.findByRole('form', { name: 'Start a companion search' });
  return { ...view, form: within(form) };
}

describe('companion search on the pulsar page', () => {
  it('lists the searches with their status and progress', async () => {
    mockApi(routes());
    renderApp('/pulsars/4');
    const table = await screen.findByRole('table', { name: 'Companion searches' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(within(rows[0]).getByRole('link', { name: 'Search #42' }).getAttribute('href')).toBe('/search-runs/42');
    expect(within(rows[0]).getByRole('progressbar', { name: 'Progress of search #42' }).getAttribute('aria-valuenow')).toBe('30');
    expect(within(rows[1]).getByText('succeeded')).toBeTruthy();
    expect(within(rows[1]).getByText('2 companions, 1 rejected')).toBeTruthy();
  });

  it('checks the form with the API’s schema before sending anything', async () => {
    const server = mockApi(routes());
    const { user, form } = await openForm();
    await user.type(form.getByLabelText('Shortest period (days)'), '100');
    await user.type(form.getByLabelText('Longest period (days)'), '50');
    await user.click(form.getByRole('button', { name: 'Start search' }));
    expect(form.getByText('must be greater than the shortest period')).toBeTruthy();
    expect(form.getByLabelText('Longest period (days)').getAttribute('aria-invalid')).toBe('true');
    expect(form.getByLabelText('Shortest period (days)').getAttribute('aria-invalid')).toBeNull();

    await user.type(form.getByLabelText('Longest period (days)'), '0'); // 500 days: the range is fine now
    await user.type(form.getByLabelText('False-alarm threshold'), '2');
    await user.type(form.getByLabelText('Most companions'), '2.5');
    await user.type(form.getByLabelText('Assumed pulsar mass (M☉)'), 'heavy');
    await user.click(form.getByRole('button', { name: 'Start search' }));
    expect(form.queryByText('must be greater than the shortest period')).toBeNull();
    expect(form.getByText('must be > 0 and < 1')).toBeTruthy();
    expect(form.getByText('must be a whole number')).toBeTruthy();
    expect(form.getByText('must be a number')).toBeTruthy();
    expect(form.getByLabelText('False-alarm threshold').getAttribute('aria-invalid')).toBe('true');
    expect(form.getByLabelText('Longest period (days)').getAttribute('aria-invalid')).toBeNull();
    expect(server.callsTo('POST', '/api/pulsars/4/search-runs')).toHaveLength(0);
  });

  it('sends only the filled-in fields and links to the queued search', async () => {
    const server = mockApi(routes({ 'POST /api/pulsars/:id/search-runs': ok({ searchRun: run(43, 'queued'), reused: false }, 202) }));
    const { user, form } = await openForm();
    await user.selectOptions(form.getByLabelText('Model revision'), '8');
    await user.type(form.getByLabelText('Shortest period (days)'), '10');
    await user.type(form.getByLabelText('Most companions'), '2');
    await user.click(form.getByRole('button', { name: 'Start search' }));
    expect((await form.findByRole('link', { name: 'search #43' })).getAttribute('href')).toBe('/search-runs/43');
    const calls = server.callsTo('POST', '/api/pulsars/4/search-runs');
    expect(calls).toHaveLength(1);
    expect(calls[0].body).toEqual({ revisionId: 8, minPeriodDays: 10, maxCompanions: 2 });
  });

  it('puts server field errors on their fields', async () => {
    mockApi(
      routes({
        'POST /api/pulsars/:id/search-runs': fail(400, 'validation_failed', 'maxPeriodDays: longer than the span of the TOAs (2000 d)', [
          { path: ['maxPeriodDays'], message: 'maxPeriodDays: longer than the span of the TOAs (2000 d)' },
        ]),
      }),
    );
    const { user, form } = await openForm();
    await user.type(form.getByLabelText('Longest period (days)'), '5000');
    await user.click(form.getByRole('button', { name: 'Start search' }));
    expect(await form.findByText('longer than the span of the TOAs (2000 d)')).toBeTruthy();
    expect(form.getByLabelText('Longest period (days)').getAttribute('aria-invalid')).toBe('true');
  });

  it('offers the existing result when identical inputs were searched, and searches again on request', async () => {
    const server = mockApi(
      routes({
        'POST /api/pulsars/:id/search-runs': (call) =>
          (call.body as { recompute?: boolean }).recompute
            ? ok({ searchRun: run(44, 'queued'), reused: false }, 202)
            : ok({ searchRun: run(41, 'succeeded', { result: summaryResult }), reused: true }),
      }),
    );
    const { user, form } = await openForm();
    await user.click(form.getByRole('button', { name: 'Start search' }));
    const existing = await form.findByRole('group', { name: 'Existing search' });
    expect(within(existing).getByText(/Search #41 used the same revision, TOAs and options.*2 companions found\. Nothing was queued\./)).toBeTruthy();
    await user.click(within(existing).getByRole('button', { name: 'Search again anyway' }));
    expect(await form.findByRole('link', { name: 'search #44' })).toBeTruthy();
    expect(server.callsTo('POST', '/api/pulsars/4/search-runs').map((c) => c.body)).toEqual([{ revisionId: 9 }, { revisionId: 9, recompute: true }]);
  });

  it('hides the start form from a viewer and says who can start one', async () => {
    mockApi(routes({ 'GET /api/auth/me': ok(VIEWER_ME) }));
    renderApp('/pulsars/4');
    expect(await screen.findByText('Starting a search needs the analyst role or higher; you can read the searches below.')).toBeTruthy();
    expect(screen.queryByRole('form', { name: 'Start a companion search' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Start search' })).toBeNull();
    expect(await screen.findByRole('table', { name: 'Companion searches' })).toBeTruthy();
  });

  it('tells a new user what to do when there are no searches yet', async () => {
    mockApi(routes({ 'GET /api/pulsars/:id/search-runs': ok([]) }));
    renderApp('/pulsars/4');
    expect(await screen.findByText('No searches yet')).toBeTruthy();
    expect(screen.getByText('Choose a revision above and start a search.')).toBeTruthy();
  });
});

import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { mockApi, noContent, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

// Plotly needs a real browser; the fake plot reports what it was given.
vi.mock('plotly.js-dist-min', () => ({ default: {} }));
vi.mock('react-plotly.js/factory', () => ({
  default: () =>
    function FakePlot(props: { data: { name: string; x: number[] }[] }) {
      return <div data-testid="plotly" data-traces={props.data.map((t) => `${t.name}:${t.x.length}`).join(',')} />;
    },
}));

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Role "lead" with the permissions api/auth/permissions.ts gives it.
const LEAD_ME = {
  user: { id: 3, email: 'lee@example.org', displayName: 'Lee Lead', role: 'lead' },
  permissions: ['observatories:read', 'pulsars:read', 'pulsars:create', 'jobs:start', 'jobs:read', 'toas:upload', 'toas:exclude', 'models:edit', 'fits:run', 'models:release', 'campaigns:start', 'toa-batches:delete'],
};

// Everything below is invented demo data in the contract's shapes (docs/api-workflow.md).
const PULSAR = {
  id: 4, name: 'J0444+4444', raHms: '04:44:44.4', decDms: '+44:44:44', toaCount: 1300, firstMjd: '57000.125', lastMjd: '59000.5',
  observatories: ['obs-a', 'obs-b'], createdAt: '2026-11-01T00:00:00Z', revisionCount: 2,
  latestFit: { id: 21, status: 'succeeded', reducedChi2: 1.07, weightedRmsUs: 2.2, finishedAt: '2026-12-01T12:00:00Z' },
};
const BATCHES = [
  { id: 5, pulsarId: 4, fileName: 'second-year.csv', uploadedBy: { id: 2, displayName: 'Olu Observer' }, checksumSha256: 'ab', rowCount: 1200, firstMjd: '58000.5', lastMjd: '59000.5', observatories: ['obs-a', 'obs-b'], backends: ['wide-1', 'wide-2'], status: 'stored', createdAt: '2026-11-20T08:00:00Z' },
  { id: 4, pulsarId: 4, fileName: 'first-year.csv', uploadedBy: { id: 2, displayName: 'Olu Observer' }, checksumSha256: 'cd', rowCount: 100, firstMjd: '57000.125', lastMjd: '57999', observatories: ['obs-a'], backends: ['wide-1'], status: 'stored', createdAt: '2026-11-10T08:00:00Z' },
];
const REVISIONS = [
  { id: 9, pulsarId: 4, parentId: 8, author: { id: 3, displayName: 'Ana Analyst' }, message: 'Fit spin-down', createdAt: '2026-11-25T09:00:00Z', releasedAt: null, releasedBy: null, releaseNote: null },
  { id: 8, pulsarId: 4, parentId: null, author: { id: 3, displayName: 'Ana Analyst' }, message: 'First model', createdAt: '2026-11-21T09:00:00Z', releasedAt: '2026-11-22T09:00:00Z', releasedBy: { id: 3, displayName: 'Lee Lead' }, releaseNote: 'good start' },
];
const MODEL_8 = { format: 'pulsekeeper-model/1', pulsar: 'J0444+4444', epoch_mjd: '58000', spin: { frequency_hz: '3.1', frequency_derivatives: ['0'] }, solve_for: ['spin.frequency_hz'] };
const MODEL_9 = { ...MODEL_8, spin: { frequency_hz: '3.1', frequency_derivatives: ['-2.5e-14'] }, solve_for: ['spin.frequency_hz', 'spin.frequency_derivatives[0]'] };
const summary = { chi2: 1380, dof: 1290, reducedChi2: 1.07, weightedRmsUs: 2.2, iterations: 3, converged: true, warnings: [] };
const run = (id: number, status: string, extra: Record<string, unknown> = {}) => ({
  id, pulsarId: 4, revisionId: 9, campaignId: null, status, progress: { percent: status === 'succeeded' ? 100 : 35, stage: status === 'running' ? 'computing delays' : status },
  inputsHash: `h${id}`, settings: { ephemeris: 'DE405', clock: 'TT(BIPM)', timeScale: 'TDB' }, toaCount: 1300, excludedCount: 0,
  requestedBy: { id: 3, displayName: 'Ana Analyst' }, queuedAt: '2026-12-01T11:00:00Z', startedAt: '2026-12-01T11:00:01Z',
  finishedAt: status === 'succeeded' ? '2026-12-01T12:00:00Z' : null, durationMs: 900, errorMessage: null,
  result: status === 'succeeded' ? summary : null, ...extra,
});
const RUNS = [run(22, 'running'), run(21, 'succeeded')];
const RESIDUALS = {
  count: 3, toaId: [1, 2, 3], mjd: ['57000.125', '58000.5', '59000.5'], residualUs: [1.5, -0.5, 0.25], uncertaintyUs: [1, 1, 2],
  frequencyMhz: [1400, null, 800], backend: ['wide-1', 'wide-2', 'wide-1'], observatory: ['obs-a', 'obs-b', 'obs-a'],
};

function routes(overrides: Record<string, Parameters<typeof mockApi>[0][string]> = {}) {
  return {
    'GET /api/auth/me': ok(LEAD_ME),
    'GET /api/auth/csrf': ok({ token: 'tok' }),
    'GET /api/pulsars/:id': ok(PULSAR),
    'GET /api/pulsars/:id/toa-batches': ok(BATCHES),
    'GET /api/pulsars/:id/revisions': ok(REVISIONS),
    'GET /api/pulsars/:id/fit-runs': ok(RUNS),
    'GET /api/fit-runs/:id/residuals': ok(RESIDUALS),
    'GET /api/notifications': ok({ pulsarIds: [4], campaignIds: [] }),
    'GET /api/revisions/:id': (_call: unknown, params: Record<string, string>) =>
      ok({ ...REVISIONS.find((r) => String(r.id) === params.id), model: params.id === '8' ? MODEL_8 : MODEL_9 }),
    ...overrides,
  };
}

describe('pulsar page', () => {
  it('renders header, TOA batches, revision timeline, fit runs with progress and the latest residual plot', async () => {
    const server = mockApi(routes());
    renderApp('/pulsars/4');
    expect(await screen.findByRole('heading', { name: 'J0444+4444' })).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Upload TOAs' }).getAttribute('href')).toBe('/pulsars/4/upload');
    expect(screen.getByRole('link', { name: 'Edit model' }).getAttribute('href')).toBe('/pulsars/4/model');

    const batches = await screen.findByRole('table', { name: 'TOA batches' });
    const first = within(batches).getByText('second-year.csv').closest('tr')!;
    expect(within(first).getAllByRole('cell').map((c) => c.textContent).slice(0, 6)).toEqual([
      'second-year.csv', 'Olu Observer', '1,200', '58000.500 – 59000.500', 'obs-a, obs-b', 'wide-1, wide-2',
    ]);

    const timeline = await screen.findByRole('list', { name: 'Model revisions' });
    const entries = within(timeline).getAllByRole('listitem');
    expect(entries.map((e) => within(e).getByText(/model|spin-down/).textContent)).toEqual(['Fit spin-down', 'First model']);
    expect(within(entries[1]).getByText('released')).toBeTruthy();
    expect(within(entries[0]).queryByText('released')).toBeNull();

    const runs = await screen.findByRole('table', { name: 'Fit runs' });
    const bar = within(runs).getByRole('progressbar', { name: 'Progress of run #22' });
    expect(bar.getAttribute('aria-valuenow')).toBe('35');
    expect(within(runs).getByText('computing delays')).toBeTruthy();
    expect(within(runs).getByRole('link', { name: 'Run #21' }).getAttribute('href')).toBe('/fit-runs/21');
    expect(within(runs).getByText('1.07')).toBeTruthy();

    // Residuals of run 21, one trace per backend.
    const plot = await screen.findByTestId('plotly');
    expect(plot.getAttribute('data-traces')).toBe('wide-1:2,wide-2:1');
    expect(server.callsTo('GET', '/api/fit-runs/21/residuals')).toHaveLength(1);

    const toggle = await screen.findByRole('switch', { name: 'Notify me by e-mail' });
    await waitFor(() => expect(toggle.getAttribute('aria-checked')).toBe('true'));
  });

  it('asks before deleting a batch, naming how many TOAs go, and refreshes after', async () => {
    let deleted = false;
    const server = mockApi(
      routes({
        'GET /api/pulsars/:id/toa-batches': () => ok(deleted ? BATCHES.slice(1) : BATCHES),
        'DELETE /api/toa-batches/:id': () => {
          deleted = true;
          return noContent();
        },
      }),
    );
    const { user } = renderApp('/pulsars/4');
    const batches = await screen.findByRole('table', { name: 'TOA batches' });
    await user.click(within(batches).getByRole('button', { name: 'Delete second-year.csv' }));
    let dialog = screen.getByRole('alertdialog', { name: 'Delete second-year.csv?' });
    expect(within(dialog).getByText(/its 1,200 TOAs/)).toBeTruthy();
    await user.click(within(dialog).getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByRole('alertdialog')).toBeNull();
    expect(server.callsTo('DELETE', '/api/toa-batches/5')).toHaveLength(0);

    await user.click(within(batches).getByRole('button', { name: 'Delete second-year.csv' }));
    dialog = screen.getByRole('alertdialog');
    await user.click(within(dialog).getByRole('button', { name: 'Delete 1,200 TOAs' }));
    await waitFor(() => expect(screen.queryByRole('alertdialog')).toBeNull());
    expect(server.callsTo('DELETE', '/api/toa-batches/5')).toHaveLength(1);
    expect(server.callsTo('DELETE', '/api/toa-batches/5')[0].headers['x-csrf-token']).toBe('tok');
    await waitFor(() => expect(within(screen.getByRole('table', { name: 'TOA batches' })).queryByText('second-year.csv')).toBeNull());
    expect(screen.getByText('The batch and its TOAs were deleted.')).toBeTruthy();
    // The pulsar's counts were invalidated too.
    expect(server.callsTo('GET', '/api/pulsars/4').length).toBeGreaterThan(1);
  });

  it('offers the existing result when the inputs were fitted already, and recomputes on request', async () => {
    const existing = run(21, 'succeeded');
    const server = mockApi(
      routes({
        'POST /api/pulsars/:id/fit-runs': (call) =>
          (call.body as { recompute?: boolean }).recompute ? ok({ fitRun: run(23, 'queued'), reused: false }, 202) : ok({ fitRun: existing, reused: true }),
      }),
    );
    const { user } = renderApp('/pulsars/4');
    const select = await screen.findByRole('combobox', { name: 'Model revision' });
    expect((select as HTMLSelectElement).value).toBe('9'); // latest by default
    await user.selectOptions(select, '8');
    await user.click(screen.getByRole('button', { name: 'Queue fit' }));

    const choice = await screen.findByRole('group', { name: 'Existing result' });
    expect(within(choice).getByText(/Run #21 used the same revision/)).toBeTruthy();
    expect(server.callsTo('POST', '/api/pulsars/4/fit-runs')[0].body).toEqual({ revisionId: 8 });
    expect(within(choice).getByRole('button', { name: 'Open existing result' })).toBeTruthy();

    await user.click(within(choice).getByRole('button', { name: 'Recompute anyway' }));
    expect(await screen.findByText(/Fit queued as/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'run #23' }).getAttribute('href')).toBe('/fit-runs/23');
    expect(server.callsTo('POST', '/api/pulsars/4/fit-runs')[1].body).toEqual({ revisionId: 8, recompute: true });
    expect(screen.queryByRole('group', { name: 'Existing result' })).toBeNull();
  });

  it('opens the existing run when asked', async () => {
    mockApi(
      routes({
        'POST /api/pulsars/:id/fit-runs': ok({ fitRun: run(21, 'succeeded'), reused: true }),
        'GET /api/fit-runs/:id': ok({ ...run(21, 'succeeded'), result: { ...summary, parameters: {}, fittedModel: {} } }),
      }),
    );
    const { user, router } = renderApp('/pulsars/4');
    await user.click(await screen.findByRole('button', { name: 'Queue fit' }));
    await user.click(await screen.findByRole('button', { name: 'Open existing result' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/fit-runs/21'));
    expect(await screen.findByRole('heading', { name: 'Fit run #21' })).toBeTruthy();
  });

  it('shows the diff between two ticked revisions', async () => {
    mockApi(routes());
    const { user } = renderApp('/pulsars/4');
    await user.click(await screen.findByRole('checkbox', { name: 'Compare #9' }));
    await user.click(screen.getByRole('checkbox', { name: 'Compare #8' }));
    const diff = await screen.findByRole('table', { name: 'Changes from #8 to #9' });
    const rows = within(diff).getAllByRole('row').slice(1).map((r) => r.textContent);
    expect(rows).toEqual([
      'spin.frequency_derivatives[0]"0"→ becomes "-2.5e-14"',
      'solve_for(absent)→ becomes "spin.frequency_derivatives[0]"',
    ]);
  });

  it('switches the e-mail notification with PUT', async () => {
    const server = mockApi(routes({ 'GET /api/notifications': ok({ pulsarIds: [], campaignIds: [] }), 'PUT /api/pulsars/:id/notification': ok({ subscribed: true }) }));
    const { user } = renderApp('/pulsars/4');
    const toggle = await screen.findByRole('switch', { name: 'Notify me by e-mail' });
    await waitFor(() => expect(toggle.hasAttribute('disabled')).toBe(false));
    expect(toggle.getAttribute('aria-checked')).toBe('false');
    await user.click(toggle);
    await waitFor(() => expect(server.callsTo('PUT', '/api/pulsars/4/notification')).toHaveLength(1));
    expect(server.callsTo('PUT', '/api/pulsars/4/notification')[0].body).toEqual({ subscribed: true });
  });

  it('polls the fit runs while one is unfinished, then stops and refreshes the pulsar', async () => {
    let listPolls = 0;
    const server = mockApi(
      routes({
        'GET /api/pulsars/:id/fit-runs': () => {
          listPolls += 1;
          return ok(listPolls < 3 ? RUNS : [run(22, 'succeeded'), run(21, 'succeeded')]);
        },
      }),
    );
    renderApp('/pulsars/4');
    const runs = await screen.findByRole('table', { name: 'Fit runs' });
    expect(within(runs).getByRole('progressbar', { name: 'Progress of run #22' })).toBeTruthy();
    await waitFor(() => expect(within(screen.getByRole('table', { name: 'Fit runs' })).queryByRole('progressbar')).toBeNull(), { timeout: 5000 });
    await waitFor(() => expect(server.callsTo('GET', '/api/pulsars/4').length).toBeGreaterThan(1));
    // The plot follows the newest succeeded run.
    await waitFor(() => expect(server.callsTo('GET', '/api/fit-runs/22/residuals')).toHaveLength(1));
    const pollsAtEnd = listPolls;
    await new Promise((r) => setTimeout(r, 1500));
    expect(listPolls).toBe(pollsAtEnd);
  });

  it('shows empty states to a viewer, without upload, edit, delete or queue controls', async () => {
    mockApi(
      routes({
        'GET /api/auth/me': ok(VIEWER_ME),
        'GET /api/pulsars/:id': ok({ ...PULSAR, toaCount: 0, firstMjd: null, lastMjd: null, latestFit: null }),
        'GET /api/pulsars/:id/toa-batches': ok([]),
        'GET /api/pulsars/:id/fit-runs': ok([]),
      }),
    );
    renderApp('/pulsars/4');
    expect(await screen.findByText('No TOAs yet — an observer can upload a file')).toBeTruthy();
    expect(await screen.findByText('No fits yet — queue one')).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Upload TOAs' })).toBeNull();
    expect(screen.queryByRole('link', { name: 'Edit model' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Queue fit' })).toBeNull();
    expect(screen.queryByTestId('plotly')).toBeNull();
  });
});

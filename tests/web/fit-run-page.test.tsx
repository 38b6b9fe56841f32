import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

vi.mock('plotly.js-dist-min', () => ({ default: {} }));
vi.mock('react-plotly.js/factory', () => ({
  default: () =>
    function FakePlot(props: { data: { name: string; x: number[] }[]; layout: { xaxis: { title: { text: string } }; yaxis: { title: { text: string } } } }) {
      return (
        <div data-testid="plotly" data-traces={props.data.map((t) => `${t.name}:${t.x.length}`).join(',')}>
          {props.layout.xaxis.title.text} / {props.layout.yaxis.title.text}
        </div>
      );
    },
}));

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const ANALYST_ME = {
  user: { id: 3, email: 'ana@example.org', displayName: 'Ana Analyst', role: 'analyst' },
  permissions: ['observatories:read', 'pulsars:read', 'pulsars:create', 'jobs:start', 'jobs:read', 'toas:upload', 'toas:exclude', 'models:edit', 'fits:run'],
};

// Invented run in the shape of docs/api-workflow.md "Fit runs".
const base = {
  id: 31, pulsarId: 4, revisionId: 9, campaignId: null, inputsHash: 'h31',
  settings: { ephemeris: 'DE405', clock: 'TT(BIPM2019)', timeScale: 'TDB', earthOrientation: 'IERS C04' },
  toaCount: 1300, excludedCount: 12, requestedBy: { id: 3, displayName: 'Ana Analyst' },
  queuedAt: '2026-12-01T11:00:00Z', startedAt: null, finishedAt: null, durationMs: null, errorMessage: null, result: null,
};
const RESULT = {
  parameters: {
    'spin.frequency_hz': { value: '3.14159265358979323', uncertainty: 2.5e-12, unit: 'Hz', startValue: '3.14159265358', changeSigma: 1.2 },
    'spin.frequency_derivatives[0]': { value: '-2.51e-14', uncertainty: 1.1e-17, unit: 'Hz/s', startValue: '-2.5e-14', changeSigma: -9.09 },
  },
  chi2: 2450.5, dof: 1286, reducedChi2: 1.9055, weightedRmsUs: 3.42, iterations: 12, converged: false,
  warnings: ['design matrix is close to singular'], fittedModel: {},
};
const RESIDUALS = {
  count: 2, toaId: [1, 2], mjd: ['57000.125', '58000.5'], residualUs: [1, -1], uncertaintyUs: [1, 1],
  frequencyMhz: [1400, 1400], backend: ['wide-1', 'wide-1'], observatory: ['obs-a', 'obs-a'],
};

describe('fit run page', () => {
  it('polls while queued and running, then shows parameters ± uncertainties, statistics and the non-convergence warning', async () => {
    let polls = 0;
    const server = mockApi({
      'GET /api/auth/me': ok(ANALYST_ME),
      'GET /api/fit-runs/:id': () => {
        polls += 1;
        if (polls === 1) return ok({ ...base, status: 'queued', progress: { percent: 0, stage: 'waiting for a worker' } });
        if (polls === 2) return ok({ ...base, status: 'running', startedAt: '2026-12-01T11:00:02Z', progress: { percent: 60, stage: 'iterating the fit' } });
        return ok({ ...base, status: 'succeeded', startedAt: '2026-12-01T11:00:02Z', finishedAt: '2026-12-01T11:00:05Z', durationMs: 3200, progress: { percent: 100, stage: 'done' }, result: RESULT });
      },
      'GET /api/fit-runs/:id/residuals': ok(RESIDUALS),
    });
    renderApp('/fit-runs/31');
    expect(await screen.findByRole('heading', { name: 'Fit run #31' })).toBeTruthy();
    expect(screen.getByText('waiting for a worker')).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Cancel fit' })).toBeTruthy();

    const bar = await screen.findByRole('progressbar', { name: 'Fit progress' }, { timeout: 4000 });
    await waitFor(() => expect(bar.getAttribute('aria-valuenow')).toBe('60'), { timeout: 4000 });
    expect(screen.getByText('iterating the fit')).toBeTruthy();

    const params = await screen.findByRole('table', { name: 'Fitted parameters' }, { timeout: 4000 });
    expect(screen.queryByRole('progressbar')).toBeNull();
    const rows = within(params).getAllByRole('row').slice(1);
    expect(within(rows[0]).getAllByRole('cell').map((c) => c.textContent)).toEqual([
      'spin.frequency_hz', '3.14159265358979323 ± 2.5e-12Hz', '3.14159265358', '+1.2σ',
    ]);
    expect(within(rows[1]).getByText('-9.1σ')).toBeTruthy();
    expect(within(rows[1]).getByText('(more than 3σ)')).toBeTruthy();
    expect(within(rows[0]).queryByText('(more than 3σ)')).toBeNull();
    expect(screen.getByText(/Uncertainties: unscaled \(formal\) 1σ/)).toBeTruthy();

    const warning = screen.getByRole('alert');
    expect(within(warning).getByText('The fit did not converge')).toBeTruthy();
    expect(within(warning).getByText('design matrix is close to singular')).toBeTruthy();

    const statistics = screen.getByLabelText('Fit statistics');
    expect(within(statistics).getByText('2450.50')).toBeTruthy();
    expect(within(statistics).getByText('1.91')).toBeTruthy();
    expect(within(statistics).getByText('3.42 µs')).toBeTruthy();
    expect(within(statistics).getByText('1,286')).toBeTruthy();
    expect(within(statistics).getByText('no')).toBeTruthy();
    const settings = screen.getByLabelText('Engine settings');
    expect(within(settings).getByText('DE405')).toBeTruthy();
    expect(within(settings).getByText('TT(BIPM2019)')).toBeTruthy();
    expect(within(settings).getByText('TDB')).toBeTruthy();

    expect(screen.getByRole('link', { name: 'Download fitted model' }).getAttribute('href')).toBe('/api/fit-runs/31/fitted-model');
    expect(screen.getByRole('link', { name: 'Download residuals CSV' }).getAttribute('href')).toBe('/api/fit-runs/31/residuals?format=csv');
    const plot = await screen.findByTestId('plotly');
    expect(plot.getAttribute('data-traces')).toBe('wide-1:2');
    expect(plot.textContent).toBe('MJD (day) / Residual (µs)');

    // Polling stopped at the final state.
    const pollsAtEnd = polls;
    await new Promise((r) => setTimeout(r, 1500));
    expect(polls).toBe(pollsAtEnd);
    expect(server.callsTo('GET', '/api/fit-runs/31/residuals')).toHaveLength(1);
  });

  it('cancels a running fit', async () => {
    let cancelled = false;
    const server = mockApi({
      'GET /api/auth/me': ok(ANALYST_ME),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'GET /api/fit-runs/:id': () =>
        ok(cancelled ? { ...base, status: 'cancelled', progress: { percent: 40, stage: 'cancelled' } } : { ...base, status: 'running', progress: { percent: 40, stage: 'computing delays' } }),
      'POST /api/fit-runs/:id/cancel': () => {
        cancelled = true;
        return ok({ ...base, status: 'cancelled', progress: { percent: 40, stage: 'cancelled' } });
      },
    });
    const { user } = renderApp('/fit-runs/31');
    await user.click(await screen.findByRole('button', { name: 'Cancel fit' }));
    expect(await screen.findByText('The fit was cancelled')).toBeTruthy();
    expect(server.callsTo('POST', '/api/fit-runs/31/cancel')).toHaveLength(1);
    expect(screen.queryByRole('button', { name: 'Cancel fit' })).toBeNull();
  });

  it('shows the engine’s message for a failed fit, with no downloads', async () => {
    mockApi({
      'GET /api/auth/me': ok(VIEWER_ME),
      'GET /api/fit-runs/:id': ok({ ...base, status: 'failed', progress: { percent: 20, stage: 'reading' }, errorMessage: 'companions[b].eccentricity: must be below 1' }),
    });
    renderApp('/fit-runs/31');
    expect(await screen.findByText('The fit failed')).toBeTruthy();
    expect(screen.getByText('companions[b].eccentricity: must be below 1')).toBeTruthy();
    expect(screen.queryByRole('link', { name: 'Download fitted model' })).toBeNull();
  });

  it('reports an unknown run', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/fit-runs/:id': fail(404, 'not_found', 'No fit run 99') });
    renderApp('/fit-runs/99');
    expect(await screen.findByText('No fit run with this id')).toBeTruthy();
  });

  it('shows no Cancel button to a viewer while a fit runs', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/fit-runs/:id': ok({ ...base, status: 'running', progress: { percent: 10, stage: 'loading TOAs' } }) });
    renderApp('/fit-runs/31');
    expect(await screen.findByText('loading TOAs')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Cancel fit' })).toBeNull();
  });
});

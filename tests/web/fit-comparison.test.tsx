/**
 * The fit comparison screens against a fake API: the side-by-side table (σ-differences, AIC/BIC
 * lowest, F-test line, warnings, settings), the stacked residual plots, saving with a comment and
 * hiding that from roles without fits:compare, the saved-comparison page and the picker on the
 * pulsar page.
 */
import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ComparedRun, FitComparison, SavedComparison } from '../../api/contracts/comparisons';
import { permissionsOf } from '../../api/auth/permissions';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

// Plotly needs a real browser; the fake plot reports the traces and axes it was given.
vi.mock('plotly.js-dist-min', () => ({ default: {} }));
vi.mock('react-plotly.js/factory', () => ({
  default: () =>
    function FakePlot(props: { data: { name: string; type: string; xaxis: string; yaxis: string; x: number[]; showlegend: boolean }[]; layout: Record<string, unknown> }) {
      return (
        <div
          data-testid="plotly"
          data-traces={props.data.map((t) => `${t.type}:${t.xaxis}/${t.yaxis}:${t.name}:${t.x.length}:${t.showlegend ? 'legend' : '-'}`).join(',')}
          data-axes={Object.keys(props.layout).filter((k) => /^[xy]axis/.test(k)).sort().join(',')}
        />
      );
    },
}));

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const me = (role: 'viewer' | 'analyst' | 'lead', id: number, name: string) => ({
  user: { id, email: `${role}@example.org`, displayName: name, role },
  permissions: permissionsOf(role), // the API's own table (api/auth/permissions.ts)
});
const VIEWER = me('viewer', 7, 'Vera Viewer');
const LEAD = me('lead', 3, 'Lee Lead');

const SETTINGS = {
  ephemeris: 'DE405',
  clock: 'observatory clock corrections → UTC',
  timeScale: 'TDB via ERFA dtdb (topocentric)',
  earthOrientation: 'IAU 2006/2000A, UT1 = UTC, no polar motion',
  jupiterShapiro: 'not included',
  engineVersion: 'pulsekeeper-engine/0.1.0',
};
const N_TOAS = 1300;

// Invented runs; AIC and BIC from their definitions (Akaike 1974; Schwarz 1978), so the lowest
// AIC (run 22, better χ²) and the lowest BIC (run 21, fewer parameters) fall on different runs.
function comparedRun(fitRunId: number, revisionNumber: number, chi2: number, paths: string[], released = false): ComparedRun {
  const k = paths.length;
  return {
    fitRunId,
    revision: { id: 100 + revisionNumber, number: revisionNumber, message: `revision ${revisionNumber} message`, released, releasedAt: released ? '2026-12-01T10:00:00Z' : null },
    finishedAt: '2026-12-01T12:00:00Z',
    toaCount: N_TOAS,
    excludedCount: 0,
    chi2,
    dof: N_TOAS - k,
    reducedChi2: chi2 / (N_TOAS - k),
    weightedRmsUs: 2.2,
    converged: true,
    warnings: [],
    freeParameters: { count: k, paths },
    aic: chi2 + 2 * k,
    bic: chi2 + k * Math.log(N_TOAS),
    settings: SETTINGS,
  };
}
const SPIN = ['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'phase_offset_turns'];
const WITH_POSITION = ['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'astrometry.ra_hms', 'astrometry.dec_dms', 'phase_offset_turns'];

function comparison(overrides: Partial<FitComparison> = {}, order: [number, number] = [21, 22]): FitComparison {
  const runs: Record<number, ComparedRun> = { 21: comparedRun(21, 1, 1400, SPIN), 22: comparedRun(22, 2, 1390, WITH_POSITION, true) };
  return {
    pulsarId: 4,
    runs: order.map((id) => runs[id]),
    parameters: [
      {
        path: 'spin.frequency_hz',
        unit: 'Hz',
        values: [
          { value: '3.14159265358979', uncertainty: 2e-12, free: true, differenceSigma: null, difference: null },
          { value: '3.14159265359979', uncertainty: 1.5e-12, free: true, differenceSigma: 4.0, difference: 1e-11 },
        ],
      },
      {
        path: 'spin.frequency_derivatives[0]',
        unit: 'Hz/s',
        values: [
          { value: '-2.5e-14', uncertainty: 1e-17, free: true, differenceSigma: null, difference: null },
          { value: '-2.50001e-14', uncertainty: 1e-17, free: true, differenceSigma: -0.7, difference: -1e-18 },
        ],
      },
      {
        path: 'astrometry.ra_hms',
        unit: 's',
        values: [
          { value: '04:44:44.4', uncertainty: null, free: false, differenceSigma: null, difference: null },
          { value: '04:44:44.40002', uncertainty: 1e-5, free: true, differenceSigma: 2.0, difference: 2e-5 },
        ],
      },
    ],
    sameSettings: true,
    sameToas: true,
    statisticsComparable: true,
    nestedTests: [{ smallerFitRunId: 21, largerFitRunId: 22, addedParameters: 2, dof: N_TOAS - 5, statistic: 4.6213, probability: 0.00996 }],
    warnings: [],
    differingSettings: [],
    references: ['Akaike 1974, IEEE Trans. Autom. Control 19, 716', 'Schwarz 1978, Ann. Stat. 6, 461'],
    ...overrides,
  };
}

const residuals = (count: number, backends: string[]) => ({
  count,
  toaId: Array.from({ length: count }, (_, i) => i + 1),
  mjd: Array.from({ length: count }, (_, i) => `${58000 + i}.5`),
  residualUs: Array.from({ length: count }, () => 0.5),
  uncertaintyUs: Array.from({ length: count }, () => 1),
  frequencyMhz: Array.from({ length: count }, () => 1400),
  backend: Array.from({ length: count }, (_, i) => backends[i % backends.length]),
  observatory: Array.from({ length: count }, () => 'obs-a'),
});

const PULSAR = {
  id: 4, name: 'J0444+4444', raHms: '04:44:44.4', decDms: '+44:44:44', toaCount: N_TOAS, firstMjd: '57000.125', lastMjd: '59000.5',
  observatories: ['obs-a'], createdAt: '2026-11-01T00:00:00Z', revisionCount: 2, latestFit: null,
};

function comparisonRoutes(who: object, extra: Parameters<typeof mockApi>[0] = {}) {
  return {
    'GET /api/auth/me': ok(who),
    'GET /api/auth/csrf': ok({ token: 'tok' }),
    'GET /api/pulsars/:id': ok(PULSAR),
    'GET /api/pulsars/:id/fit-comparison': ok(comparison()),
    'GET /api/fit-runs/:id/residuals': (_c: unknown, p: Record<string, string>) => ok(p.id === '21' ? residuals(3, ['wide-1']) : residuals(4, ['wide-2', 'wide-1'])),
    ...extra,
  };
}

/** The URLs (path + query) the client fetched. */
const urlsOf = (server: ReturnType<typeof mockApi>) => server.fetchMock.mock.calls.map((c) => {
  const url = new URL(String(c[0]), 'http://localhost');
  return url.pathname + url.search;
});

/** The text of each cell of the statistics row whose header reads `label`. */
function statisticRow(label: string): string[] {
  const table = screen.getByRole('table', { name: 'Fit statistics of the compared runs' });
  const header = within(table).getByRole('rowheader', { name: label });
  return within(header.closest('tr')!).getAllByRole('cell').map((c) => c.textContent ?? '');
}

describe('fit comparison page', () => {
  it('shows both runs side by side with AIC/BIC, the lowest of each named, and the F-test line with its source', async () => {
    const server = mockApi(comparisonRoutes(VIEWER));
    renderApp('/pulsars/4/compare?runs=21,22');
    expect(await screen.findByRole('heading', { name: 'Compare fits of J0444+4444' })).toBeTruthy();
    await screen.findByRole('table', { name: 'Fit statistics of the compared runs' });
    expect(urlsOf(server)).toContain('/api/pulsars/4/fit-comparison?runs=21,22');

    const aic = statisticRow('AIC');
    const bic = statisticRow('BIC');
    const c = comparison();
    expect(aic[0]).toContain(c.runs[0].aic.toFixed(2));
    expect(aic[1]).toContain(c.runs[1].aic.toFixed(2));
    expect(aic[1]).toContain('lowest AIC');
    expect(aic[0]).not.toContain('lowest');
    expect(aic[0]).toContain(`Δ +${(c.runs[0].aic - c.runs[1].aic).toFixed(2)}`);
    expect(bic[0]).toContain('lowest BIC');
    expect(bic[1]).not.toContain('lowest');
    expect(statisticRow('Free parameters')).toEqual(['3', '5']);
    expect(statisticRow('χ²/dof')).toEqual([(1400 / 1297).toPrecision(3), (1390 / 1295).toPrecision(3)]);

    const table = screen.getByRole('table', { name: 'Fit statistics of the compared runs' });
    const headers = within(table).getAllByRole('columnheader');
    expect(within(headers[1]).getByText('reference')).toBeTruthy();
    expect(within(headers[1]).queryByText('released')).toBeNull();
    expect(within(headers[2]).getByText('released')).toBeTruthy(); // run 22's revision is released

    expect(screen.getByText(/Bevington & Robinson, Data Reduction and Error Analysis for the Physical Sciences, 3rd ed\. \(2003\)/)).toBeTruthy();
    const tests = screen.getByRole('list', { name: 'F-tests of nested pairs' });
    expect(within(tests).getByRole('listitem').textContent).toBe(
      'Run #22 adds 2 parameters to run #21: F = 4.621 on (2, 1295) degrees of freedom, probability 0.00996',
    );
    expect(screen.getByText('Statistics are comparable').closest('[role="status"]')).toBeTruthy();
  });

  it('marks parameter differences over 3σ with a symbol and words, not only colour', async () => {
    mockApi(comparisonRoutes(VIEWER));
    renderApp('/pulsars/4/compare?runs=21,22');
    const table = await screen.findByRole('table', { name: 'Parameters of the compared runs' });
    const row = (path: string) => within(within(table).getByRole('rowheader', { name: path }).closest('tr')!).getAllByRole('cell');
    const [, frequency] = row('spin.frequency_hz');
    expect(frequency.textContent).toContain('3.14159265359979 ± 1.5e-12');
    expect(frequency.textContent).toContain('+4.0σ vs reference');
    expect(within(frequency).getByText('(more than 3σ)')).toBeTruthy();
    expect(within(frequency).getByText('▲')).toBeTruthy();
    const [, derivative] = row('spin.frequency_derivatives[0]');
    expect(derivative.textContent).toContain('-0.7σ vs reference');
    expect(within(derivative).queryByText('(more than 3σ)')).toBeNull();
    const [referenceRa, ra] = row('astrometry.ra_hms');
    expect(referenceRa.textContent).toContain('(held fixed)');
    expect(referenceRa.textContent).not.toContain('±');
    expect(ra.textContent).toContain('+2.0σ vs reference');
    expect(within(ra).queryByText('(more than 3σ)')).toBeNull();
  });

  it('draws the runs’ residuals stacked: one y axis per run, one shared x axis, one legend entry per backend', async () => {
    mockApi(comparisonRoutes(VIEWER));
    renderApp('/pulsars/4/compare?runs=21,22');
    const plot = await screen.findByTestId('plotly');
    // Backends sorted over both runs: wide-1 is styled and listed first in every panel. Seven
    // points and no WebGL in jsdom: SVG markers (WebGL cases: fit-comparison-traces.test.tsx).
    expect(plot.getAttribute('data-traces')).toBe('scatter:x/y:wide-1:3:legend,scatter:x/y2:wide-1:2:-,scatter:x/y2:wide-2:2:legend');
    expect(plot.getAttribute('data-axes')).toBe('xaxis,yaxis,yaxis2');
  });

  it('puts the API warnings first and marks nothing lowest when the statistics are not comparable', async () => {
    const notComparable = comparison({
      sameToas: false,
      sameSettings: false,
      statisticsComparable: false,
      nestedTests: [],
      differingSettings: ['ephemeris'],
      warnings: [
        { code: 'toas-differ', message: "0 TOAs not in 21, 2 of 21's left out", fitRunIds: [21, 22] },
        { code: 'settings-differ', message: 'ephemeris: DE405 in 21, DE421 in 22', fitRunIds: [21, 22] },
      ],
    });
    notComparable.runs[1] = { ...notComparable.runs[1], settings: { ...SETTINGS, ephemeris: 'DE421' } };
    mockApi(comparisonRoutes(VIEWER, { 'GET /api/pulsars/:id/fit-comparison': ok(notComparable) }));
    renderApp('/pulsars/4/compare?runs=21,22');
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('Statistics are not comparable across these runs')).toBeTruthy();
    expect(alert.textContent).toContain('different TOAs with different engine settings (ephemeris)');
    expect(alert.textContent).toContain("Different TOAs were fitted (runs #21, #22): 0 TOAs not in 21, 2 of 21's left out");
    expect(alert.textContent).toContain('Engine settings differ (runs #21, #22): ephemeris: DE405 in 21, DE421 in 22');
    expect(statisticRow('AIC').join(' ')).not.toContain('lowest');
    expect(statisticRow('BIC').join(' ')).not.toContain('lowest');
    expect(screen.getByText(/No F-test: the runs did not fit the same TOAs/)).toBeTruthy();
    const settings = screen.getByRole('table', { name: 'Engine settings of the compared runs' });
    const ephemeris = within(settings).getByRole('rowheader', { name: /Solar-system ephemeris/ });
    expect(ephemeris.textContent).toContain('differs');
    expect(within(ephemeris.closest('tr')!).getAllByRole('cell').map((c) => c.textContent)).toEqual(['DE405', 'DE421']);
    const clock = within(settings).getByRole('rowheader', { name: 'Clock chain' });
    expect(clock.textContent).not.toContain('differs');
  });

  it('hides saving from a viewer with a short explanation', async () => {
    const server = mockApi(comparisonRoutes(VIEWER));
    renderApp('/pulsars/4/compare?runs=21,22');
    await screen.findByRole('table', { name: 'Fit statistics of the compared runs' });
    expect(screen.queryByRole('button', { name: 'Save comparison' })).toBeNull();
    expect(screen.getByText(/Saving a comparison with a comment is for group leads/)).toBeTruthy();
    expect(server.calls.filter((c) => c.method === 'POST')).toHaveLength(0);
  });

  it('lets a lead save the comparison with a comment and links the saved page', async () => {
    let posted: unknown = null;
    const server = mockApi(
      comparisonRoutes(LEAD, {
        'POST /api/pulsars/:id/comparisons': (call) => {
          posted = call.body;
          return ok({ id: 31, pulsarId: 4, fitRunIds: [21, 22], comment: 'position helps', createdBy: { id: 3, displayName: 'Lee Lead' }, createdAt: '2026-12-01T13:00:00Z', comparison: comparison() }, 201);
        },
        'GET /api/comparisons/:id': fail(500, 'internal', 'should come from the cache'),
      }),
    );
    const { user } = renderApp('/pulsars/4/compare?runs=21,22');
    const form = await screen.findByRole('form', { name: 'Save comparison' });
    await user.click(within(form).getByRole('button', { name: 'Save comparison' }));
    expect(within(form).getByText(/Comment: say what this comparison shows/)).toBeTruthy();
    expect(server.callsTo('POST', '/api/pulsars/4/comparisons')).toHaveLength(0);

    await user.type(within(form).getByLabelText('Comment'), '  position helps ');
    await user.click(within(form).getByRole('button', { name: 'Save comparison' }));
    const link = await within(form).findByRole('link', { name: 'Open saved comparison #31' });
    expect(link.getAttribute('href')).toBe('/comparisons/31');
    expect(posted).toEqual({ fitRunIds: [21, 22], comment: 'position helps' });
    expect(server.callsTo('POST', '/api/pulsars/4/comparisons')[0].headers['x-csrf-token']).toBe('tok');

    // The saved page opens from the cache the save filled.
    await user.click(link);
    expect(await screen.findByRole('heading', { name: 'Comparison #31' })).toBeTruthy();
    expect(screen.getByText('position helps')).toBeTruthy();
    expect(server.callsTo('GET', '/api/comparisons/31')).toHaveLength(0);
  });

  it('shows the API’s refusal of a save and keeps the comment', async () => {
    mockApi(
      comparisonRoutes(LEAD, {
        'POST /api/pulsars/:id/comparisons': fail(400, 'validation_failed', 'fitRunIds: fit run 22 is still queued: only succeeded fit runs have results to compare', [
          { path: ['fitRunIds'], message: 'fit run 22 is still queued: only succeeded fit runs have results to compare' },
        ]),
      }),
    );
    const { user } = renderApp('/pulsars/4/compare?runs=21,22');
    const form = await screen.findByRole('form', { name: 'Save comparison' });
    await user.type(within(form).getByLabelText('Comment'), 'try');
    await user.click(within(form).getByRole('button', { name: 'Save comparison' }));
    expect((await within(form).findByRole('alert')).textContent).toContain('fit run 22 is still queued');
    expect((within(form).getByLabelText('Comment') as HTMLTextAreaElement).value).toBe('try');
  });

  it('makes another run the reference by asking again with the ids reordered', async () => {
    const server = mockApi(
      comparisonRoutes(VIEWER, {
        'GET /api/pulsars/:id/fit-comparison': () => {
          const last = urlsOf(server).filter((u) => u.includes('fit-comparison')).at(-1)!;
          return ok(last.endsWith('runs=22,21') ? comparison({}, [22, 21]) : comparison());
        },
      }),
    );
    const { user, router } = renderApp('/pulsars/4/compare?runs=21,22');
    await user.click(await screen.findByRole('button', { name: 'Use run #22 as reference' }));
    await waitFor(() => expect(router.state.location.search).toBe('?runs=22%2C21'));
    await waitFor(() => {
      const headers = within(screen.getByRole('table', { name: 'Fit statistics of the compared runs' })).getAllByRole('columnheader');
      expect(within(headers[1]).getByText('Run #22')).toBeTruthy();
      expect(within(headers[1]).getByText('reference')).toBeTruthy();
    });
    expect(urlsOf(server)).toContain('/api/pulsars/4/fit-comparison?runs=22,21');
  });

  it('says how to choose runs when the address names no valid set, and shows the API’s reason for a refusal', async () => {
    const server = mockApi(
      comparisonRoutes(VIEWER, {
        'GET /api/pulsars/:id/fit-comparison': fail(400, 'validation_failed', 'query.runs: fit run 22 is still queued: only succeeded fit runs have results to compare'),
      }),
    );
    const { router } = renderApp('/pulsars/4/compare?runs=21');
    expect((await screen.findByRole('alert')).textContent).toContain('tick 2 to 4 finished fit runs');
    expect(urlsOf(server).some((u) => u.includes('fit-comparison'))).toBe(false);
    await router.navigate('/pulsars/4/compare?runs=21,22');
    expect((await screen.findByText(/fit run 22 is still queued/)).closest('[role="alert"]')).toBeTruthy();
    expect(screen.getByText('Could not compare these fit runs')).toBeTruthy();
  });
});

describe('saved comparison page', () => {
  const SAVED = { id: 31, pulsarId: 4, fitRunIds: [21, 22], comment: 'position helps\nsecond line', createdBy: { id: 3, displayName: 'Lee Lead' }, createdAt: '2026-12-01T13:00:00Z' };

  it('shows the comment, who saved it, and the recomputed comparison', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER), 'GET /api/comparisons/:id': ok({ ...SAVED, comparison: comparison() }), 'GET /api/fit-runs/:id/residuals': ok(residuals(2, ['wide-1'])) });
    renderApp('/comparisons/31');
    expect(await screen.findByRole('heading', { name: 'Comparison #31' })).toBeTruthy();
    expect(screen.getByText(/Saved by Lee Lead on 1 Dec 2026, 13:00 UTC/)).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Open as a live comparison' }).getAttribute('href')).toBe('/pulsars/4/compare?runs=21,22');
    expect(statisticRow('AIC')[1]).toContain('lowest AIC');
    expect(screen.queryByRole('form', { name: 'Save comparison' })).toBeNull();
  });

  it('explains a comparison that can no longer be computed (409)', async () => {
    mockApi({
      'GET /api/auth/me': ok(VIEWER),
      'GET /api/comparisons/:id': fail(409, 'comparison_unavailable', 'fit run 22 has no stored result any more'),
    });
    renderApp('/comparisons/31');
    const alert = await screen.findByRole('alert');
    expect(within(alert).getByText('This comparison can no longer be computed')).toBeTruthy();
    expect(alert.textContent).toContain('fit run 22 has no stored result any more');
  });
});

describe('compare fits on the pulsar page', () => {
  const summary = { chi2: 1400, dof: 1297, reducedChi2: 1.08, weightedRmsUs: 2.2, iterations: 3, converged: true, warnings: [] };
  const run = (id: number, revisionId: number, status: string) => ({
    id, pulsarId: 4, revisionId, campaignId: null, status, progress: { percent: 100, stage: status }, inputsHash: `h${id}`, settings: SETTINGS,
    toaCount: N_TOAS, excludedCount: 0, requestedBy: null, queuedAt: '2026-12-01T11:00:00Z', startedAt: '2026-12-01T11:00:01Z',
    finishedAt: '2026-12-01T12:00:00Z', durationMs: 900, errorMessage: null, result: status === 'succeeded' ? summary : null,
  });
  const revision = (id: number, message: string, releasedAt: string | null) => ({
    id, pulsarId: 4, parentId: null, author: null, message, createdAt: '2026-11-21T09:00:00Z', releasedAt, releasedBy: null, releaseNote: null,
  });
  const SAVED: SavedComparison[] = [
    { id: 31, pulsarId: 4, fitRunIds: [22, 21], comment: 'position helps', createdBy: { id: 3, displayName: 'Lee Lead' }, createdAt: '2026-12-01T13:00:00Z' },
  ];
  const pageRoutes = (runs: object[], saved: SavedComparison[]) => ({
    'GET /api/auth/me': ok(VIEWER),
    'GET /api/pulsars/:id': ok(PULSAR),
    'GET /api/pulsars/:id/toa-batches': ok([]),
    'GET /api/pulsars/:id/revisions': ok([revision(102, 'with position', '2026-12-01T10:00:00Z'), revision(101, 'spin only', null)]),
    'GET /api/pulsars/:id/fit-runs': ok(runs),
    'GET /api/pulsars/:id/comparisons': ok(saved),
    'GET /api/pulsars/:id/search-runs': ok([]),
    'GET /api/fit-runs/:id/residuals': ok(residuals(2, ['wide-1'])),
    'GET /api/notifications': ok({ pulsarIds: [], campaignIds: [] }),
  });

  it('picks 2–4 finished runs, the first ticked as reference, and lists the saved comparisons', async () => {
    mockApi(pageRoutes([run(23, 101, 'failed'), run(22, 102, 'succeeded'), run(21, 101, 'succeeded')], SAVED));
    const { user } = renderApp('/pulsars/4');
    const picker = await screen.findByRole('list', { name: 'Finished fit runs to compare' });
    const items = within(picker).getAllByRole('listitem');
    expect(items).toHaveLength(2); // the failed run has nothing to compare
    expect(items[0].textContent).toContain('revision 2 (#102) · with position');
    expect(within(items[0]).getByText('released')).toBeTruthy();
    expect(within(items[1]).queryByText('released')).toBeNull();
    expect(screen.getByText('Tick at least two runs to compare them.')).toBeTruthy();

    await user.click(within(items[0]).getByRole('checkbox'));
    expect(within(items[0]).getByText('reference')).toBeTruthy();
    expect(screen.queryByRole('link', { name: /^Compare \d runs$/ })).toBeNull();
    await user.click(within(items[1]).getByRole('checkbox'));
    expect(screen.getByRole('link', { name: 'Compare 2 runs' }).getAttribute('href')).toBe('/pulsars/4/compare?runs=22,21');

    const saved = screen.getByRole('list', { name: 'Saved comparisons' });
    expect(within(saved).getByText('position helps')).toBeTruthy();
    expect(within(saved).getByRole('link', { name: 'Comparison #31' }).getAttribute('href')).toBe('/comparisons/31');
    expect(within(saved).getByText('runs #22, #21 (reference #22)')).toBeTruthy();
  });

  it('says what to do next when fewer than two fits have finished and nothing is saved', async () => {
    mockApi(pageRoutes([run(21, 101, 'succeeded')], []));
    renderApp('/pulsars/4');
    expect(await screen.findByText('Two finished fits are needed to compare')).toBeTruthy();
    expect(screen.getByText(/Queue a fit of another revision/)).toBeTruthy();
    expect(await screen.findByText(/No saved comparisons yet\. A group lead can save a comparison with a comment\./)).toBeTruthy();
  });
});

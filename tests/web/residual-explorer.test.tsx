import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ExplorerTable } from '../../api/contracts/explorer';
import { resetCsrfToken } from '../../web/lib/api-client';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { companionDelaysFromDaysS } from '../../worker/timing/orbits/companion-delays';
import { parseMjd } from '../../worker/timing/time/mjd-string';
import { fail, mockApi, ok } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

// A stand-in for Plotly: shows the traces' names and point counts, and offers buttons that fire
// the selection event the way Plotly does (points carry the trace's customdata = table row).
const plotlyMock = vi.hoisted(() => ({ downloadImage: vi.fn(async () => 'ok') }));
vi.mock('plotly.js-dist-min', () => ({ default: plotlyMock }));
vi.mock('react-plotly.js/factory', () => ({
  default: () =>
    function FakePlot(props: {
      data: { name: string; x: ArrayLike<number>; customdata?: ArrayLike<number>; marker?: { symbol: string; color: string }; visible?: true | 'legendonly' }[];
      layout: { xaxis?: { title?: { text?: string } }; yaxis?: { title?: { text?: string } } };
      onSelected?: (event: { points: { customdata: number }[] }) => void;
      onInitialized?: (figure: unknown, div: HTMLElement) => void;
    }) {
      return (
        <div
          // The periodogram panel draws with Plotly too; only the residual plot is "plotly".
          data-testid={props.layout.yaxis?.title?.text?.startsWith('Residual') ? 'plotly' : 'plotly-other'}
          data-traces={props.data.map((t) => `${t.name}:${t.x.length}:${t.marker?.symbol ?? 'line'}`).join(',')}
          data-hidden={props.data.filter((t) => t.visible === 'legendonly').map((t) => t.name).join(',')}
          ref={(div) => {
            if (div) props.onInitialized?.({}, div);
          }}
        >
          {props.layout.xaxis?.title?.text} / {props.layout.yaxis?.title?.text}
          <button type="button" onClick={() => props.onSelected?.({ points: [{ customdata: 0 }, { customdata: 1 }] })}>
            fake box over rows 0 and 1
          </button>
          <button type="button" onClick={() => props.onSelected?.({ points: [{ customdata: 2 }] })}>
            fake box over row 2
          </button>
        </div>
      );
    },
}));

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  plotlyMock.downloadImage.mockClear();
});

const ANALYST_ME = {
  user: { id: 3, email: 'ana@example.org', displayName: 'Ana Analyst', role: 'analyst' },
  permissions: ['observatories:read', 'pulsars:read', 'pulsars:create', 'jobs:start', 'jobs:read', 'toas:upload', 'toas:exclude', 'models:edit', 'fits:run'],
};
const VIEWER_ME = { user: { id: 7, email: 'vi@example.org', displayName: 'Vi Viewer', role: 'viewer' }, permissions: ['observatories:read', 'pulsars:read', 'jobs:read'] };

// Everything below is invented, in the contract's shapes (api/contracts/explorer.ts, docs/api-workflow.md).
const MODEL = {
  format: 'pulsekeeper-model/1',
  pulsar: 'J0444+4444',
  epoch_mjd: '58000',
  spin: { frequency_hz: '190.25', frequency_derivatives: ['-1e-16'] },
  astrometry: { ra_hms: '04:44:44.4', dec_dms: '+44:44:44', pm_ra_cosdec_mas_per_yr: 0, pm_dec_mas_per_yr: 0, parallax_mas: 0 },
  dispersion: { dm_pc_per_cm3: 12, dm_derivatives: [] },
  companions: [
    { name: 'b', kind: 'keplerian', enabled: true, period_days: '47.5', projected_semimajor_axis_lt_s: '8e-5', eccentricity: 0.05, periastron_longitude_deg: 30, periastron_epoch_mjd: '58010' },
  ],
  solve_for: ['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'companions[b].period_days'],
};

/** n TOAs every 11 days, σ = 1 µs, residuals a small deterministic wiggle, delays from the model's companion. */
function explorerTable(n = 40): ExplorerTable {
  const hi = Array.from({ length: n }, (_, i) => 3 + 11 * i + 0.123);
  const companionsS = Array.from(companionDelaysFromDaysS(readModelFile(MODEL).companions, { reference: parseMjd('58000'), hi: Float64Array.from(hi), lo: new Float64Array(n) }));
  const zeros = () => new Array<number>(n).fill(0);
  return {
    fitRunId: 31, pulsarId: 4, revisionId: 9, count: n,
    toaId: Array.from({ length: n }, (_, i) => 1000 + i),
    batchId: Array.from({ length: n }, (_, i) => (i < n / 2 ? 5 : 6)),
    batchRow: Array.from({ length: n }, (_, i) => (i % (n / 2)) + 1),
    mjd: hi.map((d) => (58000 + d).toFixed(9)),
    observatory: Array.from({ length: n }, (_, i) => (i % 3 === 0 ? 'obs-b' : 'obs-a')),
    backend: Array.from({ length: n }, (_, i) => (i % 2 === 0 ? 'wide-1' : 'narrow-2')),
    frequencyMhz: Array.from({ length: n }, (_, i) => (i % 2 === 0 ? 1400 : 820)),
    uncertaintyUs: new Array<number>(n).fill(1),
    residualUs: Array.from({ length: n }, (_, i) => 0.8 * Math.sin(i * 1.7)),
    excluded: Array.from({ length: n }, (_, i) => i === n - 1),
    evaluated: new Array<boolean>(n).fill(true),
    nearestPulse: new Array<boolean>(n).fill(true),
    referenceMjd: '58000',
    barycentricDaysHi: hi,
    barycentricDaysLo: zeros(),
    delays: { clockS: zeros(), ttMinusUtcS: new Array<number>(n).fill(69.184), tdbMinusTtS: zeros(), roemerS: zeros(), shapiroS: zeros(), dispersionS: zeros(), backendOffsetS: zeros(), companionsS },
    partials: [],
    phaseOffsetTurns: 0,
    spinFrequencyHz: '190.25',
    weightedRmsUs: 0.57,
    fittedModel: MODEL,
    settings: { ephemeris: 'DE405', clock: 'observatory clock corrections → UTC', timeScale: 'TDB via ERFA dtdb (topocentric)', earthOrientation: 'IAU 2006/2000A', jupiterShapiro: 'not included', engineVersion: 'test' },
    engineSettings: {},
  };
}

const PULSAR = {
  id: 4, name: 'J0444+4444', raHms: '04:44:44.4', decDms: '+44:44:44', toaCount: 40, firstMjd: '58003.123', lastMjd: '58432.123',
  observatories: ['obs-a', 'obs-b'], createdAt: '2026-11-01T00:00:00Z', revisionCount: 1, statisticsUpdatedAt: null,
  latestFit: { id: 31, status: 'succeeded', reducedChi2: 1.07, weightedRmsUs: 0.57, finishedAt: '2026-12-01T12:00:00Z' },
};
const RUN = {
  id: 31, pulsarId: 4, revisionId: 9, campaignId: null, status: 'succeeded', progress: { percent: 100, stage: 'done' }, inputsHash: 'h31',
  settings: { ephemeris: 'DE405' }, toaCount: 39, excludedCount: 1, requestedBy: null, queuedAt: '2026-12-01T11:00:00Z', startedAt: null,
  finishedAt: '2026-12-01T12:00:00Z', durationMs: 100, errorMessage: null,
  result: { chi2: 13, dof: 35, reducedChi2: 0.37, weightedRmsUs: 0.57, iterations: 2, converged: true, warnings: [] },
};
const exclusion = (toaId: number, restoredAt: string | null = null) => ({
  id: toaId, toaId, reason: 'RFI', excludedBy: { id: 3, displayName: 'Ana Analyst' }, excludedAt: '2026-12-01T10:00:00Z', restoredBy: null, restoredAt,
});

function routes(table: ExplorerTable, extra: Record<string, Parameters<typeof mockApi>[0][string]> = {}, me: unknown = ANALYST_ME) {
  return {
    'GET /api/auth/me': ok(me),
    'GET /api/auth/csrf': ok({ token: 'tok' }),
    'GET /api/pulsars/:id': ok(PULSAR),
    'GET /api/pulsars/:id/fit-runs': ok([RUN]),
    'GET /api/pulsars/:id/exclusions': ok([exclusion(1039)]),
    'GET /api/fit-runs/:id/explorer': ok(table),
    'GET /api/fit-runs/:id': ok({
      ...RUN,
      result: { ...RUN.result, parameters: { 'spin.frequency_hz': { value: '190.25', uncertainty: 1e-11, unit: 'Hz', startValue: '190.25', changeSigma: 0 } }, fittedModel: MODEL },
    }),
    ...extra,
  };
}

const rmsText = () => screen.getByTestId('summary-rms').textContent ?? '';
const rmsValue = () => Number.parseFloat(rmsText());

describe('residual explorer', () => {
  it('shows the summary line with counts, weighted RMS, reduced χ² and the settings behind them', async () => {
    const table = explorerTable();
    mockApi(routes(table));
    renderApp('/pulsars/4/explorer?fit=31');
    expect(await screen.findByRole('heading', { name: 'Residual explorer · J0444+4444' })).toBeTruthy();
    const summary = await screen.findByRole('status', { name: 'Summary' });
    expect(within(summary).getByTestId('summary-used').textContent).toBe('39');
    expect(within(summary).getByTestId('summary-excluded').textContent).toBe('1');
    // Weighted RMS with σ = 1 for all: sqrt(mean r²) over the 39 used TOAs (fit-statistics.ts definition).
    const used = table.residualUs.slice(0, 39) as number[];
    const want = Math.sqrt(used.reduce((s, r) => s + r * r, 0) / used.length);
    expect(rmsText()).toBe(`${want.toPrecision(3)} µs`);
    // dof = 39 − (3 solved-for + phase offset)
    expect(summary.textContent).toContain('(35 dof)');
    expect(within(summary).getByTestId('summary-chi2').textContent).toBe((used.reduce((s, r) => s + r * r, 0) / 35).toPrecision(3));
    expect(summary.textContent).toContain('DE405');
    expect(summary.textContent).toContain('TDB via ERFA dtdb');
    const plot = await screen.findByTestId('plotly');
    // Two backends with different symbols, then the excluded TOA hollow.
    expect(plot.getAttribute('data-traces')).toBe('narrow-2:19:circle,wide-1:20:square,Excluded from fits:1:circle-open');
    expect(plot.textContent).toContain('MJD (day) / Residual (µs)');
  });

  it('switching a companion off raises the RMS in the browser, on again brings it back, without queueing a fit', async () => {
    const server = mockApi(routes(explorerTable()));
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    const before = rmsText();
    const toggle = screen.getByRole('switch', { name: 'Companion b in the model' });
    expect(toggle.getAttribute('aria-checked')).toBe('true');
    await user.click(toggle);
    expect(toggle.getAttribute('aria-checked')).toBe('false');
    // x = 80 µs: the companion's signature is tens of µs, far above the ~0.6 µs fit.
    expect(rmsValue()).toBeGreaterThan(20);
    expect(screen.getByRole('status', { name: 'Summary' }).textContent).toContain('companion b off');
    expect(screen.getByText(/Last preview took/)).toBeTruthy();
    await user.click(toggle);
    expect(rmsText()).toBe(before);
    expect(screen.getByRole('status', { name: 'Summary' }).textContent).not.toContain('preview');
    expect(server.calls.filter((c) => c.method === 'POST')).toEqual([]);
  });

  it('previews a value typed into the parameter panel the same fast way', async () => {
    mockApi(routes(explorerTable()));
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    const before = rmsValue();
    // A spin frequency 1e-9 Hz higher: over ~430 days the phase drifts by up to ~0.02 turns ≈ 100 µs.
    const input = screen.getByLabelText('Spin frequency (Hz)');
    await user.clear(input);
    await user.type(input, '190.250000001');
    await waitFor(() => expect(rmsValue()).toBeGreaterThan(10 * before));
    expect(screen.getByRole('status', { name: 'Summary' }).textContent).toContain('preview of the edited model');
  });

  it('excludes the box-selected TOAs with a reason, shows the new count, and undoes it', async () => {
    const table = explorerTable();
    let active = [exclusion(1039)];
    const server = mockApi(
      routes(table, {
        'GET /api/pulsars/:id/exclusions': () => ok(active),
        'POST /api/pulsars/:id/exclusions': (call) => {
          const body = call.body as { toaIds: number[] };
          active = [...active, ...body.toaIds.map((id) => exclusion(id))];
          return ok({ excluded: body.toaIds.length }, 201);
        },
        'POST /api/pulsars/:id/exclusions/restore': (call) => {
          const body = call.body as { toaIds: number[] };
          active = active.map((e) => (body.toaIds.includes(e.toaId) ? { ...e, restoredAt: '2026-12-01T13:00:00Z' } : e));
          return ok({ restored: body.toaIds.length });
        },
      }),
    );
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    await user.click(screen.getByRole('button', { name: 'fake box over rows 0 and 1' }));
    expect(screen.getByTestId('selection-count').textContent).toBe('2 TOAs selected');
    // The delay chain of the two selected TOAs.
    const delays = screen.getByRole('table', { name: 'Delay components of the selected TOAs' });
    expect(within(delays).getAllByRole('row').slice(1).map((r) => within(r).getAllByRole('cell')[0].textContent)).toEqual(['#1000', '#1001']);

    await user.click(screen.getByRole('button', { name: 'Exclude with reason' }));
    expect(screen.getByText(/Reason: say why/)).toBeTruthy();
    expect(server.callsTo('POST', '/api/pulsars/4/exclusions')).toHaveLength(0);

    await user.type(screen.getByLabelText('Reason for leaving them out'), 'scintillation dropout');
    await user.click(screen.getByRole('button', { name: 'Exclude with reason' }));
    await waitFor(() => expect(screen.getByTestId('summary-excluded').textContent).toBe('3'));
    expect(screen.getByTestId('summary-used').textContent).toBe('37');
    const [post] = server.callsTo('POST', '/api/pulsars/4/exclusions');
    expect(post.body).toEqual({ toaIds: [1000, 1001], reason: 'scintillation dropout' });
    expect(post.headers['x-csrf-token']).toBe('tok');
    expect(screen.getByRole('status', { name: 'Summary' }).textContent).toContain('exclusions changed since the fit');
    expect(screen.getByTestId('plotly').getAttribute('data-traces')).toContain('Excluded from fits:3:circle-open');

    await user.click(screen.getByRole('button', { name: 'Undo last change' }));
    await waitFor(() => expect(screen.getByTestId('summary-excluded').textContent).toBe('1'));
    expect(server.callsTo('POST', '/api/pulsars/4/exclusions/restore')[0].body).toEqual({ toaIds: [1000, 1001] });
  });

  it('includes an excluded TOA again', async () => {
    let active = [exclusion(1039)];
    const table = explorerTable();
    // Row 2 excluded now (not at fit time).
    active = [...active, exclusion(1002)];
    const server = mockApi(
      routes(table, {
        'GET /api/pulsars/:id/exclusions': () => ok(active),
        'POST /api/pulsars/:id/exclusions/restore': (call) => {
          const ids = (call.body as { toaIds: number[] }).toaIds;
          active = active.filter((e) => !ids.includes(e.toaId));
          return ok({ restored: ids.length });
        },
      }),
    );
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    expect(screen.getByTestId('summary-excluded').textContent).toBe('2');
    await user.click(screen.getByRole('button', { name: 'fake box over row 2' }));
    expect(screen.getByTestId('selection-count').textContent).toBe('1 TOA selected (1 excluded now)');
    expect((screen.getByRole('button', { name: 'Exclude with reason' }) as HTMLButtonElement).disabled).toBe(true);
    await user.click(screen.getByRole('button', { name: 'Include again' }));
    await waitFor(() => expect(screen.getByTestId('summary-excluded').textContent).toBe('1'));
    expect(server.callsTo('POST', '/api/pulsars/4/exclusions/restore')[0].body).toEqual({ toaIds: [1002] });
  });

  it('selects an x range from the keyboard', async () => {
    mockApi(routes(explorerTable()));
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    await user.type(screen.getByLabelText('Select from (MJD (day))'), '58000');
    await user.type(screen.getByLabelText('to'), '58030');
    await user.keyboard('{Enter}');
    // MJD 58003.123, 58014.123, 58025.123
    expect(screen.getByTestId('selection-count').textContent).toBe('3 TOAs selected');
  });

  it('exports the plot as PNG and SVG through Plotly, the residuals as CSV and the fitted model as JSON', async () => {
    const table = explorerTable();
    mockApi(routes(table));
    const blobs: Blob[] = [];
    vi.stubGlobal('URL', Object.assign(URL, { createObjectURL: (b: Blob) => (blobs.push(b), 'blob:x'), revokeObjectURL: () => undefined }));
    const clicked: string[] = [];
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(function (this: HTMLAnchorElement) {
      clicked.push(this.download);
    });
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    await user.click(screen.getByRole('button', { name: 'Plot as PNG' }));
    await user.click(screen.getByRole('button', { name: 'Plot as SVG' }));
    expect(plotlyMock.downloadImage.mock.calls.map((c) => (c as unknown as [unknown, { format: string; filename: string }])[1])).toEqual([
      expect.objectContaining({ format: 'png', filename: 'J0444+4444_fit-31_residuals' }),
      expect.objectContaining({ format: 'svg', filename: 'J0444+4444_fit-31_residuals' }),
    ]);
    await user.click(screen.getByRole('button', { name: 'Residuals CSV' }));
    await user.click(screen.getByRole('button', { name: 'Fitted model JSON' }));
    expect(clicked).toEqual(['J0444+4444_fit-31_residuals.csv', 'J0444+4444_fit-31_fitted-model.json']);
    const csv = (await blobs[0].text()).split('\n');
    expect(csv[0]).toMatch(/^# residuals of fit 31/);
    expect(csv[1]).toBe('toa_id,batch_id,batch_row,mjd,observatory,backend,frequency_mhz,uncertainty_us,residual_us,excluded');
    expect(csv[2]).toBe(`1000,5,1,${table.mjd[0]},obs-b,wide-1,1400,1,${table.residualUs[0]},false`);
    expect(csv[41]).toMatch(/,true$/); // the excluded TOA
    expect(JSON.parse(await blobs[1].text())).toEqual(MODEL);
    click.mockRestore();
  });

  it('offers orbital phase of a companion and µs or turns on the axes', async () => {
    mockApi(routes(explorerTable()));
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    await user.selectOptions(screen.getByLabelText('Horizontal axis'), 'orbital-phase');
    await user.selectOptions(screen.getByLabelText('Residuals in'), 'turns');
    expect(screen.getByTestId('plotly').textContent).toContain('Orbital phase of b (turns) / Residual (turns)');
    await user.click(screen.getByLabelText('Draw its delay curve'));
    expect(screen.getByTestId('plotly').getAttribute('data-traces')).toContain('Delay of b:2000:line');
    await user.selectOptions(screen.getByLabelText('Colour and symbol by'), 'observatory');
    expect(screen.getByTestId('plotly').getAttribute('data-traces')).toMatch(/^obs-a:26:circle,obs-b:13:square/);
  });

  it('hides and shows groups from the keyboard, never all of them', async () => {
    mockApi(routes(explorerTable()));
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    const groups = screen.getByRole('group', { name: 'Groups drawn' });
    const wide = within(groups).getByRole('button', { name: /wide-1 \(20\)/ });
    wide.focus();
    await user.keyboard('{Enter}');
    expect(wide.getAttribute('aria-pressed')).toBe('false');
    expect(screen.getByTestId('plotly').getAttribute('data-hidden')).toBe('wide-1');
    await user.click(within(groups).getByRole('button', { name: /Excluded from fits/ }));
    expect((within(groups).getByRole('button', { name: /narrow-2/ }) as HTMLButtonElement).disabled).toBe(true); // the last one drawn
    await user.click(wide);
    expect(screen.getByTestId('plotly').getAttribute('data-hidden')).toBe('Excluded from fits');
  });

  it('tells a viewer that exclusions need another role', async () => {
    mockApi(routes(explorerTable(), {}, VIEWER_ME));
    const { user } = renderApp('/pulsars/4/explorer?fit=31');
    await screen.findByTestId('plotly');
    await user.click(screen.getByRole('button', { name: 'fake box over rows 0 and 1' }));
    expect(screen.queryByRole('button', { name: 'Exclude with reason' })).toBeNull();
    expect(screen.getByText(/Your role can look at exclusions but not change them/)).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Queue fit with current exclusions' })).toBeNull();
  });

  it('explains a fit without explorer data and a pulsar without a finished fit', async () => {
    mockApi(routes(explorerTable(), { 'GET /api/fit-runs/:id/explorer': fail(404, 'explorer_not_stored', 'no explorer data') }));
    renderApp('/pulsars/4/explorer?fit=31');
    expect(await screen.findByText('This fit has no explorer data')).toBeTruthy();
    cleanup();
    mockApi(routes(explorerTable(), { 'GET /api/pulsars/:id/fit-runs': ok([]) }));
    renderApp('/pulsars/4/explorer');
    expect(await screen.findByText('No finished fit yet')).toBeTruthy();
  });

  it('shows the error of a failed request with a retry', async () => {
    mockApi(routes(explorerTable(), { 'GET /api/fit-runs/:id/explorer': fail(500, 'internal', 'boom') }));
    renderApp('/pulsars/4/explorer?fit=31');
    expect(await screen.findByText('Could not load the explorer data', {}, { timeout: 8000 })).toBeTruthy();
    expect(screen.getByRole('button', { name: 'Try again' })).toBeTruthy();
  });
});

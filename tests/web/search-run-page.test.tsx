import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';
import { massFunctionSolarMasses } from '../../worker/timing/physics/mass-function';
import { minimumCompanionMass } from '../../worker/timing/physics/minimum-companion-mass';
import { orbitalSeparationAu } from '../../worker/timing/physics/orbital-separation';

// Plotly needs a real browser; the fake plot reports what it was given.
vi.mock('plotly.js-dist-min', () => ({ default: {} }));
vi.mock('react-plotly.js/factory', () => ({
  default: () =>
    function FakePlot(props: {
      data: { name: string; x: number[]; y: number[]; marker?: { symbol: string } }[];
      layout: { xaxis: { type: string; title: { text: string } }; yaxis: { title: { text: string } }; shapes: unknown[]; annotations: { text: string }[] };
    }) {
      const peak = props.data.find((t) => t.marker?.symbol === 'diamond');
      return (
        <div
          data-testid="plotly"
          data-x-type={props.layout.xaxis.type}
          data-traces={props.data.map((t) => `${t.name}:${t.x.length}`).join('|')}
          data-peak={peak ? `${peak.x[0]},${peak.y[0]}` : ''}
          data-shapes={props.layout.shapes.length}
          data-annotations={props.layout.annotations.map((a) => a.text).join('|')}
        >
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

// Role "analyst" with the permissions api/auth/permissions.ts gives it.
const ANALYST_ME = {
  user: { id: 3, email: 'ana@example.org', displayName: 'Ana Analyst', role: 'analyst' },
  permissions: ['observatories:read', 'pulsars:read', 'pulsars:create', 'jobs:start', 'jobs:read', 'toas:upload', 'toas:exclude', 'models:edit', 'fits:run', 'searches:run'],
};

// Everything below is invented demo data in the shapes of api/contracts/search-runs.ts.
const SETTINGS = {
  ephemeris: 'DE405',
  clock: 'observatory clock corrections → UTC',
  timeScale: 'TDB via ERFA dtdb (topocentric)',
  earthOrientation: 'IAU 2006/2000A, UT1 = UTC, no polar motion',
  jupiterShapiro: 'not included',
  engineVersion: 'pulsekeeper-engine/0.1.0',
  periodogram: 'generalized Lomb–Scargle, floating mean, TOA weights',
  falseAlarm: 'Baluev 2008 analytic approximation',
  companionKind: 'keplerian (Blandford–Teukolsky 1976)',
};
const OPTIONS = { minPeriodDays: null, maxPeriodDays: null, maxCompanions: 3, falseAlarmThreshold: 0.001, assumedPulsarMassSolar: 1.4 };
const peak = (round: number, periodDays: number, power: number, fap: number, aliasWarnings: string[] = []) => ({
  round, periodDays, frequencyPerDay: 1 / periodDays, power, falseAlarmProbability: fap, significant: fap < 0.001, aliasWarnings,
});
const PEAKS = [
  peak(1, 41.3, 0.62, 2e-9),
  peak(2, 8.07, 0.31, 4e-5),
  peak(3, 366.1, 0.22, 3e-4, ['one-year: peak at 366.1 d is near 1 year (365.25 d): likely a position or proper-motion error — fit astrometry first']),
  peak(4, 2.9, 0.05, 0.4),
];
const value = (v: string, uncertainty: number | null, unit: string) => ({ value: v, uncertainty, unit });
// The server's derived figures, made consistent with the elements by the engine's own routines.
const derived = (xLightSeconds: number, periodDays: number) => {
  const massFunctionSolar = massFunctionSolarMasses(xLightSeconds, periodDays * 86_400);
  const minimum = minimumCompanionMass(massFunctionSolar, 1.4);
  return {
    massFunctionSolar, assumedPulsarMassSolar: 1.4, minimumCompanionMass: minimum,
    separationAu: orbitalSeparationAu(1.4 + minimum.solarMasses, periodDays * 86_400),
  };
};
const DERIVED_B = derived(0.000851, 41.29873);
const CANDIDATES = [
  {
    round: 1, name: 'b', kind: 'keplerian', status: 'accepted', reason: null, falseAlarmProbability: 2e-9, seedPeriodDays: 41.3,
    elements: {
      period_days: value('41.29873', 0.00042, 'd'),
      projected_semimajor_axis_lt_s: value('0.000851', 1.3e-5, 'lt-s'),
      eccentricity: value('0.21', 0.034, ''),
      periastron_longitude_deg: value('112.4', 6.1, 'deg'),
      periastron_epoch_mjd: value('58010.61', 0.52, 'MJD'),
    },
    chi2Before: 5120.4, chi2After: 1710.2, chi2Change: -3410.2,
    eccentricityTest: { attempted: true, statistic: 21.7, probability: 3.1e-9, kept: true }, converged: true,
    derived: DERIVED_B,
  },
  {
    round: 2, name: 'c', kind: 'keplerian', status: 'accepted', reason: null, falseAlarmProbability: 4e-5, seedPeriodDays: 8.07,
    elements: {
      period_days: value('8.0712', 0.0003, 'd'),
      projected_semimajor_axis_lt_s: value('0.000102', 9e-6, 'lt-s'),
      eccentricity: value('0', null, ''),
      periastron_longitude_deg: value('0', null, 'deg'),
      periastron_epoch_mjd: value('58003.2', 0.4, 'MJD'),
    },
    chi2Before: 1710.2, chi2After: 1380.9, chi2Change: -329.3,
    eccentricityTest: { attempted: true, statistic: 0.8, probability: 0.45, kept: false }, converged: true,
    derived: derived(0.000102, 8.0712),
  },
  {
    round: 3, name: 'd', kind: 'keplerian', status: 'unstable', reason: 'eccentricity ran to 0.998 (→ 1)', falseAlarmProbability: 3e-4, seedPeriodDays: 366.1,
    elements: { period_days: value('371', 40, 'd'), projected_semimajor_axis_lt_s: value('0.0003', 0.0002, 'lt-s'), eccentricity: value('0.998', 0.2, ''), periastron_epoch_mjd: value('58100', 90, 'MJD') },
    chi2Before: 1380.9, chi2After: null, chi2Change: null, // the orbit fit failed
    eccentricityTest: { attempted: true, statistic: 2.1, probability: 0.12, kept: false }, converged: false,
    derived: { massFunctionSolar: null, assumedPulsarMassSolar: 1.4, minimumCompanionMass: { solarMasses: null, jupiterMasses: null, earthMasses: null }, separationAu: null },
  },
];
const RESULT = {
  peaks: PEAKS,
  candidates: CANDIDATES,
  companionsFound: 2,
  stopReason: 'candidate-rejected',
  finalFit: {
    chi2: 1380.9, dof: 1280, reducedChi2: 1.0788, weightedRmsUs: 2.31, converged: false, iterations: 20,
    parameters: { 'spin.frequency_hz': value('3.14159265358979', 2.1e-12, 'Hz'), 'companions[b].period_days': value('41.29873', 0.00042, 'd') },
  },
  warnings: ['final fit: design matrix is close to singular'],
  searchSettings: {
    minPeriodDays: 2, maxPeriodDays: 2000, maxCompanions: 3, falseAlarmThreshold: 0.001, eccentricityThreshold: 0.01,
    pulsarMassSolar: 1.4, oversampling: 10, frequencyCount: 40, spanDays: 2000,
  },
  engineSettings: SETTINGS,
  resultingModel: {},
};
const base = {
  id: 41, pulsarId: 4, revisionId: 9, inputsHash: 's41', options: OPTIONS, settings: SETTINGS, toaCount: 1300, excludedCount: 12,
  requestedBy: { id: 3, displayName: 'Ana Analyst' }, queuedAt: '2026-12-01T11:00:00Z', startedAt: null, finishedAt: null, durationMs: null,
  errorMessage: null, savedRevisionId: null, result: null,
};
const FINISHED = {
  ...base, status: 'succeeded', progress: { percent: 100, stage: 'done' }, startedAt: '2026-12-01T11:00:02Z', finishedAt: '2026-12-01T11:00:09Z',
  durationMs: 7100, result: RESULT,
};
// One periodogram per round; the highest power sits at the round's peak frequency.
function periodogramOf(p: (typeof PEAKS)[number]) {
  const count = 40;
  const stepPerDay = (1 / p.periodDays) / 20;
  const minFrequencyPerDay = stepPerDay; // index 19 is the peak: f = 20·Δf = 1/period
  const power = Array.from({ length: count }, (_, k) => (k === 19 ? p.power : p.power * 0.2 * ((k % 5) / 5)));
  // the threshold power: invented; round 4 as a run stored before the server kept it (null)
  return { round: p.round, grid: { minFrequencyPerDay, stepPerDay, count }, pointsPerBin: p.round === 1 ? 25 : 1, power, thresholdPower: p.round === 4 ? null : 0.118 };
}
const PERIODOGRAMS = { searchRunId: 41, falseAlarmThreshold: 0.001, rounds: PEAKS.map(periodogramOf) };

function routes(overrides: Record<string, Parameters<typeof mockApi>[0][string]> = {}) {
  return {
    'GET /api/auth/me': ok(ANALYST_ME),
    'GET /api/auth/csrf': ok({ token: 'tok' }),
    'GET /api/search-runs/:id': ok(FINISHED),
    'GET /api/search-runs/:id/periodograms': ok(PERIODOGRAMS),
    ...overrides,
  };
}

describe('search run page', () => {
  it('shows a finished search: candidates with ± uncertainties, the unstable one labelled, derived masses, warnings, rounds and settings', async () => {
    mockApi(routes());
    renderApp('/search-runs/41');
    expect(await screen.findByRole('heading', { name: 'Companion search #41' })).toBeTruthy();
    expect(screen.getByText('2 companions found; 1 candidate rejected.')).toBeTruthy();
    expect(screen.getByText(/Stopped: the last candidate’s fit was unstable or degenerate/)).toBeTruthy();

    const table = screen.getByRole('table', { name: 'Companion candidates' });
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(3);
    const b = within(rows[0]).getAllByRole('cell').map((c) => c.textContent);
    expect(b[0]).toBe('bround 1');
    expect(b[1]).toBe('✓accepted');
    expect(b[2]).toBe('41.29873 ± 0.00042d');
    expect(b[3]).toBe('0.000851 ± 0.000013lt-s'); // two significant digits of the uncertainty
    expect(b[4]).toBe('0.21 ± 0.034');
    expect(b[5]).toBe('112.4 ± 6.1deg');
    expect(b[6]).toBe('58010.61 ± 0.52MJD');
    expect(b[7]).toBe('2.0e-9');
    expect(b[8]).toBe('-3410.2');
    // A held-fixed element says so instead of showing an uncertainty.
    expect(within(rows[1]).getAllByRole('cell')[4].textContent).toBe('0(held fixed)');
    // The unstable candidate: its status in words, its reason, its non-converged fit; never "accepted".
    const d = within(rows[2]);
    expect(d.getByText('unstable — not a discovery')).toBeTruthy();
    expect(d.getByText('eccentricity ran to 0.998 (→ 1)')).toBeTruthy();
    expect(d.getByText('⚠ its fit did not converge')).toBeTruthy();
    expect(d.queryByText('accepted')).toBeNull();
    expect(d.getAllByRole('cell')[5].textContent).toBe('not fitted (circular orbit kept)');
    expect(d.getAllByRole('cell')[8].textContent).toBe('—');
    expect(screen.getByText(/χ² 1380\.9 → no value \(the orbit fit failed\)/)).toBeTruthy();
    expect(screen.getByText(/Eccentricity and periastron longitude fitted: the F-test favoured an eccentric orbit \(F = 21\.7/)).toBeTruthy();

    // Derived masses: accepted candidates only, the server's figures for the assumed 1.4 M☉.
    const masses = screen.getByRole('table', { name: 'Derived masses' });
    const massRows = within(masses).getAllByRole('row').slice(1);
    expect(massRows.map((r) => within(r).getAllByRole('cell')[0].textContent)).toEqual(['b', 'c']);
    expect(within(massRows[0]).getAllByRole('cell').map((c) => c.textContent)).toEqual([
      'b',
      DERIVED_B.massFunctionSolar.toExponential(2),
      DERIVED_B.minimumCompanionMass.solarMasses.toExponential(2),
      DERIVED_B.minimumCompanionMass.jupiterMasses.toPrecision(3),
      DERIVED_B.minimumCompanionMass.earthMasses.toPrecision(3),
      DERIVED_B.separationAu.toPrecision(3),
    ]);
    // Sanity of the invented elements: a 41.3-day orbit around 1.4 M☉ lies at 0.262 au (Kepler's third law by hand: (GMP²/4π²)^⅓).
    expect(DERIVED_B.separationAu).toBeGreaterThan(0.255);
    expect(DERIVED_B.separationAu).toBeLessThan(0.268);
    expect(screen.getByText(/a pulsar of 1\.4 M☉, as the search assumed/)).toBeTruthy();

    // Warnings: one prominent box with the final fit, the rejected candidate and the server's warning.
    const warnings = screen.getByRole('alert');
    expect(within(warnings).getByText('Read these 3 warnings before trusting the result')).toBeTruthy();
    expect(within(warnings).getByText(/The final fit did not converge after 20 iterations/)).toBeTruthy();
    expect(within(warnings).getByText('One candidate was rejected — d (unstable) — and is not in the resulting model.')).toBeTruthy();
    expect(within(warnings).queryByText(/companion d did not converge/)).toBeNull(); // rejected: said in its row, not as a discovery's warning
    expect(within(warnings).getByText('final fit: design matrix is close to singular')).toBeTruthy();

    // Rounds: peak facts, alias warning with the one-year advice, the periodogram with the peak marked.
    const round3 = screen.getByRole('region', { name: /Round 3/ });
    expect(within(round3).getByText('366.100 d')).toBeTruthy();
    expect(within(round3).getByText('3.0e-4')).toBeTruthy();
    const alias = within(round3).getByRole('list', { name: 'Alias warnings' });
    expect(within(alias).getByText('Near one year:')).toBeTruthy();
    expect(within(alias).getByText('likely a position or proper-motion error — fit astrometry first')).toBeTruthy();
    expect(within(round3).getByText(/seeded companion “d”, but its fit was unstable — not a discovery/)).toBeTruthy();
    const round4 = screen.getByRole('region', { name: /Round 4/ });
    expect(within(round4).getByText(/the peak that ended the search/)).toBeTruthy();
    expect(within(round4).getByText(/Not below the threshold 1.0e-3: the search stopped here/)).toBeTruthy();

    await waitFor(() => expect(screen.getAllByTestId('plotly')).toHaveLength(4));
    const plots = screen.getAllByTestId('plotly');
    expect(plots[0].getAttribute('data-x-type')).toBe('log');
    expect(plots[0].textContent).toBe('Period (days) / Normalised power');
    expect(plots[0].getAttribute('data-traces')).toBe('Power:40|Chosen peak (FAP 2.0e-9):1');
    expect(plots[0].getAttribute('data-peak')).toBe('41.3,0.62');
    expect(plots[0].getAttribute('data-shapes')).toBe('1'); // the threshold line at the power the API sent
    expect(plots[0].getAttribute('data-annotations')).toBe('False-alarm threshold 1.0e-3');
    expect(screen.getByRole('figure', { name: 'Periodogram of round 1' }).textContent).toMatch(/dashed line is the power 0\.118 at which the false-alarm probability \(Baluev 2008\) equals the threshold 1\.0e-3/);
    expect(plots[3].getAttribute('data-shapes')).toBe('0'); // round 4: no threshold power sent
    expect(screen.getByRole('figure', { name: 'Periodogram of round 4' }).textContent).toMatch(/stored without the power of its false-alarm threshold/);
    expect(screen.getByRole('figure', { name: 'Periodogram of round 1' }).textContent).toMatch(/each point the highest power of 25 neighbouring frequencies/);
    expect(screen.getByRole('figure', { name: 'Periodogram of round 2' }).textContent).not.toMatch(/neighbouring frequencies/);

    expect(screen.getByText(/Produced with ephemeris DE405, clock chain observatory clock corrections → UTC, time scale TDB via ERFA dtdb \(topocentric\) \(pulsekeeper-engine\/0\.1\.0\)/)).toBeTruthy();
    // Settings that produced it.
    const engine = screen.getByLabelText('Engine settings');
    expect(within(engine).getByText('DE405')).toBeTruthy();
    expect(within(engine).getByText('TDB via ERFA dtdb (topocentric)')).toBeTruthy();
    expect(within(engine).getByText('observatory clock corrections → UTC')).toBeTruthy();
    const options = screen.getByLabelText('Search options');
    expect(within(options).getByText('2.00000 d (from the data)')).toBeTruthy();
    // Final fit parameters ± 1σ.
    const params = screen.getByRole('table', { name: 'Final fit parameters' });
    expect(within(params).getByText('3.14159265358979 ± 2.1e-12')).toBeTruthy();
  });

  it('recomputes the minimum masses for another assumed pulsar mass and says so', async () => {
    mockApi(routes());
    const { user } = renderApp('/search-runs/41');
    const input = await screen.findByLabelText('Assumed pulsar mass (M☉)');
    await user.clear(input);
    await user.type(input, '2');
    expect(await screen.findByText(/a pulsar of 2 M☉, recomputed here from the mass function \(the search assumed 1\.4 M☉\)/)).toBeTruthy();
    const row = within(screen.getByRole('table', { name: 'Derived masses' })).getAllByRole('row')[1];
    const shown = Number(within(row).getAllByRole('cell')[2].textContent);
    // A heavier pulsar needs a heavier companion for the same mass function (f = m₂³ sin³i / (m_p + m₂)²).
    expect(shown).toBeGreaterThan(DERIVED_B.minimumCompanionMass.solarMasses);
    expect(within(row).getAllByRole('cell')[2].textContent).toBe(minimumCompanionMass(DERIVED_B.massFunctionSolar, 2).solarMasses.toExponential(2));
    await user.clear(input);
    await user.type(input, '9');
    expect(await screen.findByText('must be > 0 and ≤ 5; showing 1.4 M☉')).toBeTruthy();
  });

  it('saves the resulting model as a revision after asking for a message, then queues a fit of it', async () => {
    let saved = false;
    const server = mockApi(
      routes({
        'GET /api/search-runs/:id': () => ok({ ...FINISHED, savedRevisionId: saved ? 12 : null }),
        'POST /api/search-runs/:id/save-revision': () => {
          saved = true;
          return ok({ id: 12, pulsarId: 4, parentId: 9, author: { id: 3, displayName: 'Ana Analyst' }, message: 'companions b and c', createdAt: '2026-12-01T12:00:00Z', releasedAt: null, releasedBy: null, releaseNote: null, model: {} }, 201);
        },
        'POST /api/pulsars/:id/fit-runs': ok({ fitRun: { id: 77, pulsarId: 4, revisionId: 12, status: 'queued' }, reused: false }, 202),
      }),
    );
    const { user } = renderApp('/search-runs/41');
    await user.click(await screen.findByRole('button', { name: 'Save resulting model as a revision' }));
    const dialog = screen.getByRole('dialog', { name: 'Save as a new revision' });
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));
    expect(within(dialog).getByText('Message: say in a few words what changed.')).toBeTruthy();
    expect(server.callsTo('POST', '/api/search-runs/41/save-revision')).toHaveLength(0);
    await user.type(within(dialog).getByLabelText('Message'), 'companions b and c');
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));

    expect(await screen.findByText('Saved as revision #12')).toBeTruthy();
    expect(screen.queryByRole('dialog')).toBeNull();
    const calls = server.callsTo('POST', '/api/search-runs/41/save-revision');
    expect(calls).toHaveLength(1);
    expect(calls[0].body).toEqual({ message: 'companions b and c' });
    expect(calls[0].headers['x-csrf-token']).toBe('tok');
    expect(screen.getByRole('link', { name: 'revision #12' }).getAttribute('href')).toBe('/pulsars/4/model?revision=12');
    expect(screen.queryByRole('button', { name: 'Save resulting model as a revision' })).toBeNull();

    await user.click(screen.getByRole('button', { name: 'Queue a fit of revision #12' }));
    expect((await screen.findByRole('link', { name: 'fit run #77' })).getAttribute('href')).toBe('/fit-runs/77');
    expect(server.callsTo('POST', '/api/pulsars/4/fit-runs')[0].body).toEqual({ revisionId: 12 });
    await waitFor(() => expect(server.callsTo('GET', '/api/search-runs/41').length).toBeGreaterThan(1)); // refreshed savedRevisionId
  });

  it('shows the server’s refusal inside the dialog', async () => {
    mockApi(routes({ 'POST /api/search-runs/:id/save-revision': fail(409, 'conflict', 'search run 41 was already saved as revision 12') }));
    const { user } = renderApp('/search-runs/41');
    await user.click(await screen.findByRole('button', { name: 'Save resulting model as a revision' }));
    const dialog = screen.getByRole('dialog');
    await user.type(within(dialog).getByLabelText('Message'), 'again');
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));
    expect(await within(dialog).findByText(/search run 41 was already saved as revision 12/)).toBeTruthy();
  });

  it('offers no save or cancel to a viewer and explains why', async () => {
    mockApi(routes({ 'GET /api/auth/me': ok(VIEWER_ME) }));
    renderApp('/search-runs/41');
    expect(await screen.findByText('Saving the resulting model as a revision needs the analyst role or higher.')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Save resulting model as a revision' })).toBeNull();
  });

  it('polls while queued and running with a progress bar, cancels on request', async () => {
    let cancelled = false;
    let polls = 0;
    const server = mockApi(
      routes({
        'GET /api/search-runs/:id': () => {
          polls += 1;
          if (cancelled) return ok({ ...base, status: 'cancelled', progress: { percent: 45, stage: 'cancelled' } });
          if (polls === 1) return ok({ ...base, status: 'queued', progress: { percent: 0, stage: 'waiting for a worker' } });
          return ok({ ...base, status: 'running', startedAt: '2026-12-01T11:00:02Z', progress: { percent: 45, stage: 'round 2: periodogram' } });
        },
        'POST /api/search-runs/:id/cancel': () => {
          cancelled = true;
          return ok({ ...base, status: 'cancelled', progress: { percent: 45, stage: 'cancelled' } });
        },
      }),
    );
    const { user } = renderApp('/search-runs/41');
    expect(await screen.findByText('waiting for a worker')).toBeTruthy();
    const bar = await screen.findByRole('progressbar', { name: 'Search progress' });
    await waitFor(() => expect(bar.getAttribute('aria-valuenow')).toBe('45'), { timeout: 4000 });
    expect(screen.getByText('round 2: periodogram')).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Cancel search' }));
    expect(await screen.findByText('The search was cancelled')).toBeTruthy();
    expect(server.callsTo('POST', '/api/search-runs/41/cancel')).toHaveLength(1);
    expect(server.callsTo('GET', '/api/search-runs/41/periodograms')).toHaveLength(0);
    const pollsAtEnd = polls;
    await new Promise((r) => setTimeout(r, 1500));
    expect(polls).toBe(pollsAtEnd);
  });

  it('shows no Cancel button to a viewer while a search runs', async () => {
    mockApi(routes({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/search-runs/:id': ok({ ...base, status: 'running', progress: { percent: 10, stage: 'initial fit' } }) }));
    renderApp('/search-runs/41');
    expect(await screen.findByText('initial fit')).toBeTruthy();
    expect(screen.queryByRole('button', { name: 'Cancel search' })).toBeNull();
  });

  it('shows the engine’s message for a failed search and reports an unknown one', async () => {
    mockApi(routes({ 'GET /api/search-runs/:id': (_c, p) => (p.id === '41' ? ok({ ...base, status: 'failed', progress: { percent: 5, stage: 'initial fit' }, errorMessage: 'no TOAs are included' }) : fail(404, 'not_found', 'No search run 99')) }));
    const first = renderApp('/search-runs/41');
    expect(await screen.findByText('The search failed')).toBeTruthy();
    expect(screen.getByText('no TOAs are included')).toBeTruthy();
    first.unmount();
    renderApp('/search-runs/99');
    expect(await screen.findByText('No companion search with this id')).toBeTruthy();
  });

  it('keeps the rest of the page when the periodograms cannot be loaded', async () => {
    mockApi(routes({ 'GET /api/search-runs/:id/periodograms': fail(500, 'internal', 'boom') }));
    renderApp('/search-runs/41');
    expect(await screen.findByText('Could not load the periodograms')).toBeTruthy();
    expect(screen.getByRole('table', { name: 'Companion candidates' })).toBeTruthy();
    expect(screen.getByRole('region', { name: /Round 1/ })).toBeTruthy();
  });
});

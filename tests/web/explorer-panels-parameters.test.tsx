import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { useState } from 'react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { ExplorerTable } from '../../api/contracts/explorer';
import { FIT_ENGINE_SETTINGS } from '../../api/contracts/fit-runs';
import { ParameterPanel } from '../../web/features/residual-explorer/components/parameter-panel';
import type { ModelFileJson } from '../../web/features/residual-explorer/lib/panels/model-parameters';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok, type RecordedCall } from './helpers/mock-api';
import { renderWithClient } from './helpers/render-app';

// Invented pulsar, fit and model.
const FITTED_MODEL: ModelFileJson = {
  format: 'pulsekeeper-model/1',
  pulsar: 'J0612+3721',
  epoch_mjd: '58500',
  spin: { frequency_hz: '311.493021877730128841', frequency_derivatives: ['-1.2e-15'] },
  astrometry: { ra_hms: '06:12:44.1021', dec_dms: '+37:21:08.55', pm_ra_cosdec_mas_per_yr: 0, pm_dec_mas_per_yr: 0, parallax_mas: 0 },
  dispersion: { dm_pc_per_cm3: 27.31, dm_derivatives: [] },
  companions: [
    { name: 'b', kind: 'keplerian', enabled: true, period_days: '17.2', projected_semimajor_axis_lt_s: '0.0021', eccentricity: 0, periastron_longitude_deg: 0, periastron_epoch_mjd: '58503.25' },
  ],
  offsets: [{ backend: 'lowband', seconds: 0 }],
  noise: [{ backend: 'lowband', uncertainty_scale: 1, added_jitter_us: 0 }],
  glitches: [],
  solve_for: ['spin.frequency_hz', 'spin.frequency_derivatives[0]'],
};

const EXPLORER: ExplorerTable = {
  fitRunId: 41,
  pulsarId: 5,
  revisionId: 12,
  count: 0,
  toaId: [],
  batchId: [],
  batchRow: [],
  mjd: [],
  observatory: [],
  backend: [],
  frequencyMhz: [],
  uncertaintyUs: [],
  residualUs: [],
  excluded: [],
  evaluated: [],
  nearestPulse: [],
  referenceMjd: '58500',
  barycentricDaysHi: [],
  barycentricDaysLo: [],
  delays: { clockS: [], ttMinusUtcS: [], tdbMinusTtS: [], roemerS: [], shapiroS: [], dispersionS: [], backendOffsetS: [], companionsS: [] },
  partials: [],
  phaseOffsetTurns: 0,
  spinFrequencyHz: '311.493021877730128841',
  weightedRmsUs: 1.2,
  fittedModel: FITTED_MODEL,
  settings: { ...FIT_ENGINE_SETTINGS },
  engineSettings: {},
};

const FIT_RUN = {
  id: 41,
  pulsarId: 5,
  revisionId: 12,
  campaignId: null,
  status: 'succeeded',
  progress: { percent: 100, stage: 'done' },
  inputsHash: 'a'.repeat(64),
  settings: FIT_ENGINE_SETTINGS,
  toaCount: 400,
  excludedCount: 0,
  requestedBy: null,
  queuedAt: '2026-12-01T20:00:00Z',
  startedAt: '2026-12-01T20:00:01Z',
  finishedAt: '2026-12-01T20:00:05Z',
  durationMs: 4000,
  errorMessage: null,
  result: {
    parameters: {
      'spin.frequency_hz': { value: '311.493021877730128841', uncertainty: 3.4e-12, unit: 'Hz', startValue: '311.4930218777', changeSigma: 1.1 },
      'spin.frequency_derivatives[0]': { value: '-1.2e-15', uncertainty: 2.2e-19, unit: 'Hz/s', startValue: '-1.2e-15', changeSigma: 0 },
    },
    chi2: 410,
    dof: 396,
    reducedChi2: 1.03,
    weightedRmsUs: 1.2,
    iterations: 3,
    converged: true,
    warnings: [],
    phaseOffsetTurns: 0,
    conditionNumber: 1e6,
    engineSettings: {},
    fittedModel: FITTED_MODEL,
  },
};

const revisionReply = (id: number, call: RecordedCall) =>
  ok(
    {
      id,
      pulsarId: 5,
      parentId: 12,
      author: { id: 3, displayName: 'Ana Analyst' },
      message: (call.body as { message: string }).message,
      createdAt: '2026-12-02T01:00:00Z',
      releasedAt: null,
      releasedBy: null,
      releaseNote: null,
      model: (call.body as { model: unknown }).model,
    },
    201,
  );

/** The panel with the screen's part played by a state holder; `latest()` is the edited model. */
function Harness({ onModel }: { onModel: (m: ModelFileJson) => void }) {
  const [model, setModel] = useState<ModelFileJson>(structuredClone(FITTED_MODEL));
  return (
    <ParameterPanel
      pulsarId={5}
      explorer={EXPLORER}
      editedModel={model}
      onEditedModelChange={(next) => {
        onModel(next);
        setModel(next);
      }}
    />
  );
}

function renderPanel() {
  const models: ModelFileJson[] = [];
  const view = renderWithClient(<Harness onModel={(m) => models.push(m)} />);
  return { ...view, latest: () => models[models.length - 1] };
}

const input = (label: string) => screen.getByLabelText(label) as HTMLInputElement;

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

describe('ParameterPanel', () => {
  it('shows grouped values with the fitted uncertainty, keeps every typed digit, marks edits and resets them', async () => {
    mockApi({ 'GET /api/fit-runs/:id': ok(FIT_RUN) });
    const { user, latest } = renderPanel();
    for (const title of ['Spin', 'Position', 'Dispersion', 'Companion b', 'Offsets', 'Noise']) expect(screen.getByRole('group', { name: title })).toBeTruthy();
    expect(input('Spin frequency (Hz)').value).toBe('311.493021877730128841');
    expect(await screen.findByText('fitted ± 3.4e-12 Hz')).toBeTruthy();
    expect(screen.getAllByText('not fitted in this run').length).toBeGreaterThan(0);

    await user.type(input('Spin frequency (Hz)'), '07');
    const spin = latest().spin as { frequency_hz: unknown };
    expect(spin.frequency_hz).toBe('311.49302187773012884107'); // 23 significant digits, as a string
    expect(screen.getByText(/^edited — was/)).toBeTruthy();
    expect(screen.getByText('1 edit (previewed, not saved).', { exact: false })).toBeTruthy();

    await user.clear(input('Dispersion measure (pc/cm³)'));
    await user.type(input('Dispersion measure (pc/cm³)'), '27.35');
    expect((latest().dispersion as { dm_pc_per_cm3: unknown }).dm_pc_per_cm3).toBe(27.35);
    await user.click(screen.getByRole('button', { name: 'Reset Dispersion measure' }));
    expect((latest().dispersion as { dm_pc_per_cm3: unknown }).dm_pc_per_cm3).toBe(27.31);

    await user.clear(input('Orbital period, companion b (days)'));
    await user.type(input('Orbital period, companion b (days)'), 'x');
    expect(screen.getByText('not a number')).toBeTruthy();

    await user.click(screen.getByRole('button', { name: 'Reset all edits' }));
    expect(latest()).toEqual(FITTED_MODEL);
    expect(screen.queryByText(/^edited — was/)).toBeNull();
  });

  it('keeps optional values the fit left unset under "More values", editable in place', async () => {
    mockApi({ 'GET /api/fit-runs/:id': ok(FIT_RUN) });
    const { user, latest } = renderPanel();
    const companion = screen.getByRole('group', { name: 'Companion b' });
    await user.click(within(companion).getByText(/^More values \(3, not set in the fit\)/));
    await user.type(input('Period derivative, companion b (dimensionless)'), '-2.5e-12');
    const edited = (latest().companions as Record<string, unknown>[])[0];
    expect(edited.period_derivative).toBe(-2.5e-12);
    expect(input('Period derivative, companion b (dimensionless)').value).toBe('-2.5e-12');
  });

  it('switches solve-for paths on and off', async () => {
    mockApi({ 'GET /api/fit-runs/:id': ok(FIT_RUN) });
    const { user, latest } = renderPanel();
    const companion = screen.getByRole('group', { name: 'Companion b' });
    await user.click(within(companion).getByRole('switch', { name: 'Solve for Orbital period, companion b' }));
    expect(latest().solve_for).toEqual(['spin.frequency_hz', 'spin.frequency_derivatives[0]', 'companions[b].period_days']);
    await user.click(screen.getByRole('switch', { name: 'Solve for Frequency derivative 1' }));
    expect(latest().solve_for).toEqual(['spin.frequency_hz', 'companions[b].period_days']);
    expect(screen.queryByRole('switch', { name: /Solve for Uncertainty scale/ })).toBeNull(); // noise is not fitted
  });

  it('saves the edited model as a revision after asking for a message', async () => {
    let saved: { model: ModelFileJson; message: string; parentId: number } | undefined;
    mockApi({
      'GET /api/fit-runs/:id': ok(FIT_RUN),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/pulsars/:id/revisions': (call) => {
        saved = call.body as typeof saved;
        return revisionReply(13, call);
      },
    });
    const { user } = renderPanel();
    await user.clear(input('Parallax (mas)'));
    await user.type(input('Parallax (mas)'), '1.5');
    await user.click(screen.getByRole('button', { name: 'Save as revision' }));
    const dialog = screen.getByRole('dialog', { name: 'Save as a new revision' });
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));
    expect(within(dialog).getByText(/say in a few words what changed/)).toBeTruthy();
    await user.type(within(dialog).getByLabelText('Message'), 'parallax from the explorer');
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));
    expect(await screen.findByText('Saved as revision #13.')).toBeTruthy();
    expect(saved?.message).toBe('parallax from the explorer');
    expect(saved?.parentId).toBe(12);
    expect((saved?.model.astrometry as { parallax_mas: unknown }).parallax_mas).toBe(1.5);
    expect((saved?.model.spin as { frequency_hz: unknown }).frequency_hz).toBe('311.493021877730128841');
    expect(screen.queryByRole('dialog')).toBeNull();
  });

  it('queues a fit: saves the revision first, then queues a fit of it', async () => {
    const server = mockApi({
      'GET /api/fit-runs/:id': ok(FIT_RUN),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/pulsars/:id/revisions': (call) => revisionReply(14, call),
      'POST /api/pulsars/:id/fit-runs': ok({ fitRun: { ...FIT_RUN, id: 42, revisionId: 14, status: 'queued', result: null }, reused: false }, 202),
    });
    const { user } = renderPanel();
    await user.click(screen.getByRole('button', { name: 'Queue fit' }));
    const dialog = screen.getByRole('dialog', { name: 'Save and queue a fit' });
    await user.type(within(dialog).getByLabelText('Message'), 'refit with the edits');
    await user.click(within(dialog).getByRole('button', { name: 'Save and queue fit' }));
    const link = await screen.findByRole('link', { name: 'run #42' });
    expect(link.getAttribute('href')).toBe('/fit-runs/42');
    const queued = server.callsTo('POST', '/api/pulsars/5/fit-runs');
    expect(queued).toHaveLength(1);
    expect(queued[0].body).toEqual({ revisionId: 14 });
    const order = server.calls.filter((c) => c.method === 'POST').map((c) => c.path);
    expect(order).toEqual(['/api/pulsars/5/revisions', '/api/pulsars/5/fit-runs']);
  });

  it('lists the server’s problems when the model is refused, and queues nothing', async () => {
    const server = mockApi({
      'GET /api/fit-runs/:id': ok(FIT_RUN),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/pulsars/:id/revisions': fail(400, 'validation_failed', 'model: 1 problem', [
        { path: ['model', 'companions', 0, 'period_days'], message: 'must be above 0' },
      ]),
    });
    const { user } = renderPanel();
    await user.click(screen.getByRole('button', { name: 'Queue fit' }));
    await user.type(screen.getByLabelText('Message'), 'bad period');
    await user.click(screen.getByRole('button', { name: 'Save and queue fit' }));
    const problems = await screen.findByRole('list', { name: 'Problems in the model' });
    expect(problems.textContent).toContain('companions.0.period_days: must be above 0');
    expect(server.callsTo('POST', '/api/pulsars/5/fit-runs')).toHaveLength(0);
  });

  it('says when the fitted uncertainties could not be loaded, and still allows edits', async () => {
    mockApi({ 'GET /api/fit-runs/:id': fail(404, 'not_found', 'fit run 41 not found') });
    const { user, latest } = renderPanel();
    expect(await screen.findByText('Could not load the fitted uncertainties')).toBeTruthy();
    await user.type(input('Parallax (mas)'), '2');
    await waitFor(() => expect((latest().astrometry as { parallax_mas: unknown }).parallax_mas).toBe('02'));
  });
});

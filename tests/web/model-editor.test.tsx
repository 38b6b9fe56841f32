import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok, type RecordedCall } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

// The editor is a large form and the machine is shared; give whole-page flows room beyond the helper's 20 s.
vi.setConfig({ testTimeout: 45_000 });

const ANALYST_ME = {
  user: { id: '3', email: 'ana@example.org', displayName: 'Ana Analyst', role: 'analyst' },
  permissions: ['observatories:read', 'pulsars:read', 'jobs:read', 'models:edit', 'fits:run'],
};
// Invented pulsar and models.
const PULSAR = { id: 8, name: 'J1745-0952', raHms: '17:45:09.1', decDms: '-09:52:12', toaCount: 10, firstMjd: '58000', lastMjd: '58100', observatories: ['harrow-ridge'], createdAt: '2026-12-01T00:00:00Z' };
const MODEL = {
  format: 'pulsekeeper-model/1',
  pulsar: 'J1745-0952',
  epoch_mjd: '58000',
  spin: { frequency_hz: '716.358712478123456789', frequency_derivatives: ['-8.1e-16'] },
  astrometry: { ra_hms: '17:45:09.1234', dec_dms: '-09:52:11.9', pm_ra_cosdec_mas_per_yr: 0, pm_dec_mas_per_yr: 0, parallax_mas: 0 },
  dispersion: { dm_pc_per_cm3: 41.27, dm_derivatives: [] },
  companions: [
    { name: 'b', kind: 'keplerian', enabled: true, period_days: '41.3', projected_semimajor_axis_lt_s: '0.00085', eccentricity: 0.1, periastron_longitude_deg: 0, periastron_epoch_mjd: '58010.5' },
  ],
  offsets: [{ backend: 'wideband-2', seconds: 0 }],
  noise: [{ backend: 'wideband-1', uncertainty_scale: 1, added_jitter_us: 0 }],
  glitches: [],
  solve_for: ['spin.frequency_hz'],
};
const revision = (id: number, message: string, model: unknown) => ({
  id,
  pulsarId: 8,
  parentId: id > 1 ? id - 1 : null,
  author: { id: 3, displayName: 'Ana Analyst' },
  message,
  createdAt: '2026-12-01T20:00:00Z',
  releasedAt: null,
  releasedBy: null,
  releaseNote: null,
  model,
});

function setup(extra: Record<string, Parameters<typeof mockApi>[0][string]> = {}) {
  return mockApi({
    'GET /api/auth/me': ok(ANALYST_ME),
    'GET /api/pulsars/:id': ok(PULSAR),
    'GET /api/auth/csrf': ok({ token: 'tok' }),
    'GET /api/pulsars/:id/revisions': ok([revision(2, 'freed the period', undefined), revision(1, 'first model', undefined)]),
    'GET /api/revisions/:id': (_call: RecordedCall, params: Record<string, string>) =>
      params.id === '2'
        ? ok(revision(2, 'freed the period', MODEL))
        : ok(revision(1, 'first model', { ...MODEL, spin: { frequency_hz: '716.35871247', frequency_derivatives: [] }, solve_for: [] })),
    ...extra,
  });
}

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

const field = (label: string) => screen.getByLabelText(label) as HTMLInputElement;

describe('model editor', () => {
  it('loads the latest revision into the form and saves a new one with the message and the solve-for paths', async () => {
    let saved: unknown;
    const server = setup({
      'POST /api/pulsars/:id/revisions': (call: RecordedCall) => {
        saved = call.body;
        return ok(revision(3, 'tuned', (call.body as { model: unknown }).model), 201);
      },
    });
    const { user, router } = renderApp('/pulsars/8/model');
    expect(await screen.findByRole('heading', { name: 'Model of J1745-0952' })).toBeTruthy();
    expect((await screen.findByLabelText('Spin frequency (Hz)') as HTMLInputElement).value).toBe('716.358712478123456789');
    expect(server.callsTo('GET', '/api/revisions/2')).toHaveLength(1);
    expect(screen.getByRole('switch', { name: 'Solve for Spin frequency' }).getAttribute('aria-checked')).toBe('true');

    // Extend the frequency by digits a double cannot hold, free the first derivative and the companion period.
    await user.type(field('Spin frequency (Hz)'), '01');
    await user.click(screen.getByRole('switch', { name: 'Solve for Frequency derivative 1' }));
    const companion = screen.getByRole('region', { name: 'Companion b' });
    await user.click(within(companion).getByRole('switch', { name: 'Solve for Orbital period' }));
    await user.click(screen.getByRole('switch', { name: 'Solve for Offset 1 seconds' }));

    await user.click(screen.getByRole('button', { name: 'Save as new revision' }));
    const dialog = await screen.findByRole('dialog', { name: 'Save as a new revision' });
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));
    expect(within(dialog).getByText(/say in a few words what changed/)).toBeTruthy();
    await user.type(within(dialog).getByLabelText('Message'), 'freed the derivative and the period');
    await user.click(within(dialog).getByRole('button', { name: 'Save revision' }));

    await waitFor(() => expect(saved).toBeDefined());
    const body = saved as { model: typeof MODEL; message: string; parentId: number };
    expect(body.message).toBe('freed the derivative and the period');
    expect(body.parentId).toBe(2);
    expect(body.model.spin.frequency_hz).toBe('716.35871247812345678901');
    expect(body.model.solve_for).toEqual([
      'spin.frequency_hz',
      'spin.frequency_derivatives[0]',
      'companions[b].period_days',
      'offsets[wideband-2].seconds',
    ]);
    // Every key and every digit of the untouched companion comes back (short numbers may change from string to number).
    const asText = (o: object) => Object.fromEntries(Object.entries(o).map(([k, v]) => [k, String(v)]));
    expect(asText(body.model.companions[0])).toEqual(asText(MODEL.companions[0]));
    expect(body.model.companions[0].periastron_epoch_mjd).toBe('58010.5');
    expect(await screen.findByText('Saved as revision #3.')).toBeTruthy();
    expect(router.state.location.search).toBe('?revision=3');
    expect(screen.queryByRole('dialog')).toBeNull();
  });

  it('opens a chosen revision from ?revision=N', async () => {
    const server = setup();
    renderApp('/pulsars/8/model?revision=1');
    expect((await screen.findByLabelText('Spin frequency (Hz)') as HTMLInputElement).value).toBe('716.35871247');
    expect(server.callsTo('GET', '/api/revisions/1')).toHaveLength(1);
    expect(server.callsTo('GET', '/api/revisions/2')).toHaveLength(0);
  });

  it('switches to another revision from the picker', async () => {
    setup();
    const { user, router } = renderApp('/pulsars/8/model');
    expect((await screen.findByLabelText('Spin frequency (Hz)') as HTMLInputElement).value).toBe('716.358712478123456789');
    await user.selectOptions(screen.getByLabelText('Start from revision'), '1');
    await waitFor(() => expect(field('Spin frequency (Hz)').value).toBe('716.35871247'));
    expect(router.state.location.search).toBe('?revision=1');
    expect(screen.getByRole('switch', { name: 'Solve for Spin frequency' }).getAttribute('aria-checked')).toBe('false');
  });

  it('shows the fields of the chosen companion kind', async () => {
    setup();
    const { user } = renderApp('/pulsars/8/model');
    const companion = await screen.findByRole('region', { name: 'Companion b' });
    expect(within(companion).getByLabelText('Eccentricity (0 ≤ e < 1)')).toBeTruthy();
    expect(within(companion).queryByLabelText('Epoch of ascending node (MJD)')).toBeNull();

    await user.selectOptions(within(companion).getByLabelText('Kind'), 'low-eccentricity');
    expect(within(companion).getByLabelText('Epoch of ascending node (MJD)')).toBeTruthy();
    expect(within(companion).getByLabelText('e · sin ω (dimensionless)')).toBeTruthy();
    expect(within(companion).queryByLabelText('Eccentricity (0 ≤ e < 1)')).toBeNull();

    await user.selectOptions(within(companion).getByLabelText('Kind'), 'damour-deruelle');
    expect(within(companion).getByLabelText('Shapiro range (s)')).toBeTruthy();
    expect((within(companion).getByLabelText('Eccentricity (0 ≤ e < 1)') as HTMLInputElement).value).toBe('0.1');

    await user.click(screen.getByRole('button', { name: 'Add companion' }));
    expect(screen.getByRole('region', { name: 'Companion c' })).toBeTruthy();
    await user.click(within(screen.getByRole('region', { name: 'Companion c' })).getByRole('button', { name: 'Remove' }));
    expect(screen.queryByRole('region', { name: 'Companion c' })).toBeNull();
  });

  it('puts server errors beside the matching fields and lists them all at the top', async () => {
    setup({
      'POST /api/pulsars/:id/revisions': fail(400, 'validation_failed', 'companions[0].period_days: must be > 0 (and 2 more)', [
        { path: ['model', 'companions', 0, 'period_days'], message: 'must be > 0' },
        { path: ['model', 'spin', 'frequency_derivatives', 0], message: 'expected a number' },
        { path: ['model', 'solve_for', 0], message: 'unknown parameter path' },
      ]),
    });
    const { user } = renderApp('/pulsars/8/model');
    await screen.findByLabelText('Spin frequency (Hz)');
    await user.click(screen.getByRole('button', { name: 'Save as new revision' }));
    await user.type(screen.getByLabelText('Message'), 'try');
    await user.click(screen.getByRole('button', { name: 'Save revision' }));

    const list = await screen.findByRole('list', { name: 'Problems in the model' });
    expect(within(list).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      'companions.0.period_days: must be > 0',
      'spin.frequency_derivatives.0: expected a number',
      'solve_for.0: unknown parameter path',
    ]);
    const companion = screen.getByRole('region', { name: 'Companion b' });
    const period = within(companion).getByLabelText('Orbital period (days)');
    expect(period.getAttribute('aria-invalid')).toBe('true');
    expect(within(companion).getByText('must be > 0')).toBeTruthy();
    expect(field('Frequency derivative 1 (Hz/s)').getAttribute('aria-invalid')).toBe('true');
    expect(field('Spin frequency (Hz)').getAttribute('aria-invalid')).toBeNull();
    expect(screen.queryByRole('dialog')).toBeNull();
  });

  it('imports a model file, reports JSON syntax errors, and exports the current model', async () => {
    setup();
    const { user } = renderApp('/pulsars/8/model');
    await screen.findByLabelText('Spin frequency (Hz)');

    await user.upload(screen.getByLabelText('Import model file'), new File(['{"format": '], 'broken.json', { type: 'application/json' }));
    expect(await screen.findByText(/broken\.json is not valid JSON/)).toBeTruthy();
    expect(field('Spin frequency (Hz)').value).toBe('716.358712478123456789');

    const imported = { ...MODEL, spin: { frequency_hz: '123.000000000000000000042', frequency_derivatives: [] }, companions: [] };
    await user.upload(screen.getByLabelText('Import model file'), new File([JSON.stringify(imported)], 'other.json', { type: 'application/json' }));
    await waitFor(() => expect(field('Spin frequency (Hz)').value).toBe('123.000000000000000000042'));
    expect(screen.queryByRole('region', { name: 'Companion b' })).toBeNull();

    let exported: Blob | undefined;
    vi.stubGlobal('URL', Object.assign(URL, { createObjectURL: vi.fn((blob: Blob) => ((exported = blob), 'blob:x')), revokeObjectURL: vi.fn() }));
    const click = vi.spyOn(HTMLAnchorElement.prototype, 'click').mockImplementation(() => {});
    await user.click(screen.getByRole('button', { name: 'Export JSON' }));
    expect(click).toHaveBeenCalledTimes(1);
    const text = await (exported as Blob).text();
    expect(JSON.parse(text).spin.frequency_hz).toBe('123.000000000000000000042');
    expect(JSON.parse(text).solve_for).toEqual(['spin.frequency_hz']);
  });

  it('starts from a blank model when the pulsar has no revision', async () => {
    let saved: { model: { pulsar: string; astrometry: { ra_hms: string } }; parentId?: number } | undefined;
    setup({
      'GET /api/pulsars/:id/revisions': ok([]),
      'POST /api/pulsars/:id/revisions': (call: RecordedCall) => {
        saved = call.body as typeof saved;
        return ok(revision(1, 'first', MODEL), 201);
      },
    });
    const { user } = renderApp('/pulsars/8/model');
    expect(await screen.findByText('No model yet')).toBeTruthy();
    expect(field('Right ascension (hh:mm:ss.s)').value).toBe('17:45:09.1');
    await user.click(screen.getByRole('button', { name: 'Save as new revision' }));
    await user.type(screen.getByLabelText('Message'), 'first');
    await user.click(screen.getByRole('button', { name: 'Save revision' }));
    await waitFor(() => expect(saved).toBeDefined());
    expect(saved?.model.pulsar).toBe('J1745-0952');
    expect(saved && 'parentId' in saved).toBe(false);
  });
});

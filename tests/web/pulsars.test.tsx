import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { ADMIN_ME, fail, mockApi, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Invented pulsars; the TOA counts are chosen so name order and count order differ.
const PULSARS = [
  { id: 1, name: 'J1200-1000', raHms: '12:00:00.0', decDms: '-10:00:00', toaCount: 5, firstMjd: '58000', lastMjd: '58010', observatories: ['alpha'], createdAt: '2026-12-01T00:00:00Z' },
  { id: 2, name: 'J0300+2000', raHms: '03:00:00.0', decDms: '+20:00:00', toaCount: 300, firstMjd: '57000', lastMjd: '59000', observatories: ['alpha', 'beta'], createdAt: '2026-12-01T00:00:00Z' },
  { id: 3, name: 'J2300+0500', raHms: '23:00:00.0', decDms: '+05:00:00', toaCount: 40, firstMjd: null, lastMjd: null, observatories: [], createdAt: '2026-12-01T00:00:00Z' },
];

function rowNames(): string[] {
  const table = screen.getByRole('table', { name: 'Pulsars' });
  return within(table)
    .getAllByRole('row')
    .slice(1)
    .map((row) => within(row).getAllByRole('cell')[0].textContent ?? '');
}

describe('pulsars page', () => {
  it('lists pulsars sorted by name and re-sorts by TOA count', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars': ok(PULSARS) });
    const { user } = renderApp('/pulsars');
    await screen.findByRole('table', { name: 'Pulsars' });
    expect(rowNames()).toEqual(['J0300+2000', 'J1200-1000', 'J2300+0500']);
    await user.click(screen.getByRole('button', { name: /TOAs/ }));
    expect(rowNames()).toEqual(['J0300+2000', 'J2300+0500', 'J1200-1000']); // 300, 40, 5
    await user.click(screen.getByRole('button', { name: /TOAs/ }));
    expect(rowNames()).toEqual(['J1200-1000', 'J2300+0500', 'J0300+2000']);
    // Viewers get no create form.
    expect(screen.queryByRole('form', { name: 'Add a pulsar' })).toBeNull();
  });

  it('checks the position on the client, then shows server field errors on the fields', async () => {
    const server = mockApi({
      'GET /api/auth/me': ok(ADMIN_ME),
      'GET /api/pulsars': ok(PULSARS),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/pulsars': fail(409, 'conflict', 'name: taken', [{ path: ['name'], message: 'a pulsar with this name exists' }]),
    });
    const { user } = renderApp('/pulsars');
    const form = await screen.findByRole('form', { name: 'Add a pulsar' });
    await user.type(within(form).getByLabelText('Name'), 'J0300+2000');
    await user.type(within(form).getByLabelText('Right ascension'), '24:00:00');
    await user.type(within(form).getByLabelText('Declination'), '+91:00:00');
    await user.click(within(form).getByRole('button', { name: 'Add pulsar' }));
    expect(await within(form).findByText(/Right ascension: use hh:mm:ss.s/)).toBeTruthy();
    expect(within(form).getByText(/Declination: use ±dd:mm:ss/)).toBeTruthy();
    expect(server.callsTo('POST', '/api/pulsars')).toHaveLength(0);

    await user.clear(within(form).getByLabelText('Right ascension'));
    await user.type(within(form).getByLabelText('Right ascension'), '03:00:00.5');
    await user.clear(within(form).getByLabelText('Declination'));
    await user.type(within(form).getByLabelText('Declination'), '+20:00:00');
    await user.click(within(form).getByRole('button', { name: 'Add pulsar' }));
    expect(await within(form).findByText('a pulsar with this name exists')).toBeTruthy();
    expect(within(form).getByLabelText('Name').getAttribute('aria-invalid')).toBe('true');
    expect(server.callsTo('POST', '/api/pulsars')[0].body).toEqual({ name: 'J0300+2000', raHms: '03:00:00.5', decDms: '+20:00:00' });
  });
});

describe('pulsar detail', () => {
  it('starts a statistics recount and polls the job until it completes', async () => {
    let polls = 0;
    const server = mockApi({
      'GET /api/auth/me': ok(ADMIN_ME),
      'GET /api/pulsars/:id': ok(PULSARS[1]),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/pulsars/:id/statistics-jobs': ok({ jobId: '42' }, 202),
      'GET /api/jobs/:id': () => {
        polls += 1;
        return polls === 1
          ? ok({ id: '42', name: 'toa-statistics', state: 'active', progress: { percent: 40, stage: 'counting TOAs' }, result: null, failedReason: null })
          : ok({ id: '42', name: 'toa-statistics', state: 'completed', progress: { percent: 100, stage: 'done' }, result: { toaCount: 301, firstMjd: '57000' }, failedReason: null });
      },
    });
    const { user } = renderApp('/pulsars/2');
    expect(await screen.findByRole('heading', { name: 'J0300+2000' })).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Recount TOA statistics' }));

    const bar = await screen.findByRole('progressbar', { name: 'Recount progress' });
    expect(bar.getAttribute('aria-valuenow')).toBe('40');
    expect(screen.getByText('counting TOAs')).toBeTruthy();
    expect(await screen.findByText('Statistics recounted')).toBeTruthy();
    expect(screen.getByText('301')).toBeTruthy();
    expect(screen.queryByRole('progressbar')).toBeNull();
    // Polling stopped at the final state.
    const pollsAtEnd = polls;
    await new Promise((r) => setTimeout(r, 1500));
    expect(polls).toBe(pollsAtEnd);
    expect(server.callsTo('POST', '/api/pulsars/2/statistics-jobs')).toHaveLength(1);
  });

  it('shows why a job failed', async () => {
    mockApi({
      'GET /api/auth/me': ok(ADMIN_ME),
      'GET /api/pulsars/:id': ok(PULSARS[0]),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/pulsars/:id/statistics-jobs': ok({ jobId: '7' }, 202),
      'GET /api/jobs/:id': ok({ id: '7', name: 'toa-statistics', state: 'failed', progress: { percent: 10, stage: 'reading' }, result: null, failedReason: 'pulsar 1 has no TOAs table' }),
    });
    const { user } = renderApp('/pulsars/1');
    await user.click(await screen.findByRole('button', { name: 'Recount TOA statistics' }));
    expect(await screen.findByText('The recount failed')).toBeTruthy();
    expect(screen.getByText('pulsar 1 has no TOAs table')).toBeTruthy();
  });

  it('hides the recount button from a viewer and reports an unknown pulsar', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars/:id': fail(404, 'not_found', 'No pulsar 99') });
    renderApp('/pulsars/99');
    expect(await screen.findByText('No pulsar with this id')).toBeTruthy();
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Recount TOA statistics' })).toBeNull());
  });
});

import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { mockApi, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

// Invented pulsars; χ², RMS and spans are chosen so each sort order is different.
const fit = (id: number, reducedChi2: number, weightedRmsUs: number, finishedAt: string) => ({ id, status: 'succeeded', reducedChi2, weightedRmsUs, finishedAt });
const PULSARS = [
  { id: 1, name: 'J1200-1000', raHms: '12:00:00.0', decDms: '-10:00:00', toaCount: 5, firstMjd: '58000.5', lastMjd: '58010', observatories: ['alpha'], createdAt: '2026-12-01T00:00:00Z', revisionCount: 2, latestFit: fit(11, 1.21, 3.5, '2026-12-01T10:00:00Z') },
  { id: 2, name: 'J0300+2000', raHms: '03:00:00.0', decDms: '+20:00:00', toaCount: 300, firstMjd: '58000.25', lastMjd: '59000', observatories: ['alpha', 'beta'], createdAt: '2026-12-01T00:00:00Z', revisionCount: 1, latestFit: fit(12, 8.4, 0.75, '2026-11-30T10:00:00Z') },
  { id: 3, name: 'J2300+0500', raHms: '23:00:00.0', decDms: '+05:00:00', toaCount: 40, firstMjd: '57000', lastMjd: '57500', observatories: ['gamma'], createdAt: '2026-12-01T00:00:00Z', revisionCount: 1, latestFit: { id: 13, status: 'running', reducedChi2: null, weightedRmsUs: null, finishedAt: null } },
  { id: 4, name: 'J0000+0000', raHms: '00:00:00.0', decDms: '+00:00:00', toaCount: 0, firstMjd: null, lastMjd: null, observatories: [], createdAt: '2026-12-01T00:00:00Z', revisionCount: 0, latestFit: null },
];

function table() {
  return screen.getByRole('table', { name: 'Pulsars' });
}
function rowNames(): string[] {
  return within(table())
    .getAllByRole('row')
    .slice(1)
    .map((row) => within(row).getAllByRole('cell')[0].textContent ?? '');
}
function rowOf(name: string) {
  return within(table()).getByRole('link', { name }).closest('tr')!;
}

describe('pulsars table', () => {
  it('shows TOAs, span, observatories, the latest fit and a status per pulsar', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars': ok(PULSARS) });
    renderApp('/pulsars');
    await screen.findByRole('table', { name: 'Pulsars' });
    const cells = within(rowOf('J0300+2000')).getAllByRole('cell').map((c) => c.textContent);
    expect(cells).toEqual(['J0300+2000', '300', '58000.250 – 59000.000', 'alpha, beta', '8.40', '0.750', '30 Nov 2026, 10:00 UTC', 'Fitted']);
    expect(within(rowOf('J2300+0500')).getByText('Fitting')).toBeTruthy();
    expect(within(rowOf('J0000+0000')).getByText('No TOAs')).toBeTruthy();
  });

  it('sorts by reduced χ², RMS and span start (MJD strings compared by value)', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars': ok(PULSARS) });
    const { user } = renderApp('/pulsars');
    await screen.findByRole('table', { name: 'Pulsars' });
    expect(rowNames()).toEqual(['J0000+0000', 'J0300+2000', 'J1200-1000', 'J2300+0500']);

    await user.click(screen.getByRole('button', { name: /Reduced χ²/ }));
    expect(rowNames().slice(0, 2)).toEqual(['J1200-1000', 'J0300+2000']); // 1.21, 8.4; unfitted last
    expect(screen.getByRole('columnheader', { name: /Reduced χ²/ }).getAttribute('aria-sort')).toBe('ascending');

    await user.click(screen.getByRole('button', { name: /RMS/ }));
    expect(rowNames().slice(0, 2)).toEqual(['J0300+2000', 'J1200-1000']); // 0.75, 3.5

    await user.click(screen.getByRole('button', { name: /Span/ }));
    // 57000 < 58000.25 < 58000.5; the pulsar without TOAs goes last.
    expect(rowNames()).toEqual(['J2300+0500', 'J0300+2000', 'J1200-1000', 'J0000+0000']);
  });

  it('filters by name, observatory or status and says when nothing matches', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars': ok(PULSARS) });
    const { user } = renderApp('/pulsars');
    await screen.findByRole('table', { name: 'Pulsars' });
    const box = screen.getByRole('searchbox', { name: 'Filter pulsars' });
    await user.type(box, 'beta');
    expect(rowNames()).toEqual(['J0300+2000']);
    expect(screen.getByText('1 of 4 pulsars')).toBeTruthy();
    await user.clear(box);
    await user.type(box, 'j12');
    expect(rowNames()).toEqual(['J1200-1000']);
    await user.clear(box);
    await user.type(box, 'fitting');
    expect(rowNames()).toEqual(['J2300+0500']);
    await user.clear(box);
    await user.type(box, 'nothing-like-this');
    expect(screen.getByText('No pulsar matches “nothing-like-this”.')).toBeTruthy();
    await user.clear(box);
    expect(rowNames()).toHaveLength(4);
  });
});

describe('dashboard', () => {
  it('shows the latest fit on each pulsar card', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars': ok(PULSARS) });
    renderApp('/');
    const cards = await screen.findByRole('list', { name: 'Pulsars' });
    const card = within(cards).getByText('J1200-1000').closest('li')!;
    expect(within(card).getByText(/χ²\/dof 1\.21 · RMS 3\.50 µs/)).toBeTruthy();
    const none = within(cards).getByText('J0000+0000').closest('li')!;
    expect(within(none).getByText('no fit yet')).toBeTruthy();
  });
});

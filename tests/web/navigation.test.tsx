import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { ADMIN_ME, mockApi, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

const PULSARS = [
  { id: 3, name: 'J0000+0001', raHms: '00:00:01.0', decDms: '+00:01:00', toaCount: 12, firstMjd: '58000.5', lastMjd: '58100.25', observatories: ['alpha'], createdAt: '2026-12-01T10:00:00Z' },
];

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

async function mainNavLinks() {
  const nav = await screen.findByRole('navigation', { name: 'Main' });
  return within(nav)
    .getAllByRole('link')
    .map((a) => a.textContent);
}

describe('app shell navigation', () => {
  it('shows a viewer only the pages every role may see', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars': ok(PULSARS) });
    renderApp('/');
    expect(await mainNavLinks()).toEqual(['Dashboard', 'Pulsars', 'Observatories']);
    expect(screen.getByText('Vera Viewer')).toBeTruthy();
    expect(screen.getByText('Viewer')).toBeTruthy();
  });

  it('adds Users and Outbox for an administrator', async () => {
    mockApi({ 'GET /api/auth/me': ok(ADMIN_ME), 'GET /api/pulsars': ok(PULSARS) });
    renderApp('/');
    expect(await mainNavLinks()).toEqual(['Dashboard', 'Pulsars', 'Observatories', 'Users', 'Outbox']);
    expect(screen.getByText('Administrator')).toBeTruthy();
  });

  it('tells a viewer who opens /users directly that the page is not for their role, without calling the users API', async () => {
    const api = mockApi({ 'GET /api/auth/me': ok(VIEWER_ME) });
    renderApp('/users');
    expect(await screen.findByText('Not available for your role')).toBeTruthy();
    expect(api.callsTo('GET', '/api/users')).toHaveLength(0);
  });

  it('shows the dashboard pulsar cards with TOA count and time span', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars': ok(PULSARS) });
    renderApp('/');
    const list = await screen.findByRole('list', { name: 'Pulsars' });
    expect(within(list).getByText('J0000+0001')).toBeTruthy();
    expect(within(list).getByText('58000.500 – 58100.250')).toBeTruthy();
    expect(within(list).getByText('12')).toBeTruthy();
  });

  it('tells a new user what to do when there are no pulsars', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME), 'GET /api/pulsars': ok([]) });
    renderApp('/');
    expect(await screen.findByText('No pulsars yet')).toBeTruthy();
    const hint = screen.getByText(/An analyst can add one from/);
    expect(within(hint).getByRole('link', { name: 'Pulsars' }).getAttribute('href')).toBe('/pulsars');
  });

  it('shows the not-found page inside the shell for an unknown address', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_ME) });
    renderApp('/no/such/page');
    expect(await screen.findByText('Page not found')).toBeTruthy();
    expect(await mainNavLinks()).toContain('Dashboard');
  });
});

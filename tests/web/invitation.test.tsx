import { cleanup, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok, VIEWER_ME } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('accept invitation', () => {
  it('says the invitation is no longer valid on 404', async () => {
    const server = mockApi({ 'GET /api/invitations/:token': fail(404, 'not_found', 'No such invitation') });
    renderApp('/invitations/stale-token');
    expect(await screen.findByRole('heading', { name: 'This invitation is no longer valid' })).toBeTruthy();
    expect(screen.queryByLabelText('Display name')).toBeNull();
    expect(server.callsTo('GET', '/api/invitations/stale-token')).toHaveLength(1);
  });

  it('shows a retry, not "no longer valid", when the server fails', async () => {
    mockApi({ 'GET /api/invitations/:token': fail(503, 'service_unavailable', 'Database down') });
    renderApp('/invitations/tok');
    expect(await screen.findByRole('button', { name: 'Try again' })).toBeTruthy();
    expect(screen.queryByText('This invitation is no longer valid')).toBeNull();
  });

  it('shows the invited e-mail and role, checks the password length and accepts', async () => {
    let accepted = false;
    const server = mockApi({
      'GET /api/invitations/:token': ok({ email: 'new@example.org', role: 'analyst' }),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/invitations/:token/accept': () => {
        accepted = true;
        return ok({ user: { ...VIEWER_ME.user, role: 'analyst' } }, 201);
      },
      'GET /api/auth/me': () => (accepted ? ok(VIEWER_ME) : fail(401, 'not_signed_in', 'Sign in first')),
      'GET /api/pulsars': ok([]),
    });
    const { user, router } = renderApp('/invitations/good%20token');
    expect(await screen.findByText('new@example.org')).toBeTruthy();
    expect(screen.getByText('Analyst')).toBeTruthy();

    await user.type(screen.getByLabelText('Display name'), 'Nia New');
    await user.type(screen.getByLabelText('Password'), 'short');
    await user.type(screen.getByLabelText('Confirm password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Join Pulsekeeper' }));
    expect(await screen.findByText('Password: use at least 12 characters')).toBeTruthy();
    expect(server.callsTo('POST', '/api/invitations/good%20token/accept')).toHaveLength(0);

    await user.clear(screen.getByLabelText('Password'));
    await user.clear(screen.getByLabelText('Confirm password'));
    await user.type(screen.getByLabelText('Password'), 'twelve chars long');
    await user.type(screen.getByLabelText('Confirm password'), 'twelve chars long');
    await user.click(screen.getByRole('button', { name: 'Join Pulsekeeper' }));
    expect(await screen.findByRole('heading', { name: 'Dashboard' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/');
    const [accept] = server.callsTo('POST', '/api/invitations/good%20token/accept');
    expect(accept.body).toEqual({ displayName: 'Nia New', password: 'twelve chars long' });
  });
});

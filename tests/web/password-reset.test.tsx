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

describe('password reset', () => {
  it('answers the same way whether or not the address has an account', async () => {
    const server = mockApi({ 'GET /api/auth/csrf': ok({ token: 'tok' }), 'POST /api/auth/password-reset': ok({ sent: true }, 202) });
    const { user } = renderApp('/reset-password');
    await user.type(await screen.findByLabelText('E-mail'), 'nobody@example.org');
    await user.click(screen.getByRole('button', { name: 'Send reset link' }));
    expect((await screen.findByRole('status')).textContent).toContain('If that address has an account, a message is on its way.');
    expect(server.callsTo('POST', '/api/auth/password-reset')[0].body).toEqual({ email: 'nobody@example.org' });
  });

  it('asks for 12+ matching characters, then sets the password and opens the dashboard', async () => {
    const server = mockApi({
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/auth/password-reset/complete': ok({ user: VIEWER_ME.user }),
      'GET /api/auth/me': ok(VIEWER_ME),
      'GET /api/pulsars': ok([]),
    });
    const { user, router } = renderApp('/reset-password/tok123');
    await user.type(await screen.findByLabelText('New password'), 'eleven char');
    await user.type(screen.getByLabelText('Confirm password'), 'eleven chaR');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));
    expect(await screen.findByText('Password: use at least 12 characters')).toBeTruthy();
    expect(screen.getByText('Confirm password: the two passwords are not the same')).toBeTruthy();

    await user.clear(screen.getByLabelText('New password'));
    await user.clear(screen.getByLabelText('Confirm password'));
    await user.type(screen.getByLabelText('New password'), 'a much longer secret');
    await user.type(screen.getByLabelText('Confirm password'), 'a much longer secret');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));
    expect(await screen.findByRole('heading', { name: 'Dashboard' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/');
    expect(server.callsTo('POST', '/api/auth/password-reset/complete')[0].body).toEqual({ token: 'tok123', password: 'a much longer secret' });
  });

  it('says an unknown, used or expired link is no longer valid', async () => {
    // The documented answer: 400 with a detail on path ["token"] (docs/api.md, Details).
    mockApi({
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/auth/password-reset/complete': fail(400, 'validation_failed', 'token: unknown, used or expired reset link', [
        { path: ['token'], message: 'unknown, used or expired reset link' },
      ]),
    });
    const { user } = renderApp('/reset-password/old');
    await user.type(await screen.findByLabelText('New password'), 'a much longer secret');
    await user.type(screen.getByLabelText('Confirm password'), 'a much longer secret');
    await user.click(screen.getByRole('button', { name: 'Set new password' }));
    expect((await screen.findByRole('alert')).textContent).toContain('This reset link is no longer valid');
  });
});

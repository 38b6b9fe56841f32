import { cleanup, screen } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, ok, VIEWER_ME, type Handler } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

function signedOutApi(signIn: Handler) {
  let signedIn = false;
  return mockApi({
    'GET /api/auth/csrf': ok({ token: 'tok' }),
    'GET /api/auth/me': () => (signedIn ? ok(VIEWER_ME) : fail(401, 'not_signed_in', 'Sign in first')),
    'POST /api/auth/sign-in': (call, params) => {
      const reply = typeof signIn === 'function' ? signIn(call, params) : signIn;
      if (reply.status === 200) signedIn = true;
      return reply;
    },
    'GET /api/pulsars': ok([]),
  });
}

async function fillAndSubmit(user: ReturnType<typeof renderApp>['user'], email: string, password: string) {
  if (email) await user.type(await screen.findByLabelText('E-mail'), email);
  if (password) await user.type(screen.getByLabelText('Password'), password);
  await user.click(screen.getByRole('button', { name: 'Sign in' }));
}

describe('sign-in', () => {
  it('validates on the client and does not call the API for an empty form', async () => {
    const server = signedOutApi(ok({ user: VIEWER_ME.user }));
    const { user } = renderApp('/sign-in');
    await user.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText(/E-mail: enter an address/)).toBeTruthy();
    expect(screen.getByText('Password: enter your password')).toBeTruthy();
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
    expect(server.callsTo('POST', '/api/auth/sign-in')).toHaveLength(0);
  });

  it('shows one generic message on 401, whatever the cause', async () => {
    signedOutApi(fail(401, 'invalid_credentials', 'E-mail or password is wrong'));
    const { user } = renderApp('/sign-in');
    await fillAndSubmit(user, 'someone@example.org', 'not-the-password');
    expect((await screen.findByRole('alert')).textContent).toBe('E-mail or password is not right.');
  });

  it('asks the user to wait on 429', async () => {
    signedOutApi(fail(429, 'rate_limited', 'Too many requests'));
    const { user } = renderApp('/sign-in');
    await fillAndSubmit(user, 'someone@example.org', 'whatever-password');
    expect((await screen.findByRole('alert')).textContent).toMatch(/Too many attempts — wait a minute/);
  });

  it('sends the credentials with the CSRF token and returns to the page the user first asked for', async () => {
    const server = signedOutApi(ok({ user: VIEWER_ME.user }));
    const { user, router } = renderApp('/pulsars');
    // Signed out: the shell's loader redirected here and remembered the target.
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/sign-in');
    expect(router.state.location.search).toBe('?redirectTo=%2Fpulsars');

    await fillAndSubmit(user, 'vera@example.org', 'correct horse battery');
    expect(await screen.findByRole('heading', { name: 'Pulsars' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/pulsars');
    const [signIn] = server.callsTo('POST', '/api/auth/sign-in');
    expect(signIn.body).toEqual({ email: 'vera@example.org', password: 'correct horse battery' });
    expect(signIn.headers['x-csrf-token']).toBe('tok');
  });

  it('ignores a redirect target on another site', async () => {
    signedOutApi(ok({ user: VIEWER_ME.user }));
    const { user, router } = renderApp('/sign-in?redirectTo=%2F%2Fevil.example');
    await fillAndSubmit(user, 'vera@example.org', 'correct horse battery');
    expect(await screen.findByRole('heading', { name: 'Dashboard' })).toBeTruthy();
    expect(router.state.location.pathname).toBe('/');
  });

  it('links to the password reset page', async () => {
    signedOutApi(ok({}));
    renderApp('/sign-in');
    expect((await screen.findByRole('link', { name: 'Forgot your password?' })).getAttribute('href')).toBe('/reset-password');
  });
});

import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { api, ApiError, resetCsrfToken } from '../../web/lib/api-client';
import { fail, mockApi, noContent, ok } from './helpers/mock-api';

beforeEach(() => resetCsrfToken());
afterEach(() => vi.unstubAllGlobals());

function tokenIssuer() {
  let issued = 0;
  return () => ok({ token: `token-${++issued}` });
}

describe('api client: responses', () => {
  it('unwraps { data } and sends same-origin credentials', async () => {
    const server = mockApi({ 'GET /api/pulsars': ok([{ id: 1, name: 'J1' }]) });
    await expect(api.get('/pulsars')).resolves.toEqual([{ id: 1, name: 'J1' }]);
    const init = server.fetchMock.mock.calls[0][1];
    expect(init?.credentials).toBe('same-origin');
    expect(server.calls[0].headers.accept).toBe('application/json');
  });

  it('resolves a 204 with undefined', async () => {
    mockApi({ 'GET /api/auth/csrf': ok({ token: 't' }), 'DELETE /api/observatories/abc': noContent() });
    await expect(api.delete('/observatories/abc')).resolves.toBeUndefined();
  });

  it('maps the error shape to an ApiError with status, code, message and details', async () => {
    const details = [{ path: ['raHms'], message: 'must be hh:mm:ss' }];
    mockApi({
      'GET /api/auth/csrf': ok({ token: 't' }),
      'POST /api/pulsars': fail(400, 'validation_failed', 'raHms: must be hh:mm:ss', details),
    });
    const error = await api.post('/pulsars', { name: 'x' }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'validation_failed', message: 'raHms: must be hh:mm:ss', details });
  });

  it('gives an error without a JSON error body the code unexpected_response', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => new Response('<html>Bad gateway</html>', { status: 502 })));
    await expect(api.get('/health')).rejects.toMatchObject({ status: 502, code: 'unexpected_response' });
  });

  it('turns a failed connection into status 0, code network_error', async () => {
    vi.stubGlobal('fetch', vi.fn(async () => Promise.reject(new TypeError('Failed to fetch'))));
    await expect(api.get('/health')).rejects.toMatchObject({ status: 0, code: 'network_error' });
  });
});

describe('api client: CSRF', () => {
  it('fetches the token lazily, sends it on unsafe methods only, and caches it', async () => {
    const server = mockApi({
      'GET /api/auth/csrf': tokenIssuer(),
      'GET /api/pulsars': ok([]),
      'POST /api/pulsars': ok({ id: 1 }, 201),
      'PATCH /api/users/4': ok({ id: 4 }),
    });
    await api.get('/pulsars');
    expect(server.callsTo('GET', '/api/auth/csrf')).toHaveLength(0);
    expect(server.calls[0].headers['x-csrf-token']).toBeUndefined();

    await api.post('/pulsars', { name: 'J1' });
    await api.patch('/users/4', { role: 'analyst' });
    expect(server.callsTo('GET', '/api/auth/csrf')).toHaveLength(1);
    expect(server.callsTo('POST', '/api/pulsars')[0].headers['x-csrf-token']).toBe('token-1');
    expect(server.callsTo('PATCH', '/api/users/4')[0].headers['x-csrf-token']).toBe('token-1');
    expect(server.callsTo('POST', '/api/pulsars')[0].body).toEqual({ name: 'J1' });
  });

  it('shares one token request between concurrent mutations', async () => {
    const server = mockApi({ 'GET /api/auth/csrf': tokenIssuer(), 'POST /api/pulsars': ok({}, 201) });
    await Promise.all([api.post('/pulsars', {}), api.post('/pulsars', {})]);
    expect(server.callsTo('GET', '/api/auth/csrf')).toHaveLength(1);
  });

  it('on 403 csrf_invalid fetches a new token and retries once', async () => {
    const server = mockApi({
      'GET /api/auth/csrf': tokenIssuer(),
      'POST /api/pulsars': (call) =>
        call.headers['x-csrf-token'] === 'token-2' ? ok({ id: 9 }, 201) : fail(403, 'csrf_invalid', 'CSRF token missing or wrong'),
    });
    await expect(api.post('/pulsars', { name: 'J9' })).resolves.toEqual({ id: 9 });
    expect(server.callsTo('POST', '/api/pulsars').map((c) => c.headers['x-csrf-token'])).toEqual(['token-1', 'token-2']);
  });

  it('retries only once: a second csrf_invalid reaches the caller', async () => {
    const server = mockApi({
      'GET /api/auth/csrf': tokenIssuer(),
      'POST /api/pulsars': fail(403, 'csrf_invalid', 'CSRF token missing or wrong'),
    });
    await expect(api.post('/pulsars', {})).rejects.toMatchObject({ status: 403, code: 'csrf_invalid' });
    expect(server.callsTo('POST', '/api/pulsars')).toHaveLength(2);
  });

  it('does not retry a 403 forbidden', async () => {
    const server = mockApi({ 'GET /api/auth/csrf': tokenIssuer(), 'POST /api/pulsars': fail(403, 'forbidden', 'not allowed') });
    await expect(api.post('/pulsars', {})).rejects.toMatchObject({ code: 'forbidden' });
    expect(server.callsTo('POST', '/api/pulsars')).toHaveLength(1);
  });

  it.each([
    ['/auth/sign-in', 'POST /api/auth/sign-in'],
    ['/auth/sign-out', 'POST /api/auth/sign-out'],
    ['/auth/password-reset/complete', 'POST /api/auth/password-reset/complete'],
    ['/invitations/abc/accept', 'POST /api/invitations/abc/accept'],
  ])('drops the cached token after %s (the session was regenerated)', async (path, route) => {
    const server = mockApi({ 'GET /api/auth/csrf': tokenIssuer(), [route]: ok({ user: {} }), 'POST /api/pulsars': ok({}, 201) });
    await api.post(path, {});
    await api.post('/pulsars', {});
    expect(server.callsTo('GET', '/api/auth/csrf')).toHaveLength(2);
    expect(server.callsTo('POST', '/api/pulsars')[0].headers['x-csrf-token']).toBe('token-2');
  });

  it('keeps the token after other mutations', async () => {
    const server = mockApi({ 'GET /api/auth/csrf': tokenIssuer(), 'POST /api/auth/password-reset': ok({ sent: true }, 202) });
    await api.post('/auth/password-reset', { email: 'a@example.org' });
    await api.post('/auth/password-reset', { email: 'b@example.org' });
    expect(server.callsTo('GET', '/api/auth/csrf')).toHaveLength(1);
  });
});

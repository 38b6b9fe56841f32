import { cleanup, screen, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { AUDIT_LOG_PAGE_SIZE } from '../../web/features/audit-log/api/get-audit-log';
import { VIEWER_ME, mockApi, ok } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const ANALYST_ME = {
  user: { id: '3', email: 'ana@example.org', displayName: 'Ana Analyst', role: 'analyst' },
  permissions: ['pulsars:read', 'jobs:read', 'toas:exclude', 'models:edit', 'audit-log:read'],
};

function entry(id: number, action: string, summary: string, actor: { id: number; displayName: string; email: string } | null) {
  return { id, pulsarId: 4, actor, action, target: { kind: 'revision', id: 7 }, summary, details: {}, createdAt: `2026-11-${String(10 + (id % 18)).padStart(2, '0')}T12:00:00.000Z` };
}
const LEAD = { id: 2, displayName: 'Lev Lead', email: 'lev@example.org' };

describe('audit-log page', () => {
  it('lists who did what when, in plain words, and fetches older pages below the oldest shown', async () => {
    const first = Array.from({ length: AUDIT_LOG_PAGE_SIZE }, (_, i) => entry(500 - i, 'toas.exclude', `excluded 2 TOAs: "RFI" (${500 - i})`, LEAD));
    first[0] = entry(500, 'revision.release', 'released revision 7: "ready"', LEAD);
    const older = [entry(12, 'toa-batch.delete', 'deleted batch 3', null)];
    const server = mockApi({});
    // The mock's routes match on the path only; this one answers by the `before` parameter of the URL.
    server.fetchMock.mockImplementation(async (input: RequestInfo | URL) => {
      const url = new URL(String(input), 'http://localhost');
      if (url.pathname === '/api/auth/me') return Response.json({ data: ANALYST_ME });
      const before = url.searchParams.get('before');
      return Response.json({ data: before === null ? first : before === '451' ? older : [] });
    });
    const { user } = renderApp('/pulsars/4/audit-log');
    const table = await screen.findByRole('table', { name: 'Audit log' });
    expect(within(table).getByText('Released a revision')).toBeTruthy();
    expect(within(table).getByText('released revision 7: "ready"')).toBeTruthy();
    expect(within(table).getAllByText('Lev Lead').length).toBe(AUDIT_LOG_PAGE_SIZE);

    await user.click(screen.getByRole('button', { name: 'Show older entries' }));
    expect(await within(table).findByText('Deleted a TOA batch')).toBeTruthy();
    expect(within(table).getByText('deleted account')).toBeTruthy();
    // A short page is the last one.
    expect(screen.queryByRole('button', { name: 'Show older entries' })).toBeNull();
    const urls = server.fetchMock.mock.calls.map(([input]) => new URL(String(input), 'http://localhost')).filter((u) => u.pathname.endsWith('/audit-log'));
    expect(urls.map((u) => u.searchParams.get('before'))).toEqual([null, '451']);
    expect(urls.every((u) => u.searchParams.get('limit') === String(AUDIT_LOG_PAGE_SIZE))).toBe(true);
  });

  it('tells a new user what will appear when nothing is recorded', async () => {
    mockApi({ 'GET /api/auth/me': ok(ANALYST_ME), 'GET /api/pulsars/:id/audit-log': ok([]) });
    renderApp('/pulsars/4/audit-log');
    expect(await screen.findByText('Nothing recorded yet')).toBeTruthy();
  });

  it('explains the missing permission to a viewer instead of calling the API', async () => {
    const server = mockApi({ 'GET /api/auth/me': ok(VIEWER_ME) });
    renderApp('/pulsars/4/audit-log');
    expect(await screen.findByText('Not available for your role')).toBeTruthy();
    expect(server.calls.some((c) => c.path.endsWith('/audit-log'))).toBe(false);
  });
});

import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { ADMIN_ME, fail, mockApi, ok } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

const USERS = [
  { id: '1', email: 'ada@example.org', displayName: 'Ada Admin', role: 'admin', active: true, createdAt: '2026-11-01T00:00:00Z' },
  { id: '5', email: 'otto@example.org', displayName: 'Otto Observer', role: 'observer', active: true, createdAt: '2026-11-02T00:00:00Z' },
];

describe('users page', () => {
  it('changes a role, deactivates an account and sends an invitation', async () => {
    let users = USERS;
    const server = mockApi({
      'GET /api/auth/me': ok(ADMIN_ME),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'GET /api/users': () => ok(users),
      'PATCH /api/users/:id': (call, { id }) => {
        users = users.map((u) => (u.id === id ? { ...u, ...(call.body as object) } : u));
        return ok(users.find((u) => u.id === id));
      },
      'POST /api/users/invitations': (call) => ok({ id: '9', ...(call.body as object), expiresAt: '2026-12-08T12:00:00Z' }, 201),
    });
    const { user } = renderApp('/users');
    const table = await screen.findByRole('table', { name: 'Users' });

    await user.selectOptions(within(table).getByLabelText('Role of otto@example.org'), 'analyst');
    await waitFor(() => expect(server.callsTo('PATCH', '/api/users/5')[0]?.body).toEqual({ role: 'analyst' }));

    await user.click(within(table).getByRole('button', { name: 'Deactivate otto@example.org' }));
    expect(await within(table).findByRole('button', { name: 'Reactivate otto@example.org' })).toBeTruthy();
    expect(server.callsTo('PATCH', '/api/users/5')[1].body).toEqual({ active: false });
    // The administrator cannot lock themself out from this table.
    expect((within(table).getByRole('button', { name: 'Deactivate ada@example.org' }) as HTMLButtonElement).disabled).toBe(true);

    const form = screen.getByRole('form', { name: 'Invite a user' });
    await user.type(within(form).getByLabelText('E-mail'), 'lena@example.org');
    await user.selectOptions(within(form).getByLabelText('Role'), 'lead');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));
    expect(await within(form).findByText('Invitation sent')).toBeTruthy();
    expect(server.callsTo('POST', '/api/users/invitations')[0].body).toEqual({ email: 'lena@example.org', role: 'lead' });
  });

  it('puts "already has an account" on the e-mail field for a 409', async () => {
    mockApi({
      'GET /api/auth/me': ok(ADMIN_ME),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'GET /api/users': ok(USERS),
      'POST /api/users/invitations': fail(409, 'conflict', 'email: already has an account'),
    });
    const { user } = renderApp('/users');
    const form = await screen.findByRole('form', { name: 'Invite a user' });
    await user.type(within(form).getByLabelText('E-mail'), 'otto@example.org');
    await user.click(within(form).getByRole('button', { name: 'Send invitation' }));
    expect(await within(form).findByText('E-mail: this address already has an account')).toBeTruthy();
    expect(within(form).getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
  });
});

describe('outbox page', () => {
  it('shows captured mail newest first and renders the text part only, never the HTML', async () => {
    mockApi({
      'GET /api/auth/me': ok(ADMIN_ME),
      'GET /api/outbox': ok([
        {
          id: 'm2',
          to: 'lena@example.org',
          subject: 'You are invited to Pulsekeeper',
          text: 'Open http://127.0.0.1:5173/invitations/abc to join.',
          html: '<p id="injected">Open <a href="x">this</a></p><img src=x onerror="window.__pwned=1">',
          receivedAt: '2026-12-01T22:00:00Z',
        },
        { id: 'm1', to: 'ada@example.org', subject: 'Reset your password', text: 'Reset link: /reset-password/xyz', html: null, receivedAt: '2026-12-01T21:00:00Z' },
      ]),
    });
    const { user } = renderApp('/outbox');
    const list = await screen.findByRole('list', { name: 'Captured e-mails' });
    const items = within(list).getAllByRole('listitem');
    expect(items.map((li) => li.querySelector('summary span:nth-child(2)')?.textContent)).toEqual([
      'You are invited to Pulsekeeper',
      'Reset your password',
    ]);
    await user.click(within(items[0]).getByText('You are invited to Pulsekeeper'));
    expect(within(items[0]).getByText('Open http://127.0.0.1:5173/invitations/abc to join.')).toBeTruthy();
    expect(document.getElementById('injected')).toBeNull();
    expect(document.querySelector('img')).toBeNull();
  });
});

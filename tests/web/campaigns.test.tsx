import { cleanup, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { mockApi, ok, type RecordedCall } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

vi.setConfig({ testTimeout: 30_000 });

const LEAD_ME = {
  user: { id: '2', email: 'lena@example.org', displayName: 'Lena Lead', role: 'lead' },
  permissions: ['observatories:read', 'pulsars:read', 'jobs:read', 'campaigns:read', 'campaigns:start', 'models:edit', 'fits:run'],
};
const VIEWER_WITH_CAMPAIGNS = {
  user: { id: '7', email: 'vera@example.org', displayName: 'Vera Viewer', role: 'viewer' },
  permissions: ['observatories:read', 'pulsars:read', 'jobs:read', 'campaigns:read'],
};
// Invented pulsars and campaign figures.
const PULSARS = [
  { id: 1, name: 'J0101-0101', raHms: '01:01:00', decDms: '-01:01:00', toaCount: 10, firstMjd: null, lastMjd: null, observatories: [], createdAt: '2026-12-01T00:00:00Z' },
  { id: 2, name: 'J0202+0202', raHms: '02:02:00', decDms: '+02:02:00', toaCount: 10, firstMjd: null, lastMjd: null, observatories: [], createdAt: '2026-12-01T00:00:00Z' },
  { id: 3, name: 'J0303+0303', raHms: '03:03:00', decDms: '+03:03:00', toaCount: 10, firstMjd: null, lastMjd: null, observatories: [], createdAt: '2026-12-01T00:00:00Z' },
];
const base = {
  id: 4,
  name: 'after the clock update',
  createdBy: { id: 2, displayName: 'Lena Lead' },
  revisionChoice: 'latest',
  createdAt: '2026-12-01T23:00:00Z',
  finishedAt: null,
};
const running = {
  ...base,
  status: 'running',
  progress: { percent: 50, stage: 'fitting', done: 1, total: 2 },
  runs: [
    { pulsarId: 1, pulsarName: 'J0101-0101', revisionId: 11, fitRunId: 101, status: 'succeeded', skippedReason: null },
    { pulsarId: 3, pulsarName: 'J0303+0303', revisionId: 31, fitRunId: 103, status: 'running', skippedReason: null },
  ],
  summary: null,
};
const finished = {
  ...base,
  status: 'succeeded',
  finishedAt: '2026-12-01T23:05:00Z',
  progress: { percent: 100, stage: 'done', done: 2, total: 2 },
  runs: running.runs.map((r) => ({ ...r, status: 'succeeded' })),
  summary: [
    { pulsarId: 1, pulsarName: 'J0101-0101', before: { reducedChi2: 2.5, weightedRmsUs: 4.125 }, after: { reducedChi2: 1.05, weightedRmsUs: 1.5 }, status: 'succeeded' },
    { pulsarId: 3, pulsarName: 'J0303+0303', before: null, after: { reducedChi2: 1.2, weightedRmsUs: 0.75 }, status: 'succeeded' },
  ],
};

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('campaigns page', () => {
  it('creates a campaign over chosen pulsars with the right body and opens it', async () => {
    let posted: unknown;
    mockApi({
      'GET /api/auth/me': ok(LEAD_ME),
      'GET /api/pulsars': ok(PULSARS),
      'GET /api/campaigns': ok([]),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/campaigns': (call: RecordedCall) => {
        posted = call.body;
        return ok({ ...running, status: 'queued', runs: [] }, 202);
      },
      'GET /api/campaigns/:id': ok(finished),
      'GET /api/notifications': ok({ pulsarIds: [], campaignIds: [4] }),
    });
    const { user, router } = renderApp('/campaigns');
    expect(await screen.findByText('No campaigns yet')).toBeTruthy();
    const nav = screen.getByRole('navigation', { name: 'Main' });
    expect(within(nav).getByRole('link', { name: 'Campaigns' })).toBeTruthy();

    const form = screen.getByRole('form', { name: 'Start a campaign' });
    await user.click(within(form).getByRole('button', { name: 'Start campaign' }));
    expect(within(form).getByText('Name: give the campaign a name.')).toBeTruthy();
    await user.type(within(form).getByLabelText('Campaign name'), '  after the clock update ');
    await user.click(within(form).getByLabelText('Chosen pulsars'));
    const list = within(form).getByRole('list', { name: 'Pulsars to refit' });
    await user.click(within(list).getByLabelText('J0303+0303'));
    await user.click(within(list).getByLabelText('J0101-0101'));
    await user.click(within(form).getByLabelText(/Latest revision of each pulsar/));
    await user.click(within(form).getByLabelText('E-mail me when it finishes'));
    await user.click(within(form).getByRole('button', { name: 'Start campaign' }));

    await waitFor(() => expect(posted).toBeDefined());
    expect(posted).toEqual({ name: 'after the clock update', pulsarIds: [1, 3], revisionChoice: 'latest', notifyMe: false });
    await waitFor(() => expect(router.state.location.pathname).toBe('/campaigns/4'));
  });

  it('sends pulsarIds "all", the released revisions and notifyMe by default', async () => {
    let posted: unknown;
    mockApi({
      'GET /api/auth/me': ok(LEAD_ME),
      'GET /api/pulsars': ok(PULSARS),
      'GET /api/campaigns': ok([finished]),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'POST /api/campaigns': (call: RecordedCall) => ((posted = call.body), ok(finished, 202)),
      'GET /api/campaigns/:id': ok(finished),
      'GET /api/notifications': ok({ pulsarIds: [], campaignIds: [] }),
    });
    const { user } = renderApp('/campaigns');
    const table = await screen.findByRole('table', { name: 'Campaigns' });
    expect(within(table).getByRole('link', { name: 'after the clock update' }).getAttribute('href')).toBe('/campaigns/4');
    expect(within(table).getByText('2/2 pulsars')).toBeTruthy();
    await user.type(screen.getByLabelText('Campaign name'), 'all of them');
    await user.click(screen.getByRole('button', { name: 'Start campaign' }));
    await waitFor(() => expect(posted).toEqual({ name: 'all of them', pulsarIds: 'all', revisionChoice: 'released', notifyMe: true }));
  });

  it('shows the list without the create form to a role that may only read', async () => {
    mockApi({ 'GET /api/auth/me': ok(VIEWER_WITH_CAMPAIGNS), 'GET /api/campaigns': ok([running]) });
    renderApp('/campaigns');
    const table = await screen.findByRole('table', { name: 'Campaigns' });
    expect(within(table).getByRole('progressbar', { name: 'Progress of after the clock update' }).getAttribute('aria-valuenow')).toBe('50');
    expect(screen.queryByRole('form', { name: 'Start a campaign' })).toBeNull();
  });
});

describe('campaign detail', () => {
  it('polls until the campaign is final, then shows before → after per pulsar', async () => {
    let polls = 0;
    mockApi({
      'GET /api/auth/me': ok(LEAD_ME),
      'GET /api/campaigns/:id': () => {
        polls += 1;
        return ok(polls < 3 ? running : finished);
      },
      'GET /api/notifications': ok({ pulsarIds: [], campaignIds: [] }),
    });
    renderApp('/campaigns/4');
    expect(await screen.findByRole('heading', { name: 'after the clock update' })).toBeTruthy();
    const bar = await screen.findByRole('progressbar', { name: 'Campaign progress' });
    expect(bar.getAttribute('aria-valuenow')).toBe('50');
    const runs = screen.getByRole('table', { name: 'Runs per pulsar' });
    expect(within(runs).getByRole('link', { name: 'Fit run #103' }).getAttribute('href')).toBe('/fit-runs/103');
    expect(screen.getByRole('button', { name: 'Cancel campaign' })).toBeTruthy();

    const summary = await screen.findByRole('table', { name: 'What changed' }, { timeout: 8000 });
    expect(screen.queryByRole('progressbar')).toBeNull();
    expect(screen.queryByRole('button', { name: 'Cancel campaign' })).toBeNull();
    const rows = within(summary).getAllByRole('row').slice(1);
    const first = within(rows[0]).getAllByRole('cell');
    expect(first[0].textContent).toBe('J0101-0101');
    expect(first[1].textContent).toBe('2.500→ to 1.050(−58.0%)'); // (1.05 − 2.5) / 2.5
    expect(first[2].textContent).toBe('4.125→ to 1.500µs(−63.6%)'); // (1.5 − 4.125) / 4.125
    expect(first[2].querySelector('[data-change]')?.getAttribute('data-change')).toBe('lower');
    const second = within(rows[1]).getAllByRole('cell');
    expect(second[1].textContent).toBe('—→ to 1.200');

    const pollsAtEnd = polls;
    expect(pollsAtEnd).toBe(3);
    await new Promise((r) => setTimeout(r, 1500));
    expect(polls).toBe(pollsAtEnd);
  });

  it('cancels, and turns the e-mail switch on', async () => {
    let current: Record<string, unknown> = running;
    let subscribed = false;
    const server = mockApi({
      'GET /api/auth/me': ok(LEAD_ME),
      'GET /api/auth/csrf': ok({ token: 'tok' }),
      'GET /api/campaigns/:id': () => ok(current),
      'POST /api/campaigns/:id/cancel': () => {
        current = { ...running, status: 'cancelled', finishedAt: '2026-12-01T23:02:00Z' };
        return ok(current);
      },
      'GET /api/notifications': () => ok({ pulsarIds: [], campaignIds: subscribed ? [4] : [] }),
      'PUT /api/campaigns/:id/notification': (call: RecordedCall) => {
        subscribed = (call.body as { subscribed: boolean }).subscribed;
        return ok({ subscribed });
      },
    });
    const { user } = renderApp('/campaigns/4');
    const toggle = await screen.findByRole('switch', { name: 'E-mail me when this campaign finishes' });
    await waitFor(() => expect((toggle as HTMLButtonElement).disabled).toBe(false));
    expect(toggle.getAttribute('aria-checked')).toBe('false');
    await user.click(toggle);
    await waitFor(() => expect(toggle.getAttribute('aria-checked')).toBe('true'));
    expect(server.callsTo('PUT', '/api/campaigns/4/notification')[0].body).toEqual({ subscribed: true });

    await user.click(screen.getByRole('button', { name: 'Cancel campaign' }));
    expect(await screen.findByText('cancelled')).toBeTruthy();
    expect(server.callsTo('POST', '/api/campaigns/4/cancel')).toHaveLength(1);
    expect(screen.queryByRole('button', { name: 'Cancel campaign' })).toBeNull();
  });
});

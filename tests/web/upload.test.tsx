import { act, cleanup, fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { resetCsrfToken } from '../../web/lib/api-client';
import { precheckUpload, MAX_UPLOAD_BYTES } from '../../web/features/upload/upload-rules';
import { mockApi, ok } from './helpers/mock-api';
import { renderApp } from './helpers/render-app';

/** A stand-in for XMLHttpRequest: records each request and lets the test drive progress and the answer. */
class FakeXhr {
  static all: FakeXhr[] = [];
  method = '';
  url = '';
  headers: Record<string, string> = {};
  body: FormData | null = null;
  status = 0;
  responseText = '';
  aborted = false;
  upload: { onprogress: ((e: ProgressEvent) => void) | null; onload: (() => void) | null } = { onprogress: null, onload: null };
  onload: (() => void) | null = null;
  onerror: (() => void) | null = null;
  onabort: (() => void) | null = null;
  constructor() {
    FakeXhr.all.push(this);
  }
  open(method: string, url: string) {
    this.method = method;
    this.url = url;
  }
  setRequestHeader(name: string, value: string) {
    this.headers[name.toLowerCase()] = value;
  }
  send(body: FormData) {
    this.body = body;
  }
  abort() {
    this.aborted = true;
    this.onabort?.();
  }
  progress(loaded: number, total: number) {
    act(() => this.upload.onprogress?.({ loaded, total, lengthComputable: true } as ProgressEvent));
  }
  sent() {
    act(() => this.upload.onload?.());
  }
  respond(status: number, body: unknown) {
    this.status = status;
    this.responseText = JSON.stringify(body);
    act(() => this.onload?.());
  }
}

const UPLOADER_ME = {
  user: { id: '4', email: 'olga@example.org', displayName: 'Olga Observer', role: 'observer' },
  permissions: ['observatories:read', 'pulsars:read', 'jobs:read', 'toas:upload'],
};
// Invented pulsar and batch.
const PULSAR = { id: 5, name: 'J0437-1234', raHms: '04:37:00.0', decDms: '-12:34:00', toaCount: 0, firstMjd: null, lastMjd: null, observatories: [], createdAt: '2026-12-01T00:00:00Z' };
const BATCH = {
  id: 12,
  pulsarId: 5,
  fileName: 'night-7.csv',
  uploadedBy: { id: 4, displayName: 'Olga Observer' },
  checksumSha256: 'ab'.repeat(32),
  rowCount: 1842,
  firstMjd: '58000.125000000000000001',
  lastMjd: '58365.5',
  observatories: ['harrow-ridge', 'cardenal-plateau'],
  backends: ['wideband-1', 'wideband-2'],
  status: 'stored',
  createdAt: '2026-12-01T23:00:00Z',
};

function setup() {
  FakeXhr.all = [];
  vi.stubGlobal('XMLHttpRequest', FakeXhr);
  return mockApi({
    'GET /api/auth/me': ok(UPLOADER_ME),
    'GET /api/pulsars/:id': ok(PULSAR),
    'GET /api/auth/csrf': ok({ token: 'tok-upload' }),
  });
}

async function chooseAndSend(user: ReturnType<typeof renderApp>['user'], file: File) {
  await user.upload(await screen.findByLabelText('TOA file'), file);
  await user.click(screen.getByRole('button', { name: `Upload ${file.name}` }));
  await waitFor(() => expect(FakeXhr.all.length).toBeGreaterThan(0));
  return FakeXhr.all[FakeXhr.all.length - 1];
}

beforeEach(() => resetCsrfToken());
afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
});

describe('upload page', () => {
  it('moves the progress bar with upload events, then shows the stage and the stored batch', async () => {
    setup();
    const { user } = renderApp('/pulsars/5/upload');
    expect(await screen.findByRole('heading', { name: 'Upload TOAs for J0437-1234' })).toBeTruthy();
    const file = new File(['mjd,uncertainty_us,frequency_mhz,observatory\n58000.1,1,1400,harrow-ridge\n'], 'night-7.csv', { type: 'text/csv' });
    const xhr = await chooseAndSend(user, file);

    expect(xhr.method).toBe('POST');
    expect(xhr.url).toBe('/api/pulsars/5/toa-batches');
    expect(xhr.headers['x-csrf-token']).toBe('tok-upload');
    expect((xhr.body?.get('file') as File).name).toBe('night-7.csv');
    expect(xhr.body?.get('confirmDuplicate')).toBeNull();

    xhr.progress(250, 1000);
    const bar = screen.getByRole('progressbar', { name: 'Upload progress' });
    expect(bar.getAttribute('aria-valuenow')).toBe('25');
    xhr.progress(800, 1000);
    expect(bar.getAttribute('aria-valuenow')).toBe('80');
    expect(within(screen.getByRole('list', { name: 'Upload stages' })).getByText('Uploading').getAttribute('aria-current')).toBe('step');

    xhr.sent();
    expect(screen.queryByRole('progressbar')).toBeNull();
    expect(within(screen.getByRole('list', { name: 'Upload stages' })).getByText('Validating and storing').getAttribute('aria-current')).toBe('step');

    xhr.respond(201, { data: BATCH });
    expect(await screen.findByText('Stored 1842 TOAs from night-7.csv')).toBeTruthy();
    const summary = document.querySelector('dl[aria-label="Stored batch"]') as HTMLElement;
    expect(within(summary).getByText('1,842')).toBeTruthy();
    expect(within(summary).getByText('58000.125000')).toBeTruthy();
    expect(within(summary).getByText('365.4 days')).toBeTruthy(); // 58365.5 − 58000.125
    expect(within(summary).getByText('harrow-ridge, cardenal-plateau')).toBeTruthy();
    expect(within(summary).getByText('wideband-1, wideband-2')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Back to the pulsar' }).getAttribute('href')).toBe('/pulsars/5');
  });

  it('lists every problem of a rejected file by line and column', async () => {
    setup();
    const { user } = renderApp('/pulsars/5/upload');
    const xhr = await chooseAndSend(user, new File(['x'], 'bad.csv'));
    xhr.sent();
    xhr.respond(400, {
      error: {
        code: 'invalid_toa_file',
        message: '250 problems; first: line 4, column uncertainty_us: must be > 0',
        details: [
          { path: [], line: 4, column: 'uncertainty_us', message: 'must be > 0' },
          { path: [], line: 9, column: 'observatory', message: 'unknown observatory "north-dish"; register it on the Observatories page' },
          { path: [], line: 12, column: null, message: 'expected 4 fields, found 5' },
        ],
      },
    });
    expect(await screen.findByText('The file was rejected')).toBeTruthy();
    expect(screen.getByText('250 problems; first: line 4, column uncertainty_us: must be > 0')).toBeTruthy();
    expect(screen.getByText(/Showing the first 3 of 250 problems/)).toBeTruthy();
    const rows = within(screen.getByRole('table', { name: 'Problems in the file' })).getAllByRole('row').slice(1);
    expect(rows.map((r) => within(r).getAllByRole('cell').map((c) => c.textContent))).toEqual([
      ['4', 'uncertainty_us', 'must be > 0'],
      ['9', 'observatory', 'unknown observatory "north-dish"; register it on the Observatories page'],
      ['12', '—', 'expected 4 fields, found 5'],
    ]);
  });

  it('asks before storing a duplicate and re-posts with confirmDuplicate', async () => {
    setup();
    const { user } = renderApp('/pulsars/5/upload');
    const first = await chooseAndSend(user, new File(['same bytes'], 'night-7.csv'));
    first.respond(409, {
      error: { code: 'duplicate_upload', message: 'already stored', details: [{ path: ['file'], message: 'same SHA-256 as batch 9', existingBatchId: 9 }] },
    });
    expect(await screen.findByText('This exact file was already uploaded (batch #9). Store it again?')).toBeTruthy();

    // Cancel leaves the file chosen and sends nothing.
    await user.click(screen.getByRole('button', { name: 'Cancel' }));
    expect(screen.queryByText(/already uploaded/)).toBeNull();
    expect(FakeXhr.all).toHaveLength(1);

    await user.click(screen.getByRole('button', { name: 'Upload night-7.csv' }));
    await waitFor(() => expect(FakeXhr.all).toHaveLength(2));
    FakeXhr.all[1].respond(409, { error: { code: 'duplicate_upload', message: 'already stored', details: [{ path: ['file'], message: 'dup', existingBatchId: 9 }] } });
    await user.click(await screen.findByRole('button', { name: 'Confirm' }));
    await waitFor(() => expect(FakeXhr.all).toHaveLength(3));
    const again = FakeXhr.all[2];
    expect(again.body?.get('confirmDuplicate')).toBe('true');
    expect((again.body?.get('file') as File).name).toBe('night-7.csv');
    again.respond(201, { data: { ...BATCH, id: 13 } });
    expect(await screen.findByText('#13')).toBeTruthy();
  });

  it('explains a 413 and blocks files over 50 MB before sending', async () => {
    setup();
    const { user } = renderApp('/pulsars/5/upload');
    const xhr = await chooseAndSend(user, new File(['x'], 'big.csv'));
    xhr.respond(413, { error: { code: 'payload_too_large', message: 'The file is over 50 MB.' } });
    expect(await screen.findByText('The file is too large')).toBeTruthy();
    expect(screen.getByText(/The file is over 50 MB\./)).toBeTruthy();

    const huge = new File(['x'], 'huge.csv');
    Object.defineProperty(huge, 'size', { value: MAX_UPLOAD_BYTES + 1 });
    await user.upload(screen.getByLabelText('TOA file'), huge);
    expect(screen.getByText('This file cannot be uploaded')).toBeTruthy();
    expect((screen.getByRole('button', { name: 'Upload huge.csv' }) as HTMLButtonElement).disabled).toBe(true);
  });

  it('takes a dropped file, warns about a name without .csv, and sends it anyway', async () => {
    setup();
    const { user } = renderApp('/pulsars/5/upload');
    const zone = await screen.findByTestId('drop-zone');
    const dropped = new File(['mjd,uncertainty_us,frequency_mhz,observatory\n'], 'toas.txt', { type: 'text/plain' });
    fireEvent.dragOver(zone, { dataTransfer: { files: [dropped] } });
    fireEvent.drop(zone, { dataTransfer: { files: [dropped] } });
    expect(await screen.findByText(/toas\.txt does not end in \.csv/)).toBeTruthy();
    await user.click(screen.getByRole('button', { name: 'Upload toas.txt' }));
    await waitFor(() => expect(FakeXhr.all).toHaveLength(1));
    expect((FakeXhr.all[0].body?.get('file') as File).name).toBe('toas.txt');
  });

  it('fetches a fresh CSRF token and sends again once after 403 csrf_invalid', async () => {
    const server = setup();
    const { user } = renderApp('/pulsars/5/upload');
    const first = await chooseAndSend(user, new File(['x'], 'night-7.csv'));
    first.respond(403, { error: { code: 'csrf_invalid', message: 'stale token' } });
    await waitFor(() => expect(FakeXhr.all).toHaveLength(2));
    expect(server.callsTo('GET', '/api/auth/csrf')).toHaveLength(2);
    FakeXhr.all[1].respond(201, { data: BATCH });
    expect(await screen.findByText('Stored 1842 TOAs from night-7.csv')).toBeTruthy();
  });

  it('cancels an upload in flight', async () => {
    setup();
    const { user } = renderApp('/pulsars/5/upload');
    const xhr = await chooseAndSend(user, new File(['x'], 'night-7.csv'));
    xhr.progress(10, 100);
    await user.click(screen.getByRole('button', { name: 'Cancel upload' }));
    expect(xhr.aborted).toBe(true);
    expect(screen.queryByRole('progressbar')).toBeNull();
    expect(screen.getByRole('button', { name: 'Upload night-7.csv' })).toBeTruthy();
  });

  it('hides the page from roles without toas:upload', async () => {
    FakeXhr.all = [];
    mockApi({
      'GET /api/auth/me': ok({ ...UPLOADER_ME, permissions: ['pulsars:read'] }),
      'GET /api/pulsars/:id': ok(PULSAR),
    });
    renderApp('/pulsars/5/upload');
    expect(await screen.findByText('Not available for your role')).toBeTruthy();
    expect(screen.queryByLabelText('TOA file')).toBeNull();
  });
});

describe('upload pre-checks', () => {
  it('blocks over the limit, warns on a name without .csv', () => {
    expect(precheckUpload({ name: 'a.csv', size: MAX_UPLOAD_BYTES })).toEqual({ errors: [], warnings: [] });
    expect(precheckUpload({ name: 'a.csv', size: MAX_UPLOAD_BYTES + 1 }).errors).toHaveLength(1);
    const txt = precheckUpload({ name: 'a.txt', size: 10 });
    expect(txt.errors).toEqual([]);
    expect(txt.warnings[0]).toMatch(/does not end in \.csv/);
    expect(precheckUpload({ name: 'A.CSV', size: 10 }).warnings).toEqual([]);
  });
});

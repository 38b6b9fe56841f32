/**
 * Uploading arrival-time files (docs/api-workflow.md, docs/formats.md §1):
 * every bad file is rejected whole with line/column errors and nothing of it
 * stored; good files are stored with their MJD digits kept exactly.
 */
import { createHash, randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { MAX_TOA_UPLOAD_BYTES } from '../../api/contracts/toas';
import { createObservatoryRow, TOA_HEADER, toaCsv, uploadToaFile } from '../fixtures/uploads/toa-files';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let observer: Client;
let observatory: string;

beforeAll(async () => {
  t = buildTestApp();
  const u = await createUser(t.knex, 'observer');
  observer = await signedInClient(t.app, u.email, u.password);
  observatory = await createObservatoryRow(t.knex);
});
afterAll(() => t.close());

async function storedCounts(pulsarId: number) {
  const [toas] = await t.knex('toas').where({ pulsar_id: pulsarId }).count({ n: '*' });
  const [batches] = await t.knex('toa_batches').where({ pulsar_id: pulsarId }).count({ n: '*' });
  const pulsar = await t.knex('pulsars').where({ id: pulsarId }).first('toa_count');
  return { toas: Number(toas.n), batches: Number(batches.n), toaCount: Number(pulsar.toa_count) };
}

/** Uploads a file that must be rejected; checks the answer's shape and that nothing was stored. */
async function expectRejected(content: string | Uint8Array) {
  const pulsar = await createPulsarRow(t.knex);
  const res = await uploadToaFile(observer, pulsar.id, content);
  expect({ status: res.status, code: res.body.error?.code }, JSON.stringify(res.body)).toEqual({ status: 400, code: 'invalid_toa_file' });
  expect(await storedCounts(pulsar.id)).toEqual({ toas: 0, batches: 0, toaCount: 0 });
  const details = res.body.error.details as { path: unknown[]; line: number | null; column: string | null; message: string }[];
  for (const d of details) expect(d.path).toEqual([]);
  return { message: res.body.error.message as string, details };
}

describe('bad files are rejected whole, nothing stored', () => {
  it('an empty file', async () => {
    const { details, message } = await expectRejected('');
    expect(details).toEqual([{ path: [], line: 1, column: null, message: expect.stringContaining('the file is empty') }]);
    expect(message).toMatch(/^1 problem: line 1: the file is empty/);
  });

  it('a header without data rows', async () => {
    const { details } = await expectRejected(`# comment\n${TOA_HEADER}\n`);
    expect(details).toEqual([{ path: [], line: 2, column: null, message: 'the file has a header but no data rows' }]);
  });

  it('a missing required column', async () => {
    const { details } = await expectRejected(`mjd,frequency_mhz,observatory\n58000.5,1400,${observatory}\n`);
    expect(details).toEqual([{ path: [], line: 1, column: 'uncertainty_us', message: expect.stringContaining('required column "uncertainty_us" is missing') }]);
  });

  it('a non-numeric value', async () => {
    const { details } = await expectRejected(`${TOA_HEADER}\n58000.5,1,1400,${observatory},a\n58001.5,1,fourteen,${observatory},a\n`);
    expect(details).toEqual([{ path: [], line: 3, column: 'frequency_mhz', message: expect.stringContaining('"fourteen" is not a number') }]);
  });

  it('negative and zero uncertainties, each listed, the total in the message', async () => {
    const { details, message } = await expectRejected(`${TOA_HEADER}\n58000.5,-1,1400,${observatory},a\n58001.5,0,1400,${observatory},a\n58002.5,1,1400,${observatory},a\n`);
    expect(details.map((d) => [d.line, d.column])).toEqual([[2, 'uncertainty_us'], [3, 'uncertainty_us']]);
    expect(details[0].message).toMatch(/must be > 0/);
    expect(message).toMatch(/^2 problems; first: line 2, column uncertainty_us: must be > 0/);
  });

  it('an MJD outside the ephemeris range', async () => {
    // DE405 covers MJD 36912–73488 (its casacore table's first and last rows); 30000 and 80000 lie outside.
    const { details, message } = await expectRejected(`${TOA_HEADER}\n30000.5,1,1400,${observatory},a\n58000.5,1,1400,${observatory},a\n80000.25,1,1400,${observatory},a\n`);
    expect(details.map((d) => [d.line, d.column])).toEqual([[2, 'mjd'], [4, 'mjd']]);
    expect(details[0].message).toMatch(/MJD 30000\.5 is outside the DE405 ephemeris range/);
    expect(message).toMatch(/^2 problems/);
  });

  it('an unknown observatory, named, with the advice to register it', async () => {
    const { details } = await expectRejected(`${TOA_HEADER}\n58000.5,1,1400,nowhere-peak,a\n`);
    expect(details).toHaveLength(1);
    expect(details[0]).toMatchObject({ line: 2, column: 'observatory' });
    expect(details[0].message).toContain('"nowhere-peak"');
    expect(details[0].message).toMatch(/register/);
  });

  it('binary garbage', async () => {
    const garbage = new Uint8Array(randomBytes(2048));
    garbage[10] = 0; // at least one NUL byte
    const { details } = await expectRejected(garbage);
    expect(details).toHaveLength(1);
    expect(details[0].column).toBeNull();
    expect(details[0].line).toEqual(expect.any(Number));
  });

  it('a row with too many fields', async () => {
    const { details } = await expectRejected(`${TOA_HEADER}\n58000.5,1,1400,${observatory},a\n58001.5,1,1400,${observatory},a,extra\n`);
    expect(details).toEqual([{ path: [], line: 3, column: null, message: 'too many fields: found 6, the header has 5' }]);
  });

  it('lists at most 100 problems and counts all of them', async () => {
    const rows = Array.from({ length: 150 }, (_, i) => `${58000 + i}.5,0,1400,${observatory},a`);
    const { details, message } = await expectRejected(`${TOA_HEADER}\n${rows.join('\n')}\n`);
    expect(details).toHaveLength(100);
    expect(details[99].line).toBe(101);
    expect(message).toMatch(/^150 problems; first: line 2/);
  });

  it('more data rows than the limit (limit lowered for the test)', async () => {
    t.app.locals.toaUploadLimits = { maxRows: 3 };
    try {
      const { details } = await expectRejected(toaCsv(observatory, 4));
      expect(details).toEqual([{ path: [], line: 5, column: null, message: 'the file has 4 data rows; at most 3 are accepted per file' }]);
    } finally {
      t.app.locals.toaUploadLimits = undefined;
    }
  });
});

describe('size limit', () => {
  it('answers 413 for a file over the (lowered) byte limit and stores nothing', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const file = toaCsv(observatory, 40);
    t.app.locals.toaUploadLimits = { maxBytes: file.length - 1 };
    try {
      const res = await uploadToaFile(observer, pulsar.id, file);
      expect([res.status, res.body.error?.code]).toEqual([413, 'payload_too_large']);
      expect(await storedCounts(pulsar.id)).toEqual({ toas: 0, batches: 0, toaCount: 0 });
      t.app.locals.toaUploadLimits = { maxBytes: file.length };
      await uploadToaFile(observer, pulsar.id, file).expect(201);
    } finally {
      t.app.locals.toaUploadLimits = undefined;
    }
  });

  it('answers 413 at the real 50 MiB limit', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const line = `# ${'x'.repeat(1021)}\n`; // 1024 bytes of comment
    const big = Buffer.from(line.repeat(MAX_TOA_UPLOAD_BYTES / 1024) + '#', 'utf8'); // one byte over
    const res = await uploadToaFile(observer, pulsar.id, big);
    expect([res.status, res.body.error?.code]).toEqual([413, 'payload_too_large']);
    expect(await storedCounts(pulsar.id)).toEqual({ toas: 0, batches: 0, toaCount: 0 });
  }, 60_000);
});

describe('good files', () => {
  it('accepts CRLF line ends and a UTF-8 byte-order mark', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const text = `\uFEFF${TOA_HEADER}\r\n58000.25,1,1400,${observatory},a\r\n58001.75,2,inf,${observatory},b\r\n`;
    const res = await uploadToaFile(observer, pulsar.id, text, { fileName: 'windows.csv' });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.data).toMatchObject({ fileName: 'windows.csv', rowCount: 2, firstMjd: '58000.25', lastMjd: '58001.75', observatories: [observatory], backends: ['a', 'b'], status: 'stored' });
    expect(await storedCounts(pulsar.id)).toEqual({ toas: 2, batches: 1, toaCount: 2 });
  });

  it('reads an 18-digit MJD back identical', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const mjd = '58123.123456789012345678';
    await uploadToaFile(observer, pulsar.id, `${TOA_HEADER}\n${mjd},0.5,1400,${observatory},a\n`).expect(201);
    const toas = await observer.agent.get(`/api/pulsars/${pulsar.id}/toas`).expect(200);
    expect(toas.body.data.mjd).toEqual([mjd]);
  });

  it('accepts 40 fractional digits and keeps exactly the 38 stored ones (rounded at the 38th)', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const digits38 = '12345678901234567890123456789012345678';
    const up = `58000.${digits38.slice(0, 37)}8` + '96'; // 38th digit 8, then 96: rounds up to 9
    const down = `58001.${digits38}49`; // rounds down
    await uploadToaFile(observer, pulsar.id, `${TOA_HEADER}\n${up},1,1400,${observatory},a\n${down},1,1400,${observatory},a\n`).expect(201);
    const toas = await observer.agent.get(`/api/pulsars/${pulsar.id}/toas`).expect(200);
    expect(toas.body.data.mjd).toEqual([`58000.${digits38.slice(0, 37)}9`, `58001.${digits38}`]);
    const stored = await t.knex('toas').where({ pulsar_id: pulsar.id }).orderBy('mjd_day').select('mjd_fraction');
    expect(stored.map((r) => r.mjd_fraction)).toEqual([`0.${digits38.slice(0, 37)}9`, `0.${digits38}`]);
  });

  it('stores a file with labels and pulse numbers and updates the pulsar statistics', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const text = `${TOA_HEADER},pulse_number,session\n58010.5,1,1400,${observatory},a,-7,s1\n58002.5,1,1400,ssb,a,,s2\n`;
    await uploadToaFile(observer, pulsar.id, text).expect(201);
    const p = await observer.agent.get(`/api/pulsars/${pulsar.id}`).expect(200);
    expect(p.body.data).toMatchObject({ toaCount: 2, firstMjd: '58002.5', lastMjd: '58010.5', observatories: [observatory, 'ssb'].sort() });
    const rows = await t.knex('toas').where({ pulsar_id: pulsar.id }).orderBy('row_number').select('row_number', 'line_number', 'pulse_number', 'labels');
    expect(rows.map((r) => [r.row_number, r.line_number, r.pulse_number, typeof r.labels === 'string' ? JSON.parse(r.labels) : r.labels])).toEqual([[1, 2, '-7', { session: 's1' }], [2, 3, null, { session: 's2' }]]);
  });
  it('keeps backends and labels with quotes, backslashes, question marks and non-ASCII text exactly', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const backend = "o'neil\\x?";
    const label = 'say "hi"; DROP TABLE toas; -- ? \\\\ ñ ✓';
    const text = `${TOA_HEADER},note\n58000.5,1,1400,${observatory},${backend},"${label.replace(/"/g, '""')}"\n`;
    await uploadToaFile(observer, pulsar.id, text).expect(201);
    const row = await t.knex('toas').where({ pulsar_id: pulsar.id }).first('backend', 'labels');
    expect(row.backend).toBe(backend);
    expect(typeof row.labels === 'string' ? JSON.parse(row.labels) : row.labels).toEqual({ note: label });
  });
});

describe('duplicates and request checks', () => {
  it('recognises the same file by SHA-256 and stores it again only when confirmed', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const file = toaCsv(observatory, 5);
    const first = await uploadToaFile(observer, pulsar.id, file).expect(201);
    expect(first.body.data.checksumSha256).toBe(createHash('sha256').update(file).digest('hex'));

    const again = await uploadToaFile(observer, pulsar.id, file, { fileName: 'again.csv' });
    expect([again.status, again.body.error?.code]).toEqual([409, 'duplicate_upload']);
    expect(again.body.error.details).toEqual([{ path: ['file'], message: expect.any(String), existingBatchId: first.body.data.id }]);
    expect(await storedCounts(pulsar.id)).toEqual({ toas: 5, batches: 1, toaCount: 5 });

    const confirmed = await uploadToaFile(observer, pulsar.id, file, { fileName: 'again.csv', confirmDuplicate: true });
    expect(confirmed.status).toBe(201);
    expect(await storedCounts(pulsar.id)).toEqual({ toas: 10, batches: 2, toaCount: 10 });

    const other = await createPulsarRow(t.knex); // another pulsar: not a duplicate
    await uploadToaFile(observer, other.id, file).expect(201);
  });

  it('requires the CSRF header for a multipart upload', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const res = await uploadToaFile(observer, pulsar.id, toaCsv(observatory, 2), { csrf: false });
    expect([res.status, res.body.error?.code]).toEqual([403, 'csrf_invalid']);
    expect(await storedCounts(pulsar.id)).toEqual({ toas: 0, batches: 0, toaCount: 0 });
  });

  it('answers 400 for a body that is not multipart, a missing file part and a bad confirmDuplicate', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const url = `/api/pulsars/${pulsar.id}/toa-batches`;
    const json = await observer.agent.post(url).set('x-csrf-token', observer.csrf).send({ file: 'x' });
    expect([json.status, json.body.error?.code]).toEqual([400, 'validation_failed']);
    const noFile = await observer.agent.post(url).set('x-csrf-token', observer.csrf).field('confirmDuplicate', 'true');
    expect([noFile.status, noFile.body.error?.details?.[0]?.path]).toEqual([400, ['file']]);
    const bad = await uploadToaFile(observer, pulsar.id, toaCsv(observatory, 2)).field('confirmDuplicate', 'yes');
    expect([bad.status, bad.body.error?.details?.[0]?.path]).toEqual([400, ['confirmDuplicate']]);
    expect(await storedCounts(pulsar.id)).toEqual({ toas: 0, batches: 0, toaCount: 0 });
  });

  it('answers 400 for a malformed multipart body', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const res = await observer.agent
      .post(`/api/pulsars/${pulsar.id}/toa-batches`)
      .set('x-csrf-token', observer.csrf)
      .set('content-type', 'multipart/form-data; boundary=xyz')
      .send('--xyz\r\nContent-Disposition: form-data; name="file"; filename="a.csv"\r\n\r\nmjd,unfinished');
    expect([res.status, res.body.error?.code]).toEqual([400, 'validation_failed']);
    expect(await storedCounts(pulsar.id)).toEqual({ toas: 0, batches: 0, toaCount: 0 });
  });

  it('answers 404 for an unknown pulsar', async () => {
    const res = await uploadToaFile(observer, 2147483000, toaCsv(observatory, 2));
    expect([res.status, res.body.error?.code]).toEqual([404, 'not_found']);
  });
});

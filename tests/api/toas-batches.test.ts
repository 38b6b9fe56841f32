/** TOA batches and TOAs through the API: listing, the columnar TOA read-back, deleting a batch (lead/admin, audit-logged). */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createObservatoryRow, TOA_HEADER, toaCsv, uploadToaFile } from '../fixtures/uploads/toa-files';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let observer: Client;
let analyst: Client;
let lead: Client;
let observerId: number;
let leadId: number;
let observatory: string;

beforeAll(async () => {
  t = buildTestApp();
  const o = await createUser(t.knex, 'observer');
  const a = await createUser(t.knex, 'analyst');
  const l = await createUser(t.knex, 'lead');
  observerId = o.id;
  leadId = l.id;
  observer = await signedInClient(t.app, o.email, o.password);
  analyst = await signedInClient(t.app, a.email, a.password);
  lead = await signedInClient(t.app, l.email, l.password);
  observatory = await createObservatoryRow(t.knex);
});
afterAll(() => t.close());

describe('TOA batches', () => {
  it('lists a pulsar\'s batches newest first with the uploader', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const first = await uploadToaFile(observer, pulsar.id, toaCsv(observatory, 3), { fileName: 'first.csv' }).expect(201);
    const second = await uploadToaFile(observer, pulsar.id, toaCsv(observatory, 2, 59_000), { fileName: 'second.csv' }).expect(201);
    const res = await analyst.agent.get(`/api/pulsars/${pulsar.id}/toa-batches`).expect(200);
    expect(res.body.data.map((b: { id: number }) => b.id)).toEqual([second.body.data.id, first.body.data.id]);
    expect(res.body.data[1]).toEqual(first.body.data);
    expect(res.body.data[1]).toMatchObject({
      pulsarId: pulsar.id,
      fileName: 'first.csv',
      uploadedBy: { id: observerId, displayName: 'Test observer' },
      rowCount: 3,
      firstMjd: expect.stringMatching(/^58000\./),
      lastMjd: expect.stringMatching(/^58002\./),
      backends: ['wide-a', 'wide-b'],
      status: 'stored',
    });
    await analyst.agent.get('/api/pulsars/2147483000/toa-batches').expect(404);
  });

  it('reads TOAs back as sorted columns across batches', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const a = await uploadToaFile(observer, pulsar.id, `${TOA_HEADER},pulse_number\n58005.5,1.5,inf,${observatory},x,12\n58001.5,0.5,1400,ssb,y,\n`).expect(201);
    const b = await uploadToaFile(observer, pulsar.id, `${TOA_HEADER}\n58003.25,2,800.5,${observatory},x\n`).expect(201);
    const res = await analyst.agent.get(`/api/pulsars/${pulsar.id}/toas`).expect(200);
    const d = res.body.data;
    expect(d.count).toBe(3);
    expect(d.mjd).toEqual(['58001.5', '58003.25', '58005.5']);
    expect(d.batchId).toEqual([a.body.data.id, b.body.data.id, a.body.data.id]);
    expect(d.row).toEqual([2, 1, 1]);
    expect(d.uncertaintyUs).toEqual([0.5, 2, 1.5]);
    expect(d.frequencyMhz).toEqual([1400, 800.5, null]);
    expect(d.observatory).toEqual(['ssb', observatory, observatory]);
    expect(d.backend).toEqual(['y', 'x', 'x']);
    expect(d.pulseNumber).toEqual([null, null, 12]);
    expect(d.excluded).toEqual([false, false, false]);
    expect(d.id).toHaveLength(3);
    await analyst.agent.get('/api/pulsars/2147483000/toas').expect(404);
  });
});

describe('deleting a batch', () => {
  it('is refused to an analyst and removes the batch, its TOAs and their exclusions for a lead, with an audit row', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const keep = await uploadToaFile(observer, pulsar.id, toaCsv(observatory, 2, 58_000)).expect(201);
    const gone = await uploadToaFile(observer, pulsar.id, toaCsv(observatory, 3, 59_000), { fileName: 'gone.csv' }).expect(201);
    const goneToa = await t.knex('toas').where({ batch_id: gone.body.data.id }).first('id');
    await analyst.agent.post(`/api/pulsars/${pulsar.id}/exclusions`).set('x-csrf-token', analyst.csrf).send({ toaIds: [Number(goneToa.id)], reason: 'bad' }).expect(201);

    const refused = await analyst.agent.delete(`/api/toa-batches/${gone.body.data.id}`).set('x-csrf-token', analyst.csrf);
    expect([refused.status, refused.body.error?.code]).toEqual([403, 'forbidden']);

    await lead.agent.delete(`/api/toa-batches/${gone.body.data.id}`).set('x-csrf-token', lead.csrf).expect(204);
    expect(await t.knex('toas').where({ batch_id: gone.body.data.id }).count({ n: '*' }).then(([r]) => Number(r.n))).toBe(0);
    expect(await t.knex('toa_exclusions').where({ toa_id: goneToa.id }).count({ n: '*' }).then(([r]) => Number(r.n))).toBe(0);
    const batches = await lead.agent.get(`/api/pulsars/${pulsar.id}/toa-batches`).expect(200);
    expect(batches.body.data.map((b: { id: number }) => b.id)).toEqual([keep.body.data.id]);

    const p = await lead.agent.get(`/api/pulsars/${pulsar.id}`).expect(200);
    expect(p.body.data).toMatchObject({ toaCount: 2, firstMjd: keep.body.data.firstMjd, lastMjd: keep.body.data.lastMjd });

    const audit = await t.knex('audit_log').where({ pulsar_id: pulsar.id, action: 'toa-batch.delete' });
    expect(audit).toHaveLength(1);
    expect(audit[0].user_id).toBe(leadId);
    const details = typeof audit[0].details === 'string' ? JSON.parse(audit[0].details) : audit[0].details;
    expect(details).toMatchObject({ batchId: gone.body.data.id, fileName: 'gone.csv', rowCount: 3, checksumSha256: gone.body.data.checksumSha256 });

    const again = await lead.agent.delete(`/api/toa-batches/${gone.body.data.id}`).set('x-csrf-token', lead.csrf);
    expect([again.status, again.body.error?.code]).toEqual([404, 'not_found']);
  });

  it('empties the statistics when the last batch goes', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const only = await uploadToaFile(observer, pulsar.id, toaCsv(observatory, 2)).expect(201);
    await lead.agent.delete(`/api/toa-batches/${only.body.data.id}`).set('x-csrf-token', lead.csrf).expect(204);
    const p = await lead.agent.get(`/api/pulsars/${pulsar.id}`).expect(200);
    expect(p.body.data).toMatchObject({ toaCount: 0, firstMjd: null, lastMjd: null, observatories: [] });
  });
});

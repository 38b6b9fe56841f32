/**
 * The per-pulsar audit log: every audited action done through the API
 * (revision save, release, withdrawal, exclusion, restore, TOA-batch deletion,
 * comparison save) shows up with who, what and when, newest first, paged by
 * entry id; only analysts and up may read it; another pulsar's rows stay out.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AuditLogEntry } from '../../api/contracts/audit-log';
import { createObservatoryRow, toaCsv, uploadToaFile } from '../fixtures/uploads/toa-files';
import { modelWith, seedFitRun, seedRevision, toaIdRange } from './comparisons-fixtures';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser, type CreatedUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let viewer: Client;
let observer: Client;
let analyst: Client;
let lead: Client;
let analystUser: CreatedUser;
let leadUser: CreatedUser;
let pulsar: { id: number; name: string };
let other: { id: number; name: string };
let revisionId: number;
let batchId: number;
let comparisonId: number;
let fitRunIds: number[];

const post = (client: Client, url: string, body: object = {}) => client.agent.post(url).set('x-csrf-token', client.csrf).send(body);

beforeAll(async () => {
  t = buildTestApp();
  const users = await Promise.all((['viewer', 'observer', 'analyst', 'lead'] as const).map((role) => createUser(t.knex, role)));
  [, , analystUser, leadUser] = users;
  [viewer, observer, analyst, lead] = await Promise.all(users.map((u) => signedInClient(t.app, u.email, u.password)));
  pulsar = await createPulsarRow(t.knex);
  other = await createPulsarRow(t.knex);
  const observatory = await createObservatoryRow(t.knex);

  // The actions, in this order, each through its API route.
  const saved = await post(analyst, `/api/pulsars/${pulsar.id}/revisions`, { model: modelWith(pulsar.name, ['spin.frequency_hz']), message: 'first model' });
  expect(saved.status, JSON.stringify(saved.body)).toBe(201);
  revisionId = saved.body.data.id;
  expect((await post(lead, `/api/revisions/${revisionId}/release`, { note: 'ready for the campaign' })).status).toBe(200);
  expect((await post(lead, `/api/revisions/${revisionId}/withdraw-release`)).status).toBe(200);
  const upload = await uploadToaFile(observer, pulsar.id, toaCsv(observatory, 5));
  expect(upload.status, JSON.stringify(upload.body)).toBe(201);
  batchId = upload.body.data.id;
  const toaIds = (await analyst.agent.get(`/api/pulsars/${pulsar.id}/toas`).expect(200)).body.data.id as number[];
  expect((await post(analyst, `/api/pulsars/${pulsar.id}/exclusions`, { toaIds: toaIds.slice(0, 2), reason: 'RFI' })).status).toBe(201);
  expect((await post(analyst, `/api/pulsars/${pulsar.id}/exclusions/restore`, { toaIds: [toaIds[0]] })).status).toBe(200);
  await lead.agent.delete(`/api/toa-batches/${batchId}`).set('x-csrf-token', lead.csrf).expect(204);
  const model = modelWith(pulsar.name, ['spin.frequency_hz']);
  const seeded = { pulsarId: pulsar.id, revisionId, fittedModel: model, uncertainties: { 'spin.frequency_hz': 1e-12 }, toaIds: toaIdRange(20) };
  fitRunIds = [await seedFitRun(t.knex, { ...seeded, chi2: 25 }), await seedFitRun(t.knex, { ...seeded, chi2: 24 })];
  const comparison = await post(lead, `/api/pulsars/${pulsar.id}/comparisons`, { fitRunIds, comment: 'same model twice' });
  expect(comparison.status, JSON.stringify(comparison.body)).toBe(201);
  comparisonId = comparison.body.data.id;

  // Something on another pulsar, which must not show.
  await seedRevision(t.knex, other.id, analystUser.id, modelWith(other.name, ['spin.frequency_hz']));
  expect((await post(analyst, `/api/pulsars/${other.id}/revisions`, { model: modelWith(other.name, ['spin.frequency_hz']), message: 'elsewhere' })).status).toBe(201);
});
afterAll(() => t.close());

async function page(client: Client, query = ''): Promise<{ status: number; entries: AuditLogEntry[]; meta: { nextBefore: number | null; limit: number } }> {
  const res = await client.agent.get(`/api/pulsars/${pulsar.id}/audit-log${query}`);
  return { status: res.status, entries: res.body.data, meta: res.body.meta };
}

describe('the audit log of a pulsar', () => {
  it('lists every audited action newest first with who, what and when', async () => {
    const { status, entries, meta } = await page(analyst);
    expect(status).toBe(200);
    expect(meta).toEqual({ nextBefore: null, limit: 50 });
    expect(entries.map((e) => e.action)).toEqual([
      'comparison.save',
      'toa-batch.delete',
      'toas.restore',
      'toas.exclude',
      'revision.withdraw-release',
      'revision.release',
      'revision.create',
    ]);
    expect(entries.every((e) => e.pulsarId === pulsar.id)).toBe(true);
    const ids = entries.map((e) => e.id);
    expect(ids).toEqual([...ids].sort((a, b) => b - a));
    const times = entries.map((e) => Date.parse(e.createdAt));
    expect(times).toEqual([...times].sort((a, b) => b - a));

    const byAction = new Map(entries.map((e) => [e.action, e]));
    expect(byAction.get('revision.create')).toMatchObject({
      actor: { id: analystUser.id, displayName: 'Test analyst', email: analystUser.email },
      target: { kind: 'revision', id: revisionId },
      details: { revisionId, message: 'first model', parentId: null },
      summary: `saved revision ${revisionId}: "first model"`,
    });
    expect(byAction.get('revision.release')).toMatchObject({
      actor: { id: leadUser.id, email: leadUser.email },
      target: { kind: 'revision', id: revisionId },
      details: { revisionId, note: 'ready for the campaign' },
      summary: `released revision ${revisionId}: "ready for the campaign"`,
    });
    expect(byAction.get('revision.withdraw-release')).toMatchObject({ actor: { id: leadUser.id }, details: { revisionId, previousNote: 'ready for the campaign' } });
    expect(byAction.get('toas.exclude')).toMatchObject({ actor: { id: analystUser.id }, target: { kind: 'toas', id: null }, details: { count: 2, reason: 'RFI' }, summary: 'excluded 2 TOAs from fits: "RFI"' });
    expect(byAction.get('toas.restore')).toMatchObject({ details: { count: 1 }, summary: 'included 1 TOA in fits again' });
    expect(byAction.get('toa-batch.delete')).toMatchObject({ actor: { id: leadUser.id }, target: { kind: 'toa-batch', id: batchId }, details: { batchId, rowCount: 5 } });
    expect(byAction.get('comparison.save')).toMatchObject({
      actor: { id: leadUser.id },
      target: { kind: 'comparison', id: comparisonId },
      details: { comparisonId, fitRunIds, comment: 'same model twice' },
    });
  });

  it('pages by entry id: each page older than the last, no entry twice, the last page says so', async () => {
    const all = (await page(lead)).entries.map((e) => e.id);
    const seen: number[] = [];
    let before: number | null = null;
    for (let guard = 0; guard < 10; guard++) {
      const p = await page(lead, `?limit=3${before === null ? '' : `&before=${before}`}`);
      expect(p.status).toBe(200);
      expect(p.entries.length).toBeLessThanOrEqual(3);
      seen.push(...p.entries.map((e) => e.id));
      before = p.meta.nextBefore;
      if (before === null) break;
      expect(before).toBe(p.entries[p.entries.length - 1].id);
    }
    expect(seen).toEqual(all);
    expect(all).toHaveLength(7);
  });

  it('names no actor once the account is gone, and keeps the row', async () => {
    const gone = await createUser(t.knex, 'analyst');
    const [id] = await t.knex('audit_log').insert({ pulsar_id: pulsar.id, user_id: gone.id, action: 'toas.restore', details: JSON.stringify({ toaIds: [], count: 0 }) });
    await t.knex('users').where({ id: gone.id }).delete();
    const { entries } = await page(analyst, '?limit=1');
    expect(entries[0]).toMatchObject({ id: Number(id), actor: null, action: 'toas.restore' });
    await t.knex('audit_log').where({ id }).delete();
  });

  it('is readable by analysts, leads and admins only; 404 for an unknown pulsar; 400 for bad paging', async () => {
    expect((await page(viewer)).status).toBe(403);
    expect((await page(observer)).status).toBe(403);
    expect((await page(lead)).status).toBe(200);
    await analyst.agent.get('/api/pulsars/2147480000/audit-log').expect(404);
    for (const query of ['?limit=0', '?limit=201', '?limit=x', '?before=-1', '?page=2']) {
      const res = await analyst.agent.get(`/api/pulsars/${pulsar.id}/audit-log${query}`);
      expect(res.status, query).toBe(400);
      expect(res.body.error.code).toBe('validation_failed');
    }
  });
});

/** Excluding TOAs from fits and restoring them: round trip, history, audit rows, input checks. */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createObservatoryRow, toaCsv, uploadToaFile } from '../fixtures/uploads/toa-files';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let observer: Client;
let analyst: Client;
let analystId: number;
let observatory: string;

beforeAll(async () => {
  t = buildTestApp();
  const o = await createUser(t.knex, 'observer');
  const a = await createUser(t.knex, 'analyst');
  analystId = a.id;
  observer = await signedInClient(t.app, o.email, o.password);
  analyst = await signedInClient(t.app, a.email, a.password);
  observatory = await createObservatoryRow(t.knex);
});
afterAll(() => t.close());

async function pulsarWithToas(count: number): Promise<{ pulsarId: number; toaIds: number[] }> {
  const pulsar = await createPulsarRow(t.knex);
  await uploadToaFile(observer, pulsar.id, toaCsv(observatory, count)).expect(201);
  const toas = await analyst.agent.get(`/api/pulsars/${pulsar.id}/toas`).expect(200);
  return { pulsarId: pulsar.id, toaIds: toas.body.data.id };
}

function post(path: string, body: object) {
  return analyst.agent.post(path).set('x-csrf-token', analyst.csrf).send(body);
}

function detailsOf(value: unknown): Record<string, unknown> {
  return (typeof value === 'string' ? JSON.parse(value) : value) as Record<string, unknown>;
}

describe('exclusions', () => {
  it('excludes with a reason, restores, keeps the history and audit-logs both', async () => {
    const { pulsarId, toaIds } = await pulsarWithToas(4);
    const excluded = await post(`/api/pulsars/${pulsarId}/exclusions`, { toaIds: [toaIds[1], toaIds[2]], reason: 'RFI in this session' });
    expect([excluded.status, excluded.body.data]).toEqual([201, { excluded: 2 }]);
    const repeat = await post(`/api/pulsars/${pulsarId}/exclusions`, { toaIds: [toaIds[1]], reason: 'again' });
    expect(repeat.body.data).toEqual({ excluded: 0 }); // already excluded: nothing new

    const toas = await analyst.agent.get(`/api/pulsars/${pulsarId}/toas`).expect(200);
    expect(toas.body.data.excluded).toEqual([false, true, true, false]);

    const restored = await post(`/api/pulsars/${pulsarId}/exclusions/restore`, { toaIds: [toaIds[2], toaIds[3]] });
    expect([restored.status, restored.body.data]).toEqual([200, { restored: 1 }]);
    const after = await analyst.agent.get(`/api/pulsars/${pulsarId}/toas`).expect(200);
    expect(after.body.data.excluded).toEqual([false, true, false, false]);

    const list = await observer.agent.get(`/api/pulsars/${pulsarId}/exclusions`).expect(200);
    expect(list.body.data).toHaveLength(2);
    const byToa = new Map(list.body.data.map((e: { toaId: number }) => [e.toaId, e]));
    expect(byToa.get(toaIds[1])).toMatchObject({ reason: 'RFI in this session', excludedBy: { id: analystId, displayName: 'Test analyst' }, restoredBy: null, restoredAt: null });
    expect(byToa.get(toaIds[2])).toMatchObject({ reason: 'RFI in this session', restoredBy: { id: analystId, displayName: 'Test analyst' }, restoredAt: expect.any(String) });

    const audit = await t.knex('audit_log').where({ pulsar_id: pulsarId }).orderBy('id');
    expect(audit.map((r) => [r.action, r.user_id])).toEqual([['toas.exclude', analystId], ['toas.restore', analystId]]);
    expect(detailsOf(audit[0].details)).toEqual({ toaIds: [toaIds[1], toaIds[2]], reason: 'RFI in this session', count: 2 });
    expect(detailsOf(audit[1].details)).toEqual({ toaIds: [toaIds[2]], count: 1 });

    // excluding a restored TOA again opens a new exclusion row; the old one stays as history
    await post(`/api/pulsars/${pulsarId}/exclusions`, { toaIds: [toaIds[2]], reason: 'second look' }).expect(201);
    const history = await observer.agent.get(`/api/pulsars/${pulsarId}/exclusions`).expect(200);
    expect(history.body.data.filter((e: { toaId: number }) => e.toaId === toaIds[2]).map((e: { reason: string }) => e.reason)).toEqual(['second look', 'RFI in this session']);
  });

  it('refuses ids of another pulsar\'s TOAs and stores nothing', async () => {
    const mine = await pulsarWithToas(2);
    const theirs = await pulsarWithToas(1);
    const res = await post(`/api/pulsars/${mine.pulsarId}/exclusions`, { toaIds: [mine.toaIds[0], theirs.toaIds[0]], reason: 'x' });
    expect([res.status, res.body.error?.code, res.body.error?.details?.[0]?.path]).toEqual([400, 'validation_failed', ['toaIds']]);
    expect(res.body.error.message).toContain(String(theirs.toaIds[0]));
    expect(await t.knex('toa_exclusions').where({ pulsar_id: mine.pulsarId }).count({ n: '*' }).then(([r]) => Number(r.n))).toBe(0);
  });

  it('checks the body: a reason is required, ids must be positive integers', async () => {
    const { pulsarId, toaIds } = await pulsarWithToas(1);
    const noReason = await post(`/api/pulsars/${pulsarId}/exclusions`, { toaIds, reason: '  ' });
    expect([noReason.status, noReason.body.error?.details?.[0]?.path]).toEqual([400, ['reason']]);
    const badIds = await post(`/api/pulsars/${pulsarId}/exclusions/restore`, { toaIds: [] });
    expect([badIds.status, badIds.body.error?.details?.[0]?.path]).toEqual([400, ['toaIds']]);
    const unknownPulsar = await post('/api/pulsars/2147483000/exclusions', { toaIds, reason: 'x' });
    expect(unknownPulsar.status).toBe(404);
  });
});

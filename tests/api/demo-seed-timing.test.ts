/**
 * The demo seed's timing part (api/db/demo-scenario/seed-demo-timing.ts) on the
 * real MariaDB: every simulated file is stored once however often the seed runs,
 * with the built row counts, uploaded by the observer; each pulsar gets one
 * starting revision by the analyst; the stored TOAs still fit the true model.
 */
import { createHash } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { seedDemo } from '../../api/db/seed-demo';
import { buildDemoScenario, type DemoPulsarData } from '../../api/db/demo-scenario/build-demo-scenario';
import { STARTING_REVISION_MESSAGE } from '../../api/db/demo-scenario/demo-pulsars';
import { loadToasForFit } from '../../api/db/load-toas-for-fit';
import { fitTimingModel } from '../../worker/timing/pipeline/fit-timing-model';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { builtinObservatories } from '../../worker/timing/earth/builtin-observatories';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let scenario: DemoPulsarData[];

beforeAll(() => {
  t = buildTestApp();
  scenario = buildDemoScenario();
});
afterAll(() => t.close());

async function userId(email: string): Promise<number> {
  return Number((await t.knex('users').where({ email }).first('id')).id);
}

async function pulsarId(name: string): Promise<number> {
  const row = await t.knex('pulsars').where({ name }).first('id');
  expect(row, `pulsar ${name}`).toBeTruthy();
  return Number(row.id);
}

async function countRows(table: string, where: Record<string, unknown>): Promise<number> {
  return Number((await t.knex(table).where(where).count({ n: '*' }))[0].n);
}

describe('demo seed: timing scenario', () => {
  it('running seedDemo twice stores each demo file once, with the built TOA counts, uploaded by the observer', async () => {
    const first = await seedDemo(t.knex);
    const second = await seedDemo(t.knex);
    expect(second).toEqual(first);
    const observer = await userId('observer@pulsekeeper.test');
    for (const p of scenario) {
      const id = await pulsarId(p.name);
      const batches = await t.knex('toa_batches').where({ pulsar_id: id }).orderBy('id').select('file_name', 'row_count', 'checksum_sha256', 'uploaded_by');
      expect(batches.map((b) => b.file_name).sort()).toEqual(p.batches.map((b) => b.fileName).sort());
      for (const built of p.batches) {
        const stored = batches.find((b) => b.file_name === built.fileName)!;
        expect(stored.checksum_sha256).toBe(createHash('sha256').update(built.csv).digest('hex'));
        expect(stored.row_count).toBe(built.rowCount);
        expect(stored.uploaded_by).toBe(observer);
      }
      const builtCount = p.batches.reduce((s, b) => s + b.rowCount, 0);
      expect(await countRows('toas', { pulsar_id: id })).toBe(builtCount);
      const pulsar = await t.knex('pulsars').where({ id }).first('toa_count', 'ra_hms', 'dec_dms');
      expect(pulsar).toMatchObject({ toa_count: builtCount, ra_hms: p.raHms, dec_dms: p.decDms });
    }
  });

  it('gives each demo pulsar exactly one starting revision, by the analyst, holding the starting model', async () => {
    await seedDemo(t.knex);
    const analyst = await userId('analyst@pulsekeeper.test');
    for (const p of scenario) {
      // Other tests in this database (the browser tests) add revisions of their own; the seed's are those with no parent.
      const revisions = await t.knex('model_revisions').where({ pulsar_id: await pulsarId(p.name) }).whereNull('parent_id').select('parent_id', 'author_id', 'message', 'model_json', 'released_at');
      expect(revisions).toHaveLength(1);
      expect(revisions[0]).toMatchObject({ parent_id: null, author_id: analyst, message: STARTING_REVISION_MESSAGE, released_at: null });
      expect(JSON.parse(revisions[0].model_json)).toEqual(p.startingModel);
      expect(JSON.parse(revisions[0].model_json)).not.toEqual(p.trueModel);
    }
  });

  it('fills in only what a pulsar lacks: its files and starting revision come back, the other pulsars are left alone', async () => {
    await seedDemo(t.knex);
    const target = scenario[3];
    const targetId = await pulsarId(target.name);
    const batchIdsOfOthers = async () => t.knex('toa_batches').whereNot({ pulsar_id: targetId }).whereIn('pulsar_id', t.knex('pulsars').whereIn('name', scenario.map((p) => p.name)).select('id')).orderBy('id').pluck('id');
    const before = await batchIdsOfOthers();
    await t.knex('toa_batches').where({ pulsar_id: targetId }).delete(); // its TOAs go with them (ON DELETE CASCADE)
    await t.knex('model_revisions').where({ pulsar_id: targetId }).delete();
    expect(await countRows('toas', { pulsar_id: targetId })).toBe(0);
    await seedDemo(t.knex);
    expect(await batchIdsOfOthers()).toEqual(before);
    const restored = await t.knex('toa_batches').where({ pulsar_id: targetId }).pluck('checksum_sha256');
    expect(restored.sort()).toEqual(target.batches.map((b) => createHash('sha256').update(b.csv).digest('hex')).sort());
    expect(await countRows('toas', { pulsar_id: targetId })).toBe(target.batches.reduce((s, b) => s + b.rowCount, 0));
    expect(await countRows('model_revisions', { pulsar_id: targetId })).toBe(1);
  });

  it('stores the simulated TOAs losslessly enough that the true model still fits them with reduced χ² ≈ 1', async () => {
    const observatories = new Map(builtinObservatories().map((o) => [o.code, o]));
    const p = scenario[1]; // the binary millisecond pulsar: 1 µs uncertainties, the most demanding
    const { toas } = await loadToasForFit(t.knex, await pulsarId(p.name));
    const fit = fitTimingModel(readModelFile({ ...p.trueModel, solve_for: [] }), toas, observatories);
    expect(fit.reducedChi2).toBeGreaterThan(0.7);
    expect(fit.reducedChi2).toBeLessThan(1.3);
  });
});

/**
 * A comparison of real fits: simulated TOAs stored through the upload service,
 * two revisions (spin only; spin and position) and a refit after excluding two
 * TOAs, all fitted by the real worker. Checks that the free-parameter count
 * agrees with the engine's dof, that the nested pair gets the F-test of the
 * hand formula, and that the exclusion is seen as a different TOA set.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { FitComparison } from '../../api/contracts/comparisons';
import { startWorker } from '../../worker/index';
import { createTestObservatory, demoModelJson, simulatedCsv, storeCsv } from '../worker/fit-run-fixtures';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser } from './helpers/factories';
import { buildTestApp, type TestApp } from './helpers/test-app';

const TOA_COUNT = 120;
const SPIN_ONLY = ['spin.frequency_hz', 'spin.frequency_derivatives[0]'];
const WITH_POSITION = [...SPIN_ONLY, 'astrometry.ra_hms', 'astrometry.dec_dms'];

let t: TestApp;
let worker: ReturnType<typeof startWorker>;
let analyst: Client;
let pulsar: { id: number; name: string };
let runSpin: number;
let runPosition: number;
let runFewerToas: number;

const post = (url: string, body: object) => analyst.agent.post(url).set('x-csrf-token', analyst.csrf).send(body);

async function fitToEnd(revisionId: number): Promise<number> {
  const queued = await post(`/api/pulsars/${pulsar.id}/fit-runs`, { revisionId });
  expect(queued.status, JSON.stringify(queued.body)).toBe(202);
  const id = queued.body.data.fitRun.id as number;
  const deadline = Date.now() + 90_000;
  for (;;) {
    const run = (await analyst.agent.get(`/api/fit-runs/${id}`).expect(200)).body.data;
    if (run.status === 'succeeded') return id;
    if (run.status === 'failed' || run.status === 'cancelled') throw new Error(`fit run ${id} ${run.status}: ${run.errorMessage}`);
    if (Date.now() > deadline) throw new Error(`fit run ${id} still ${run.status}`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}

async function revision(solveFor: string[], message: string): Promise<number> {
  const res = await post(`/api/pulsars/${pulsar.id}/revisions`, { model: { ...demoModelJson(pulsar.name), solve_for: solveFor }, message });
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.data.id as number;
}

beforeAll(async () => {
  t = buildTestApp();
  worker = startWorker(t.config);
  const a = await createUser(t.knex, 'analyst');
  analyst = await signedInClient(t.app, a.email, a.password);
  const observatory = await createTestObservatory(t.knex);
  pulsar = await createPulsarRow(t.knex);
  await storeCsv(t.knex, pulsar.id, simulatedCsv(demoModelJson(pulsar.name), observatory, TOA_COUNT, 11), a.id);
  const spinRevision = await revision(SPIN_ONLY, 'spin only');
  runSpin = await fitToEnd(spinRevision);
  runPosition = await fitToEnd(await revision(WITH_POSITION, 'spin and position'));
  const toaIds = (await analyst.agent.get(`/api/pulsars/${pulsar.id}/toas`).expect(200)).body.data.id as number[];
  expect((await post(`/api/pulsars/${pulsar.id}/exclusions`, { toaIds: toaIds.slice(0, 2), reason: 'test exclusion' })).status).toBe(201);
  runFewerToas = await fitToEnd(spinRevision);
}, 300_000);

afterAll(async () => {
  await worker.close();
  await t.close();
});

async function comparison(ids: number[]): Promise<FitComparison> {
  const res = await analyst.agent.get(`/api/pulsars/${pulsar.id}/fit-comparison?runs=${ids.join(',')}`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return res.body.data as FitComparison;
}

describe('comparing real fits', () => {
  it('counts free parameters as the engine does (k = N − dof) and gives AIC, BIC and the F-test by hand formula', async () => {
    const c = await comparison([runSpin, runPosition]);
    expect(c).toMatchObject({ sameToas: true, sameSettings: true, statisticsComparable: true });
    for (const run of c.runs) {
      expect(run.toaCount).toBe(TOA_COUNT);
      expect(run.freeParameters.count).toBe(run.toaCount - run.dof);
      expect(run.aic).toBeCloseTo(run.chi2 + 2 * run.freeParameters.count, 9); // Akaike 1974
      expect(run.bic).toBeCloseTo(run.chi2 + run.freeParameters.count * Math.log(run.toaCount), 9); // Schwarz 1978
    }
    const [spin, position] = c.runs;
    expect(position.freeParameters.count - spin.freeParameters.count).toBe(2);
    expect(c.nestedTests).toHaveLength(1);
    const test = c.nestedTests[0];
    expect(test).toMatchObject({ smallerFitRunId: runSpin, largerFitRunId: runPosition, addedParameters: 2, dof: position.dof });
    const f = Math.max(0, (spin.chi2 - position.chi2) / 2) / (position.chi2 / position.dof); // Bevington & Robinson 2003, §11.4
    expect(test.statistic).toBeCloseTo(f, 9);
    const p = (1 + (2 * f) / position.dof) ** (-position.dof / 2); // P(F > f) for F(2, ν) in closed form (from memory)
    expect(p).toBeGreaterThan(1e-12); // a start at the truth: the two added parameters change χ² little
    expect(test.probability / p).toBeCloseTo(1, 8);
    expect(c.parameters.map((p) => p.path)).toEqual(WITH_POSITION);
    for (const p of c.parameters) for (const v of p.values) if (v?.free) expect(v.uncertainty).toBeGreaterThan(0);
  });

  it('sees the refit after an exclusion as another TOA set: no F-test, a warning naming the two TOAs', async () => {
    const c = await comparison([runSpin, runFewerToas]);
    expect(c).toMatchObject({ sameToas: false, statisticsComparable: false, nestedTests: [] });
    expect(c.runs[1]).toMatchObject({ toaCount: TOA_COUNT - 2, excludedCount: 2 });
    const warning = c.warnings.find((w) => w.code === 'toas-differ')!;
    expect(warning.message).toContain(`0 TOAs not in ${runSpin}, 2 of ${runSpin}'s left out`);
  });
});

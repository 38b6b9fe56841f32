/**
 * Residual store: writing and reading back the residuals of a 100 000-TOA fit
 * (one fit_residuals row of compressed columns, api/db/residual-columns.ts) on
 * the test profile's MariaDB — target: read back in < 300 ms. Also the time one
 * engine call of the fit job takes for 10 000 TOAs (the CPU the job moves into
 * a worker thread, so BullMQ's lock renewal is never blocked by it).
 *
 * Uses the running (or a started) test-profile services without resetting the
 * database; every row it writes belongs to one invented pulsar it deletes at the end.
 * Run: npx tsx -e "import('./scripts/bench/residual-store.ts').then(m=>m.bench())"
 */
import { randomBytes } from 'node:crypto';
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { loadavg } from 'node:os';
import knexFactory from 'knex';
import { decodeResidualColumns, encodeResidualColumns, type EncodedResidualColumns, type ResidualColumns } from '../../api/db/residual-columns';
import { knexConfig } from '../../knexfile';
import { runFitEngine } from '../../worker/jobs/fit-run-engine';
import { builtinObservatories } from '../../worker/timing/earth/builtin-observatories';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { simulateToas } from '../../worker/timing/simulate/simulate-toas';
import { parseMjd } from '../../worker/timing/time/mjd-string';
import { startServices } from '../services/services';

const N = 100_000;
const READ_TARGET_MS = 300;
const FIT_TOAS = 10_000;

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)];
}

/** Residual columns of an invented fit: a 20-year span, two backends, one site. */
function syntheticColumns(): ResidualColumns {
  const mjd: string[] = [];
  for (let i = 0; i < N; i++) mjd.push(`${51000 + Math.floor((i * 7305) / N)}.${String(1e17 + i * 7919).slice(1)}`);
  return {
    count: N,
    toaIds: Float64Array.from({ length: N }, (_, i) => 1_000_000 + i),
    mjd,
    residualUs: Float64Array.from({ length: N }, () => (Math.random() - 0.5) * 3),
    uncertaintyUs: Float64Array.from({ length: N }, (_, i) => (i % 2 === 0 ? 0.8 : 1.6)),
    frequencyMhz: Float64Array.from({ length: N }, (_, i) => (i % 2 === 0 ? 1400 : 820)),
    backend: Array.from({ length: N }, (_, i) => (i % 2 === 0 ? 'wideband-1' : 'narrow-2')),
    observatory: Array.from({ length: N }, () => 'harrow-ridge'),
  };
}

async function benchStore(): Promise<void> {
  const services = await startServices({ profile: 'test' });
  const knex = knexFactory(knexConfig(services.config));
  const name = `bench-${randomBytes(4).toString('hex')}`;
  try {
    const [pulsarId] = await knex('pulsars').insert({ name, ra_hms: '00:00:00', dec_dms: '+00:00:00' });
    const [revisionId] = await knex('model_revisions').insert({ pulsar_id: pulsarId, message: 'bench', model_json: '{}' });
    const [fitRunId] = await knex('fit_runs').insert({ pulsar_id: pulsarId, revision_id: revisionId, inputs_hash: '0'.repeat(64), settings: '{}', status: 'running' });

    const columns = syntheticColumns();
    const encodeStart = performance.now();
    const encoded = encodeResidualColumns(columns);
    const encodeMs = performance.now() - encodeStart;
    const bytes = Object.values(encoded).reduce<number>((sum, v) => sum + (Buffer.isBuffer(v) ? v.length : 0), 0);

    const writeTimes: number[] = [];
    const readTimes: number[] = [];
    const queryTimes: number[] = [];
    for (let k = 0; k < 5; k++) {
      let start = performance.now();
      await knex.transaction(async (trx) => {
        await trx('fit_residuals').where({ fit_run_id: fitRunId }).del();
        await trx('fit_residuals').insert({ fit_run_id: fitRunId, ...encoded });
      });
      writeTimes.push(performance.now() - start);

      start = performance.now();
      const row = (await knex('fit_residuals').where({ fit_run_id: fitRunId }).first()) as EncodedResidualColumns;
      queryTimes.push(performance.now() - start);
      const decoded = decodeResidualColumns(row);
      readTimes.push(performance.now() - start);
      if (decoded.count !== N || decoded.residualUs[N - 1] !== columns.residualUs[N - 1] || decoded.mjd[N - 1] !== columns.mjd[N - 1]) {
        throw new Error('residual store: read-back differs from what was written');
      }
    }
    const readMs = median(readTimes);
    const rawBytes = N * 8 * 4 + Buffer.byteLength(columns.mjd.join('\n')) + N * 4 * 2; // 4 float64 columns, MJD text, 2 label index columns
    console.log(`residuals of ${N} TOAs: ${(bytes / 1e6).toFixed(2)} MB compressed (${(rawBytes / 1e6).toFixed(2)} MB raw)`);
    console.log(`  encode ${encodeMs.toFixed(0)} ms; write (delete + insert, one transaction) median ${median(writeTimes).toFixed(0)} ms`);
    console.log(`  read back (SELECT ${median(queryTimes).toFixed(0)} ms + decode) median ${readMs.toFixed(0)} ms — target < ${READ_TARGET_MS} ms (${(readMs / READ_TARGET_MS).toFixed(2)} of target)`);
  } finally {
    await knex('pulsars').where({ name }).del(); // cascades to the revision, run and residuals
    await knex.destroy();
    await services.stop();
  }
}

function benchFitEngine(): void {
  const modelJson = JSON.parse(readFileSync(path.join(import.meta.dirname, '../../tests/fixtures/cli/demo-model.json'), 'utf8')) as Record<string, unknown>;
  const observatories = builtinObservatories();
  const { toas } = simulateToas(
    readModelFile(modelJson),
    { startMjd: parseMjd('58200'), endMjd: parseMjd('59400'), count: FIT_TOAS, observatory: 'harrow-ridge', uncertaintyUs: 1.5, seed: 3 },
    new Map(observatories.map((o) => [o.code, o])),
  );
  const start = performance.now();
  let iterations = 0;
  runFitEngine({ modelJson: { ...modelJson, spin: { ...(modelJson.spin as object), frequency_hz: '218.8118472401' } }, toas, observatories }, {
    onStage: () => {},
    onIteration: () => void (iterations += 1),
  });
  const fitMs = performance.now() - start;
  console.log(`fit-run engine call, ${FIT_TOAS} TOAs × 5 parameters: ${fitMs.toFixed(0)} ms (${iterations} iterations), run in a worker thread by the job`);
}

export async function bench(): Promise<void> {
  console.log(`load average ${loadavg().map((x) => x.toFixed(1)).join(' ')}`);
  await benchStore();
  benchFitEngine();
}

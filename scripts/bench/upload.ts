/**
 * Speed of storing an uploaded arrival-time file: 100 000 rows through
 * storeToaBatch (engine validation, then the batch, the TOAs in multi-row
 * INSERTs and the pulsar statistics in one transaction), target < 5 s, with
 * several INSERT sizes compared (the default is TOA_INSERT_CHUNK_ROWS); then reading the 100 000 TOAs back as columns.
 * Uses the dev profile's MariaDB (started if needed, never reset: test runs
 * reset the test database when they start) and a
 * throwaway pulsar and observatory, deleted afterwards.
 *
 * Run: npx tsx -e "import('./scripts/bench/upload.ts').then(m=>m.bench())"
 */
import { cpus, loadavg } from 'node:os';
import { randomBytes } from 'node:crypto';
import { loadConfig } from '../../api/config';
import { createKnex } from '../../api/db/create-knex';
import { listToas } from '../../api/services/toas/list-toas';
import { storeToaBatch, TOA_INSERT_CHUNK_ROWS, type StoreTimings } from '../../api/services/toas/store-toa-batch';
import { startServices } from '../services/services';

const ROWS = 100_000;
const TARGET_STORE_S = 5;
// The default first: later runs follow a 100 000-row DELETE whose InnoDB purge still runs in the background.
const CHUNK_SIZES = [TOA_INSERT_CHUNK_ROWS, 500, 5_000, 20_000];
const PAUSE_AFTER_DELETE_MS = 3_000;

/** An invented file: daily-ish TOAs with 18 fractional digits, two backends, a label column. */
function benchFile(observatory: string): Uint8Array {
  const lines = ['mjd,uncertainty_us,frequency_mhz,observatory,backend,session'];
  for (let i = 0; i < ROWS; i++) {
    const day = 50_000 + Math.floor(i / 10);
    const fraction = String((i * 7_919_993) % 1_000_000_000).padStart(9, '0');
    lines.push(`${day}.${fraction}123456789,${(0.3 + (i % 11) * 0.1).toFixed(2)},${1300 + (i % 5) * 50},${observatory},${i % 2 ? 'wide-b' : 'wide-a'},s${i % 97}`);
  }
  return new TextEncoder().encode(`${lines.join('\n')}\n`);
}

export async function bench(): Promise<void> {
  const services = await startServices({ profile: 'dev' });
  Object.assign(process.env, services.env);
  const knex = createKnex(loadConfig());
  const suffix = randomBytes(4).toString('hex');
  const observatory = `bench-${suffix}`;
  let pulsarId: number | null = null;
  try {
    await knex('observatories').insert({ code: observatory, name: 'Bench site (invented)', itrf_x_m: 4_000_000, itrf_y_m: 1_000_000, itrf_z_m: 4_800_000 });
    [pulsarId] = await knex('pulsars').insert({ name: `BENCH-${suffix}`, ra_hms: '01:00:00', dec_dms: '+01:00:00' });
    const bytes = benchFile(observatory);
    console.log(`${ROWS} rows, ${(bytes.length / 1e6).toFixed(1)} MB; cpus ${cpus().length}, load ${loadavg().map((x) => x.toFixed(1)).join(' ')}`);
    for (const chunkRows of CHUNK_SIZES) {
      const timings: StoreTimings = { parseMs: 0, storeMs: 0 };
      const start = performance.now();
      await storeToaBatch(knex, { pulsarId: pulsarId as number, fileName: 'bench.csv', uploadedBy: null, bytes, confirmDuplicate: true, insertChunkRows: chunkRows }, timings);
      const totalS = (performance.now() - start) / 1000;
      console.log(
        `  ${String(chunkRows).padStart(6)} rows/INSERT${chunkRows === TOA_INSERT_CHUNK_ROWS ? ' (default)' : ''}: parse ${(timings.parseMs / 1000).toFixed(2)} s, ` +
          `store ${(timings.storeMs / 1000).toFixed(2)} s (inserts ${((timings.insertMs ?? 0) / 1000).toFixed(2)}, statistics ${((timings.statisticsMs ?? 0) / 1000).toFixed(2)}), ` +
          `total ${totalS.toFixed(2)} s = ${Math.round(ROWS / totalS)} rows/s; ${(totalS / TARGET_STORE_S).toFixed(2)} × the ${TARGET_STORE_S} s target`,
      );
      await knex('toas').where({ pulsar_id: pulsarId }).delete();
      await knex('toa_batches').where({ pulsar_id: pulsarId }).delete();
      await new Promise((r) => setTimeout(r, PAUSE_AFTER_DELETE_MS));
    }
    await storeToaBatch(knex, { pulsarId: pulsarId as number, fileName: 'bench.csv', uploadedBy: null, bytes, confirmDuplicate: true });
    const readStart = performance.now();
    const columns = await listToas(knex, pulsarId as number);
    console.log(`  read back ${columns.count} TOAs as columns: ${((performance.now() - readStart) / 1000).toFixed(2)} s`);
  } finally {
    if (pulsarId !== null) await knex('pulsars').where({ id: pulsarId }).delete(); // cascades to batches and TOAs
    await knex('observatories').where({ code: observatory }).delete();
    await knex.destroy();
    await services.stop();
  }
}

/**
 * Speed of the arrival geometry (clock → UTC → TAI → TT → TDB, DE405 Earth,
 * Sun and Jupiter, GCRS site vector): 100 000 TOAs at one invented observatory
 * spread over 20 years, target < 2 s on the project's 2-core machine.
 *
 * Run: npx tsx -e "import('./scripts/bench/barycentre.ts').then(m=>m.bench())"
 */
import { loadavg } from 'node:os';
import { computeArrivalGeometry } from '../../worker/timing/pipeline/compute-arrival-geometry';
import { loadDe405 } from '../../worker/timing/ephemeris/de405-ephemeris';
import type { Observatory } from '../../worker/timing/earth/observatory';
import { mjdFromParts } from '../../worker/timing/time/mjd-arithmetic';

const TOA_COUNT = 100_000;
const SPAN_DAYS = 20 * 365.25;
const FIRST_MJD = 52000;
const TARGET_S = 2;

/** An invented site (|r| ≈ 6371 km) with a clock table of one point per 30 days. */
function benchObservatory(): Observatory {
  const clockCorrections = [];
  for (let d = FIRST_MJD - 30; d <= FIRST_MJD + SPAN_DAYS + 30; d += 30) {
    clockCorrections.push({ mjd: mjdFromParts(d, 0), correctionUs: 0.5 * Math.sin(d / 200) });
  }
  return { code: 'bench-site', name: 'Bench site (invented)', itrfXM: 3_950_000, itrfYM: 1_320_000, itrfZM: 4_820_000, clockCorrections };
}

export async function bench(): Promise<void> {
  const loadStart = performance.now();
  const ephemeris = loadDe405();
  const loadS = (performance.now() - loadStart) / 1000;
  const observatory = benchObservatory();
  const observatories = new Map([[observatory.code, observatory]]);
  const toas = Array.from({ length: TOA_COUNT }, (_, i) => {
    const mjd = FIRST_MJD + (i * SPAN_DAYS) / TOA_COUNT + 0.37 * Math.sin(i); // irregular times of day
    const day = Math.floor(mjd);
    return { row: i + 1, mjd: mjdFromParts(day, mjd - day), observatory: observatory.code };
  });
  // Cold: the first call in the process fills the ERFA grids (TDB−TT, precession–nutation).
  let start = performance.now();
  const cpuStart = process.cpuUsage();
  const geometry = computeArrivalGeometry(toas, observatories, { ephemeris });
  const coldS = (performance.now() - start) / 1000;
  const cpu = process.cpuUsage(cpuStart);
  const coldCpuS = (cpu.user + cpu.system) / 1e6; // CPU time: less sensitive than wall time to other jobs on the machine
  // Warm: the same TOAs again, grids already filled (e.g. a second pulsar at the same site and epoch range).
  start = performance.now();
  computeArrivalGeometry(toas, observatories, { ephemeris });
  const warmS = (performance.now() - start) / 1000;
  console.log(`load average while measuring: ${loadavg().map((v) => v.toFixed(2)).join(' ')} (2 cores; wall times grow with other jobs)`);
  console.log(`DE405 load (casacore table, once per process): ${loadS.toFixed(2)} s`);
  console.log(`barycentre ${TOA_COUNT} TOAs: ${coldS.toFixed(2)} s (target < ${TARGET_S} s, ratio ${(coldS / TARGET_S).toFixed(2)})`);
  console.log(`barycentre ${TOA_COUNT} TOAs, CPU time of that call: ${coldCpuS.toFixed(2)} s`);
  console.log(`barycentre ${TOA_COUNT} TOAs, ERFA grids already filled: ${warmS.toFixed(2)} s (target < ${TARGET_S} s, ratio ${(warmS / TARGET_S).toFixed(2)})`);
  if (geometry.count !== TOA_COUNT) throw new Error('bench: wrong geometry count');
}

/**
 * Everything about a TOA set that does not depend on the pulsar's model,
 * flattened into typed arrays once (after the arrival geometry is computed)
 * so that every fit iteration runs without per-TOA objects.
 */
import type { ArrivalGeometry } from './arrival-geometry';
import type { Toa } from '../toas/toa';
import type { Mjd } from '../time/epoch';
import type { BackendNoise } from '../model/timing-model';
import { mjdDiffDays } from '../time/mjd-arithmetic';
import { TimingInputError } from '../engine-error';

export interface PreparedArrivals {
  count: number;
  geometry: ArrivalGeometry;
  /** The epoch the day counts below are measured from (the model epoch, TDB). */
  epochMjd: Mjd;
  /** Observatory TDB arrival − epoch, days, double-double: hi + lo. */
  tdbDaysHi: Float64Array;
  tdbDaysLo: Float64Array;
  frequencyMhz: Float64Array; // at the observatory; Infinity for `inf`
  uncertaintyUs: Float64Array; // as in the file
  /** Pulse numbers (NaN where a row has none) and whether every row has one. */
  pulseNumber: Float64Array;
  everyRowHasPulseNumber: boolean;
  backendIndex: Int32Array;
  backends: string[];
  /** 1 for barycentric (`ssb`) rows: no solar-system Shapiro delay applies there. */
  atBarycentre: Uint8Array;
  rows: Int32Array;
}

/**
 * Flattens TOAs and their arrival geometry.
 *
 * @param toas      the arrivals, in the same order as the geometry
 * @param geometry  computeArrivalGeometry(toas, …)
 * @param epochMjd  the model epoch (TDB) the day counts start from
 * Throws TimingInputError when the geometry does not match the TOAs.
 */
export function prepareArrivals(toas: readonly Toa[], geometry: ArrivalGeometry, epochMjd: Mjd): PreparedArrivals {
  const n = toas.length;
  if (geometry.count !== n || geometry.tdb.length !== n) {
    throw new TimingInputError(`arrival geometry has ${geometry.count} entries for ${n} TOAs`);
  }
  const prepared: PreparedArrivals = {
    count: n,
    geometry,
    epochMjd,
    tdbDaysHi: new Float64Array(n),
    tdbDaysLo: new Float64Array(n),
    frequencyMhz: new Float64Array(n),
    uncertaintyUs: new Float64Array(n),
    pulseNumber: new Float64Array(n),
    everyRowHasPulseNumber: n > 0,
    backendIndex: new Int32Array(n),
    backends: [],
    atBarycentre: new Uint8Array(n),
    rows: new Int32Array(n),
  };
  const backendIndexByName = new Map<string, number>();
  for (let i = 0; i < n; i += 1) {
    const toa = toas[i];
    const days = mjdDiffDays(geometry.tdb[i], epochMjd); // days first, then fractions
    prepared.tdbDaysHi[i] = days[1];
    prepared.tdbDaysLo[i] = days[0];
    prepared.frequencyMhz[i] = toa.frequencyMhz;
    prepared.uncertaintyUs[i] = toa.uncertaintyUs;
    prepared.pulseNumber[i] = toa.pulseNumber ?? Number.NaN;
    if (toa.pulseNumber === null) prepared.everyRowHasPulseNumber = false;
    let index = backendIndexByName.get(toa.backend);
    if (index === undefined) {
      index = prepared.backends.length;
      backendIndexByName.set(toa.backend, index);
      prepared.backends.push(toa.backend);
    }
    prepared.backendIndex[i] = index;
    prepared.atBarycentre[i] = toa.observatory === 'ssb' ? 1 : 0;
    prepared.rows[i] = toa.row;
  }
  return prepared;
}

/**
 * Effective 1σ uncertainty per TOA in seconds: √((scale·σ)² + jitter²) with the backend's noise
 * settings (docs/formats.md §2; backends without settings: scale 1, jitter 0).
 */
export function effectiveUncertaintiesS(prepared: PreparedArrivals, noise: readonly BackendNoise[]): Float64Array {
  const scale = new Float64Array(prepared.backends.length).fill(1);
  const jitterUs = new Float64Array(prepared.backends.length);
  prepared.backends.forEach((backend, b) => {
    const setting = noise.find((x) => x.backend === backend);
    if (setting !== undefined) {
      scale[b] = setting.uncertaintyScale;
      jitterUs[b] = setting.addedJitterUs;
    }
  });
  const out = new Float64Array(prepared.count);
  for (let i = 0; i < prepared.count; i += 1) {
    const b = prepared.backendIndex[i];
    const scaled = scale[b] * prepared.uncertaintyUs[i];
    out[i] = Math.sqrt(scaled * scaled + jitterUs[b] * jitterUs[b]) * 1e-6; // docs/formats.md §2 noise rule
  }
  return out;
}

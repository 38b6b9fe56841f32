/**
 * JPL DE405 read from Debian's casacore table (casacore-data-jpl-de405) and
 * evaluated from its Chebyshev coefficients.
 *
 * Notes:
 * 1. Each table row holds the 32-day record that starts at that row's `MJD`
 *    (TDB); a body's record part is split into equal sub-intervals, each with
 *    Chebyshev series for x, y and z (km; Standish 1998, JPL IOM 312.F-98-048).
 * 2. The time argument is formed as (day − rowStart) + fraction, so the large
 *    day number never meets the fraction in one float64: τ keeps ~1e-16 of a
 *    sub-interval (≤ 1 ns of time, ≤ 0.03 mm of Earth motion).
 * 3. Earth = EMB − Moon/(1 + EMRAT) and Moon(SSB) = Earth + Moon(geocentric),
 *    since DE405 lists the Moon relative to the geocentre (Standish 1998).
 * 4. Loading checks the layout: row count, row start dates against the
 *    keywords MJD0 + dMJD·(row + 1) and dMJD = 32 days.
 * Accuracy: as DE405 itself (Standish 1998: inner planets ~ km, Moon ~ m) plus
 * Chebyshev rounding ~1e-16 relative; jumps at record boundaries are ~mm
 * (tests/engine/ephemeris/de405-ephemeris.test.ts).
 */
import type { Mjd } from '../time/epoch';
import { readCasacoreChebyshevTable } from './casacore-table-reader';
import { chebyshevValueAndDerivative } from './chebyshev';
import {
  DE405_BODY_INDEX,
  DE405_COEFFICIENTS_PER_ROW,
  DE405_DAYS_PER_ROW,
  de405BodyLayout,
  type BodyLayout,
} from './de405-record-layout';
import type { BodyState, SolarSystemBody, SolarSystemEphemeris } from './solar-system-ephemeris';

export const DE405_DEBIAN_DIRECTORY = '/usr/share/casacore/data/ephemerides/DE405';
const SECONDS_PER_DAY = 86_400;

const cache = new Map<string, SolarSystemEphemeris>();

/**
 * The DE405 ephemeris from a casacore table directory, read once per process
 * and then served from memory (~9 MB of Float64Array).
 * Throws Error when the table's layout is not the expected one (Note 4).
 */
export function loadDe405(directory = DE405_DEBIAN_DIRECTORY): SolarSystemEphemeris {
  const cached = cache.get(directory);
  if (cached !== undefined) return cached;
  const ephemeris = buildDe405(directory);
  cache.set(directory, ephemeris);
  return ephemeris;
}

function buildDe405(directory: string): SolarSystemEphemeris {
  const table = readCasacoreChebyshevTable(directory, DE405_COEFFICIENTS_PER_ROW);
  const { keywords, rowCount } = table.header;
  const numberKeyword = (name: string): number => {
    const value = keywords[name];
    if (typeof value !== 'number') throw new Error(`DE405 table ${directory}: keyword ${name} missing or not a number`);
    return value;
  };
  const mjd0 = numberKeyword('MJD0');
  const daysPerRow = numberKeyword('dMJD');
  if (daysPerRow !== DE405_DAYS_PER_ROW) throw new Error(`DE405 table ${directory}: dMJD = ${daysPerRow}, expected 32`);
  for (let r = 0; r < rowCount; r++) {
    if (table.rowStartMjd[r] !== mjd0 + daysPerRow * (r + 1)) {
      throw new Error(`DE405 table ${directory}: row ${r} starts at MJD ${table.rowStartMjd[r]}, expected MJD0 + dMJD·(row+1) = ${mjd0 + daysPerRow * (r + 1)}`);
    }
  }
  const constants: Record<string, number> = {};
  for (const [name, value] of Object.entries(keywords)) if (typeof value === 'number') constants[name] = value;
  const emrat = numberKeyword('EMRAT');
  const firstMjd = table.rowStartMjd[0];
  const lastMjd = firstMjd + rowCount * DE405_DAYS_PER_ROW;
  const info = { name: 'DE405', firstMjdTdb: firstMjd, lastMjdTdb: lastMjd, source: `casacore table ${directory}` };
  const layouts = new Map<number, BodyLayout>();
  const layoutOf = (index: number): BodyLayout => {
    let layout = layouts.get(index);
    if (layout === undefined) layouts.set(index, (layout = de405BodyLayout(index)));
    return layout;
  };
  const scratch = new Float64Array(2);

  /** Raw table body (EMB, Moon geocentric, planets, Sun): position km and velocity km/s into out[0..5]. */
  const rawState = (index: number, tdb: Mjd, out: Float64Array): void => {
    const layout = layoutOf(index);
    const daysFromFirst = tdb.day - firstMjd + tdb.frac[1] + tdb.frac[0];
    let row = Math.floor(daysFromFirst / DE405_DAYS_PER_ROW);
    if (!(daysFromFirst >= 0 && row <= rowCount)) throw outOfRange(tdb);
    if (row === rowCount) {
      if (daysFromFirst > rowCount * DE405_DAYS_PER_ROW) throw outOfRange(tdb);
      row = rowCount - 1; // the very end of the last record
    }
    // Note 2: integer day difference first, then the fraction.
    const daysIntoRow = tdb.day - table.rowStartMjd[row] + tdb.frac[1] + tdb.frac[0];
    const subDays = DE405_DAYS_PER_ROW / layout.subIntervals;
    const sub = Math.min(layout.subIntervals - 1, Math.max(0, Math.floor(daysIntoRow / subDays)));
    const tau = (2 * (daysIntoRow - sub * subDays)) / subDays - 1;
    const n = layout.coefficientsPerComponent;
    const base = row * DE405_COEFFICIENTS_PER_ROW + (layout.recordOffset - 3) + sub * 3 * n;
    const kmPerSPerUnitTau = 2 / (subDays * SECONDS_PER_DAY); // dτ/dt
    for (let axis = 0; axis < 3; axis++) {
      chebyshevValueAndDerivative(table.coefficients, base + axis * n, n, tau, scratch);
      out[axis] = scratch[0];
      out[3 + axis] = scratch[1] * kmPerSPerUnitTau;
    }
  };
  const outOfRange = (tdb: Mjd): RangeError =>
    new RangeError(`DE405: TDB MJD ${tdb.day + tdb.frac[1]} is outside the ephemeris range MJD ${firstMjd}–${lastMjd}`);

  const emb = new Float64Array(6);
  const moon = new Float64Array(6);
  const body = new Float64Array(6);
  const stateInto = (name: SolarSystemBody, tdb: Mjd, out: Float64Array): void => {
    if (name === 'earth' || name === 'moon') {
      rawState(DE405_BODY_INDEX['earth-moon-barycentre'], tdb, emb);
      rawState(DE405_BODY_INDEX['moon-geocentric'], tdb, moon);
      for (let k = 0; k < 6; k++) {
        const earth = emb[k] - moon[k] / (1 + emrat); // Note 3 (Standish 1998)
        out[k] = name === 'earth' ? earth : earth + moon[k];
      }
    } else {
      const index = name === 'earth-moon-barycentre' ? DE405_BODY_INDEX['earth-moon-barycentre'] : DE405_BODY_INDEX[name];
      if (index === undefined) throw new RangeError(`DE405: unknown body "${String(name)}"`);
      rawState(index, tdb, out);
    }
  };
  const state = (name: SolarSystemBody, tdb: Mjd): BodyState => {
    stateInto(name, tdb, body);
    return { positionKm: [body[0], body[1], body[2]], velocityKmPerS: [body[3], body[4], body[5]] };
  };
  return { info, constants, state, stateInto };
}

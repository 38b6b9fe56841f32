/**
 * Arrival times the engine cannot reduce because they fall outside the
 * solar-system ephemeris (DE405, the engine's only one). Compared on day
 * numbers with a one-day margin at each end, which covers the difference
 * between the file's time scale (observatory UTC, TT or TDB) and TDB (about
 * 70 s) without evaluating any geometry.
 */
import { loadDe405 } from '../../../worker/timing/ephemeris/de405-ephemeris';
import type { ToaFileError } from '../../../worker/timing/toas/read-toa-csv';
import type { Toa } from '../../../worker/timing/toas/toa';

export interface EphemerisDayRange {
  name: string;
  firstDay: number; // first whole MJD day accepted
  lastDay: number; // last whole MJD day accepted (the whole day lies inside the range)
}

let cached: EphemerisDayRange | undefined;

/** DE405's range less one day at each end (read once per process: ~60 ms). */
export function ephemerisDayRange(): EphemerisDayRange {
  if (cached) return cached;
  const { info } = loadDe405();
  cached = { name: info.name, firstDay: Math.ceil(info.firstMjdTdb) + 1, lastDay: Math.floor(info.lastMjdTdb) - 2 };
  return cached;
}

/**
 * One error per arrival time outside the accepted days.
 *
 * @param toas       rows as read by readToaCsv
 * @param maxErrors  how many to list (all are counted)
 * @returns          `{ errors, count }` with errors on column `mjd`
 */
export function ephemerisRangeErrors(toas: readonly Toa[], maxErrors: number): { errors: ToaFileError[]; count: number } {
  const range = ephemerisDayRange();
  const errors: ToaFileError[] = [];
  let count = 0;
  for (const toa of toas) {
    if (toa.mjd.day >= range.firstDay && toa.mjd.day <= range.lastDay) continue;
    count += 1;
    if (errors.length < maxErrors) {
      const text = toa.mjdText ?? String(toa.mjd.day);
      errors.push({
        line: toa.line,
        column: 'mjd',
        message: `MJD ${text} is outside the ${range.name} ephemeris range (accepted: MJD ${range.firstDay} to ${range.lastDay + 1})`,
      });
    }
  }
  return { errors, count };
}

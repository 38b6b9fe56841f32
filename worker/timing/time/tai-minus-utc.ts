/**
 * TAI − UTC (the accumulated leap seconds, and before 1972 the drifting
 * offsets) at a UTC instant, from ERFA's eraDat.
 *
 * How a UTC MJD is read (Note 1 of taiMinusUtc): the fraction of the day is
 * seconds-of-day / 86 400, the common practice for arrival-time stamps. A day
 * that ends with a positive leap second has 86 401 SI seconds, and TAI − UTC
 * steps by one second at the following midnight, so TT(next 00:00) − TT(23:59:59)
 * = 2 s as it must be. The one approximation: an arrival inside the leap second
 * itself (23:59:60.x) cannot be written as such a fraction; written as the next
 * day's first second it is read one second late (TAI one second too large). Such
 * days are flagged (`leapSecondAtEndOfDay`) so the caller can warn.
 */
import { erfaLibrary } from '../erfa/erfa-library';
import type { Mjd } from './epoch';

const MJD_1972_JANUARY_1 = 41317; // start of integral leap seconds (IERS); before it TAI−UTC drifts within a day
const MJD_ZERO_AS_JD = 2400000.5;
const FIRST_UTC_YEAR = 1960; // eraDat returns status 1 (not an error) for earlier years too, so reject them here

export interface TaiMinusUtc {
  seconds: number;
  /** ERFA status 1: the date is beyond ERFA's leap-second knowledge (a later leap second may be missing). */
  dubiousYear: boolean;
  /** The UTC day of this instant ends with a leap second (Note 1 of the module). */
  leapSecondAtEndOfDay: boolean;
}

interface DayEntry {
  iy: number;
  im: number;
  id: number;
  startSeconds: number;
  dubiousYear: boolean;
  leapSecondAtEndOfDay: boolean;
}

const dayCache = new Map<number, DayEntry>();
const out = new Float64Array(1);
const iyOut = new Int32Array(1);
const imOut = new Int32Array(1);
const idOut = new Int32Array(1);
const fdOut = new Float64Array(1);

function datAt(iy: number, im: number, id: number, fd: number, mjdDay: number): { seconds: number; status: number } {
  if (iy < FIRST_UTC_YEAR) {
    throw new RangeError(`taiMinusUtc: UTC MJD ${mjdDay} (${iy}-${im}-${id}) is before UTC began (1960); no TAI−UTC`);
  }
  const status = erfaLibrary().eraDat(iy, im, id, fd, out);
  if (status < 0) {
    throw new RangeError(`taiMinusUtc: UTC MJD ${mjdDay} (${iy}-${im}-${id}) has no TAI−UTC in ERFA (eraDat status ${status}; UTC starts in 1960)`);
  }
  return { seconds: out[0], status };
}

function calendarDate(mjdDay: number): [number, number, number] {
  const status = erfaLibrary().eraJd2cal(MJD_ZERO_AS_JD, mjdDay, iyOut, imOut, idOut, fdOut);
  if (status !== 0) throw new RangeError(`taiMinusUtc: MJD ${mjdDay} is outside ERFA's calendar range`);
  return [iyOut[0], imOut[0], idOut[0]];
}

function dayEntry(mjdDay: number): DayEntry {
  let entry = dayCache.get(mjdDay);
  if (entry !== undefined) return entry;
  const [iy, im, id] = calendarDate(mjdDay);
  const start = datAt(iy, im, id, 0, mjdDay);
  const [ny, nm, nd] = calendarDate(mjdDay + 1);
  const next = datAt(ny, nm, nd, 0, mjdDay + 1);
  entry = {
    iy,
    im,
    id,
    startSeconds: start.seconds,
    dubiousYear: start.status === 1,
    leapSecondAtEndOfDay: mjdDay >= MJD_1972_JANUARY_1 && next.seconds !== start.seconds,
  };
  dayCache.set(mjdDay, entry);
  return entry;
}

/**
 * TAI − UTC at a UTC instant.
 *
 * @param utc  instant in UTC; fraction = seconds of day / 86 400 (module Note 1)
 * @returns    seconds, ERFA's dubious-year flag and the leap-second-day flag
 *
 * Notes: 1. From 1972 TAI − UTC is constant through each UTC day and taken at 0h
 *           (cached per day). Before 1972 eraDat's drift formula is evaluated at
 *           the fraction of the day.
 * Accuracy: exact (integral seconds) from 1972; pre-1972 as ERFA's table (~µs).
 * References: IERS Bulletin C (leap seconds); ERFA eraDat (github.com/liberfa/erfa, src/dat.c).
 * Throws RangeError before 1960 (no UTC).
 */
export function taiMinusUtc(utc: Mjd): TaiMinusUtc {
  const entry = dayEntry(utc.day);
  if (utc.day >= MJD_1972_JANUARY_1) {
    return { seconds: entry.startSeconds, dubiousYear: entry.dubiousYear, leapSecondAtEndOfDay: entry.leapSecondAtEndOfDay };
  }
  const fraction = Math.min(1, Math.max(0, utc.frac[1] + utc.frac[0]));
  const drift = datAt(entry.iy, entry.im, entry.id, fraction, utc.day);
  return { seconds: drift.seconds, dubiousYear: drift.status === 1, leapSecondAtEndOfDay: false };
}

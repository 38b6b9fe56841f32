/**
 * Arithmetic on `Mjd` values (integer day + double-double fraction) that never
 * passes an instant through a single float64.
 *
 * Normal form (Note 1 of every routine here): `day` is an integer and the exact
 * value hi + lo of `frac` satisfies 0 ≤ hi + lo < 1. In the rare case where the
 * fraction lies within half an ulp below one, hi is exactly 1 and lo is
 * negative; the value is still below one day and no digits are lost.
 */
import type { DoubleDouble, Mjd } from './epoch';
import { SECONDS_PER_DAY } from './epoch';
import {
  ddAdd,
  ddAddNumber,
  ddDivideByNumber,
  ddSignOf,
  ddSub,
  ddTimesNumber,
  ddToNumber,
  toDoubleDouble,
} from './double-double-typed';

/**
 * An `Mjd` in normal form from a day number and a fraction of a day.
 *
 * @param day   MJD day; any finite number (a non-integer part moves into the fraction)
 * @param frac  fraction of a day, any finite value (it may be negative or ≥ 1)
 * @returns     the same instant with integer `day` and 0 ≤ frac < 1 (module Note 1)
 * Throws RangeError when either part is not finite.
 */
export function mjdFromParts(day: number, frac: number | DoubleDouble): Mjd {
  const fracDd = toDoubleDouble(frac);
  if (!Number.isFinite(day) || !Number.isFinite(fracDd[0]) || !Number.isFinite(fracDd[1])) {
    throw new RangeError(`mjdFromParts: day ${day} and fraction ${String(frac)} must be finite`);
  }
  const dayInt = Math.floor(day);
  // day − floor(day) is exact for |day| < 2^52 (Sterbenz lemma), so nothing is lost here.
  let f = ddAddNumber(fracDd, day - dayInt);
  let d = dayInt;
  const whole = Math.floor(f[1]);
  if (whole !== 0) {
    d += whole;
    f = ddAddNumber(f, -whole);
  }
  if (ddSignOf(f) < 0) {
    d -= 1;
    f = ddAddNumber(f, 1);
  }
  if (f[1] >= 1 && f[0] >= 0) {
    d += 1;
    f = ddAddNumber(f, -1);
  }
  return { day: d + 0, frac: [f[0] + 0, f[1] + 0] }; // "+ 0" turns −0 into +0
}

/**
 * The instant `seconds` after `m`.
 *
 * @param m        an instant (time scale unchanged)
 * @param seconds  SI seconds of that time scale to add, number or double-double
 * @returns        normalised `Mjd`
 * Accuracy: the conversion to days is a double-double division (relative ~1e-32).
 */
export function mjdAddSeconds(m: Mjd, seconds: number | DoubleDouble): Mjd {
  const days = ddDivideByNumber(toDoubleDouble(seconds), SECONDS_PER_DAY);
  return mjdAddDays(m, days);
}

/**
 * The instant `days` days after `m`.
 *
 * @param m     an instant
 * @param days  days to add, number or double-double; the integer part goes to `day` exactly
 */
export function mjdAddDays(m: Mjd, days: number | DoubleDouble): Mjd {
  const daysDd = toDoubleDouble(days);
  const wholeDays = Math.trunc(daysDd[1]);
  const rest = ddAddNumber(daysDd, -wholeDays);
  return mjdFromParts(m.day + wholeDays, ddAdd(m.frac, rest));
}

/**
 * a − b in days: day numbers differenced first (exact integers), then fractions.
 */
export function mjdDiffDays(a: Mjd, b: Mjd): DoubleDouble {
  return ddAddNumber(ddSub(a.frac, b.frac), a.day - b.day);
}

/**
 * a − b in seconds of the instants' common time scale (days first, then fractions).
 */
export function mjdDiffSeconds(a: Mjd, b: Mjd): DoubleDouble {
  return ddTimesNumber(mjdDiffDays(a, b), SECONDS_PER_DAY);
}

/**
 * The instant as one float64 MJD: ~1 µs resolution. For plot axes, grids and
 * interpolation lookups only — never for timing arithmetic.
 */
export function mjdToApproxNumber(m: Mjd): number {
  return m.day + ddToNumber(m.frac);
}

/** −1, 0 or +1 as a is before, equal to or after b. */
export function compareMjd(a: Mjd, b: Mjd): number {
  return ddSignOf(mjdDiffDays(a, b));
}

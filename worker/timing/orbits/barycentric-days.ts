/**
 * Barycentric times as days since a reference instant, held as double-double
 * in two parallel arrays. Companion orbits need only these (no geometry), so
 * they can be re-evaluated cheaply when only orbital parameters change.
 */
import type { DoubleDouble, Mjd } from '../time/epoch';
import { mjdDiffDays } from '../time/mjd-arithmetic';
import { ddDivideByNumber, ddSub } from '../time/double-double-typed';

export interface BarycentricDays {
  /** The instant the days count from (TDB). */
  reference: Mjd;
  /** Days since `reference`: value i = hi[i] + lo[i] exactly. */
  hi: Float64Array;
  lo: Float64Array;
}

/**
 * Days since `reference` for each barycentric TDB instant.
 *
 * @param times      barycentric arrival instants, TDB
 * @param reference  counting origin, TDB
 */
export function barycentricDaysFromMjd(times: readonly Mjd[], reference: Mjd): BarycentricDays {
  const hi = new Float64Array(times.length);
  const lo = new Float64Array(times.length);
  for (let i = 0; i < times.length; i += 1) {
    const d = mjdDiffDays(times[i], reference); // days first, then fractions
    hi[i] = d[1];
    lo[i] = d[0];
  }
  return { reference, hi, lo };
}

/** Orbits elapsed since an epoch: whole count and the fraction in [−½, ½), plus elapsed days. */
export interface OrbitCount {
  wholeOrbits: number;
  fractionalOrbits: number;
  elapsedDays: number;
}

/**
 * Elapsed orbits between `epoch` (given as days since the reference, double-double)
 * and sample i, split into an integer and a fraction so no digits are lost in 2π·orbits.
 *
 * @param days            barycentric days
 * @param i               sample index
 * @param epochDays       epoch − reference, days, double-double
 * @param periodDays      orbital period, days
 * @param out             reused result object
 */
export function orbitCountAt(
  days: BarycentricDays,
  i: number,
  epochDays: DoubleDouble,
  periodDays: number,
  out: OrbitCount,
): OrbitCount {
  const elapsed = ddSub([days.lo[i], days.hi[i]], epochDays);
  const orbits = ddDivideByNumber(elapsed, periodDays);
  const whole = Math.round(orbits[1]);
  out.wholeOrbits = whole;
  out.fractionalOrbits = orbits[1] - whole + orbits[0]; // hi − whole is exact (Sterbenz)
  out.elapsedDays = elapsed[1] + elapsed[0];
  return out;
}

/** epoch − reference in days (double-double). */
export function epochOffsetDays(epoch: Mjd, reference: Mjd): DoubleDouble {
  return mjdDiffDays(epoch, reference);
}

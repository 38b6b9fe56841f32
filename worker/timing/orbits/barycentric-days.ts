/**
 * Barycentric times as days since a reference instant, held as double-double
 * in two parallel arrays. Companion orbits need only these (no geometry), so
 * they can be re-evaluated cheaply when only orbital parameters change.
 */
import type { DoubleDouble, Mjd } from '../time/epoch';
import { mjdDiffDays } from '../time/mjd-arithmetic';

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
  // elapsed = (hi + lo) − (eHi + eLo): two-sum of the large parts, then the small ones (Knuth 1969,
  // TAOCP vol. 2, §4.2.2: error-free addition)
  const a = days.hi[i];
  const b = -epochDays[1];
  const sum = a + b;
  const bVirtual = sum - a;
  const sumError = (a - (sum - bVirtual)) + (b - bVirtual) + (days.lo[i] - epochDays[0]);
  const elapsedHi = sum + sumError;
  const elapsedLo = sumError - (elapsedHi - sum);
  // orbits = elapsed / Pb in double-double: q₁ = hi/Pb, then the exact remainder (Dekker 1971, Numer. Math. 18, 224)
  const q1 = elapsedHi / periodDays;
  const product = q1 * periodDays;
  const remainder = elapsedHi - product - productError(q1, periodDays, product) + elapsedLo;
  const q2 = remainder / periodDays;
  const whole = Math.round(q1);
  out.wholeOrbits = whole;
  out.fractionalOrbits = q1 - whole + q2; // q1 − whole is exact (Sterbenz)
  out.elapsedDays = elapsedHi + elapsedLo;
  return out;
}

const SPLITTER = 134_217_729; // 2^27 + 1 (Dekker 1971)

/** The exact rounding error of a·b given p = fl(a·b): Dekker's two-product by splitting. */
function productError(a: number, b: number, p: number): number {
  const ca = SPLITTER * a;
  const aHi = ca - (ca - a);
  const aLo = a - aHi;
  const cb = SPLITTER * b;
  const bHi = cb - (cb - b);
  const bLo = b - bHi;
  return ((aHi * bHi - p) + aHi * bLo + aLo * bHi) + aLo * bLo;
}

/** epoch − reference in days (double-double). */
export function epochOffsetDays(epoch: Mjd, reference: Mjd): DoubleDouble {
  return mjdDiffDays(epoch, reference);
}

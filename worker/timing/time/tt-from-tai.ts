/**
 * Terrestrial Time from International Atomic Time.
 */
import type { Mjd } from './epoch';
import { mjdAddSeconds } from './mjd-arithmetic';

export const TT_MINUS_TAI_SECONDS = 32.184; // fixed by definition: IAU 1991 Resolution A4 (Recommendation IV)

/**
 * TT = TAI + 32.184 s.
 * @param tai  instant in TAI (MJD day + fraction)
 * @returns    the same instant in TT
 * Accuracy: exact to double-double rounding (~1e-27 s).
 * References: IAU 1991 Resolution A4; IERS Conventions 2010, Chapter 10.
 */
export function ttFromTai(tai: Mjd): Mjd {
  return mjdAddSeconds(tai, TT_MINUS_TAI_SECONDS);
}

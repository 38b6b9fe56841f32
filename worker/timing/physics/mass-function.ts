import { SUN_MASS_SECONDS } from '../delays/physical-constants';

/**
 * Binary mass function f = (m_c sin i)³ / (m_p + m_c)² of a single-line orbit.
 *
 * @param projectedSemiMajorAxisLightSeconds  x = a_p sin i / c, light-seconds (> 0)
 * @param orbitalPeriodSeconds                Pb, seconds (> 0)
 * @returns                                   f, solar masses
 *
 * Notes: 1. Evaluated as 4π² x³ / (T☉ Pb²) with T☉ = GM☉/c³, so G and M☉ enter only
 *           through their well-measured product GM☉.
 * Accuracy: limited by the inputs; rounding error of a few units in the last place.
 * References: Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, eq. 8.34.
 */
export function massFunctionSolarMasses(projectedSemiMajorAxisLightSeconds: number, orbitalPeriodSeconds: number): number {
  if (!(projectedSemiMajorAxisLightSeconds > 0)) {
    throw new RangeError(`projectedSemiMajorAxisLightSeconds: must be > 0, got ${projectedSemiMajorAxisLightSeconds}`);
  }
  if (!(orbitalPeriodSeconds > 0)) throw new RangeError(`orbitalPeriodSeconds: must be > 0, got ${orbitalPeriodSeconds}`);
  const x = projectedSemiMajorAxisLightSeconds;
  return (4 * Math.PI ** 2 * x ** 3) / (SUN_MASS_SECONDS * orbitalPeriodSeconds ** 2); // Lorimer & Kramer 2005, eq. 8.34
}

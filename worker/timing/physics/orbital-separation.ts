import { AU_LIGHT_SECONDS, SUN_MASS_SECONDS } from '../delays/physical-constants';

/**
 * Relative orbital separation (semi-major axis of the relative orbit) from Kepler's third law.
 *
 * @param totalMassSolar        m_p + m_c, solar masses (> 0)
 * @param orbitalPeriodSeconds  Pb, seconds (> 0)
 * @returns                     a, au
 *
 * Notes: 1. a = (G M Pb² / 4π²)^(1/3) is evaluated as c (T☉ M)^(1/3) (Pb/2π)^(2/3), in
 *           light-seconds, then divided by the au in light-seconds (IAU 2012 Resolution B2).
 *        2. Newtonian: relativistic corrections are of order GM/(a c²), ≤ 1e-5 for known binaries.
 * Accuracy: rounding error of a few units in the last place; model error as in Note 2.
 * References: Kepler's third law; Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, §8.2.
 */
export function orbitalSeparationAu(totalMassSolar: number, orbitalPeriodSeconds: number): number {
  if (!(totalMassSolar > 0)) throw new RangeError(`totalMassSolar: must be > 0, got ${totalMassSolar}`);
  if (!(orbitalPeriodSeconds > 0)) throw new RangeError(`orbitalPeriodSeconds: must be > 0, got ${orbitalPeriodSeconds}`);
  const separationLightSeconds = Math.cbrt(SUN_MASS_SECONDS * totalMassSolar) * (orbitalPeriodSeconds / (2 * Math.PI)) ** (2 / 3); // Kepler's third law
  return separationLightSeconds / AU_LIGHT_SECONDS;
}

import { SECONDS_PER_JULIAN_YEAR, SUN_MASS_SECONDS } from '../delays/physical-constants';

/** Masses implied by two post-Keplerian parameters, or null with warnings when none exist. */
export interface ImpliedMasses {
  readonly pulsarMassSolar: number;
  readonly companionMassSolar: number;
  readonly totalMassSolar: number;
}

export interface ImpliedMassesResult {
  /** the solution, or null when the measured pair admits no positive masses under GR */
  readonly masses: ImpliedMasses | null;
  /** the other solution where the pair cannot tell the two bodies apart (ω̇ + Ṗb), else null */
  readonly swappedMasses: ImpliedMasses | null;
  /** 'no-positive-mass-solution' when the pair is inconsistent with general relativity */
  readonly warnings: readonly string[];
}

/** The Keplerian part shared by both inversions. */
export interface KeplerianOrbit {
  readonly eccentricity: number;
  readonly orbitalPeriodSeconds: number;
}

const DEG_TO_RAD = Math.PI / 180;

/**
 * Total mass implied by the periastron advance under general relativity.
 *
 * @param periastronAdvanceDegPerYear  ω̇, degrees per Julian year (> 0)
 * @param orbit                        e in [0, 1), Pb in seconds
 * @returns                            M = m_p + m_c, solar masses
 *
 * Notes: 1. Inverts ω̇ = 3 (Pb/2π)^(−5/3) (T☉ M)^(2/3) / (1 − e²) in closed form.
 * Accuracy: rounding error of a few units in the last place.
 * References: Taylor & Weisberg 1989, ApJ 345, 434, eq. 21 (as recalled).
 */
export function totalMassFromPeriastronAdvance(periastronAdvanceDegPerYear: number, orbit: KeplerianOrbit): number {
  checkOrbit(orbit);
  if (!(periastronAdvanceDegPerYear > 0)) {
    throw new RangeError(`periastronAdvanceDegPerYear: must be > 0, got ${periastronAdvanceDegPerYear}`);
  }
  const omegaDotRadPerSecond = (periastronAdvanceDegPerYear * DEG_TO_RAD) / SECONDS_PER_JULIAN_YEAR;
  const pbOver2Pi = orbit.orbitalPeriodSeconds / (2 * Math.PI);
  const e = orbit.eccentricity;
  return ((omegaDotRadPerSecond * (1 - e * e)) / 3) ** 1.5 * pbOver2Pi ** 2.5 / SUN_MASS_SECONDS; // Taylor & Weisberg 1989, eq. 21 solved for M
}

/**
 * Pulsar and companion masses from the periastron advance and the Einstein delay (GR).
 *
 * @param periastronAdvanceDegPerYear  ω̇, degrees per Julian year (> 0)
 * @param einsteinDelaySeconds         γ, seconds (> 0)
 * @param orbit                        e in (0, 1) (γ vanishes for e = 0), Pb in seconds
 * @returns                            the masses in solar masses, or null with a warning
 *
 * Notes: 1. Method: closed form, no iteration. ω̇ gives M (totalMassFromPeriastronAdvance);
 *           γ = e (Pb/2π)^(1/3) T☉^(2/3) M^(−4/3) m_c (m_p + 2 m_c) with m_p + 2 m_c = M + m_c
 *           is the quadratic m_c² + M m_c − K = 0, K = γ M^(4/3) / (e (Pb/2π)^(1/3) T☉^(2/3)),
 *           whose positive root m_c = 2K / (M + √(M² + 4K)) is taken in the cancellation-free form.
 *        2. When m_c ≥ M (m_p ≤ 0) the pair is inconsistent with GR: masses is null.
 * Accuracy: the predictions are inverted to ≤ 1e-10 relative (checked in tests/engine/physics).
 * References: Taylor & Weisberg 1989, ApJ 345, 434, eqs. 21–22 (as recalled).
 */
export function massesFromPeriastronAdvanceAndEinsteinDelay(
  periastronAdvanceDegPerYear: number,
  einsteinDelaySeconds: number,
  orbit: KeplerianOrbit,
): ImpliedMassesResult {
  const m = totalMassFromPeriastronAdvance(periastronAdvanceDegPerYear, orbit);
  if (!(einsteinDelaySeconds > 0)) throw new RangeError(`einsteinDelaySeconds: must be > 0, got ${einsteinDelaySeconds}`);
  if (!(orbit.eccentricity > 0)) throw new RangeError(`eccentricity: must be > 0 for an Einstein delay, got ${orbit.eccentricity}`);
  const pbOver2Pi = orbit.orbitalPeriodSeconds / (2 * Math.PI);
  const k = (einsteinDelaySeconds * m ** (4 / 3)) / (orbit.eccentricity * Math.cbrt(pbOver2Pi) * Math.cbrt(SUN_MASS_SECONDS) ** 2); // Taylor & Weisberg 1989, eq. 22 rearranged
  const mc = (2 * k) / (m + Math.sqrt(m * m + 4 * k)); // positive root of m_c² + M m_c − K = 0 (Note 1)
  const mp = m - mc;
  if (!(mp > 0)) return { masses: null, swappedMasses: null, warnings: ['no-positive-mass-solution'] };
  return { masses: { pulsarMassSolar: mp, companionMassSolar: mc, totalMassSolar: m }, swappedMasses: null, warnings: [] };
}

/**
 * Pulsar and companion masses from the periastron advance and the orbital period derivative (GR).
 *
 * @param periastronAdvanceDegPerYear  ω̇, degrees per Julian year (> 0)
 * @param orbitalPeriodDerivative      intrinsic Ṗb, s/s (< 0 under GR; Note 3)
 * @param orbit                        e in [0, 1), Pb in seconds
 * @returns                            masses with m_p ≥ m_c, the swapped pair, or null with a warning
 *
 * Notes: 1. Method: closed form. ω̇ gives M; Ṗb = −(192π/5) (Pb/2π)^(−5/3) f(e) T☉^(5/3) m_p m_c M^(−1/3)
 *           gives the product P = m_p m_c, so m_p and m_c are the roots of m² − M m + P = 0.
 *        2. The product is symmetric in the two masses: Ṗb cannot tell which body is the pulsar.
 *           masses holds m_p ≥ m_c and swappedMasses the exchange (equal when m_p = m_c).
 *        3. Ṗb must be the intrinsic, gravitational-wave part (kinematic terms removed).
 *        4. When P > M²/4 no real masses exist: masses is null and a warning is given.
 * Accuracy: the predictions are inverted to ≤ 1e-6 relative for the Hulse–Taylor masses (tested); the
 *           split degrades as √ε near m_p = m_c (a double root).
 * References: Taylor & Weisberg 1989, ApJ 345, 434, eqs. 21 and 23 (as recalled).
 */
export function massesFromPeriastronAdvanceAndPeriodDerivative(
  periastronAdvanceDegPerYear: number,
  orbitalPeriodDerivative: number,
  orbit: KeplerianOrbit,
): ImpliedMassesResult {
  const m = totalMassFromPeriastronAdvance(periastronAdvanceDegPerYear, orbit);
  if (!(orbitalPeriodDerivative < 0)) {
    throw new RangeError(`orbitalPeriodDerivative: must be < 0 (gravitational-wave decay), got ${orbitalPeriodDerivative}`);
  }
  const e = orbit.eccentricity;
  const pbOver2Pi = orbit.orbitalPeriodSeconds / (2 * Math.PI);
  const enhancement = (1 + (73 / 24) * e ** 2 + (37 / 96) * e ** 4) * (1 - e * e) ** (-7 / 2); // eccentricity factor of Taylor & Weisberg 1989, eq. 23
  const product = (-orbitalPeriodDerivative * Math.cbrt(m)) / ((192 * Math.PI) / 5 * pbOver2Pi ** (-5 / 3) * enhancement * SUN_MASS_SECONDS ** (5 / 3)); // eq. 23 solved for m_p m_c
  const discriminant = m * m - 4 * product;
  if (!(discriminant >= 0)) return { masses: null, swappedMasses: null, warnings: ['no-positive-mass-solution'] };
  const larger = (m + Math.sqrt(discriminant)) / 2; // larger root of m² − M m + P = 0
  const smaller = product / larger; // Vieta, free of cancellation
  return {
    masses: { pulsarMassSolar: larger, companionMassSolar: smaller, totalMassSolar: m },
    swappedMasses: { pulsarMassSolar: smaller, companionMassSolar: larger, totalMassSolar: m },
    warnings: [],
  };
}

function checkOrbit(orbit: KeplerianOrbit): void {
  if (!(orbit.eccentricity >= 0 && orbit.eccentricity < 1)) throw new RangeError(`eccentricity: must be in [0, 1), got ${orbit.eccentricity}`);
  if (!(orbit.orbitalPeriodSeconds > 0)) throw new RangeError(`orbitalPeriodSeconds: must be > 0, got ${orbit.orbitalPeriodSeconds}`);
}

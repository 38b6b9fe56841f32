import { SECONDS_PER_JULIAN_YEAR, SUN_MASS_SECONDS } from '../delays/physical-constants';

/** The inputs of the general-relativity predictions. */
export interface BinaryMassesAndOrbit {
  readonly pulsarMassSolar: number;
  readonly companionMassSolar: number;
  /** orbital eccentricity, 0 ≤ e < 1 */
  readonly eccentricity: number;
  readonly orbitalPeriodSeconds: number;
  /** x = a_p sin i / c; needed only for the Shapiro shape (omit it and shapiroShape is NaN) */
  readonly projectedSemiMajorAxisLightSeconds?: number;
}

/** Post-Keplerian parameters predicted by general relativity. */
export interface PostKeplerianPrediction {
  readonly periastronAdvanceRadPerSecond: number;
  /** ω̇ in degrees per Julian year (365.25 d) */
  readonly periastronAdvanceDegPerYear: number;
  /** γ, seconds */
  readonly einsteinDelaySeconds: number;
  /** Ṗb from gravitational-wave emission, seconds per second (dimensionless) */
  readonly orbitalPeriodDerivative: number;
  /** r = T☉ m_c, seconds */
  readonly shapiroRangeSeconds: number;
  /** s = sin i implied by x and the masses; NaN without x */
  readonly shapiroShape: number;
  /** 'shapiro-shape-exceeds-one' when x is too large for the masses (no inclination fits) */
  readonly warnings: readonly string[];
}

const RAD_TO_DEG = 180 / Math.PI;

/**
 * General-relativity predictions of the five post-Keplerian parameters from the two masses.
 *
 * @param orbit  masses (solar masses), eccentricity, Pb (s) and optionally x (lt-s); Note 1
 * @returns      ω̇, γ, Ṗb, r, s and warnings
 *
 * Notes: 1. Masses enter as T☉ m with T☉ = GM☉/c³; n = 2π/Pb; M = m_p + m_c.
 *        2. Leading (first post-Newtonian) order, as in the cited equations; higher-order
 *           terms are ~ (v/c)² ≈ 1e-6 relative for the tightest known binaries.
 *        3. Ṗb is the intrinsic gravitational-wave part only (no kinematic terms).
 * Accuracy: rounding error of a few units in the last place; model error as in Note 2.
 * References: Taylor & Weisberg 1989, ApJ 345, 434, eqs. 21–25 (equation numbers as recalled). Damour & Deruelle 1986,
 *             Ann. Inst. H. Poincaré (Phys. Théor.) 44, 263.
 */
export function postKeplerianPredictions(orbit: BinaryMassesAndOrbit): PostKeplerianPrediction {
  const { pulsarMassSolar: mp, companionMassSolar: mc, eccentricity: e, orbitalPeriodSeconds: pb } = orbit;
  if (!(mp > 0)) throw new RangeError(`pulsarMassSolar: must be > 0, got ${mp}`);
  if (!(mc > 0)) throw new RangeError(`companionMassSolar: must be > 0, got ${mc}`);
  if (!(e >= 0 && e < 1)) throw new RangeError(`eccentricity: must be in [0, 1), got ${e}`);
  if (!(pb > 0)) throw new RangeError(`orbitalPeriodSeconds: must be > 0, got ${pb}`);
  const m = mp + mc;
  const t = SUN_MASS_SECONDS;
  const pbOver2Pi = pb / (2 * Math.PI);
  const oneMinusE2 = 1 - e * e;

  const omegaDot = 3 * pbOver2Pi ** (-5 / 3) * Math.cbrt(t * m) ** 2 / oneMinusE2; // Taylor & Weisberg 1989, eq. 21
  const gamma = e * Math.cbrt(pbOver2Pi) * Math.cbrt(t) ** 2 * m ** (-4 / 3) * mc * (mp + 2 * mc); // Taylor & Weisberg 1989, eq. 22
  const enhancement = (1 + (73 / 24) * e ** 2 + (37 / 96) * e ** 4) * oneMinusE2 ** (-7 / 2); // eccentricity factor of Taylor & Weisberg 1989, eq. 23 (Peters & Mathews 1963)
  const pbDot = ((-192 * Math.PI) / 5) * pbOver2Pi ** (-5 / 3) * enhancement * t ** (5 / 3) * mp * mc * m ** (-1 / 3); // Taylor & Weisberg 1989, eq. 23
  const range = t * mc; // Taylor & Weisberg 1989, eq. 24
  const x = orbit.projectedSemiMajorAxisLightSeconds;
  const shape = x === undefined ? Number.NaN : (x * pbOver2Pi ** (-2 / 3) * m ** (2 / 3)) / (Math.cbrt(t) * mc); // Taylor & Weisberg 1989, eq. 25
  const warnings = shape > 1 ? ['shapiro-shape-exceeds-one'] : [];
  return {
    periastronAdvanceRadPerSecond: omegaDot,
    periastronAdvanceDegPerYear: omegaDot * RAD_TO_DEG * SECONDS_PER_JULIAN_YEAR,
    einsteinDelaySeconds: gamma,
    orbitalPeriodDerivative: pbDot,
    shapiroRangeSeconds: range,
    shapiroShape: shape,
    warnings,
  };
}

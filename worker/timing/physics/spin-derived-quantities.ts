import { SECONDS_PER_JULIAN_YEAR } from '../delays/physical-constants';
import { NEUTRON_STAR_MOMENT_OF_INERTIA_G_CM2, SURFACE_FIELD_COEFFICIENT_GAUSS } from './physics-constants';

/** Quantities derived from a pulsar's spin frequency and its derivative. */
export interface SpinDerivedQuantities {
  /** P = 1/F, seconds */
  readonly periodSeconds: number;
  /** Ṗ = −Ḟ/F², s/s */
  readonly periodDerivative: number;
  /** τ = P/(2Ṗ), Julian years; NaN when Ṗ ≤ 0 */
  readonly characteristicAgeYears: number;
  /** B = 3.2e19 G √(P Ṗ); NaN when Ṗ ≤ 0 */
  readonly surfaceMagneticFieldGauss: number;
  /** Ė = 4π² I Ṗ / P³, erg/s (negative when the pulsar spins up) */
  readonly spinDownLuminosityErgPerSecond: number;
  /** the moment of inertia used for the luminosity, g cm² */
  readonly momentOfInertiaGCm2: number;
  /** 'period-derivative-not-positive' when Ṗ ≤ 0 (age and field undefined; often an accelerated pulsar) */
  readonly warnings: readonly string[];
}

/**
 * Period, period derivative, characteristic age, surface dipole field and spin-down luminosity.
 *
 * @param spinFrequencyHz                   F, Hz (> 0)
 * @param spinFrequencyDerivativeHzPerSecond Ḟ, Hz/s
 * @param momentOfInertiaGCm2               I, g cm² (default 1e45, Note 1)
 * @returns                                 the quantities above, with warnings
 *
 * Notes: 1. I = 10⁴⁵ g cm² is the canonical neutron-star value (common practice).
 *        2. The age assumes magnetic-dipole braking (braking index 3) and a birth period
 *           much shorter than today's; the field assumes a dipole of radius 10 km with
 *           I = 10⁴⁵ g cm² (the 3.2e19 coefficient). Both are order-of-magnitude estimates.
 *        3. Ṗ is taken as measured: no correction for Shklovskii or acceleration terms.
 * Accuracy: rounding error of a few units in the last place; model error as in Note 2.
 * References: Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, §3.1 (Ė, τ) and eq. 3.15 (B).
 */
export function spinDerivedQuantities(
  spinFrequencyHz: number,
  spinFrequencyDerivativeHzPerSecond: number,
  momentOfInertiaGCm2: number = NEUTRON_STAR_MOMENT_OF_INERTIA_G_CM2,
): SpinDerivedQuantities {
  if (!(spinFrequencyHz > 0) || !Number.isFinite(spinFrequencyHz)) throw new RangeError(`spinFrequencyHz: must be finite and > 0, got ${spinFrequencyHz}`);
  if (!Number.isFinite(spinFrequencyDerivativeHzPerSecond)) {
    throw new RangeError(`spinFrequencyDerivativeHzPerSecond: must be finite, got ${spinFrequencyDerivativeHzPerSecond}`);
  }
  if (!(momentOfInertiaGCm2 > 0)) throw new RangeError(`momentOfInertiaGCm2: must be > 0, got ${momentOfInertiaGCm2}`);
  const p = 1 / spinFrequencyHz; // P = 1/F
  const pDot = -spinFrequencyDerivativeHzPerSecond / spinFrequencyHz ** 2; // Ṗ = −Ḟ/F², differentiating P = 1/F
  const spinningDown = pDot > 0;
  return {
    periodSeconds: p,
    periodDerivative: pDot,
    characteristicAgeYears: spinningDown ? p / (2 * pDot) / SECONDS_PER_JULIAN_YEAR : Number.NaN, // Lorimer & Kramer 2005, §3.1 (dipole-braking age)
    surfaceMagneticFieldGauss: spinningDown ? SURFACE_FIELD_COEFFICIENT_GAUSS * Math.sqrt(p * pDot) : Number.NaN, // Lorimer & Kramer 2005, eq. 3.15
    spinDownLuminosityErgPerSecond: (4 * Math.PI ** 2 * momentOfInertiaGCm2 * pDot) / p ** 3, // Lorimer & Kramer 2005, §3.1 (Ė = −I Ω Ω̇)
    momentOfInertiaGCm2,
    warnings: spinningDown ? [] : ['period-derivative-not-positive'],
  };
}

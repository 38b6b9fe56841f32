import { SUN_TO_JUPITER_MASS_RATIO } from '../delays/physical-constants';
import { bracketedRoot } from './bracketed-root';
import { DEFAULT_PULSAR_MASS_SOLAR, SUN_TO_EARTH_MASS_RATIO } from './physics-constants';

/** A companion mass in the three units users read it in. */
export interface CompanionMass {
  readonly solarMasses: number;
  /** solar masses × 1047.3486 (DE405 Sun/Jupiter ratio, Standish 1998) */
  readonly jupiterMasses: number;
  /** solar masses × 332 946.050895 (DE405 Sun/Earth ratio, Standish 1998) */
  readonly earthMasses: number;
}

/**
 * Minimum companion mass: the m_c solving f = (m_c sin i)³ / (m_p + m_c)² for i = 90°.
 *
 * @param massFunctionSolar  f, solar masses (≥ 0), e.g. from massFunctionSolarMasses
 * @param pulsarMassSolar    assumed pulsar mass m_p, solar masses (≥ 0; default 1.4, Note 1)
 * @returns                  m_c,min in solar, Jupiter and Earth masses (Note 2)
 *
 * Notes: 1. 1.4 M☉ is the canonical neutron-star mass (common practice).
 *        2. The mass ratios are those of the DE405 ephemeris (Standish 1998, JPL IOM
 *           312.F-98-048): M☉/M_J = 1047.3486 (Jupiter with satellites), M☉/M⊕ = 332 946.050895.
 *        3. g(m) = m³/(m_p + m)² − f increases monotonically in m ≥ 0. The root lies in
 *           [max(f, (f m_p²)^(1/3)), max(4f, f^(1/3)(2 m_p)^(2/3))] (from m_c³ = f (m_p+m_c)²
 *           with m_c ≤ m_p or m_c ≥ m_p), and is found by bisection to adjacent doubles.
 * Accuracy: f is reproduced to ≤ 1e-12 relative (checked in tests/engine/physics).
 * References: Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, eq. 8.34.
 */
export function minimumCompanionMass(massFunctionSolar: number, pulsarMassSolar: number = DEFAULT_PULSAR_MASS_SOLAR): CompanionMass {
  if (!(massFunctionSolar >= 0) || !Number.isFinite(massFunctionSolar)) {
    throw new RangeError(`massFunctionSolar: must be finite and ≥ 0, got ${massFunctionSolar}`);
  }
  if (!(pulsarMassSolar >= 0) || !Number.isFinite(pulsarMassSolar)) {
    throw new RangeError(`pulsarMassSolar: must be finite and ≥ 0, got ${pulsarMassSolar}`);
  }
  const f = massFunctionSolar;
  const mp = pulsarMassSolar;
  const solarMasses = f === 0 ? 0 : solveForCompanionMass(f, mp);
  return {
    solarMasses,
    jupiterMasses: solarMasses * SUN_TO_JUPITER_MASS_RATIO,
    earthMasses: solarMasses * SUN_TO_EARTH_MASS_RATIO,
  };
}

function solveForCompanionMass(f: number, mp: number): number {
  const lo = Math.max(f, Math.cbrt(f * mp * mp)); // Note 3
  const hi = Math.max(4 * f, Math.cbrt(f) * Math.cbrt(2 * mp) ** 2); // Note 3
  const excess = (m: number) => m ** 3 / (mp + m) ** 2 / f - 1; // mass-function equation at i = 90°, divided by f
  if (!(hi > lo)) return lo;
  return bracketedRoot(excess, lo, hi);
}

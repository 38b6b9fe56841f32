/**
 * The physical quantities shown beside a candidate companion.
 */
import type { KeplerianCompanion } from '../model/timing-model';
import { massFunctionSolarMasses } from '../physics/mass-function';
import { minimumCompanionMass } from '../physics/minimum-companion-mass';
import { orbitalSeparationAu } from '../physics/orbital-separation';
import type { CandidateDerivedQuantities } from './companion-search-report';

const SECONDS_PER_DAY = 86_400;

/**
 * Mass function, minimum companion mass and orbital separation of a fitted orbit.
 *
 * @param companion        the fitted Keplerian elements (x > 0, Pb > 0)
 * @param pulsarMassSolar  the assumed pulsar mass, solar masses
 * @returns                f (M☉), m_c,min (M☉, M_J, M⊕) for i = 90°, a (au) for m_p + m_c,min;
 *                         NaN everywhere when x or Pb is not positive
 * References: Lorimer & Kramer 2005, eq. 8.34 (mass function); Kepler's third law (separation).
 */
export function candidateDerivedQuantities(companion: KeplerianCompanion, pulsarMassSolar: number): CandidateDerivedQuantities {
  const x = companion.projectedSemimajorAxisLtS;
  const periodS = companion.periodDays * SECONDS_PER_DAY;
  if (!(x > 0 && periodS > 0 && Number.isFinite(x) && Number.isFinite(periodS))) {
    return { massFunctionSolar: NaN, pulsarMassSolar, minimumCompanionMass: { solarMasses: NaN, jupiterMasses: NaN, earthMasses: NaN }, separationAu: NaN };
  }
  const massFunctionSolar = massFunctionSolarMasses(x, periodS); // Lorimer & Kramer 2005, eq. 8.34
  const mass = minimumCompanionMass(massFunctionSolar, pulsarMassSolar);
  const separationAu = orbitalSeparationAu(pulsarMassSolar + mass.solarMasses, periodS); // Kepler's third law
  return { massFunctionSolar, pulsarMassSolar, minimumCompanionMass: mass, separationAu };
}

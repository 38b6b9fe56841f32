import { minimumCompanionMass } from '../../../../worker/timing/physics/minimum-companion-mass';
import { orbitalSeparationAu } from '../../../../worker/timing/physics/orbital-separation';
import type { SearchCandidate } from '../api/get-search-run';

const SECONDS_PER_DAY = 86_400;

/** The derived quantities of one candidate for one assumed pulsar mass. */
export interface DerivedForMass {
  massFunctionSolar: number;
  pulsarMassSolar: number;
  minimumMass: { solarMasses: number; jupiterMasses: number; earthMasses: number };
  separationAu: number;
  /** true when computed here for a mass other than the one the server used */
  recomputed: boolean;
}

/**
 * The candidate's derived masses for `pulsarMassSolar`: the server's figures when the mass is the
 * one the run assumed, else recomputed in the browser with the engine's own routines from the
 * server's mass function and the fitted period. Null when the orbit fit failed (the server
 * derived nothing) or there is no usable period.
 *
 * @param candidate        a search candidate (its `derived` and `elements.period_days`)
 * @param pulsarMassSolar  assumed pulsar mass, solar masses (> 0)
 *
 * Accuracy: the engine's (minimum-companion-mass.ts: bisection to double precision; separation
 * by Kepler's third law with pulsar + minimum companion mass, as the server does).
 */
export function derivedForMass(candidate: Pick<SearchCandidate, 'derived' | 'elements'>, pulsarMassSolar: number): DerivedForMass | null {
  const derived = candidate.derived;
  const f = derived.massFunctionSolar;
  if (f === null) return null; // the orbit fit failed: nothing was derived
  if (pulsarMassSolar === derived.assumedPulsarMassSolar) {
    const m = derived.minimumCompanionMass;
    if (m.solarMasses === null || m.jupiterMasses === null || m.earthMasses === null || derived.separationAu === null) return null;
    return {
      massFunctionSolar: f,
      pulsarMassSolar,
      minimumMass: { solarMasses: m.solarMasses, jupiterMasses: m.jupiterMasses, earthMasses: m.earthMasses },
      separationAu: derived.separationAu,
      recomputed: false,
    };
  }
  const periodDays = Number(candidate.elements.period_days?.value);
  if (!(periodDays > 0) || !(pulsarMassSolar > 0) || !(f >= 0)) return null;
  const minimumMass = minimumCompanionMass(f, pulsarMassSolar); // mass-function equation at i = 90°
  const separationAu = orbitalSeparationAu(pulsarMassSolar + minimumMass.solarMasses, periodDays * SECONDS_PER_DAY); // Kepler's third law
  return { massFunctionSolar: f, pulsarMassSolar, minimumMass, separationAu, recomputed: true };
}

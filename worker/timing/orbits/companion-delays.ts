/**
 * Total delay of all enabled companions, from barycentric times alone.
 */
import type { Companion, TimingModel } from '../model/timing-model';
import type { Mjd } from '../time/epoch';
import { TimingInputError } from '../engine-error';
import type { BarycentricDays } from './barycentric-days';
import { barycentricDaysFromMjd } from './barycentric-days';
import { addBlandfordTeukolskyDelayS } from './blandford-teukolsky-delay';
import { addLowEccentricityDelayS } from './low-eccentricity-delay';
import { addDamourDeruelleDelayS } from './damour-deruelle-delay';

/**
 * Adds one companion's orbit delay (seconds) into `out`; disabled companions add nothing.
 * Throws TimingInputError for a kind that is not known.
 */
export function addCompanionDelayS(companion: Companion, days: BarycentricDays, out: Float64Array): void {
  if (!companion.enabled) return;
  switch (companion.kind) {
    case 'keplerian':
      addBlandfordTeukolskyDelayS(companion, days, out);
      return;
    case 'low-eccentricity':
      addLowEccentricityDelayS(companion, days, out);
      return;
    case 'damour-deruelle':
      addDamourDeruelleDelayS(companion, days, out);
      return;
    default: {
      const unknown: never = companion;
      throw new TimingInputError(`companion kind ${String((unknown as Companion).kind)} is not known`);
    }
  }
}

/**
 * Sum of the orbit delays of every enabled companion at the given barycentric days.
 *
 * @param companions  the model's companions (disabled ones contribute nothing)
 * @param days        barycentric arrival times (TDB, infinite frequency) as days since a reference
 * @returns           seconds per sample, to subtract from the barycentric arrival time
 */
export function companionDelaysFromDaysS(companions: readonly Companion[], days: BarycentricDays): Float64Array {
  const out = new Float64Array(days.hi.length);
  for (const companion of companions) addCompanionDelayS(companion, days, out);
  return out;
}

/**
 * Companion delays at barycentric instants, with no re-barycentring.
 *
 * @param model           the timing model (only `companions` and `epochMjd` are used)
 * @param barycentricTdb  barycentric arrival times at infinite frequency (TDB)
 * @returns               seconds per instant (emission = barycentric arrival − delay)
 * References: see blandford-teukolsky-delay.ts, low-eccentricity-delay.ts and damour-deruelle-delay.ts.
 */
export function companionDelaysS(model: Pick<TimingModel, 'companions' | 'epochMjd'>, barycentricTdb: readonly Mjd[]): Float64Array {
  return companionDelaysFromDaysS(model.companions, barycentricDaysFromMjd(barycentricTdb, model.epochMjd));
}

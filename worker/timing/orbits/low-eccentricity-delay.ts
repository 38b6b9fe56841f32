/**
 * Low-eccentricity orbit delay of Lange et al. (2001), and conversions
 * between its elements and Keplerian ones.
 */
import type { BarycentricDays, OrbitCount } from './barycentric-days';
import { epochOffsetDays, orbitCountAt } from './barycentric-days';
import type { KeplerianCompanion, LowEccentricityCompanion } from '../model/timing-model';
import type { Mjd } from '../time/epoch';
import { mjdAddDays } from '../time/mjd-arithmetic';

const TWO_PI = 2 * Math.PI;
const SECONDS_PER_DAY = 86_400;

/**
 * Low-eccentricity orbit delay for each barycentric time, added into `out`.
 *
 * @param companion  Pb (days), x (lt-s), T_asc (TDB MJD of the ascending node), η = e sin ω, κ = e cos ω,
 *                   optional Ṗb
 * @param days       barycentric arrival times (TDB) as days since a reference
 * @param out        seconds; the delay is ADDED to out[i]
 *
 * Notes: 1. Φ = 2π[(t−T_asc)/Pb − ½Ṗb((t−T_asc)/Pb)²], the orbital phase from the ascending node.
 *        2. Δ = x[sin Φ + (κ/2) sin 2Φ − (η/2) cos 2Φ] (Lange et al. 2001, MNRAS 326, 274),
 *           times [1 − n·dΔ/dΦ], the same first-order arrival-vs-emission correction as the
 *           Blandford–Teukolsky delay.
 *        3. The published model omits the constant −(3/2)·x·η relative to the Keplerian delay (it is
 *           absorbed by the fit's phase offset); this routine follows the publication.
 * Accuracy: agrees with the Keplerian delay to O(x·e²) (Lange et al. 2001), i.e. use when x·e² is
 *           below the timing precision. No Einstein or binary Shapiro delay.
 * References: Lange et al. 2001, MNRAS 326, 274.
 */
export function addLowEccentricityDelayS(companion: LowEccentricityCompanion, days: BarycentricDays, out: Float64Array): void {
  const epochDays = epochOffsetDays(companion.ascendingNodeEpochMjd, days.reference);
  const x = companion.projectedSemimajorAxisLtS;
  const eta = companion.eSinOmega;
  const kappa = companion.eCosOmega;
  const pb = companion.periodDays;
  const count: OrbitCount = { wholeOrbits: 0, fractionalOrbits: 0, elapsedDays: 0 };
  for (let i = 0; i < out.length; i += 1) {
    orbitCountAt(days, i, epochDays, pb, count);
    const orbits = count.elapsedDays / pb;
    const phase = TWO_PI * (count.fractionalOrbits - 0.5 * companion.periodDerivative * orbits * orbits); // Note 1
    const sinPhi = Math.sin(phase);
    const cosPhi = Math.cos(phase);
    const sin2Phi = 2 * sinPhi * cosPhi;
    const cos2Phi = cosPhi * cosPhi - sinPhi * sinPhi;
    const delay = x * (sinPhi + 0.5 * kappa * sin2Phi - 0.5 * eta * cos2Phi); // Lange et al. 2001, MNRAS 326, 274
    const slope = x * (cosPhi + kappa * cos2Phi + eta * sin2Phi); // dΔ/dΦ
    const meanMotion = TWO_PI / ((pb + companion.periodDerivative * count.elapsedDays) * SECONDS_PER_DAY);
    out[i] += delay * (1 - meanMotion * slope); // Note 2
  }
}

/**
 * Low-eccentricity elements from Keplerian ones: η = e sin ω, κ = e cos ω, T_asc = T₀ − ω·Pb/(2π)
 * (Lange et al. 2001, MNRAS 326, 274, §2). Keeps name, enabled, Pb, x, Ṗb; drops ω̇ and γ.
 */
export function lowEccentricityFromKeplerian(k: KeplerianCompanion): LowEccentricityCompanion {
  const omegaRad = (k.periastronLongitudeDeg * Math.PI) / 180;
  const ascendingNodeEpochMjd: Mjd = mjdAddDays(k.periastronEpochMjd, (-omegaRad / TWO_PI) * k.periodDays); // Lange et al. 2001 §2
  return {
    kind: 'low-eccentricity',
    name: k.name,
    enabled: k.enabled,
    periodDays: k.periodDays,
    projectedSemimajorAxisLtS: k.projectedSemimajorAxisLtS,
    ascendingNodeEpochMjd,
    eSinOmega: k.eccentricity * Math.sin(omegaRad),
    eCosOmega: k.eccentricity * Math.cos(omegaRad),
    periodDerivative: k.periodDerivative,
  };
}

/**
 * Keplerian elements from low-eccentricity ones: e = √(η² + κ²), ω = atan2(η, κ) in [0°, 360°),
 * T₀ = T_asc + ω·Pb/(2π) (Lange et al. 2001, MNRAS 326, 274, §2). For e = 0, ω = 0 and T₀ = T_asc.
 */
export function keplerianFromLowEccentricity(l: LowEccentricityCompanion): KeplerianCompanion {
  const eccentricity = Math.hypot(l.eSinOmega, l.eCosOmega);
  let omegaRad = eccentricity === 0 ? 0 : Math.atan2(l.eSinOmega, l.eCosOmega);
  if (omegaRad < 0) omegaRad += TWO_PI;
  return {
    kind: 'keplerian',
    name: l.name,
    enabled: l.enabled,
    periodDays: l.periodDays,
    projectedSemimajorAxisLtS: l.projectedSemimajorAxisLtS,
    eccentricity,
    periastronLongitudeDeg: (omegaRad * 180) / Math.PI,
    periastronEpochMjd: mjdAddDays(l.ascendingNodeEpochMjd, (omegaRad / TWO_PI) * l.periodDays), // Lange et al. 2001 §2
    periodDerivative: l.periodDerivative,
    periastronAdvanceDegPerYr: 0,
    einsteinDelayS: 0,
  };
}

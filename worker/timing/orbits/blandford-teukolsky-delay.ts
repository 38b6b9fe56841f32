/**
 * Blandford–Teukolsky orbit delay of a pulsar in a Keplerian orbit.
 */
import { solveKepler } from './kepler-equation';
import type { BarycentricDays, OrbitCount } from './barycentric-days';
import { epochOffsetDays, orbitCountAt } from './barycentric-days';
import { DAYS_PER_JULIAN_YEAR } from '../delays/physical-constants';
import type { KeplerianCompanion } from '../model/timing-model';

const TWO_PI = 2 * Math.PI;
const RAD_PER_DEG = Math.PI / 180;
const SECONDS_PER_DAY = 86_400;

/**
 * Orbit delay (Roemer across the orbit + Einstein) for each barycentric time, added into `out`.
 *
 * @param companion  Keplerian elements: Pb (days), x = a·sin i/c (lt-s), e, ω (deg) and T₀ (TDB MJD),
 *                   optional Ṗb (dimensionless), ω̇ (deg/yr) and γ (s)
 * @param days       barycentric arrival times (TDB) as days since a reference
 * @param out        seconds; the delay is ADDED to out[i] (so several companions can share it)
 *
 * Notes: 1. Mean anomaly M = 2π[(t−T₀)/Pb − ½Ṗb((t−T₀)/Pb)²]; ω = ω₀ + ω̇·(t−T₀) with t−T₀ in
 *           Julian years (Blandford & Teukolsky 1976, ApJ 205, 580).
 *        2. Δ = [α(cos E − e) + (β + γ) sin E]·[1 − n(β cos E − α sin E)/(1 − e cos E)],
 *           α = x sin ω, β = x √(1−e²) cos ω, n = 2π/Pb(t): the Roemer and Einstein delays with the
 *           first-order correction for evaluating the orbit at the arrival rather than the
 *           emission time (Blandford & Teukolsky 1976, ApJ 205, 580).
 *        3. The delay is subtracted from the barycentric arrival to give the emission time.
 * Accuracy: the dropped second-order term is ~ x·(2πx/Pb)² (e.g. 4 ns for x = 1 lt-s, Pb = 0.1 d).
 *           Assumes e < 1; Shapiro delay in the binary is not included (see damour-deruelle).
 * References: Blandford & Teukolsky 1976, ApJ 205, 580; Lorimer & Kramer 2005, ch. 8.
 */
export function addBlandfordTeukolskyDelayS(companion: KeplerianCompanion, days: BarycentricDays, out: Float64Array): void {
  const epochDays = epochOffsetDays(companion.periastronEpochMjd, days.reference);
  const x = companion.projectedSemimajorAxisLtS;
  const e = companion.eccentricity;
  const pb = companion.periodDays;
  const sqrtOneMinusE2 = Math.sqrt(1 - e * e);
  const count: OrbitCount = { wholeOrbits: 0, fractionalOrbits: 0, elapsedDays: 0 };
  for (let i = 0; i < out.length; i += 1) {
    orbitCountAt(days, i, epochDays, pb, count);
    const orbitsSincePeriastron = count.elapsedDays / pb;
    const meanAnomaly = TWO_PI * (count.fractionalOrbits - 0.5 * companion.periodDerivative * orbitsSincePeriastron ** 2); // Note 1
    const omegaRad = (companion.periastronLongitudeDeg + (companion.periastronAdvanceDegPerYr * count.elapsedDays) / DAYS_PER_JULIAN_YEAR) * RAD_PER_DEG; // Note 1
    const eccentricAnomaly = solveKepler(meanAnomaly, e);
    const sinE = Math.sin(eccentricAnomaly);
    const cosE = Math.cos(eccentricAnomaly);
    const alpha = x * Math.sin(omegaRad);
    const beta = x * sqrtOneMinusE2 * Math.cos(omegaRad);
    const periodS = (pb + companion.periodDerivative * count.elapsedDays) * SECONDS_PER_DAY;
    const meanMotion = TWO_PI / periodS;
    const delay = alpha * (cosE - e) + (beta + companion.einsteinDelayS) * sinE; // Blandford & Teukolsky 1976
    const correction = 1 - (meanMotion * (beta * cosE - alpha * sinE)) / (1 - e * cosE); // B&T 1976, first order
    out[i] += delay * correction;
  }
}

/**
 * Kepler's equation E − e·sin E = M for the eccentric anomaly E.
 */

const TWO_PI = 2 * Math.PI;
const TOLERANCE_RAD = 1e-15;
const MAX_ITERATIONS = 60;

/**
 * Eccentric anomaly from mean anomaly and eccentricity.
 *
 * @param meanAnomalyRad  M, any real value (radians)
 * @param eccentricity    e, 0 ≤ e < 1 (Note 4: −1 < e < 0 is accepted too)
 * @returns               E in the same revolution as M (E − M = e·sin E, so |E − M| ≤ e)
 *
 * Notes: 1. M is reduced to [−π, π) first, and the revolution count added back at the end.
 *        2. Start value E₀ = M + 0.85·e·sign(sin M), which keeps Newton's method safe for all
 *           e < 1 (Danby 1988, Fundamentals of Celestial Mechanics, 2nd ed., §6.6).
 *        3. Halley's third-order step (Newton with the curvature term), stopping when a step is
 *           below 1e-15 rad; a final Newton step polishes the last bit.
 *        4. A slightly negative e has no physical meaning but the equation stays well posed
 *           (E + |e| sin E = M is monotonic); it is accepted so that numeric derivatives can
 *           straddle e = 0.
 * Accuracy: |E − e sin E − M| ≲ 1e-15 rad for e up to 0.99 (tests/engine/orbits/kepler-equation.test.ts).
 * Throws RangeError when e is outside (−1, 1) or M is not finite.
 * References: Danby 1988, §6.6; Meeus 1998, Astronomical Algorithms, 2nd ed., ch. 30.
 */
export function solveKepler(meanAnomalyRad: number, eccentricity: number): number {
  if (!(eccentricity > -1 && eccentricity < 1)) {
    throw new RangeError(`solveKepler: eccentricity ${eccentricity} must be in [0, 1) (or slightly negative: Note 4)`);
  }
  if (!Number.isFinite(meanAnomalyRad)) {
    throw new RangeError(`solveKepler: meanAnomalyRad ${meanAnomalyRad} must be finite`);
  }
  if (eccentricity === 0) return meanAnomalyRad;
  const revolutions = Math.floor((meanAnomalyRad + Math.PI) / TWO_PI);
  const m = meanAnomalyRad - revolutions * TWO_PI; // Note 1
  let e = m + 0.85 * eccentricity * Math.sign(Math.sin(m)); // Note 2: Danby 1988 §6.6
  for (let i = 0; i < MAX_ITERATIONS; i += 1) {
    const sinE = Math.sin(e);
    const f = e - eccentricity * sinE - m; // Kepler's equation
    const fPrime = 1 - eccentricity * Math.cos(e);
    const fSecond = eccentricity * sinE;
    const step = f / (fPrime - (0.5 * f * fSecond) / fPrime); // Halley's method
    e -= step;
    if (Math.abs(step) <= TOLERANCE_RAD) break;
  }
  e -= (e - eccentricity * Math.sin(e) - m) / (1 - eccentricity * Math.cos(e)); // Note 3: Newton polish
  return e + revolutions * TWO_PI;
}

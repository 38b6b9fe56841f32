/**
 * Damour–Deruelle orbit delay of a pulsar in a relativistic binary: Roemer,
 * Einstein and Shapiro delays with the post-Keplerian parameters, through the
 * inverse timing formula.
 */
import { solveKepler } from './kepler-equation';
import type { BarycentricDays, OrbitCount } from './barycentric-days';
import { epochOffsetDays, orbitCountAt } from './barycentric-days';
import { DAYS_PER_JULIAN_YEAR } from '../delays/physical-constants';
import type { DoubleDouble } from '../time/epoch';
import type { DamourDeruelleCompanion } from '../model/timing-model';

const TWO_PI = 2 * Math.PI;
const RAD_PER_DEG = Math.PI / 180;
const SECONDS_PER_DAY = 86_400;

/** Per-companion constants of the delay (computed once, shared with the partials). */
export interface DamourDeruelleConstants {
  epochDays: DoubleDouble; // T₀ − reference, days
  rootOneMinusE2: number; // √(1 − e²)
  trueAnomalyBeta: number; // e / (1 + √(1 − e²)) (Note 2)
  advancePerTrueAnomaly: number; // k = ω̇·Pb/(2π), dimensionless (Note 3)
}

/** Per-TOA quantities of the delay (one reused object; the partials read them too). */
export interface DamourDeruelleState {
  elapsedDays: number; // t − T₀
  u: number; // eccentric anomaly, rad (Note 1)
  sinU: number;
  cosU: number;
  g: number; // 1 − e cos u
  trueAnomaly: number; // A_e(u) counted from T₀ including whole orbits, rad (Note 2)
  sinW: number;
  cosW: number;
  meanMotion: number; // n = 2π/Pb(t), rad/s
  alpha: number; // x sin ω
  betaPlusGamma: number; // x √(1−e²) cos ω + γ
  D: number; // Roemer + Einstein at the arrival time, s (Note 4)
  Du: number; // dD/du
  Duu: number; // d²D/du²
  Dt: number; // dD/dt (dimensionless)
  Dtt: number; // d²D/dt², 1/s
  inverseFactor: number; // 1 − Dt + Dt² + ½·D·Dtt (Note 5)
  shapiroShapeTerm: number; // H = sin ω (cos u − e) + √(1−e²) cos ω sin u
  shapiroArgument: number; // L = 1 − e cos u − s·H (Note 6)
}

/** A fresh state object for damourDeruelleStateAt. */
export function emptyDamourDeruelleState(): DamourDeruelleState {
  return {
    elapsedDays: 0, u: 0, sinU: 0, cosU: 0, g: 1, trueAnomaly: 0, sinW: 0, cosW: 1, meanMotion: 0, alpha: 0, betaPlusGamma: 0,
    D: 0, Du: 0, Duu: 0, Dt: 0, Dtt: 0, inverseFactor: 1, shapiroShapeTerm: 0, shapiroArgument: 1,
  };
}

/** The per-companion constants (see DamourDeruelleConstants). */
export function damourDeruelleConstants(c: DamourDeruelleCompanion, days: BarycentricDays): DamourDeruelleConstants {
  const e = c.eccentricity;
  const rootOneMinusE2 = Math.sqrt(1 - e * e);
  const omegaDotRadPerDay = (c.periastronAdvanceDegPerYr * RAD_PER_DEG) / DAYS_PER_JULIAN_YEAR;
  return {
    epochDays: epochOffsetDays(c.periastronEpochMjd, days.reference),
    rootOneMinusE2,
    trueAnomalyBeta: e / (1 + rootOneMinusE2),
    advancePerTrueAnomaly: (omegaDotRadPerDay * c.periodDays) / TWO_PI, // k = ω̇/n: Damour & Deruelle 1986
  };
}

/**
 * Fills `st` with the per-TOA quantities of the delay at sample i (see addDamourDeruelleDelayS).
 *
 * @param c      the companion
 * @param k      damourDeruelleConstants(c, days)
 * @param days   barycentric days
 * @param i      sample index
 * @param count  reused orbit-count scratch object
 * @param st     reused state object, filled in place
 */
export function damourDeruelleStateAt(
  c: DamourDeruelleCompanion,
  k: DamourDeruelleConstants,
  days: BarycentricDays,
  i: number,
  count: OrbitCount,
  st: DamourDeruelleState,
): DamourDeruelleState {
  const { eccentricity: e, periodDays: pb, periodDerivative: periodRate, projectedSemimajorAxisLtS: x } = c;
  orbitCountAt(days, i, k.epochDays, pb, count);
  const t = count.elapsedDays;
  const meanAnomaly = TWO_PI * (count.fractionalOrbits - 0.5 * periodRate * (t / pb) ** 2); // Note 1: Damour & Deruelle 1986
  const u = solveKepler(meanAnomaly, e);
  const sinU = Math.sin(u);
  const cosU = Math.cos(u);
  const g = 1 - e * cosU;
  // ν − u = 2 atan(β sin u/(1 − β cos u)), continuous in u (Broucke & Cefola 1973, Celest. Mech. 7, 388, from memory)
  const trueAnomaly = TWO_PI * count.wholeOrbits + u + 2 * Math.atan2(k.trueAnomalyBeta * sinU, 1 - k.trueAnomalyBeta * cosU);
  const omega = c.periastronLongitudeDeg * RAD_PER_DEG + k.advancePerTrueAnomaly * trueAnomaly; // ω = ω₀ + k·A_e(u): Damour & Deruelle 1986
  const sinW = Math.sin(omega);
  const cosW = Math.cos(omega);
  const alpha = x * sinW;
  const betaPlusGamma = x * k.rootOneMinusE2 * cosW + c.einsteinDelayS;
  const meanMotion = TWO_PI / ((pb + periodRate * t) * SECONDS_PER_DAY);
  const D = alpha * (cosU - e) + betaPlusGamma * sinU; // Roemer + Einstein γ sin u: Damour & Deruelle 1986
  const Du = -alpha * sinU + betaPlusGamma * cosU;
  const Duu = -alpha * cosU - betaPlusGamma * sinU;
  const Dt = (meanMotion * Du) / g; // du/dt = n/(1 − e cos u) from Kepler's equation
  const Dtt = meanMotion * meanMotion * (Duu / (g * g) - (e * sinU * Du) / (g * g * g));
  const H = sinW * (cosU - e) + k.rootOneMinusE2 * cosW * sinU;
  st.elapsedDays = t;
  st.u = u;
  st.sinU = sinU;
  st.cosU = cosU;
  st.g = g;
  st.trueAnomaly = trueAnomaly;
  st.sinW = sinW;
  st.cosW = cosW;
  st.meanMotion = meanMotion;
  st.alpha = alpha;
  st.betaPlusGamma = betaPlusGamma;
  st.D = D;
  st.Du = Du;
  st.Duu = Duu;
  st.Dt = Dt;
  st.Dtt = Dtt;
  st.inverseFactor = 1 - Dt + Dt * Dt + 0.5 * D * Dtt; // inverse timing formula: Damour & Deruelle 1986
  st.shapiroShapeTerm = H;
  st.shapiroArgument = g - c.shapiroShape * H; // Shapiro: Damour & Deruelle 1986
  return st;
}

/**
 * Damour–Deruelle orbit delay for each barycentric time, added into `out`.
 *
 * @param companion  Pb (days), x (lt-s), e, ω₀ (deg), T₀ (TDB MJD), Ṗb (dimensionless), ω̇ (deg/yr),
 *                   γ (s), Shapiro range r = T☉·m_c (s) and shape s = sin i
 * @param days       barycentric arrival times (TDB) as days since a reference
 * @param out        seconds; the delay is ADDED to out[i]
 *
 * Notes: 1. u − e sin u = M, M = 2π[(t−T₀)/Pb − ½Ṗb((t−T₀)/Pb)²], the orbit counted in double-double
 *           (whole orbits + fraction, barycentric-days.ts) before 2π is applied.
 *        2. True anomaly A_e(u) = 2 atan[√((1+e)/(1−e)) tan(u/2)] (Damour & Deruelle 1986), evaluated as
 *           u + 2 atan2(β sin u, 1 − β cos u), β = e/(1 + √(1−e²)), plus 2π per whole orbit since T₀,
 *           so it grows continuously.
 *        3. ω = ω₀ + k·A_e(u), k = ω̇·Pb/(2π): the periastron advances with the true anomaly, not
 *           linearly in time as in the keplerian kind (Damour & Deruelle 1986).
 *        4. D = x sin ω (cos u − e) + [x √(1−e²) cos ω + γ] sin u: Roemer plus Einstein delay
 *           (Damour & Deruelle 1986), with e_r = e_θ = e (no δ_r, δ_θ) and constant x and e.
 *        5. Inverse timing formula (Damour & Deruelle 1986): Δ_RE = D·[1 − D' + D'² + ½·D·D''],
 *           derivatives with respect to time (du/dt = n/(1 − e cos u), n = 2π/Pb(t)); this is the
 *           series solution of t_arrival = t_emission + D(t_emission) to second order in n·x.
 *        6. Shapiro delay Δ_S = −2r ln{1 − e cos u − s[sin ω (cos u − e) + √(1−e²) cos ω sin u]}
 *           (Damour & Deruelle 1986), at the arrival time. The argument equals
 *           (1 − e cos u)(1 − s sin(ω + A_e)) > 0 for |s| < 1; |s| > 1 (only inside a fit step) can
 *           make it ≤ 0, giving a non-finite delay that the fit treats as a χ² rise.
 *        7. The aberration terms A and B of Damour & Deruelle 1986 are taken as zero: their effect is
 *           largely absorbed into x and e (Damour & Deruelle 1986), and they are not model parameters.
 * Accuracy: the next term of the inverse series is ~x·(2πx/Pb)³ (e.g. 3e-8 s for x = 3 lt-s,
 *           Pb = 0.1 d); compared with an iterated emission-time solution in
 *           tests/engine/orbits/damour-deruelle-delay.test.ts. Assumes e < 1.
 * References: Damour & Deruelle 1986, Ann. Inst. H. Poincaré (Phys. Théor.) 44, 263;
 *             Blandford & Teukolsky 1976, ApJ 205, 580 (the first-order form).
 */
export function addDamourDeruelleDelayS(companion: DamourDeruelleCompanion, days: BarycentricDays, out: Float64Array): void {
  const k = damourDeruelleConstants(companion, days);
  const count: OrbitCount = { wholeOrbits: 0, fractionalOrbits: 0, elapsedDays: 0 };
  const st = emptyDamourDeruelleState();
  const r = companion.shapiroRangeS;
  for (let i = 0; i < out.length; i += 1) {
    damourDeruelleStateAt(companion, k, days, i, count, st);
    const shapiro = r === 0 ? 0 : -2 * r * Math.log(st.shapiroArgument); // Note 6
    out[i] += st.D * st.inverseFactor + shapiro;
  }
}

/**
 * Analytic partial derivatives of one companion's orbit delay with respect to
 * its parameters (and to time), in one pass over the TOAs.
 */
import type { Companion, DamourDeruelleCompanion, KeplerianCompanion, LowEccentricityCompanion } from '../model/timing-model';
import { TimingInputError } from '../engine-error';
import { DAYS_PER_JULIAN_YEAR } from '../delays/physical-constants';
import type { BarycentricDays, OrbitCount } from './barycentric-days';
import { epochOffsetDays, orbitCountAt } from './barycentric-days';
import { solveKepler } from './kepler-equation';
import type { DamourDeruelleState } from './damour-deruelle-delay';
import { damourDeruelleConstants, damourDeruelleStateAt, emptyDamourDeruelleState } from './damour-deruelle-delay';

const TWO_PI = 2 * Math.PI;
const RAD_PER_DEG = Math.PI / 180;
const SECONDS_PER_DAY = 86_400;

/** The key for ∂Δ/∂t (seconds of delay per second of barycentric time). */
export const TIME_RATE_KEY = 'time';

/**
 * ∂Δ/∂p for each requested key of `companion`, per TOA.
 *
 * @param companion  an enabled or disabled companion (disabled: all zeros)
 * @param days       barycentric arrival times as days since a reference
 * @param keys       file keys (period_days, projected_semimajor_axis_lt_s, eccentricity,
 *                   periastron_longitude_deg, periastron_epoch_mjd, period_derivative,
 *                   periastron_advance_deg_per_yr, einstein_delay_s; for low-eccentricity
 *                   ascending_node_epoch_mjd, e_sin_omega, e_cos_omega; for damour-deruelle also
 *                   shapiro_range_s, shapiro_shape) or TIME_RATE_KEY
 * @returns          one Float64Array per key: seconds per unit of the parameter (days for periods
 *                   and epochs, degrees, deg/yr, lt-s, s; dimensionless for e, η, κ, Ṗb)
 *
 * Notes: 1. Chain rule through the delay formulas of blandford-teukolsky-delay.ts
 *           (Δ = D·C, D = α(cos E − e) + (β+γ) sin E, C = 1 − n(β cos E − α sin E)/(1 − e cos E))
 *           and low-eccentricity-delay.ts (Δ = R·(1 − n·dR/dΦ)), with ∂E/∂M = 1/(1 − e cos E) and
 *           ∂E/∂e = sin E/(1 − e cos E) from Kepler's equation; and damour-deruelle-delay.ts
 *           (Δ = D·P − 2r ln L, P = 1 − D' + D'² + ½DD''), through u, e, ω, x, γ, n, r and s, with
 *           ∂A_e/∂u = √(1−e²)/(1 − e cos u) and ∂A_e/∂e = sin u/(√(1−e²)(1 − e cos u)) for the true anomaly.
 *        2. The delay depends on t − T₀ only, so ∂Δ/∂t = −∂Δ/∂T₀ (per second).
 * Accuracy: exact derivatives of the implemented delays (agree with numeric differences to
 *           ≤ 1e-6 relative: tests/engine/pipeline/timing-residuals.test.ts).
 *           Damour–Deruelle: tests/engine/orbits/damour-deruelle-partials.test.ts.
 * References: Blandford & Teukolsky 1976, ApJ 205, 580; Lange et al. 2001, MNRAS 326, 274;
 *             Damour & Deruelle 1986, Ann. Inst. H. Poincaré (Phys. Théor.) 44, 263.
 */
export function companionDelayPartials(companion: Companion, days: BarycentricDays, keys: readonly string[]): Float64Array[] {
  const out = keys.map(() => new Float64Array(days.hi.length));
  if (!companion.enabled) return out;
  if (companion.kind === 'keplerian') keplerianPartials(companion, days, keys, out);
  else if (companion.kind === 'low-eccentricity') lowEccentricityPartials(companion, days, keys, out);
  else if (companion.kind === 'damour-deruelle') damourDeruellePartials(companion, days, keys, out);
  else {
    const unknown: never = companion;
    throw new TimingInputError(`companion kind ${String((unknown as Companion).kind)} is not known`);
  }
  return out;
}

function keyIndex(keys: readonly string[], key: string): number {
  return keys.indexOf(key);
}

/** Per-TOA quantities of the Keplerian delay shared by all its partials (reused, no allocation). */
const keplerianState = { D: 0, q: 0, C: 0, n: 0, alpha: 0, cosEMinusE: 0, sinE: 0, dDdE: 0, dqdE: 0, dqdAlpha: 0, dqdBeta: 0, dqdEExplicit: 0 };

/** ∂Δ from the changes of E, α, β, γ, the explicit e and n, for Δ = D·C (Note 1). */
function keplerianCombine(st: typeof keplerianState, dE: number, dAlpha: number, dBeta: number, dGamma: number, dEcc: number, dN: number): number {
  const dD = st.dDdE * dE + st.cosEMinusE * dAlpha + st.sinE * (dBeta + dGamma) - st.alpha * dEcc;
  const dq = st.dqdE * dE + st.dqdAlpha * dAlpha + st.dqdBeta * dBeta + st.dqdEExplicit * dEcc;
  return dD * st.C + st.D * (-dN * st.q - st.n * dq);
}

function keplerianPartials(c: KeplerianCompanion, days: BarycentricDays, keys: readonly string[], out: Float64Array[]): void {
  const epochDays = epochOffsetDays(c.periastronEpochMjd, days.reference);
  const { projectedSemimajorAxisLtS: x, eccentricity: e, periodDays: pb, periodDerivative: periodRate, einsteinDelayS: gamma } = c;
  const rootE = Math.sqrt(1 - e * e);
  const omegaDotRadPerDay = (c.periastronAdvanceDegPerYr * RAD_PER_DEG) / DAYS_PER_JULIAN_YEAR;
  const k = {
    x: keyIndex(keys, 'projected_semimajor_axis_lt_s'), e: keyIndex(keys, 'eccentricity'), om: keyIndex(keys, 'periastron_longitude_deg'),
    t0: keyIndex(keys, 'periastron_epoch_mjd'), pb: keyIndex(keys, 'period_days'), periodRate: keyIndex(keys, 'period_derivative'),
    advance: keyIndex(keys, 'periastron_advance_deg_per_yr'), gamma: keyIndex(keys, 'einstein_delay_s'), time: keyIndex(keys, TIME_RATE_KEY),
  };
  const count: OrbitCount = { wholeOrbits: 0, fractionalOrbits: 0, elapsedDays: 0 };
  for (let i = 0; i < days.hi.length; i += 1) {
    orbitCountAt(days, i, epochDays, pb, count);
    const t = count.elapsedDays;
    const meanAnomaly = TWO_PI * (count.fractionalOrbits - 0.5 * periodRate * (t / pb) ** 2); // as blandford-teukolsky-delay.ts
    const omega = c.periastronLongitudeDeg * RAD_PER_DEG + omegaDotRadPerDay * t;
    const E = solveKepler(meanAnomaly, e);
    const sinE = Math.sin(E);
    const cosE = Math.cos(E);
    const sinW = Math.sin(omega);
    const cosW = Math.cos(omega);
    const alpha = x * sinW;
    const beta = x * rootE * cosW;
    const oneMinusECosE = 1 - e * cosE;
    const periodNowDays = pb + periodRate * t;
    const n = TWO_PI / (periodNowDays * SECONDS_PER_DAY);
    const st = keplerianState;
    st.D = alpha * (cosE - e) + (beta + gamma) * sinE;
    st.q = (beta * cosE - alpha * sinE) / oneMinusECosE;
    st.C = 1 - n * st.q;
    st.n = n;
    st.alpha = alpha;
    st.cosEMinusE = cosE - e;
    st.sinE = sinE;
    // partials of D and q with respect to E, α, β, γ and the explicit e (Note 1)
    st.dDdE = -alpha * sinE + (beta + gamma) * cosE;
    st.dqdE = ((-beta * sinE - alpha * cosE) * oneMinusECosE - (beta * cosE - alpha * sinE) * e * sinE) / (oneMinusECosE * oneMinusECosE);
    st.dqdAlpha = -sinE / oneMinusECosE;
    st.dqdBeta = cosE / oneMinusECosE;
    st.dqdEExplicit = ((beta * cosE - alpha * sinE) * cosE) / (oneMinusECosE * oneMinusECosE);
    const combine = keplerianCombine;
    const dEdM = 1 / oneMinusECosE; // Kepler's equation
    // ω depends on T₀ through ω̇·(t − T₀); M and n through t − T₀
    const dMdT0 = TWO_PI * (-1 / pb + (periodRate * t) / (pb * pb));
    const dOmegadT0 = -omegaDotRadPerDay;
    const dNdT0 = (n * periodRate) / periodNowDays;
    const dT0 = combine(st, dEdM * dMdT0, x * cosW * dOmegadT0, -x * rootE * sinW * dOmegadT0, 0, 0, dNdT0);
    if (k.t0 >= 0) out[k.t0][i] = dT0;
    if (k.time >= 0) out[k.time][i] = -dT0 / SECONDS_PER_DAY; // Note 2
    if (k.x >= 0) out[k.x][i] = combine(st, 0, sinW, rootE * cosW, 0, 0, 0);
    if (k.e >= 0) out[k.e][i] = combine(st, sinE / oneMinusECosE, 0, rootE > 0 ? (-x * e * cosW) / rootE : 0, 0, 1, 0);
    if (k.om >= 0) out[k.om][i] = combine(st, 0, x * cosW * RAD_PER_DEG, -x * rootE * sinW * RAD_PER_DEG, 0, 0, 0);
    if (k.pb >= 0) out[k.pb][i] = combine(st, dEdM * TWO_PI * (-t / (pb * pb) + (periodRate * t * t) / pb ** 3), 0, 0, 0, 0, -n / periodNowDays);
    if (k.periodRate >= 0) out[k.periodRate][i] = combine(st, dEdM * -Math.PI * (t / pb) ** 2, 0, 0, 0, 0, (-n * t) / periodNowDays);
    if (k.advance >= 0) {
      const dOmega = (RAD_PER_DEG * t) / DAYS_PER_JULIAN_YEAR;
      out[k.advance][i] = combine(st, 0, x * cosW * dOmega, -x * rootE * sinW * dOmega, 0, 0, 0);
    }
    if (k.gamma >= 0) out[k.gamma][i] = combine(st, 0, 0, 0, 1, 0, 0);
  }
}

/** Per-TOA quantities of the low-eccentricity delay shared by its partials. */
const lowEccentricityState = { R: 0, S: 0, n: 0, xCurvature: 0 };

/** ∂Δ for Δ = R(1 − nS): dΔ = dR(1 − nS) − R(dn·S + n·dS), R and S moving with Φ too (Note 1). */
function lowEccentricityCombine(st: typeof lowEccentricityState, dPhi: number, dR: number, dS: number, dN: number): number {
  return (dR + st.S * dPhi) * (1 - st.n * st.S) - st.R * (dN * st.S + st.n * (dS + st.xCurvature * dPhi));
}

function lowEccentricityPartials(c: LowEccentricityCompanion, days: BarycentricDays, keys: readonly string[], out: Float64Array[]): void {
  const epochDays = epochOffsetDays(c.ascendingNodeEpochMjd, days.reference);
  const { projectedSemimajorAxisLtS: x, eSinOmega: eta, eCosOmega: kappa, periodDays: pb, periodDerivative: periodRate } = c;
  const k = {
    x: keyIndex(keys, 'projected_semimajor_axis_lt_s'), eta: keyIndex(keys, 'e_sin_omega'), kappa: keyIndex(keys, 'e_cos_omega'),
    tasc: keyIndex(keys, 'ascending_node_epoch_mjd'), pb: keyIndex(keys, 'period_days'), periodRate: keyIndex(keys, 'period_derivative'), time: keyIndex(keys, TIME_RATE_KEY),
  };
  const count: OrbitCount = { wholeOrbits: 0, fractionalOrbits: 0, elapsedDays: 0 };
  for (let i = 0; i < days.hi.length; i += 1) {
    orbitCountAt(days, i, epochDays, pb, count);
    const t = count.elapsedDays;
    const phi = TWO_PI * (count.fractionalOrbits - 0.5 * periodRate * (t / pb) ** 2); // as low-eccentricity-delay.ts
    const s1 = Math.sin(phi);
    const c1 = Math.cos(phi);
    const s2 = 2 * s1 * c1;
    const c2 = c1 * c1 - s1 * s1;
    const shape = s1 + 0.5 * kappa * s2 - 0.5 * eta * c2; // R/x
    const slope = c1 + kappa * c2 + eta * s2; // (dR/dΦ)/x
    const curvature = -s1 - 2 * kappa * s2 + 2 * eta * c2; // (d²R/dΦ²)/x
    const periodNowDays = pb + periodRate * t;
    const n = TWO_PI / (periodNowDays * SECONDS_PER_DAY);
    const R = x * shape;
    const S = x * slope;
    // Δ = R(1 − nS): dΔ = dR(1 − nS) − R(dn·S + n·dS), with R, S depending on Φ, x, η, κ (Note 1)
    const st = lowEccentricityState;
    st.R = R;
    st.S = S;
    st.n = n;
    st.xCurvature = x * curvature;
    const combine = lowEccentricityCombine;
    const dTasc = combine(st, TWO_PI * (-1 / pb + (periodRate * t) / (pb * pb)), 0, 0, (n * periodRate) / periodNowDays);
    if (k.tasc >= 0) out[k.tasc][i] = dTasc;
    if (k.time >= 0) out[k.time][i] = -dTasc / SECONDS_PER_DAY; // Note 2
    if (k.x >= 0) out[k.x][i] = combine(st, 0, shape, slope, 0);
    if (k.eta >= 0) out[k.eta][i] = combine(st, 0, -0.5 * x * c2, x * s2, 0);
    if (k.kappa >= 0) out[k.kappa][i] = combine(st, 0, 0.5 * x * s2, x * c2, 0);
    if (k.pb >= 0) out[k.pb][i] = combine(st, TWO_PI * (-t / (pb * pb) + (periodRate * t * t) / pb ** 3), 0, 0, -n / periodNowDays);
    if (k.periodRate >= 0) out[k.periodRate][i] = combine(st, -Math.PI * (t / pb) ** 2, 0, 0, (-n * t) / periodNowDays);
  }
}

/** Constants of one Damour–Deruelle companion used by its combine step. */
interface DamourDeruelleCombineConstants { x: number; e: number; rootE: number; r: number; s: number }

/**
 * ∂Δ of the Damour–Deruelle delay from the changes of its primitive quantities: eccentric anomaly u,
 * explicit e, ω (rad), x, γ, n (rad/s), r and s (Note 1). Δ = D·P − 2r ln L with
 * D = α(cos u − e) + B sin u, α = x sin ω, B = x√(1−e²) cos ω + γ, D' = nD_u/g, D'' = n²Q,
 * Q = D_uu/g² − (e sin u)D_u/g³, g = 1 − e cos u, P = 1 − D' + D'² + ½DD'', L = g − sH.
 */
function damourDeruelleCombine(
  st: DamourDeruelleState, c: DamourDeruelleCombineConstants,
  du: number, de: number, dOmega: number, dx: number, dGamma: number, dN: number, dr: number, ds: number,
): number {
  const { x, e, rootE } = c;
  const { sinU, cosU, sinW, cosW, g, meanMotion: n, D, Du, Duu } = st;
  const dAlpha = sinW * dx + x * cosW * dOmega;
  const dB = rootE * cosW * dx - x * rootE * sinW * dOmega + (rootE > 0 ? (-x * e * cosW * de) / rootE : 0) + dGamma;
  const dD = Du * du - st.alpha * de + (cosU - e) * dAlpha + sinU * dB;
  const dDu = Duu * du - sinU * dAlpha + cosU * dB;
  const dDuu = -Du * du - cosU * dAlpha - sinU * dB;
  const dg = e * sinU * du - cosU * de;
  const w = e * sinU;
  const dw = e * cosU * du + sinU * de;
  const dDt = (dN * Du + n * dDu - st.Dt * dg) / g;
  const g2 = g * g;
  const g3 = g2 * g;
  const q = Duu / g2 - (w * Du) / g3;
  const dq = dDuu / g2 - (2 * Duu * dg) / g3 - (dw * Du + w * dDu) / g3 + (3 * w * Du * dg) / (g3 * g);
  const dDtt = 2 * n * dN * q + n * n * dq;
  const dP = -dDt + 2 * st.Dt * dDt + 0.5 * (dD * st.Dtt + D * dDtt);
  const dRoemerEinstein = dD * st.inverseFactor + D * dP;
  const dH = (-sinW * sinU + rootE * cosW * cosU) * du + (cosW * (cosU - e) - rootE * sinW * sinU) * dOmega
    + (-sinW - (rootE > 0 ? (e * cosW * sinU) / rootE : 0)) * de;
  const dL = dg - c.s * dH - st.shapiroShapeTerm * ds;
  const dShapiro = (dr === 0 ? 0 : -2 * Math.log(st.shapiroArgument) * dr) - (c.r === 0 ? 0 : (2 * c.r * dL) / st.shapiroArgument);
  return dRoemerEinstein + dShapiro;
}

function damourDeruellePartials(c: DamourDeruelleCompanion, days: BarycentricDays, keys: readonly string[], out: Float64Array[]): void {
  const constants = damourDeruelleConstants(c, days);
  const { eccentricity: e, periodDays: pb, periodDerivative: periodRate } = c;
  const rootE = constants.rootOneMinusE2;
  const kAdvance = constants.advancePerTrueAnomaly;
  const cc: DamourDeruelleCombineConstants = { x: c.projectedSemimajorAxisLtS, e, rootE, r: c.shapiroRangeS, s: c.shapiroShape };
  const k = {
    x: keyIndex(keys, 'projected_semimajor_axis_lt_s'), e: keyIndex(keys, 'eccentricity'), om: keyIndex(keys, 'periastron_longitude_deg'),
    t0: keyIndex(keys, 'periastron_epoch_mjd'), pb: keyIndex(keys, 'period_days'), periodRate: keyIndex(keys, 'period_derivative'),
    advance: keyIndex(keys, 'periastron_advance_deg_per_yr'), gamma: keyIndex(keys, 'einstein_delay_s'),
    range: keyIndex(keys, 'shapiro_range_s'), shape: keyIndex(keys, 'shapiro_shape'), time: keyIndex(keys, TIME_RATE_KEY),
  };
  const count: OrbitCount = { wholeOrbits: 0, fractionalOrbits: 0, elapsedDays: 0 };
  const st = emptyDamourDeruelleState();
  const combine = damourDeruelleCombine;
  for (let i = 0; i < days.hi.length; i += 1) {
    damourDeruelleStateAt(c, constants, days, i, count, st);
    const t = st.elapsedDays;
    const g = st.g;
    const dTrueAnomalyDu = rootE / g; // dA_e/du (Note 1)
    const dTrueAnomalyDe = rootE > 0 ? st.sinU / (rootE * g) : 0; // ∂A_e/∂e at fixed u (Note 1)
    const periodNowDays = pb + periodRate * t;
    const n = st.meanMotion;
    // a change dM of the mean anomaly moves u by dM/g, and ω by k·(dA_e/du)·du
    const viaMeanAnomaly = (dM: number, dN: number, dk: number): number => {
      const du = dM / g;
      return combine(st, cc, du, 0, st.trueAnomaly * dk + kAdvance * dTrueAnomalyDu * du, 0, 0, dN, 0, 0);
    };
    const dT0 = viaMeanAnomaly(TWO_PI * (-1 / pb + (periodRate * t) / (pb * pb)), (n * periodRate) / periodNowDays, 0);
    if (k.t0 >= 0) out[k.t0][i] = dT0;
    if (k.time >= 0) out[k.time][i] = -dT0 / SECONDS_PER_DAY; // Note 2
    if (k.x >= 0) out[k.x][i] = combine(st, cc, 0, 0, 0, 1, 0, 0, 0, 0);
    if (k.e >= 0) {
      const du = st.sinU / g; // ∂u/∂e from Kepler's equation
      out[k.e][i] = combine(st, cc, du, 1, kAdvance * (dTrueAnomalyDu * du + dTrueAnomalyDe), 0, 0, 0, 0, 0);
    }
    if (k.om >= 0) out[k.om][i] = combine(st, cc, 0, 0, RAD_PER_DEG, 0, 0, 0, 0, 0);
    if (k.pb >= 0) out[k.pb][i] = viaMeanAnomaly(TWO_PI * (-t / (pb * pb) + (periodRate * t * t) / pb ** 3), -n / periodNowDays, kAdvance / pb);
    if (k.periodRate >= 0) out[k.periodRate][i] = viaMeanAnomaly(-Math.PI * (t / pb) ** 2, (-n * t) / periodNowDays, 0);
    if (k.advance >= 0) {
      const dk = (RAD_PER_DEG / DAYS_PER_JULIAN_YEAR) * (pb / TWO_PI); // ∂k/∂ω̇ per deg/yr
      out[k.advance][i] = combine(st, cc, 0, 0, st.trueAnomaly * dk, 0, 0, 0, 0, 0);
    }
    if (k.gamma >= 0) out[k.gamma][i] = combine(st, cc, 0, 0, 0, 0, 1, 0, 0, 0);
    if (k.range >= 0) out[k.range][i] = combine(st, cc, 0, 0, 0, 0, 0, 0, 1, 0);
    if (k.shape >= 0) out[k.shape][i] = combine(st, cc, 0, 0, 0, 0, 0, 0, 0, 1);
  }
}

/**
 * An observatory's geocentric position and velocity in the GCRS from its ITRF
 * coordinates, with ERFA's IAU 2006/2000A (CIO-based) Earth orientation.
 *
 *   r_GCRS = C2Iᵀ · R3(−θ) · Wᵀ · r_ITRS
 *
 * with C2I the celestial-to-intermediate matrix (eraC2i06a: IAU 2006
 * precession, IAU 2000A nutation, frame bias), θ the Earth rotation angle of
 * UT1 and W the polar-motion matrix (eraPom00 from xp, yp and the TIO locator
 * s′). This is the product eraC2tcio forms (IERS Conventions 2010, eq. 5.1).
 *
 * Notes:
 * 1. Speed: eraC2i06a costs ~60 µs, so it is evaluated on a one-day grid of TT
 *    and interpolated with 8-point Lagrange polynomials (nutation's shortest
 *    periods are ~5 days); measured matrix-element error ≤ 2.1e-11, i.e. ≤ 0.14 mm for a
 *    6400 km radius (tests/engine/geometry/observatory-gcrs.test.ts). θ is
 *    evaluated per instant in closed form (IERS Conventions 2010, eq. 5.15).
 * 2. Without an Earth-orientation value UT1 = UTC and xp = yp = 0 (then
 *    W = R3(s′), which is kept: |s′| < 0.1 mas for centuries around 2000).
 * 3. Velocity = C2Iᵀ · (ω ẑ × R3(−θ) · Wᵀ · r_ITRS), ω the rate of θ
 *    (2π·1.00273781191135448 rad per UT1 day). Neglected: the rates of
 *    precession–nutation and polar motion (≲ 1e-4 m/s, v/c ~ 3e-13) and the UT1/TT rate
 *    difference (LOD excess, ~1e-8 relative).
 * Accuracy: as ERFA's IAU 2006/2000A model (~1 mas ≈ 3 cm at the surface for
 *   the nutation model's own error) once UT1 and polar motion are supplied;
 *   with UT1 = UTC the rotation error |UT1 − UTC| ≤ 0.9 s moves a site by up to
 *   ~420 m along its parallel (~1.4 µs of light time).
 */
import { erfaLibrary } from '../erfa/erfa-library';
import type { Mjd } from '../time/epoch';
import { UniformGridInterpolator } from '../time/uniform-grid-interpolator';

const MJD_ZERO_AS_JD = 2400000.5;
const J2000_MJD = 51544.5;
const DAYS_PER_JULIAN_CENTURY = 36_525;
const ARCSEC_TO_RAD = Math.PI / (180 * 3600);
const EARTH_ROTATION_RATE_REV_PER_UT1_DAY = 1.00273781191135448; // IERS Conventions 2010, eq. 5.15
export const EARTH_ROTATION_RATE_RAD_PER_S = (2 * Math.PI * EARTH_ROTATION_RATE_REV_PER_UT1_DAY) / 86_400;
const GRID_STEP_DAYS = 1;
const GRID_POINTS = 8;

export interface PolarMotion {
  xpRad: number;
  ypRad: number;
}

export interface GcrsState {
  positionM: [number, number, number];
  velocityMPerS: [number, number, number];
}

/**
 * Earth rotation angle, radians in [0, 2π), from UT1 as day + fraction.
 * θ = 2π(0.7790572732640 + 0.00273781191135448·Tu + frac(JD_UT1)), Tu = JD_UT1 − 2451545.0
 * (IERS Conventions 2010, eq. 5.15; as ERFA eraEra00, keeping the day fraction separate).
 */
export function earthRotationAngleRad(ut1: Mjd): number {
  const tu = ut1.day - J2000_MJD + (ut1.frac[1] + ut1.frac[0]);
  let dayFraction = (ut1.frac[1] + ut1.frac[0] + 0.5) % 1; // frac(JD) = frac(MJD + 0.5); MJD day is an integer
  if (dayFraction < 0) dayFraction += 1;
  const turns = dayFraction + 0.779057273264 + 0.00273781191135448 * tu; // IERS Conventions 2010, eq. 5.15
  const angle = 2 * Math.PI * (turns % 1);
  return angle < 0 ? angle + 2 * Math.PI : angle;
}

/** TIO locator s′ = −47 µas · t (t in Julian centuries of TT since J2000); IERS Conventions 2010, eq. 5.13. */
export function tioLocatorRad(tt: Mjd): number {
  const t = (tt.day - J2000_MJD + (tt.frac[1] + tt.frac[0])) / DAYS_PER_JULIAN_CENTURY;
  return -47e-6 * t * ARCSEC_TO_RAD;
}

/**
 * Evaluator over the precession–nutation grid (Note 1); the grid's nodes are
 * computed once per process and shared by all evaluators.
 */
// One grid per process: a node's matrix depends only on its date, so every evaluator shares it.
let sharedC2iGrid: UniformGridInterpolator | undefined;
function c2iGridOfProcess(): UniformGridInterpolator {
  sharedC2iGrid ??= new UniformGridInterpolator(GRID_STEP_DAYS, GRID_POINTS, 9, (nodeMjd, out) => {
    erfaLibrary().eraC2i06a(MJD_ZERO_AS_JD, nodeMjd, out);
  });
  return sharedC2iGrid;
}

export class ObservatoryGcrsEvaluator {
  private readonly c2iGrid = c2iGridOfProcess();
  private readonly c2i = new Float64Array(9);
  private readonly pom = new Float64Array(9);

  /** Number of eraC2i06a calls so far in this process (the grid is shared). */
  get erfaCallCount(): number {
    return this.c2iGrid.evaluatedNodeCount;
  }

  /** The interpolated celestial-to-intermediate matrix (row-major) at `tt`. */
  celestialToIntermediate(tt: Mjd, out: Float64Array): void {
    this.c2iGrid.evaluate(tt, out);
  }

  /**
   * GCRS position (m) and velocity (m/s) of an ITRF site.
   *
   * @param itrfM   [x, y, z] ITRF geocentric coordinates, metres
   * @param tt      the instant in TT (precession–nutation argument)
   * @param ut1     the same instant in UT1 (rotation argument; = UTC by default, Note 2)
   * @param polar   polar motion, radians; omitted = none (Note 2)
   */
  state(itrfM: readonly [number, number, number], tt: Mjd, ut1: Mjd, polar?: PolarMotion): GcrsState {
    const out = new Float64Array(6);
    this.stateInto(itrfM, tt, ut1, polar, out);
    return { positionM: [out[0], out[1], out[2]], velocityMPerS: [out[3], out[4], out[5]] };
  }

  /** As `state`, written to out[0..2] (position, m) and out[3..5] (velocity, m/s) without allocating. */
  stateInto(itrfM: readonly [number, number, number], tt: Mjd, ut1: Mjd, polar: PolarMotion | undefined, out: Float64Array): void {
    const c = this.c2i;
    this.c2iGrid.evaluate(tt, c);
    const sp = tioLocatorRad(tt);
    let theta = earthRotationAngleRad(ut1);
    let wx = itrfM[0];
    let wy = itrfM[1];
    let wz = itrfM[2];
    if (polar === undefined) {
      theta += sp; // W = R3(s′) when xp = yp = 0 (ERFA pom00), so it only adds to θ
    } else {
      const w = this.pom;
      erfaLibrary().eraPom00(polar.xpRad, polar.ypRad, sp, w);
      const x = itrfM[0];
      const y = itrfM[1];
      const z = itrfM[2];
      wx = w[0] * x + w[3] * y + w[6] * z; // Wᵀ · r
      wy = w[1] * x + w[4] * y + w[7] * z;
      wz = w[2] * x + w[5] * y + w[8] * z;
    }
    const cosT = Math.cos(theta);
    const sinT = Math.sin(theta);
    const qx = cosT * wx - sinT * wy; // R3(−θ) · w
    const qy = sinT * wx + cosT * wy;
    const qz = wz;
    const vx = -EARTH_ROTATION_RATE_RAD_PER_S * qy; // ω ẑ × q (Note 3)
    const vy = EARTH_ROTATION_RATE_RAD_PER_S * qx;
    out[0] = c[0] * qx + c[3] * qy + c[6] * qz; // C2Iᵀ · q
    out[1] = c[1] * qx + c[4] * qy + c[7] * qz;
    out[2] = c[2] * qx + c[5] * qy + c[8] * qz;
    out[3] = c[0] * vx + c[3] * vy; // C2Iᵀ · (ω ẑ × q), Note 3
    out[4] = c[1] * vx + c[4] * vy;
    out[5] = c[2] * vx + c[5] * vy;
  }
}

/**
 * The same GCRS position straight from ERFA (eraC2t06a, ~75 µs per call), for
 * checks: r_GCRS = C2Tᵀ · r_ITRS.
 *
 * @param tt, ut1  two-part instants as in ObservatoryGcrsEvaluator.state
 */
export function observatoryGcrsPositionDirect(itrfM: readonly [number, number, number], tt: Mjd, ut1: Mjd, polar?: PolarMotion): [number, number, number] {
  const m = new Float64Array(9);
  erfaLibrary().eraC2t06a(
    MJD_ZERO_AS_JD,
    tt.day + (tt.frac[1] + tt.frac[0]),
    MJD_ZERO_AS_JD + tt.day,
    ut1.day - tt.day + (ut1.frac[1] + ut1.frac[0]),
    polar?.xpRad ?? 0,
    polar?.ypRad ?? 0,
    m,
  );
  const [x, y, z] = itrfM;
  return [m[0] * x + m[3] * y + m[6] * z, m[1] * x + m[4] * y + m[7] * z, m[2] * x + m[5] * y + m[8] * z];
}

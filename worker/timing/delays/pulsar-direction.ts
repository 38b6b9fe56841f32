/**
 * The unit vector from the solar-system barycentre toward the pulsar at a
 * given time, with proper motion applied linearly in right ascension and
 * declination.
 */
import { RAD_PER_MAS } from './physical-constants';

export interface PulsarAstrometry {
  raRad: number;
  decRad: number;
  pmRaCosDecMasPerYr: number;
  pmDecMasPerYr: number;
}

/** Position on the sky at one time: angles plus the direction and its two tangent vectors. */
export interface SkyDirection {
  raRad: number;
  decRad: number;
  /** n̂ toward the pulsar, ICRF axes. */
  x: number;
  y: number;
  z: number;
}

/**
 * Propagated sky position and direction of the pulsar.
 *
 * @param astrometry       ICRS position at the model epoch (rad) and proper motion (mas/yr; RA term × cos δ)
 * @param yearsSinceEpoch  Julian years (365.25 d) of TDB since the model epoch
 * @param out              reused result object (avoids allocation in loops)
 * @returns                `out`, filled
 *
 * Notes: 1. Linear propagation on the sky: α(t) = α₀ + μ_α*·t / cos δ₀, δ(t) = δ₀ + μ_δ·t
 *           (first order in μt; radial velocity and the second-order terms of the
 *           spherical geometry are neglected, ≤ (μt)²·tan δ ~ 1e-10 rad over decades
 *           for 100 mas/yr). Not valid within a few arcseconds of a celestial pole.
 *        2. n̂ = (cos δ cos α, cos δ sin α, sin δ) (standard spherical → Cartesian).
 * References: Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, ch. 8 (proper motion).
 */
export function pulsarDirection(astrometry: PulsarAstrometry, yearsSinceEpoch: number, out: SkyDirection): SkyDirection {
  const cosDec0 = Math.cos(astrometry.decRad);
  const raRad = astrometry.raRad + (astrometry.pmRaCosDecMasPerYr * RAD_PER_MAS * yearsSinceEpoch) / cosDec0; // Note 1
  const decRad = astrometry.decRad + astrometry.pmDecMasPerYr * RAD_PER_MAS * yearsSinceEpoch; // Note 1
  const cosDec = Math.cos(decRad);
  out.raRad = raRad;
  out.decRad = decRad;
  out.x = cosDec * Math.cos(raRad); // Note 2
  out.y = cosDec * Math.sin(raRad);
  out.z = Math.sin(decRad);
  return out;
}

/** A fresh SkyDirection to pass as `out`. */
export function newSkyDirection(): SkyDirection {
  return { raRad: 0, decRad: 0, x: 0, y: 0, z: 1 };
}

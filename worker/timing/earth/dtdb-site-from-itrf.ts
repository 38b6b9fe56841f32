/**
 * The observatory terms of ERFA's eraDtdb from ITRF coordinates.
 */
import type { DtdbSite } from '../time/tdb-minus-tt';

/**
 * East longitude, distance from the spin axis and distance north of the
 * equator, from geocentric ITRF coordinates.
 *
 * @param xM, yM, zM  ITRF geocentric coordinates, metres
 * @returns           { elongRad, uKm, vKm } as eraDtdb defines them (ERFA dtdb.c, "Given")
 *
 * Notes: 1. Cylindrical coordinates about the ITRF z axis: u = √(x² + y²),
 *           v = z, λ = atan2(y, x). The ITRF pole differs from the spin axis by
 *           polar motion (≲ 0.5″ ≈ 15 m), which changes the topocentric term by < 5 ps.
 */
export function dtdbSiteFromItrf(xM: number, yM: number, zM: number): DtdbSite {
  return {
    elongRad: Math.atan2(yM, xM), // geocentric longitude, east positive
    uKm: Math.hypot(xM, yM) / 1000, // distance from the spin axis
    vKm: zM / 1000, // distance north of the equatorial plane
  };
}

/**
 * An optional Earth-orientation table (UT1 − UTC and polar motion), linearly
 * interpolated. Without one the engine assumes UT1 = UTC and no polar motion
 * and reports that assumption.
 */
import { taiMinusUtc } from '../time/tai-minus-utc';
import type { Mjd } from '../time/epoch';
import { mjdToApproxNumber } from '../time/mjd-arithmetic';

export interface EarthOrientationPoint {
  /** UTC MJD of the tabulated value (a float64 suffices: values vary by ms per day). */
  mjd: number;
  ut1MinusUtcS: number;
  xpArcsec: number;
  ypArcsec: number;
}

export interface EarthOrientation {
  /** Where the values came from (e.g. "IERS EOP 14 C04"), for reports. */
  source: string;
  /** Sorted by `mjd`. */
  points: ReadonlyArray<EarthOrientationPoint>;
}

export interface EarthOrientationValue {
  ut1MinusUtcS: number;
  xpRad: number;
  ypRad: number;
  /** True when the instant lies outside the table (end values held). */
  outsideTable: boolean;
}

const ARCSEC_TO_RAD = Math.PI / (180 * 3600);

/**
 * Earth orientation at a UTC instant.
 *
 * @param table  the Earth-orientation table
 * @param utc    instant in UTC
 * @returns      UT1 − UTC (s), polar motion xp, yp (radians), table-edge flag
 *
 * Notes: 1. UT1 − UTC jumps by 1 s at each leap second, so UT1 − TAI (continuous)
 *           is interpolated and TAI − UTC added back (common practice).
 *        2. Outside the table the nearest end value is held.
 * Throws RangeError for an empty table.
 */
export function earthOrientationAt(table: EarthOrientation, utc: Mjd): EarthOrientationValue {
  const { points } = table;
  if (points.length === 0) throw new RangeError(`earthOrientationAt: table "${table.source}" has no points`);
  const mjd = mjdToApproxNumber(utc); // interpolation weight only (Note 1)
  const first = points[0];
  const last = points[points.length - 1];
  if (mjd <= first.mjd || mjd >= last.mjd) {
    const end = mjd <= first.mjd ? first : last;
    return {
      ut1MinusUtcS: end.ut1MinusUtcS,
      xpRad: end.xpArcsec * ARCSEC_TO_RAD,
      ypRad: end.ypArcsec * ARCSEC_TO_RAD,
      outsideTable: mjd !== end.mjd,
    };
  }
  let lo = 0;
  let hi = points.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (points[mid].mjd > mjd) hi = mid;
    else lo = mid;
  }
  const a = points[lo];
  const b = points[hi];
  const w = (mjd - a.mjd) / (b.mjd - a.mjd);
  const taiMinusUtcAt = (m: number) => taiMinusUtc({ day: Math.floor(m), frac: [0, m - Math.floor(m)] }).seconds;
  const ut1MinusTaiA = a.ut1MinusUtcS - taiMinusUtcAt(a.mjd); // Note 1
  const ut1MinusTaiB = b.ut1MinusUtcS - taiMinusUtcAt(b.mjd);
  const ut1MinusTai = ut1MinusTaiA + w * (ut1MinusTaiB - ut1MinusTaiA);
  return {
    ut1MinusUtcS: ut1MinusTai + taiMinusUtc(utc).seconds,
    xpRad: (a.xpArcsec + w * (b.xpArcsec - a.xpArcsec)) * ARCSEC_TO_RAD,
    ypRad: (a.ypArcsec + w * (b.ypArcsec - a.ypArcsec)) * ARCSEC_TO_RAD,
    outsideTable: false,
  };
}

import { describe, expect, it } from 'vitest';
import { earthOrientationAt } from '../../../worker/timing/earth/earth-orientation';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { expectWithin } from '../time/expect-within';

const ARCSEC = Math.PI / (180 * 3600);
// Invented values around the 2016-12-31 leap second (MJD 57753 ends with it; TAI−UTC 36 s → 37 s, IERS Bulletin C).
const table = {
  source: 'invented',
  points: [
    { mjd: 57752, ut1MinusUtcS: -0.59, xpArcsec: 0.1, ypArcsec: 0.3 },
    { mjd: 57753, ut1MinusUtcS: -0.6, xpArcsec: 0.2, ypArcsec: 0.3 },
    { mjd: 57755, ut1MinusUtcS: 0.38, xpArcsec: 0.4, ypArcsec: 0.2 },
  ],
};

describe('earthOrientationAt', () => {
  it('interpolates UT1 − TAI across a leap second, so UT1 − UTC keeps its 1 s step at midnight', () => {
    // UT1 − TAI: −36.60 s at 57753 and −36.62 s at 57755; at 57754.5 it is −36.615 s, so UT1 − UTC = 37 − 36.615.
    expectWithin(earthOrientationAt(table, parseMjd('57754.5')).ut1MinusUtcS, 0.385, 1e-12, 'UT1−UTC after the leap (s)');
    expectWithin(earthOrientationAt(table, parseMjd('57753.5')).ut1MinusUtcS, -0.605, 1e-12, 'UT1−UTC before the leap (s)');
  });

  it('interpolates polar motion linearly and converts to radians', () => {
    const v = earthOrientationAt(table, parseMjd('57752.25'));
    expectWithin(v.xpRad, 0.125 * ARCSEC, 1e-18, 'xp (rad)');
    expectWithin(v.ypRad, 0.3 * ARCSEC, 1e-18, 'yp (rad)');
    expect(v.outsideTable).toBe(false);
  });

  it('holds the end values outside the table and says so', () => {
    const v = earthOrientationAt(table, parseMjd('57760'));
    expect(v.outsideTable).toBe(true);
    expect(v.ut1MinusUtcS).toBe(0.38);
    expect(earthOrientationAt(table, parseMjd('57755')).outsideTable).toBe(false);
  });

  it('rejects an empty table', () => {
    expect(() => earthOrientationAt({ source: 'empty', points: [] }, parseMjd('57760'))).toThrow(RangeError);
  });
});

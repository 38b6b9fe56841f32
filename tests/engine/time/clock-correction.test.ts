import { describe, expect, it } from 'vitest';
import { clockCorrection } from '../../../worker/timing/time/clock-correction';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { expectWithin } from './expect-within';

const points = [
  { mjd: parseMjd('58000'), correctionUs: 1 },
  { mjd: parseMjd('58010'), correctionUs: 3 },
  { mjd: parseMjd('58020'), correctionUs: -1 },
];

describe('clockCorrection', () => {
  it('interpolates linearly between points (hand-checkable: 58005 is halfway from 1 µs to 3 µs)', () => {
    const c = clockCorrection(points, parseMjd('58005'));
    expectWithin(c.seconds, 2e-6, 1e-18, 'correction (s)');
    expect(c.outsideTable).toBe(false);
    expectWithin(clockCorrection(points, parseMjd('58015.25')).seconds, 0.9e-6, 1e-18, 'correction (s)');
  });

  it('returns the table values at the points', () => {
    expect(clockCorrection(points, parseMjd('58010')).seconds).toBeCloseTo(3e-6, 18);
    expect(clockCorrection(points, parseMjd('58020')).outsideTable).toBe(false);
  });

  it('holds the end values outside the table and says so', () => {
    const before = clockCorrection(points, parseMjd('57999.9'));
    const after = clockCorrection(points, parseMjd('58020.1'));
    expect(before).toEqual({ seconds: 1e-6, outsideTable: true });
    expect(after).toEqual({ seconds: -1e-6, outsideTable: true });
  });

  it('is zero without a table', () => {
    expect(clockCorrection([], parseMjd('58000'))).toEqual({ seconds: 0, outsideTable: false });
  });
});

import { describe, expect, it } from 'vitest';
import { taiMinusUtc } from '../../../worker/timing/time/tai-minus-utc';
import { TT_MINUS_TAI_SECONDS, ttFromTai } from '../../../worker/timing/time/tt-from-tai';
import { mjdDiffSeconds, mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { expectWithin } from './expect-within';

describe('TAI − UTC', () => {
  // Source: IERS Bulletin C — TAI−UTC = 36 s from 2015-07-01, 37 s from 2017-01-01 (no leap second since).
  it('is 36 s during the first half of 2016 and 37 s from 2017-01-01', () => {
    expect(taiMinusUtc(parseMjd('57388.5')).seconds).toBe(36); // 2016-01-01 12h
    expect(taiMinusUtc(parseMjd('57570.9')).seconds).toBe(36); // 2016-06-28
    expect(taiMinusUtc(parseMjd('57754.0')).seconds).toBe(37); // 2017-01-01 0h
    expect(taiMinusUtc(parseMjd('60310.25')).seconds).toBe(37); // 2024-01-01
  });

  it('flags the leap-second day 2016-12-31 (MJD 57753) and only that day', () => {
    expect(taiMinusUtc(parseMjd('57753.99')).leapSecondAtEndOfDay).toBe(true);
    expect(taiMinusUtc(parseMjd('57753.99')).seconds).toBe(36);
    expect(taiMinusUtc(parseMjd('57752.5')).leapSecondAtEndOfDay).toBe(false);
    expect(taiMinusUtc(parseMjd('57754.5')).leapSecondAtEndOfDay).toBe(false);
  });

  it('makes TAI advance 3 s from 23:59:59 on a leap-second day to the next 00:00:01 (the day has 86401 s)', () => {
    const before = mjdFromParts(57753, 86_399 / 86_400);
    const after = mjdFromParts(57754, 1 / 86_400);
    const taiBefore = mjdFromParts(before.day, [before.frac[0], before.frac[1] + taiMinusUtc(before).seconds / 86_400]);
    const taiAfter = mjdFromParts(after.day, [after.frac[0], after.frac[1] + taiMinusUtc(after).seconds / 86_400]);
    const elapsed = mjdDiffSeconds(taiAfter, taiBefore);
    expectWithin(elapsed[1] + elapsed[0], 3, 1e-9, 'elapsed TAI seconds (2 s of clock + 1 leap second)');
  });

  it('warns (dubious year) far beyond ERFA’s leap-second knowledge', () => {
    const far = taiMinusUtc(parseMjd('69807.5')); // 2050
    expect(far.dubiousYear).toBe(true);
    expect(far.seconds).toBe(37);
    expect(taiMinusUtc(parseMjd('58000.5')).dubiousYear).toBe(false);
  });

  // Source: USNO tai-utc.dat drift formulas (from memory): from 1966-01-01 TAI−UTC = 4.3131700 s + (MJD − 39126) × 0.002592 s,
  // from 1968-02-01 4.2131700 s + (MJD − 39126) × 0.002592 s.
  it('follows the pre-1972 drift within a day', () => {
    const at = (text: string) => taiMinusUtc(parseMjd(text)).seconds;
    expectWithin(at('39500.5'), 4.31317 + (39500.5 - 39126) * 0.002592, 1e-9, 'TAI−UTC at MJD 39500.5 (s)');
    expectWithin(at('40000.25'), 4.21317 + (40000.25 - 39126) * 0.002592, 1e-9, 'TAI−UTC at MJD 40000.25 (s)');
    expect(at('39500.75') - at('39500.25')).toBeCloseTo(0.5 * 0.002592, 9);
  });

  it('throws a RangeError before UTC existed (1960)', () => {
    expect(() => taiMinusUtc(parseMjd('30000.5'))).toThrow(RangeError);
  });
});

describe('TT from TAI', () => {
  // Source: IAU 1991 Resolution A4 (TT − TAI = 32.184 s exactly).
  it('adds exactly 32.184 s', () => {
    expect(TT_MINUS_TAI_SECONDS).toBe(32.184);
    const tai = parseMjd('58000.123456789012345678');
    const d = mjdDiffSeconds(ttFromTai(tai), tai);
    expectWithin(d[1] + d[0], 32.184, 1e-15, 'TT − TAI (s)');
  });
});

import { describe, expect, it } from 'vitest';
import {
  compareMjd,
  mjdAddDays,
  mjdAddSeconds,
  mjdDiffDays,
  mjdDiffSeconds,
  mjdFromParts,
  mjdToApproxNumber,
} from '../../../worker/timing/time/mjd-arithmetic';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { expectWithin } from './expect-within';

const ONE_FS = 1e-15;

describe('mjdFromParts', () => {
  it('moves whole days out of the fraction and keeps 0 ≤ frac < 1', () => {
    expect(mjdFromParts(58000, 1.25)).toEqual({ day: 58001, frac: [0, 0.25] });
    expect(mjdFromParts(58000, -0.25)).toEqual({ day: 57999, frac: [0, 0.75] });
    expect(mjdFromParts(58000.5, 0.75)).toEqual({ day: 58001, frac: [0, 0.25] });
    expect(mjdFromParts(58000, [0, 0])).toEqual({ day: 58000, frac: [0, 0] });
  });

  it('keeps a tiny negative fraction by borrowing a day (value preserved)', () => {
    const m = mjdFromParts(58000, [-1e-30, 0]);
    expect(m.day).toBe(57999);
    expect(m.frac[1]).toBe(1);
    expect(m.frac[0]).toBeLessThan(0);
  });

  it('rejects non-finite parts', () => {
    expect(() => mjdFromParts(NaN, 0)).toThrow(RangeError);
    expect(() => mjdFromParts(1, Infinity)).toThrow(RangeError);
  });
});

describe('seconds and days', () => {
  it('adds one second 86400 times to reach the next day within 1 fs', () => {
    let m = parseMjd('58000.123456789012345678');
    for (let i = 0; i < 86_400; i++) m = mjdAddSeconds(m, 1);
    const diff = mjdDiffSeconds(m, parseMjd('58001.123456789012345678'));
    expectWithin(diff[1] + diff[0], 0, ONE_FS, 'accumulated error (s)');
  });

  it('differences days first: 1e-9 s apart at MJD 58000 is resolved', () => {
    const a = mjdAddSeconds(parseMjd('58000.5'), 1e-9);
    const d = mjdDiffSeconds(a, parseMjd('58000.5'));
    expectWithin(d[1] + d[0], 1e-9, 1e-24, 'difference (s)');
  });

  it('adds days with whole and fractional parts', () => {
    const m = mjdAddDays(parseMjd('58000.75'), 10.5);
    expect(m).toEqual({ day: 58011, frac: [0, 0.25] });
    const back = mjdDiffDays(m, parseMjd('58000.75'));
    expect(back[1] + back[0]).toBe(10.5);
  });

  it('compares and approximates', () => {
    const a = parseMjd('58000.5');
    const b = mjdAddSeconds(a, 1e-12);
    expect(compareMjd(a, b)).toBe(-1);
    expect(compareMjd(b, a)).toBe(1);
    expect(compareMjd(a, parseMjd('58000.50'))).toBe(0);
    expect(mjdToApproxNumber(a)).toBe(58000.5);
  });
});

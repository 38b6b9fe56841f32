/** The stored form of an MJD (day + 38-digit DECIMAL fraction): exact digits, rounding at the 38th, text back. */
import { describe, expect, it } from 'vitest';
import { MJD_FRACTION_DIGITS, mjdTextFromStored, storedMjdFromMjd, storedMjdFromText } from '../../api/db/toas';
import { parseMjd } from '../../worker/timing/time/mjd-string';

const zeros = (n: number) => '0'.repeat(n);

describe('storedMjdFromText', () => {
  it('pads up to 38 digits without changing any', () => {
    expect(storedMjdFromText('58000')).toEqual({ day: 58000, fraction: `0.${zeros(38)}` });
    expect(storedMjdFromText('58000.')).toEqual({ day: 58000, fraction: `0.${zeros(38)}` });
    expect(storedMjdFromText('+58000.25')).toEqual({ day: 58000, fraction: `0.25${zeros(36)}` });
    const d38 = '98765432109876543210987654321098765432';
    expect(storedMjdFromText(`58000.${d38}`)).toEqual({ day: 58000, fraction: `0.${d38}` });
  });

  it('rounds digits beyond the 38th half to even, carrying into the day', () => {
    const d37 = '1234567890123456789012345678901234567';
    expect(storedMjdFromText(`1.${d37}4` + '5001').fraction).toBe(`0.${d37}5`); // above half: up
    expect(storedMjdFromText(`1.${d37}4` + '5000').fraction).toBe(`0.${d37}4`); // tie, 4 is even: stays
    expect(storedMjdFromText(`1.${d37}3` + '5').fraction).toBe(`0.${d37}4`); // tie, 3 is odd: up
    expect(storedMjdFromText(`1.${d37}3` + '4999').fraction).toBe(`0.${d37}3`); // below half: down
    expect(storedMjdFromText(`58000.${'9'.repeat(40)}`)).toEqual({ day: 58001, fraction: `0.${zeros(38)}` });
  });

  it('refuses negative and malformed text', () => {
    expect(() => storedMjdFromText('-1.5')).toThrow(RangeError);
    expect(() => storedMjdFromText('5.8e4')).toThrow(RangeError);
  });
});

describe('mjdTextFromStored and storedMjdFromMjd', () => {
  it('drops trailing zeros only', () => {
    expect(mjdTextFromStored(58000, `0.${zeros(38)}`)).toBe('58000');
    expect(mjdTextFromStored('58000', `0.5${zeros(37)}`)).toBe('58000.5');
    expect(mjdTextFromStored(58000, `0.1020${zeros(34)}`)).toBe('58000.102');
  });

  it('an MJD without text is stored from its exact binary value, within 1e-30 day of the decimal', () => {
    const text = '58000.123456789012345678';
    const stored = storedMjdFromMjd(parseMjd(text));
    expect(stored.day).toBe(58000);
    expect(stored.fraction).toHaveLength(2 + MJD_FRACTION_DIGITS);
    // the double-double carries ~32 significant digits of the fraction (docs/formats.md §1.1: about 1e-32 day)
    const errorUnits = BigInt(stored.fraction.slice(2)) - BigInt('123456789012345678'.padEnd(38, '0'));
    const errorDays = Number(errorUnits < 0n ? -errorUnits : errorUnits) * 1e-38;
    expect(errorDays).toBeLessThan(1e-30);
  });
});

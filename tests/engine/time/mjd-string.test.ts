import Decimal from 'decimal.js';
import { describe, expect, it } from 'vitest';
import { formatMjd, parseMjd } from '../../../worker/timing/time/mjd-string';
import { expectWithin } from './expect-within';

const ONE_PS_IN_DAYS = 1e-12 / 86_400; // 1.16e-17 day
Decimal.set({ precision: 80 });

/** Exact decimal value of an Mjd via decimal.js (each double printed exactly with 1100 digits). */
function exactValue(m: { day: number; frac: [number, number] }): Decimal {
  const exact = (x: number) => new Decimal(exactDoubleString(x));
  return new Decimal(m.day).plus(exact(m.frac[1])).plus(exact(m.frac[0]));
}

/** The exact decimal expansion of a double, computed independently of formatMjd (x = k / 2^1074). */
function exactDoubleString(x: number): string {
  if (x === 0) return '0';
  let mantissa = x;
  let exponent = 0;
  while (!Number.isInteger(mantissa)) {
    mantissa *= 2; // exact: scaling by two
    exponent += 1;
  }
  return new Decimal(mantissa.toString()).div(new Decimal(2).pow(exponent)).toFixed();
}

function randomDigits(count: number, seed: { s: number }): string {
  let out = '';
  for (let i = 0; i < count; i++) {
    seed.s = (seed.s * 1103515245 + 12345) % 2147483648;
    out += String(Math.floor((seed.s / 2147483648) * 10));
  }
  return out;
}

describe('parseMjd', () => {
  it.each(['', 'abc', '1e5', '58000.5e0', ' 58000', '.5', '+', '58000..1', '0x10'])('rejects %j with a RangeError naming the text', (text) => {
    expect(() => parseMjd(text)).toThrow(RangeError);
    expect(() => parseMjd(text)).toThrow(`"${text}"`);
  });

  it('reads -0.5 as day -1 plus half a day', () => {
    const m = parseMjd('-0.5');
    expect(m.day).toBe(-1);
    expect(m.frac[1] + m.frac[0]).toBe(0.5);
  });

  it("reads '58000.' (trailing point) as the integer day 58000", () => {
    const m = parseMjd('58000.');
    expect(m).toEqual({ day: 58000, frac: [0, 0] });
  });

  it('keeps a 1e-37 day fraction from a 37-digit input', () => {
    const m = parseMjd('58000.0000000000000000000000000000000000001');
    expect(m.day).toBe(58000);
    expectWithin(m.frac[1] + m.frac[0], 1e-37, 1e-50, 'fraction (days)');
  });

  it('accepts sign and leading zeros', () => {
    expect(parseMjd('+00058000.25')).toEqual({ day: 58000, frac: [0, 0.25] });
  });

  it('reads 40 fractional digits to well below 1 ps (exact comparison with decimal.js)', () => {
    const seed = { s: 7 };
    for (let i = 0; i < 200; i++) {
      const text = `${50000 + i * 37}.${randomDigits(40, seed)}`;
      const error = exactValue(parseMjd(text)).minus(new Decimal(text)).abs().toNumber();
      expectWithin(error, 0, 1e-30, `parse error of ${text} (days)`);
    }
  });
});

describe('formatMjd', () => {
  it('prints the exact binary value: 0.1 as a double is 0.1000000000000000055511151231257827…', () => {
    // exact decimal expansion of the double nearest 0.1 (IEEE 754; computed by hand as 3602879701896397/2^55)
    expect(formatMjd({ day: 0, frac: [0, 0.1] }, 40)).toBe('0.1000000000000000055511151231257827021182');
  });

  it('prints the double-double low part: 2^-60 below 0.25', () => {
    const want = new Decimal(58000.25).minus(new Decimal(2).pow(-60)).toFixed(30);
    expect(formatMjd({ day: 58000, frac: [-(2 ** -60), 0.25] }, 30)).toBe(want);
  });

  it('rounds half to even', () => {
    expect(formatMjd({ day: 1, frac: [0, 0.125] }, 2)).toBe('1.12');
    expect(formatMjd({ day: 1, frac: [0, 0.375] }, 2)).toBe('1.38');
    expect(formatMjd({ day: 1, frac: [0, 0.5] }, 0)).toBe('2');
    expect(formatMjd({ day: 2, frac: [0, 0.5] }, 0)).toBe('2');
  });

  it('prints negative instants with a sign', () => {
    expect(formatMjd({ day: -1, frac: [0, 0.5] }, 3)).toBe('-0.500');
  });

  it('round trip parse → format (18 digits) → parse agrees within 1 ps, including 40-digit inputs', () => {
    const seed = { s: 99 };
    for (let i = 0; i < 200; i++) {
      const text = `${40000 + i * 113}.${randomDigits(i % 2 === 0 ? 40 : 1 + (i % 25), seed)}`;
      const printed = formatMjd(parseMjd(text));
      const error = new Decimal(printed).minus(new Decimal(text)).abs().toNumber();
      expectWithin(error, 0, ONE_PS_IN_DAYS, `round trip of ${text} → ${printed} (days)`);
      const again = exactValue(parseMjd(printed)).minus(new Decimal(text)).abs().toNumber();
      expectWithin(again, 0, ONE_PS_IN_DAYS, `second parse of ${printed} (days)`);
    }
  });

  it('rejects a bad digit count', () => {
    expect(() => formatMjd({ day: 1, frac: [0, 0] }, -1)).toThrow(RangeError);
    expect(() => formatMjd({ day: 1, frac: [0, 0] }, 1.5)).toThrow(RangeError);
  });
});

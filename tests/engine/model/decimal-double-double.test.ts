import { describe, expect, it } from 'vitest';
import Decimal from 'decimal.js';
import { ddToScaledDecimal, formatDoubleDouble, parseDecimalFractionToDd, parseDecimalToDd } from '../../../worker/timing/model/decimal-double-double';

Decimal.set({ precision: 400 });
const bits = new BigUint64Array(1);
const view = new Float64Array(bits.buffer);
/** The exact value of a double (decimal.js reads numbers by their shortest text, so go through the bits). */
function exactDouble(x: number): Decimal {
  if (x === 0) return new Decimal(0);
  view[0] = x;
  const exponentBits = Number((bits[0] >> 52n) & 0x7ffn);
  const mantissa = (bits[0] & 0xfffffffffffffn) | (exponentBits === 0 ? 0n : 1n << 52n);
  const value = new Decimal(mantissa.toString()).times(new Decimal(2).pow(Math.max(exponentBits, 1) - 1075));
  return x < 0 ? value.negated() : value;
}
const exact = (dd: [number, number]) => exactDouble(dd[1]).plus(exactDouble(dd[0]));

describe('parseDecimalToDd', () => {
  it('reads π to 36 digits as the known double-double of π (hi = Math.PI, lo = 1.2246467991473532e-16, from memory)', () => {
    expect(parseDecimalToDd('3.14159265358979323846264338327950288')).toEqual([1.2246467991473532e-16, Math.PI]);
  });
  it('hi is the double nearest the value and lo the double nearest the rest (checked with decimal.js)', () => {
    for (const text of ['287.45812645130', '0.1', '-8.1e-16', '123456789.123456789123456789123456', '1e-250', '6.02214076e23']) {
      const dd = parseDecimalToDd(text);
      expect(dd[1]).toBe(Number(text)); // JavaScript's Number() is correctly rounded (ECMA-262)
      const rest = new Decimal(text).minus(exactDouble(dd[1]));
      expect(dd[0]).toBe(rest.toNumber()); // decimal.js toNumber is correctly rounded
      const error = new Decimal(text).minus(exact(dd)).abs();
      expect(error.lte(exactDouble(Math.abs(dd[1])).times(new Decimal(2).pow(-104)))).toBe(true);
    }
  });
  it('keeps the sign of −0', () => {
    expect(Object.is(parseDecimalToDd('-0.000')[1], -0)).toBe(true);
  });
  it.each(['', '.', 'abc', '1.2.3', '1e', '0x10', ' 1', 'inf', 'NaN'])('rejects %j', (text) => {
    expect(() => parseDecimalToDd(text)).toThrow(RangeError);
  });
  it('rejects numbers beyond double range', () => {
    expect(() => parseDecimalToDd('1e400')).toThrow(RangeError);
  });
});

describe('parseDecimalFractionToDd', () => {
  it('reads 0.d1d2… as the nearest double-double (checked with decimal.js), any number of digits', () => {
    let state = 31337;
    const digit = () => {
      state = (state * 1103515245 + 12345) % 2 ** 31;
      return String(Math.floor((state / 2 ** 31) * 10));
    };
    for (let i = 0; i < 100; i += 1) {
      const digits = Array.from({ length: 1 + ((i * 7) % 45) + (i === 99 ? 900 : 0) }, digit).join('');
      const dd = parseDecimalFractionToDd(digits);
      const value = new Decimal(`0.${digits}`);
      expect(dd[1], digits).toBe(value.toNumber()); // decimal.js toNumber is correctly rounded
      expect(dd[0], digits).toBe(value.minus(exactDouble(dd[1])).toNumber());
    }
  });
  it('reads no digits or only zeros as zero', () => {
    expect(parseDecimalFractionToDd('')).toEqual([0, 0]);
    expect(parseDecimalFractionToDd('000')).toEqual([0, 0]);
  });
  it.each(['-1', '1.5', '1e3', ' 1'])('rejects %j', (digits) => {
    expect(() => parseDecimalFractionToDd(digits)).toThrow(RangeError);
  });
});

describe('formatDoubleDouble', () => {
  it('prints the shortest text that reads back identically', () => {
    expect(formatDoubleDouble(parseDecimalToDd('287.45812645130'))).toBe('287.4581264513');
    expect(formatDoubleDouble(parseDecimalToDd('-8.1e-16'))).toBe('-8.1e-16');
    expect(formatDoubleDouble([0, 0])).toBe('0');
  });
  it('round-trips random double-doubles exactly', () => {
    let state = 99;
    const next = () => {
      state = (state * 1103515245 + 12345) % 2 ** 31;
      return state / 2 ** 31;
    };
    for (let i = 0; i < 300; i += 1) {
      const hi = (next() - 0.5) * 10 ** Math.floor(next() * 30 - 15);
      const loRaw = hi * (next() - 0.5) * 2 ** -52;
      const sum = hi + loRaw;
      const dd: [number, number] = [loRaw - (sum - hi), sum];
      const text = formatDoubleDouble(dd);
      expect(parseDecimalToDd(text)).toEqual(dd);
    }
  });
  it('prints a fixed number of significant digits, rounded half to even on the exact value', () => {
    expect(formatDoubleDouble(parseDecimalToDd('2.5'), 1)).toBe('2');
    expect(formatDoubleDouble(parseDecimalToDd('9.96'), 2)).toBe('10');
    expect(formatDoubleDouble(parseDecimalToDd('1234.5678'), 6)).toBe('1234.57');
  });
  it('ddToScaledDecimal rounds value·10^k half to even', () => {
    expect(ddToScaledDecimal(parseDecimalToDd('1.25'), 1)).toBe(12n);
    expect(ddToScaledDecimal(parseDecimalToDd('-1.25'), 1)).toBe(-12n);
    expect(ddToScaledDecimal(parseDecimalToDd('1.75'), 1)).toBe(18n);
  });
  it('ddToScaledDecimal adds its whole units before rounding, so ties go to the even total', () => {
    expect(ddToScaledDecimal([0, 0.5], 0, 1n)).toBe(2n);
    expect(ddToScaledDecimal([0, 0.5], 0, 2n)).toBe(2n);
    expect(ddToScaledDecimal([0, 0.25], 1, -1n)).toBe(-8n); // −0.75 → −8 tenths (tie to even)
  });
});

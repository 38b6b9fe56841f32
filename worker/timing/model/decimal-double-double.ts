/**
 * Decimal text ⇄ double-double, correctly rounded, for the model file's
 * high-precision numbers (spin frequency), the sexagesimal angles and the
 * fractions of MJDs (time/mjd-string.ts).
 *
 * Every double is an integer multiple of 2^-1074, so a double-double hi + lo is
 * exactly N / 2^1074 for a BigInt N; a decimal string is exactly p / q for
 * BigInts p, q. Both directions are done in exact BigInt arithmetic and rounded
 * once (round half to even), so:
 *   - parsing returns hi = the double nearest the decimal value and
 *     lo = the double nearest (value − hi): the nearest normalised double-double;
 *   - printing with "shortest" digits returns the fewest significant digits
 *     that parse back to the identical [lo, hi] (Note 1 of formatDoubleDouble).
 */
import type { DoubleDouble } from '../time/epoch';

const DECIMAL_NUMBER = /^([+-]?)(\d*)(?:\.(\d*))?(?:[eE]([+-]?\d+))?$/;
const BINARY_SCALE_BITS = 1074n; // 2^1074 · (any double) is an integer
const BINARY_SCALE = 1n << BINARY_SCALE_BITS;
const TWO_POW_52 = 1n << 52n;
const TWO_POW_53 = 1n << 53n;
const MAX_DECIMAL_EXPONENT = 400; // beyond ±400 every double-double over- or underflows
const MAX_SHORTEST_DIGITS = 40;

const float64View = new Float64Array(1);
const bitsView = new BigUint64Array(float64View.buffer);

/** True for text such as `287.4581`, `-8.1e-16`, `.5`, `3.` (a plain or exponent decimal). */
export function isDecimalNumberText(text: string): boolean {
  const match = DECIMAL_NUMBER.exec(text);
  return match !== null && ((match[2] ?? '') + (match[3] ?? '')).length > 0;
}

/**
 * The nearest double-double to a decimal number.
 *
 * @param text  decimal text: optional sign, digits with an optional point, optional
 *              exponent (`e`/`E`); at least one digit; no spaces
 * @returns     [lo, hi] with hi = nearest double to the value, lo = nearest double
 *              to value − hi (both round half to even)
 *
 * Accuracy: exact rounding, |value − (hi + lo)| ≤ ulp(lo)/2, except below ~1e-290
 * where lo becomes subnormal (Note 1).
 * Notes: 1. Subnormal results are rounded twice and may be off by one subnormal ulp.
 * Throws RangeError naming the text when it is not a decimal number or its
 * exponent lies beyond ±400.
 */
export function parseDecimalToDd(text: string): DoubleDouble {
  const match = DECIMAL_NUMBER.exec(text);
  const integerDigits = match?.[2] ?? '';
  const fractionDigits = match?.[3] ?? '';
  if (match === null || integerDigits.length + fractionDigits.length === 0) {
    throw new RangeError(`"${text}" is not a decimal number`);
  }
  const negative = match[1] === '-';
  const exponent10 = Number(match[4] ?? '0') - fractionDigits.length;
  const digits = BigInt(integerDigits + fractionDigits);
  if (digits === 0n) return negative ? [-0, -0] : [0, 0];
  const magnitudeEstimate = exponent10 + integerDigits.length + fractionDigits.length;
  if (Math.abs(exponent10) > MAX_DECIMAL_EXPONENT * 2 || Math.abs(magnitudeEstimate) > MAX_DECIMAL_EXPONENT) {
    throw new RangeError(`"${text}" is out of the range of double precision`);
  }
  const p = exponent10 >= 0 ? digits * 10n ** BigInt(exponent10) : digits;
  const q = exponent10 >= 0 ? 1n : 10n ** BigInt(-exponent10);
  const nearest = nearestDdToRatio(p, q);
  if (!Number.isFinite(nearest[1])) throw new RangeError(`"${text}" is out of the range of double precision`);
  return negative ? [-nearest[0], -nearest[1]] : nearest;
}

/**
 * The nearest double-double to the decimal fraction 0.d1d2d3… (the digits after
 * the point, any number of them; `''` is zero).
 *
 * @param fractionDigits  decimal digits only, no sign or point
 * @returns               [lo, hi] as parseDecimalToDd, with 0 ≤ hi + lo ≤ 1
 *
 * Accuracy: exact rounding as parseDecimalToDd (same routine); no digit-count limit.
 * Throws RangeError when `fractionDigits` holds anything but digits.
 */
export function parseDecimalFractionToDd(fractionDigits: string): DoubleDouble {
  if (!/^\d*$/.test(fractionDigits)) {
    throw new RangeError(`"${fractionDigits}" is not a string of decimal digits`);
  }
  const digits = BigInt(`0${fractionDigits}`);
  if (digits === 0n) return [0, 0];
  return nearestDdToRatio(digits, 10n ** BigInt(fractionDigits.length));
}

/** [lo, hi] nearest p / q (q > 0): hi nearest the ratio, lo nearest ratio − hi (half to even). */
function nearestDdToRatio(p: bigint, q: bigint): DoubleDouble {
  const hi = nearestDouble(p, q);
  if (!Number.isFinite(hi)) return [0, hi];
  // hi = s·2^k exactly, so value − hi = (p − s·2^k·q) / q, kept in integers.
  const [significand, exponent2] = doubleAsSignificandTimesPowerOfTwo(hi);
  const lo =
    exponent2 >= 0
      ? nearestDouble(p - (significand << BigInt(exponent2)) * q, q)
      : nearestDouble((p << BigInt(-exponent2)) - significand * q, q << BigInt(-exponent2));
  return [lo, hi];
}

/**
 * Decimal text of a double-double.
 *
 * @param value              [lo, hi], finite
 * @param significantDigits  digits to print (1–60); omitted: the shortest that
 *                           parse back (parseDecimalToDd) to the identical pair (Note 1)
 * @returns                  plain notation for 1e-6 ≤ |x| < 1e21 (`287.4581264513`),
 *                           otherwise exponent notation (`-8.1e-16`); `0` for zero
 *
 * Notes: 1. A normalised pair always round-trips within 40 digits except for a lo
 *           far below ulp(hi) (e.g. hi = 1, lo = 2^-90); then the exact value is
 *           printed with 40 digits and parses back to within ulp(lo)·2^-3.
 * Throws RangeError for non-finite input or a bad digit count.
 */
export function formatDoubleDouble(value: DoubleDouble, significantDigits?: number): string {
  if (!Number.isFinite(value[0]) || !Number.isFinite(value[1])) {
    throw new RangeError(`formatDoubleDouble: [${value[0]}, ${value[1]}] is not finite`);
  }
  if (significantDigits !== undefined) {
    if (!Number.isInteger(significantDigits) || significantDigits < 1 || significantDigits > 60) {
      throw new RangeError(`formatDoubleDouble: significantDigits ${significantDigits} must be an integer 1–60`);
    }
    return renderSignificant(value, significantDigits);
  }
  for (let digits = 1; digits <= MAX_SHORTEST_DIGITS; digits += 1) {
    const text = renderSignificant(value, digits);
    if (parsesBackTo(text, value)) return text;
  }
  return renderSignificant(value, MAX_SHORTEST_DIGITS);
}

/** True when `text` parses to exactly `value` (a too-short text may overflow: false). */
function parsesBackTo(text: string, value: DoubleDouble): boolean {
  try {
    const back = parseDecimalToDd(text);
    return back[0] === value[0] && back[1] === value[1];
  } catch {
    return false;
  }
}

/**
 * round((wholeUnits + value) · 10^fractionDigits) as an exact BigInt, round half to even.
 *
 * @param value           [lo, hi], finite
 * @param fractionDigits  decimal places kept, integer ≥ 0
 * @param wholeUnits      exact integer added to `value` before rounding (default 0),
 *                        e.g. the day of an `Mjd` whose fraction is `value`
 */
export function ddToScaledDecimal(value: DoubleDouble, fractionDigits: number, wholeUnits = 0n): bigint {
  const n = (wholeUnits << BINARY_SCALE_BITS) + doubleTimesBinaryScale(value[1]) + doubleTimesBinaryScale(value[0]);
  return divideRoundHalfEven(n * 10n ** BigInt(fractionDigits), BINARY_SCALE);
}

/** `digits` significant decimal digits of the exact value, rounded half to even. */
function renderSignificant(value: DoubleDouble, digits: number): string {
  const n = doubleTimesBinaryScale(value[1]) + doubleTimesBinaryScale(value[0]);
  if (n === 0n) return '0';
  const negative = n < 0n;
  const magnitude = negative ? -n : n;
  let exponent10 = Math.floor(Math.log10(Math.abs(value[1] + value[0])));
  let scaled = scaleToDigits(magnitude, digits, exponent10);
  // log10 of a double may be off by one near powers of ten; correct it.
  if (scaled >= 10n ** BigInt(digits)) {
    exponent10 += 1;
    scaled = scaleToDigits(magnitude, digits, exponent10);
  } else if (scaled < 10n ** BigInt(digits - 1)) {
    exponent10 -= 1;
    scaled = scaleToDigits(magnitude, digits, exponent10);
  }
  if (scaled >= 10n ** BigInt(digits)) {
    // rounding carried into a new digit (9.99… → 10.0…)
    exponent10 += 1;
    scaled /= 10n;
  }
  const digitText = scaled.toString().replace(/0+$/, '') || '0';
  return (negative ? '-' : '') + placePoint(digitText, exponent10);
}

/** round(magnitude / 2^1074 · 10^(digits − 1 − exponent10)). */
function scaleToDigits(magnitude: bigint, digits: number, exponent10: number): bigint {
  const power = digits - 1 - exponent10;
  return power >= 0
    ? divideRoundHalfEven(magnitude * 10n ** BigInt(power), BINARY_SCALE)
    : divideRoundHalfEven(magnitude, BINARY_SCALE * 10n ** BigInt(-power));
}

/** d1.d2d3… × 10^exponent10 written out, plain for 1e-6 ≤ x < 1e21 as JavaScript does. */
function placePoint(digitText: string, exponent10: number): string {
  if (exponent10 >= 21 || exponent10 < -6) {
    const mantissa = digitText.length > 1 ? `${digitText[0]}.${digitText.slice(1)}` : digitText;
    return `${mantissa}e${exponent10 >= 0 ? '+' : '-'}${Math.abs(exponent10)}`;
  }
  if (exponent10 < 0) return `0.${'0'.repeat(-exponent10 - 1)}${digitText}`;
  if (digitText.length <= exponent10 + 1) return digitText + '0'.repeat(exponent10 + 1 - digitText.length);
  return `${digitText.slice(0, exponent10 + 1)}.${digitText.slice(exponent10 + 1)}`;
}

/** The double nearest p / q (q > 0), round half to even; p may be negative. */
function nearestDouble(p: bigint, q: bigint): number {
  if (p === 0n) return 0;
  const negative = p < 0n;
  const num = negative ? -p : p;
  // 2^52 ≤ num·2^shift / q < 2^53 fixes the 53-bit significand.
  let shift = 53 - (bitLength(num) - bitLength(q));
  for (;;) {
    const n = shift >= 0 ? num << BigInt(shift) : num;
    const d = shift >= 0 ? q : q << BigInt(-shift);
    let significand = n / d;
    if (significand >= TWO_POW_53) {
      shift -= 1;
      continue;
    }
    if (significand < TWO_POW_52) {
      shift += 1;
      continue;
    }
    const twiceRemainder = 2n * (n - significand * d);
    if (twiceRemainder > d || (twiceRemainder === d && (significand & 1n) === 1n)) significand += 1n;
    const x = timesPowerOfTwo(Number(significand), -shift);
    return negative ? -x : x;
  }
}

/** x · 2^e without intermediate overflow (exact while the result is normal). */
function timesPowerOfTwo(x: number, e: number): number {
  let result = x;
  let rest = e;
  while (rest > 1000) {
    result *= 2 ** 1000;
    rest -= 1000;
  }
  while (rest < -1000) {
    result *= 2 ** -1000;
    rest += 1000;
  }
  return result * 2 ** rest;
}

/** Bits of n > 0 (read from its hexadecimal text: 4 per digit after the first). */
function bitLength(n: bigint): number {
  const hex = n.toString(16);
  return (hex.length - 1) * 4 + (32 - Math.clz32(parseInt(hex[0], 16)));
}

/** [s, k] with x = s · 2^k exactly, s a BigInt (IEEE 754 binary64 layout). */
function doubleAsSignificandTimesPowerOfTwo(x: number): [bigint, number] {
  if (x === 0) return [0n, 0];
  float64View[0] = x;
  const bits = bitsView[0];
  const negative = bits >> 63n === 1n;
  const biasedExponent = Number((bits >> 52n) & 0x7ffn);
  const mantissaBits = bits & 0xfffffffffffffn;
  // IEEE 754 binary64: normal x = (2^52 + m)·2^(e−1075); subnormal x = m·2^(−1074).
  const significand = biasedExponent === 0 ? mantissaBits : mantissaBits | TWO_POW_52;
  const exponent2 = biasedExponent === 0 ? -1074 : biasedExponent - 1075;
  return [negative ? -significand : significand, exponent2];
}

/** x · 2^1074 as an exact BigInt (every double is an integer multiple of 2^-1074). */
function doubleTimesBinaryScale(x: number): bigint {
  const [significand, exponent2] = doubleAsSignificandTimesPowerOfTwo(x);
  return significand << BigInt(exponent2 + 1074);
}

/** round(n / d) for d > 0, ties to even. */
function divideRoundHalfEven(n: bigint, d: bigint): bigint {
  let q = n / d;
  let r = n % d;
  if (r < 0n) {
    q -= 1n;
    r += d;
  }
  const twice = 2n * r;
  if (twice > d || (twice === d && q % 2n !== 0n)) q += 1n;
  return q;
}

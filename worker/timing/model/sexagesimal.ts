/**
 * Sexagesimal angles of the model file: right ascension `hh:mm:ss.sss` (hours of
 * time) and declination `±dd:mm:ss.sss` (degrees of arc) ⇄ radians.
 *
 * The conversion runs in double-double: the decimal seconds are read exactly
 * (decimal-double-double.ts), multiplied by π/43 200 (rad per second of time) or
 * π/648 000 (rad per arcsecond), and rounded once to a double. Printing reverses
 * this, so "shortest" output parses back to the identical double.
 *
 * The sign of a declination is its own token: `-00:30:00` is −0.5°, not +0.5°
 * (the degrees field alone would read as −0, which carries no sign in a sum).
 */
import { ddDivDd } from 'double-double';
import type { DoubleDouble } from '../time/epoch';
import { ddAdd, ddAddNumber, ddSignOf, ddSub, ddTimes, ddToNumber } from '../time/double-double-typed';
import { ddToScaledDecimal, parseDecimalToDd } from './decimal-double-double';

const HMS_TEXT = /^(\d{1,2}):(\d{1,2}):(\d{1,2}(?:\.\d*)?)$/;
const DMS_TEXT = /^([+-]?)(\d{1,2}):(\d{1,2}):(\d{1,2}(?:\.\d*)?)$/;
const PI_DD = parseDecimalToDd('3.14159265358979323846264338327950288419716939937510'); // π to 51 digits (common knowledge)
const TWO_PI_DD = ddTimes(PI_DD, [0, 2]);
const SECONDS_OF_TIME_PER_TURN = 86_400; // 24 h × 3600 s: definition of hour angle
const ARCSECONDS_PER_HALF_TURN = 648_000; // 180° × 3600″: definition of the degree
const RAD_PER_SECOND_OF_TIME = ddDivDd(PI_DD, [0, SECONDS_OF_TIME_PER_TURN / 2]) as DoubleDouble; // 2π rad per 86 400 s
const SECONDS_OF_TIME_PER_RAD = ddDivDd([0, SECONDS_OF_TIME_PER_TURN / 2], PI_DD) as DoubleDouble;
const RAD_PER_ARCSECOND = ddDivDd(PI_DD, [0, ARCSECONDS_PER_HALF_TURN]) as DoubleDouble; // π rad per 648 000″
const ARCSECONDS_PER_RAD = ddDivDd([0, ARCSECONDS_PER_HALF_TURN], PI_DD) as DoubleDouble;
const MAX_SHORTEST_DIGITS = 20;

/**
 * Right ascension `hh:mm:ss.sss` → radians.
 *
 * @param text  hours 0–23, minutes 0–59, seconds 0 ≤ s < 60 with any number of decimals
 * @returns     angle in [0, 2π) rad, the double nearest the exact value (±1 ulp)
 * Throws RangeError naming the text when it is malformed or a field is out of range.
 */
export function parseHms(text: string): number {
  const match = HMS_TEXT.exec(text);
  if (match === null) throw new RangeError(`"${text}" is not a right ascension of the form hh:mm:ss.sss`);
  const hours = Number(match[1]);
  const minutes = Number(match[2]);
  const seconds = parseDecimalToDd(match[3]);
  if (hours > 23) throw new RangeError(`"${text}": hours must be 0–23`);
  if (minutes > 59) throw new RangeError(`"${text}": minutes must be 0–59`);
  if (ddToNumber(seconds) >= 60) throw new RangeError(`"${text}": seconds must be below 60`);
  const totalSeconds = ddAddNumber(seconds, hours * 3600 + minutes * 60);
  return ddToNumber(ddTimes(totalSeconds, RAD_PER_SECOND_OF_TIME));
}

/**
 * Declination `±dd:mm:ss.sss` → radians.
 *
 * @param text  optional sign, degrees 0–90, minutes 0–59, seconds 0 ≤ s < 60; at most 90° in all
 * @returns     angle in [−π/2, π/2] rad; `-00:mm:ss` is negative, `-00:00:00` is −0
 * Throws RangeError naming the text when it is malformed or out of range.
 */
export function parseDms(text: string): number {
  const match = DMS_TEXT.exec(text);
  if (match === null) throw new RangeError(`"${text}" is not a declination of the form ±dd:mm:ss.sss`);
  const sign = match[1] === '-' ? -1 : 1;
  const degrees = Number(match[2]);
  const minutes = Number(match[3]);
  const seconds = parseDecimalToDd(match[4]);
  if (minutes > 59) throw new RangeError(`"${text}": minutes must be 0–59`);
  if (ddToNumber(seconds) >= 60) throw new RangeError(`"${text}": seconds must be below 60`);
  const totalArcseconds = ddAddNumber(seconds, degrees * 3600 + minutes * 60);
  if (ddToNumber(totalArcseconds) > 90 * 3600) throw new RangeError(`"${text}": declination must be within ±90°`);
  return sign * ddToNumber(ddTimes(totalArcseconds, RAD_PER_ARCSECOND));
}

/**
 * Radians → right ascension `hh:mm:ss.sss`.
 *
 * @param rad            any finite angle; reduced to [0, 2π)
 * @param secondDigits   decimals of the seconds (0–20); omitted: the fewest that
 *                       parse back (parseHms) to the identical double
 * Throws RangeError for a non-finite angle or a bad digit count.
 */
export function formatHms(rad: number, secondDigits?: number): string {
  if (!Number.isFinite(rad)) throw new RangeError(`formatHms: angle ${rad} rad is not finite`);
  if (secondDigits !== undefined) return renderHms(rad, checkDigits(secondDigits, 'formatHms'));
  for (let digits = 0; digits <= MAX_SHORTEST_DIGITS; digits += 1) {
    const text = renderHms(rad, digits);
    if (Object.is(parseHms(text), reduceToTurn(rad))) return text;
  }
  return renderHms(rad, MAX_SHORTEST_DIGITS);
}

/**
 * Radians → declination `±dd:mm:ss.sss` (the sign is always written).
 *
 * @param rad             angle in [−π/2, π/2]; −0 and tiny negatives print with `-`
 * @param arcsecDigits    decimals of the arcseconds (0–20); omitted: the fewest that
 *                        parse back (parseDms) to the identical double
 * Throws RangeError for a non-finite angle, |angle| > π/2 or a bad digit count.
 */
export function formatDms(rad: number, arcsecDigits?: number): string {
  if (!Number.isFinite(rad) || Math.abs(rad) > Math.PI / 2) {
    throw new RangeError(`formatDms: angle ${rad} rad is not a declination (finite, within ±π/2)`);
  }
  if (arcsecDigits !== undefined) return renderDms(rad, checkDigits(arcsecDigits, 'formatDms'));
  for (let digits = 0; digits <= MAX_SHORTEST_DIGITS; digits += 1) {
    const text = renderDms(rad, digits);
    if (Object.is(parseDms(text), rad)) return text;
  }
  return renderDms(rad, MAX_SHORTEST_DIGITS);
}

function checkDigits(digits: number, routine: string): number {
  if (!Number.isInteger(digits) || digits < 0 || digits > MAX_SHORTEST_DIGITS) {
    throw new RangeError(`${routine}: digit count ${digits} must be an integer 0–${MAX_SHORTEST_DIGITS}`);
  }
  return digits;
}

/** The angle reduced to [0, 2π) as parseHms would return it. */
function reduceToTurn(rad: number): number {
  return ddToNumber(angleInTurn(rad));
}

/** rad + k·2π in [0, 2π) exactly (every double in [0, 2π] already is: 2π as a double is below 2π). */
function angleInTurn(rad: number): DoubleDouble {
  let x: DoubleDouble = [0, rad];
  while (ddSignOf(x) < 0) x = ddAdd(x, TWO_PI_DD);
  while (ddSignOf(ddSub(x, TWO_PI_DD)) >= 0) x = ddSub(x, TWO_PI_DD);
  return x;
}

function renderHms(rad: number, digits: number): string {
  const seconds = ddTimes(angleInTurn(rad), SECONDS_OF_TIME_PER_RAD);
  const unitsPerTurn = BigInt(SECONDS_OF_TIME_PER_TURN) * 10n ** BigInt(digits);
  const units = ddToScaledDecimal(seconds, digits) % unitsPerTurn; // 24:00:00 wraps to 00:00:00
  return splitSexagesimal(units < 0n ? units + unitsPerTurn : units, digits);
}

function renderDms(rad: number, digits: number): string {
  const negative = rad < 0 || Object.is(rad, -0);
  const arcseconds = ddTimes([0, Math.abs(rad)], ARCSECONDS_PER_RAD);
  return (negative ? '-' : '+') + splitSexagesimal(ddToScaledDecimal(arcseconds, digits), digits);
}

/** `units` = value · 10^digits in the smallest unit → `aa:bb:cc.ddd`. */
function splitSexagesimal(units: bigint, digits: number): string {
  const scale = 10n ** BigInt(digits);
  const wholeSeconds = units / scale;
  const fraction = units % scale;
  const major = wholeSeconds / 3600n;
  const minor = (wholeSeconds / 60n) % 60n;
  const second = wholeSeconds % 60n;
  const two = (n: bigint) => n.toString().padStart(2, '0');
  const fractionText = digits > 0 ? `.${fraction.toString().padStart(digits, '0')}` : '';
  return `${two(major)}:${two(minor)}:${two(second)}${fractionText}`;
}

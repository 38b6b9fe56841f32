/**
 * Typed views of the npm `double-double` routines the time modules use.
 *
 * The package types its values as `number[]`; the engine's `DoubleDouble` is
 * the tuple `[lo, hi]` (worker/timing/time/epoch.ts). These wrappers only fix
 * the types and the argument order (double-double first everywhere), so the
 * call sites read the same way. No arithmetic is added here.
 */
import {
  ddAddDd,
  ddAddDouble,
  ddDiffDd,
  ddDivDouble,
  ddMultDd,
  ddMultDouble2,
  twoSum,
} from 'double-double';
import type { DoubleDouble } from './epoch';

/** x + y, both double-double. */
export function ddAdd(x: DoubleDouble, y: DoubleDouble): DoubleDouble {
  return ddAddDd(x, y) as DoubleDouble;
}

/** x + y for a double-double x and a double y. */
export function ddAddNumber(x: DoubleDouble, y: number): DoubleDouble {
  return ddAddDouble(x, y) as DoubleDouble;
}

/** x − y, both double-double. */
export function ddSub(x: DoubleDouble, y: DoubleDouble): DoubleDouble {
  return ddDiffDd(x, y) as DoubleDouble;
}

/** x · y for a double-double x and a double y. */
export function ddTimesNumber(x: DoubleDouble, y: number): DoubleDouble {
  return ddMultDouble2(y, x) as DoubleDouble;
}

/** x · y, both double-double. */
export function ddTimes(x: DoubleDouble, y: DoubleDouble): DoubleDouble {
  return ddMultDd(x, y) as DoubleDouble;
}

/** x / y for a double-double x and a double y. */
export function ddDivideByNumber(x: DoubleDouble, y: number): DoubleDouble {
  return ddDivDouble(x, y) as DoubleDouble;
}

/** The exact sum a + b of two doubles as a double-double. */
export function ddFromSum(a: number, b: number): DoubleDouble {
  return twoSum(a, b) as DoubleDouble;
}

/** A number or a double-double, as a double-double. */
export function toDoubleDouble(x: number | DoubleDouble): DoubleDouble {
  return typeof x === 'number' ? [0, x] : x;
}

/** hi + lo as one double (loses the low part's digits; for approximations only). */
export function ddToNumber(x: DoubleDouble): number {
  return x[1] + x[0];
}

/** −1, 0 or +1: the sign of the double-double's value. */
export function ddSignOf(x: DoubleDouble): number {
  if (x[1] !== 0) return Math.sign(x[1]);
  return Math.sign(x[0]);
}

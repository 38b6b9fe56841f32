/**
 * expectWithin(got, want, tol, label): fails with want, got, |error| and tol.
 * Used by the time, ephemeris and geometry tests (physical-unit tolerances).
 */
import { expect } from 'vitest';

export function expectWithin(got: number, want: number, tol: number, label: string): void {
  const error = Math.abs(got - want);
  const ok = Number.isFinite(got) && error <= tol;
  expect(ok, `${label}: want ${want}, got ${got}, |error| ${error.toExponential(3)}, tol ${tol.toExponential(3)}`).toBe(true);
}

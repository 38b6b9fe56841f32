/**
 * The threshold power of a false-alarm level: the inverse of the Baluev 2008
 * analytic false-alarm probability (MNRAS 385, 1279, eq. 6 with Table 1's
 * z₁ normalisation) in its power argument. Checked by round trip through
 * falseAlarmBaluev itself, the function the engine uses for every peak.
 */
import { describe, expect, it } from 'vitest';
import { falseAlarmBaluev } from '../../../worker/timing/periodogram/false-alarm-probability';
import { powerAtFalseAlarm } from '../../../worker/timing/periodogram/false-alarm-power-level';
import { createSeededUniform } from '../../../worker/timing/fit/seeded-normal';
import { expectWithin } from '../time/expect-within';

/** Invented irregular sampling: `n` times over `spanDays`, σ varying 0.5–2 µs. */
function sampling(n: number, spanDays: number, seed: number) {
  const uniform = createSeededUniform(seed);
  const tDays = Float64Array.from(Array.from({ length: n }, () => uniform() * spanDays).sort((a, b) => a - b));
  const weights = Float64Array.from(tDays, () => {
    const sigmaUs = 0.5 + 1.5 * uniform();
    return 1 / (sigmaUs * sigmaUs);
  });
  return { tDays, weights };
}

describe('powerAtFalseAlarm (inverse of Baluev 2008)', () => {
  const { tDays, weights } = sampling(300, 2000, 5);
  const fMaxPerDay = 1; // shortest trial period 1 d

  it.each([1e-1, 1e-2, 1e-3, 1e-4, 1e-8])('round-trips FAP %s through falseAlarmBaluev (weighted)', (fap) => {
    const p = powerAtFalseAlarm(fap, tDays.length, fMaxPerDay, tDays, weights);
    expect(p).toBeGreaterThan(0);
    expect(p).toBeLessThan(1);
    expectWithin(falseAlarmBaluev(p, tDays.length, fMaxPerDay, tDays, weights) / fap, 1, 1e-9, 'FAP(level)/target');
    // just below the level the probability is above the target (the level is the crossing, not any point past it)
    expect(falseAlarmBaluev(p * (1 - 1e-6), tDays.length, fMaxPerDay, tDays, weights)).toBeGreaterThan(fap);
  });

  it('rises with stricter levels, more frequencies searched and fewer samples', () => {
    const at = (fap: number, n = tDays.length, fMax = fMaxPerDay) => powerAtFalseAlarm(fap, n, fMax, tDays.subarray(0, n));
    expect(at(1e-3)).toBeGreaterThan(at(1e-2));
    expect(at(1e-3, tDays.length, 10)).toBeGreaterThan(at(1e-3)); // more independent frequencies, higher bar
    expect(at(1e-3, 60)).toBeGreaterThan(at(1e-3)); // fewer samples, a random peak reaches higher
  });

  it('answers 1 when even a perfect peak cannot reach the target, and rejects targets outside (0, 1)', () => {
    const few = sampling(5, 100, 9);
    expect(powerAtFalseAlarm(1e-300, 5, 100, few.tDays)).toBe(1);
    expect(() => powerAtFalseAlarm(0, tDays.length, 1, tDays)).toThrow(/targetFap/);
    expect(() => powerAtFalseAlarm(1, tDays.length, 1, tDays)).toThrow(/targetFap/);
    expect(() => powerAtFalseAlarm(Number.NaN, tDays.length, 1, tDays)).toThrow(RangeError);
    expect(() => powerAtFalseAlarm(1e-3, 4, 1, tDays)).toThrow(/n must be/); // checked by falseAlarmBaluev
  });
});

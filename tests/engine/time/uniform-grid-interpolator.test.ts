import { describe, expect, it } from 'vitest';
import { UniformGridInterpolator } from '../../../worker/timing/time/uniform-grid-interpolator';
import { mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import { expectWithin } from './expect-within';

describe('UniformGridInterpolator', () => {
  it('reproduces a polynomial of degree pointCount − 1 exactly (Lagrange identity)', () => {
    const cubic = (t: number) => 2 - 0.5 * t + 0.25 * t * t - 0.125 * t * t * t; // t: days from MJD 58000
    const grid = new UniformGridInterpolator(1, 4, 1, (mjd, out) => {
      out[0] = cubic(mjd - 58000);
    });
    const out = new Float64Array(1);
    for (const [day, frac] of [[58000, 0.3], [58003, 0.999], [57998, 0.5], [58001, 0]] as const) {
      grid.evaluate(mjdFromParts(day, frac), out);
      expectWithin(out[0], cubic(day - 58000 + frac), 1e-12, `value at ${day}+${frac}`);
    }
  });

  it('evaluates each node once and interpolates several components', () => {
    let calls = 0;
    const grid = new UniformGridInterpolator(0.5, 6, 2, (mjd, out) => {
      calls++;
      out[0] = Math.sin(mjd / 10);
      out[1] = mjd;
    });
    const out = new Float64Array(2);
    for (let i = 0; i < 100; i++) grid.evaluate(mjdFromParts(60000, i / 100), out);
    expect(calls).toBe(grid.evaluatedNodeCount);
    expect(calls).toBe(7); // centred 6-point stencils for [60000, 60000.5) and [60000.5, 60001): nodes 59999 … 60002
    grid.evaluate(mjdFromParts(60000, 0.25), out);
    expectWithin(out[1], 60000.25, 1e-9, 'linear component');
    expectWithin(out[0], Math.sin(6000.025), 1e-9, 'sine component');
  });

  it('rejects an odd point count', () => {
    expect(() => new UniformGridInterpolator(1, 3, 1, () => {})).toThrow(RangeError);
  });
});

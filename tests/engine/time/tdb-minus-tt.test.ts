import { describe, expect, it } from 'vitest';
import { erfaLibrary } from '../../../worker/timing/erfa/erfa-library';
import {
  TdbMinusTtEvaluator,
  tdbMinusTtSeconds,
  topocentricTdbMinusTtSeconds,
} from '../../../worker/timing/time/tdb-minus-tt';
import { mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import { expectWithin } from './expect-within';

function seeded(seed: number): () => number {
  let s = seed;
  return () => {
    s = (s * 1103515245 + 12345) % 2147483648;
    return s / 2147483648;
  };
}

describe('TDB − TT', () => {
  // Source: ERFA test suite (t_erfa_c.c, t_dtdb): eraDtdb(2448939.5, 0.123, 0.76543, 5.0123, 5525.242, 3190.0)
  // = -0.1280368005936998991e-2 s.
  it('reproduces ERFA’s own regression value through the binding to 1e-15 s', () => {
    const value = erfaLibrary().eraDtdb(2448939.5, 0.123, 0.76543, 5.0123, 5525.242, 3190.0);
    expectWithin(value, -0.1280368005936998991e-2, 1e-15, 'eraDtdb (s)');
  });

  it('the same case through tdbMinusTtSeconds with an MJD argument agrees to 1e-12 s', () => {
    const tt = mjdFromParts(2448939.5 - 2400000.5, 0.123);
    const site = { elongRad: 5.0123, uKm: 5525.242, vKm: 3190.0 };
    expectWithin(tdbMinusTtSeconds(tt, 0.76543, site), -0.1280368005936998991e-2, 1e-12, 'TDB−TT (s)');
  });

  it('the JavaScript topocentric part equals eraDtdb(full) − eraDtdb(u = v = 0) to 1e-15 s', () => {
    const random = seeded(3);
    for (let i = 0; i < 500; i++) {
      const tt = mjdFromParts(37000 + Math.floor(random() * 36000), random());
      const ut = random();
      const site = { elongRad: random() * 2 * Math.PI - Math.PI, uKm: 6378 * random(), vKm: 6357 * (2 * random() - 1) };
      const direct = tdbMinusTtSeconds(tt, ut, site) - tdbMinusTtSeconds(tt, ut, { elongRad: 0, uKm: 0, vKm: 0 });
      expectWithin(topocentricTdbMinusTtSeconds(tt, ut, site), direct, 1e-15, `topocentric part at MJD ${tt.day} (s)`);
    }
  });

  it('the interpolated evaluator is within 1 ns of direct eraDtdb at 5000 random instants 1960–2059 (measured ~4e-12 s)', () => {
    const random = seeded(11);
    const evaluator = new TdbMinusTtEvaluator();
    let worst = 0;
    for (let i = 0; i < 5000; i++) {
      const tt = mjdFromParts(36950 + Math.floor(random() * 36400), [0, random()]);
      const ut = random();
      const site = { elongRad: random() * 2 * Math.PI, uKm: 3000 + 3378 * random(), vKm: 6000 * (2 * random() - 1) };
      worst = Math.max(worst, Math.abs(evaluator.seconds(tt, ut, site) - tdbMinusTtSeconds(tt, ut, site)));
    }
    expectWithin(worst, 0, 1e-9, 'largest interpolation error (s)');
    expect(worst).toBeGreaterThan(0); // the two paths really are different computations
  });

  it('has the annual ~1.66 ms amplitude (ERFA dtdb Note 4)', () => {
    const evaluator = new TdbMinusTtEvaluator();
    let max = 0;
    for (let d = 0; d < 366; d++) max = Math.max(max, Math.abs(evaluator.geocentricSeconds(mjdFromParts(58000 + d, 0))));
    expectWithin(max, 1.66e-3, 0.05e-3, 'largest |TDB−TT| over a year (s)');
  });
});

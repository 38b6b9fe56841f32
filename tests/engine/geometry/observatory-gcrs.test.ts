import { describe, expect, it } from 'vitest';
import { dtdbSiteFromItrf } from '../../../worker/timing/earth/dtdb-site-from-itrf';
import {
  EARTH_ROTATION_RATE_RAD_PER_S,
  ObservatoryGcrsEvaluator,
  earthRotationAngleRad,
  observatoryGcrsPositionDirect,
} from '../../../worker/timing/earth/observatory-gcrs';
import { erfaLibrary } from '../../../worker/timing/erfa/erfa-library';
import { mjdAddSeconds, mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import type { Mjd } from '../../../worker/timing/time/epoch';
import { expectWithin } from '../time/expect-within';

// An invented site, |r| ≈ 6371 km at latitude ~49°.
const SITE_M: [number, number, number] = [3_950_000, 1_320_000, 4_820_000];
const SITE_RADIUS_M = Math.hypot(...SITE_M);
const norm = (v: number[]) => Math.hypot(v[0], v[1], v[2]);

function seeded(seed: number): () => number {
  let s = seed;
  return () => {
    s = (s * 1103515245 + 12345) % 2147483648;
    return s / 2147483648;
  };
}

/** TT and a UT1 about 69 s earlier (as in 2017–2024). */
function instants(random: () => number): { tt: Mjd; ut1: Mjd } {
  const tt = mjdFromParts(36950 + Math.floor(random() * 36400), random());
  return { tt, ut1: mjdAddSeconds(tt, -69.184 + random()) };
}

describe('observatory GCRS position and velocity', () => {
  const evaluator = new ObservatoryGcrsEvaluator();

  it('keeps the ITRF radius (distance to the geocentre) to 1 µm', () => {
    const random = seeded(5);
    for (let i = 0; i < 200; i++) {
      const { tt, ut1 } = instants(random);
      expectWithin(norm(evaluator.state(SITE_M, tt, ut1).positionM), SITE_RADIUS_M, 1e-6, 'GCRS radius (m)');
    }
  });

  it('interpolated precession–nutation agrees with direct eraC2t06a within 1 mm at 3000 random instants 1960–2059', () => {
    const random = seeded(17);
    let worstM = 0;
    for (let i = 0; i < 3000; i++) {
      const { tt, ut1 } = instants(random);
      const polar = i % 2 === 0 ? undefined : { xpRad: (random() - 0.5) * 3e-6, ypRad: (random() - 0.5) * 3e-6 };
      const fast = evaluator.state(SITE_M, tt, ut1, polar).positionM;
      const direct = observatoryGcrsPositionDirect(SITE_M, tt, ut1, polar);
      worstM = Math.max(worstM, norm([fast[0] - direct[0], fast[1] - direct[1], fast[2] - direct[2]]));
    }
    expectWithin(worstM, 0, 1e-3, 'largest position difference (m)');
    expect(worstM).toBeGreaterThan(0);
  });

  it('computes the Earth rotation angle as ERFA eraEra00 does (two-part UT1) to 1e-12 rad', () => {
    const random = seeded(23);
    for (let i = 0; i < 500; i++) {
      const ut1 = mjdFromParts(36950 + Math.floor(random() * 36400), random());
      const erfa = erfaLibrary().eraEra00(2400000.5 + ut1.day, ut1.frac[1] + ut1.frac[0]);
      let d = Math.abs(erfa - earthRotationAngleRad(ut1));
      d = Math.min(d, 2 * Math.PI - d);
      expectWithin(d, 0, 1e-12, `ERA difference at UT1 MJD ${ut1.day} (rad)`);
    }
  });

  // Common practice: one sidereal day = 86164.0905 s; the rotation relative to the fixed
  // directions of the GCRS (stellar day) is 86164.0989 s, so allow the 0.01 s between them.
  it('rotates once per sidereal day (86164.0905 s)', () => {
    const tt0 = mjdFromParts(58849, 0.2);
    const ut10 = mjdAddSeconds(tt0, -69.184);
    const r0 = evaluator.state(SITE_M, tt0, ut10).positionM;
    const gap = (seconds: number) => {
      const r = evaluator.state(SITE_M, mjdAddSeconds(tt0, seconds), mjdAddSeconds(ut10, seconds)).positionM;
      return norm([r[0] - r0[0], r[1] - r0[1], r[2] - r0[2]]);
    };
    // golden-section search for the closest return between 86 160 s and 86 168 s
    let a = 86_160;
    let b = 86_168;
    for (let k = 0; k < 60; k++) {
      const m1 = b - (b - a) * 0.618;
      const m2 = a + (b - a) * 0.618;
      if (gap(m1) < gap(m2)) b = m2;
      else a = m1;
    }
    expectWithin((a + b) / 2, 86_164.0905, 0.02, 'period of return (s)');
    expectWithin(gap((a + b) / 2), 0, 10, 'closest return distance (m; precession moves the pole)');
  });

  it('velocity is ω × r: matches a ±1 s central difference of the position within 1 mm/s', () => {
    const random = seeded(29);
    for (let i = 0; i < 100; i++) {
      const { tt, ut1 } = instants(random);
      const v = evaluator.state(SITE_M, tt, ut1).velocityMPerS;
      const plus = evaluator.state(SITE_M, mjdAddSeconds(tt, 1), mjdAddSeconds(ut1, 1)).positionM;
      const less = evaluator.state(SITE_M, mjdAddSeconds(tt, -1), mjdAddSeconds(ut1, -1)).positionM;
      for (let k = 0; k < 3; k++) expectWithin(v[k], (plus[k] - less[k]) / 2, 1e-3, `velocity[${k}] (m/s)`);
      // Speed = ω · distance from the rotation axis (≈ √(x² + y²) in ITRF): ~305 m/s here.
      expectWithin(norm(v), EARTH_ROTATION_RATE_RAD_PER_S * Math.hypot(SITE_M[0], SITE_M[1]), 0.05, 'speed (m/s)');
    }
  });

  // Common practice: Earth's rotation rate 7.292115e-5 rad/s (IERS conventional value).
  it('uses the conventional rotation rate 7.292115e-5 rad/s', () => {
    expectWithin(EARTH_ROTATION_RATE_RAD_PER_S, 7.292115e-5, 1e-11, 'ω (rad/s)');
  });
});

describe('dtdbSiteFromItrf', () => {
  it('splits the ITRF vector into longitude, axis distance and height above the equator', () => {
    const site = dtdbSiteFromItrf(...SITE_M);
    expectWithin(Math.hypot(site.uKm, site.vKm), SITE_RADIUS_M / 1000, 1e-9, 'radius (km)');
    expectWithin(site.vKm, 4820, 1e-12, 'v (km)');
    expectWithin(site.elongRad, Math.atan2(1_320_000, 3_950_000), 1e-15, 'longitude (rad)');
    expect(dtdbSiteFromItrf(-1000, -1, 0).elongRad).toBeLessThan(-3); // west of 180° comes out negative
  });
});

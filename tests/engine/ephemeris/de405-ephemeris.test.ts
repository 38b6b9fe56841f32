import { describe, expect, it } from 'vitest';
import { loadDe405 } from '../../../worker/timing/ephemeris/de405-ephemeris';
import { erfaLibrary } from '../../../worker/timing/erfa/erfa-library';
import { mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import { expectWithin } from '../time/expect-within';

const ephemeris = loadDe405();
const AU_KM = ephemeris.constants.AU;
const norm = (v: number[]) => Math.hypot(v[0], v[1], v[2]);
const minus = (a: number[], b: number[]) => [a[0] - b[0], a[1] - b[1], a[2] - b[2]];

describe('DE405 ephemeris', () => {
  it('reports its range from the table (TDB MJD 36912–73488)', () => {
    expect(ephemeris.info.name).toBe('DE405');
    expect(ephemeris.info.firstMjdTdb).toBe(36912);
    expect(ephemeris.info.lastMjdTdb).toBe(36912 + 1143 * 32);
  });

  it('is continuous across record boundaries: position < 1 m, velocity < 1 µm/s', () => {
    const bodies = ['earth', 'moon', 'sun', 'jupiter', 'mercury', 'earth-moon-barycentre'] as const;
    let worstPositionKm = 0;
    let worstVelocityKmPerS = 0;
    for (let row = 1; row < 1143; row += 7) {
      const boundaryDay = 36912 + 32 * row;
      for (const body of bodies) {
        const before = ephemeris.state(body, mjdFromParts(boundaryDay - 1, [0, 1 - 2 ** -40]));
        const after = ephemeris.state(body, mjdFromParts(boundaryDay, 0));
        worstPositionKm = Math.max(worstPositionKm, norm(minus(after.positionKm, before.positionKm)) - norm(before.velocityKmPerS) * 2 ** -40 * 86400);
        worstVelocityKmPerS = Math.max(worstVelocityKmPerS, norm(minus(after.velocityKmPerS, before.velocityKmPerS)));
      }
    }
    expectWithin(worstPositionKm, 0, 1e-3, 'largest position jump (km)');
    expectWithin(worstVelocityKmPerS, 0, 1e-9, 'largest velocity jump (km/s)');
  });

  it('velocity is the derivative of position (central difference over ±60 s)', () => {
    for (const body of ['earth', 'moon', 'jupiter'] as const) {
      const t = mjdFromParts(55123, 0.3);
      const plus = ephemeris.state(body, mjdFromParts(55123, 0.3 + 60 / 86400)).positionKm;
      const less = ephemeris.state(body, mjdFromParts(55123, 0.3 - 60 / 86400)).positionKm;
      const v = ephemeris.state(body, t).velocityKmPerS;
      for (let k = 0; k < 3; k++) expectWithin((plus[k] - less[k]) / 120, v[k], 1e-6, `${body} velocity[${k}] (km/s)`);
    }
  });

  // Reference: ERFA eraEpv00 header, Note 4: versus DE405 over 1900–2100, barycentric Earth
  // position error rms 4.6 km / max 13.4 km, velocity rms 1.4 / max 4.9 mm/s.
  it('Earth agrees with ERFA epv00 within its documented accuracy versus DE405 at 50 dates 1960–2059', () => {
    const erfa = erfaLibrary();
    const pvh = new Float64Array(6);
    const pvb = new Float64Array(6);
    let sumSquaresKm2 = 0;
    for (let i = 0; i < 50; i++) {
      const mjd = 37000 + i * 727.37; // 1960-04 … 2058-09
      const day = Math.floor(mjd);
      expect(erfa.eraEpv00(2400000.5, mjd, pvh, pvb)).toBe(0);
      const state = ephemeris.state('earth', mjdFromParts(day, mjd - day));
      const dpKm = norm(minus(state.positionKm, [pvb[0] * AU_KM, pvb[1] * AU_KM, pvb[2] * AU_KM]));
      const dvKmPerS = norm(minus(state.velocityKmPerS, [3, 4, 5].map((k) => (pvb[k] * AU_KM) / 86400)));
      expectWithin(dpKm, 0, 13.4, `Earth position difference at MJD ${mjd} (km)`);
      expectWithin(dvKmPerS * 1e6, 0, 4.9, `Earth velocity difference at MJD ${mjd} (mm/s)`);
      sumSquaresKm2 += dpKm * dpKm;
    }
    expectWithin(Math.sqrt(sumSquaresKm2 / 50), 0, 2 * 4.6, 'rms position difference (km), twice the documented rms');
  });

  // Reference: perihelion 0.98329 au and aphelion 1.01671 au (astronomical almanac, from memory).
  it('Sun–Earth distance over 2019 spans perihelion 0.98329 au to aphelion 1.01671 au', () => {
    let minAu = Infinity;
    let maxAu = 0;
    for (let hour = 0; hour < 366 * 24; hour++) {
      const t = mjdFromParts(58484, hour / 24);
      const distanceKm = norm(minus(ephemeris.state('earth', t).positionKm, ephemeris.state('sun', t).positionKm));
      minAu = Math.min(minAu, distanceKm / AU_KM);
      maxAu = Math.max(maxAu, distanceKm / AU_KM);
    }
    expectWithin(minAu, 0.98329, 2e-4, 'perihelion distance (au)');
    expectWithin(maxAu, 1.01671, 2e-4, 'aphelion distance (au)');
  });

  it('Moon is about 384 000 km from the Earth (mean distance 384 400 km, from memory)', () => {
    const t = mjdFromParts(60000, 0);
    const d = norm(minus(ephemeris.state('moon', t).positionKm, ephemeris.state('earth', t).positionKm));
    expectWithin(d, 384_400, 30_000, 'Earth–Moon distance (km)');
  });

  it('throws a RangeError naming the date and the range outside the table', () => {
    expect(() => ephemeris.state('earth', mjdFromParts(30000, 0.5))).toThrow(RangeError);
    expect(() => ephemeris.state('earth', mjdFromParts(30000, 0.5))).toThrow(/30000.5.*36912.*73488/);
    expect(() => ephemeris.state('sun', mjdFromParts(73488, 0.001))).toThrow(RangeError);
    expect(() => ephemeris.state('sun', mjdFromParts(73487, 0.999))).not.toThrow();
  });

  // Source: IAU 2012 Resolution B2 (au = 149 597 870 700 m exactly) and c = 299 792 458 m/s (SI): 499.004784 s.
  it('light time for one au is 499.004784 s; DE405’s own au (9 m shorter) differs by only 3e-8 s', () => {
    expectWithin(149_597_870_700 / 299_792_458, 499.004784, 5e-7, 'IAU 2012 au light time (s)');
    expect(ephemeris.constants.CLIGHT).toBe(299_792.458);
    expectWithin(ephemeris.constants.AU / ephemeris.constants.CLIGHT, 149_597_870_700 / 299_792_458, 4e-8, 'DE405 au light time (s)');
  });

  it('is loaded once and then served from memory', () => {
    expect(loadDe405()).toBe(ephemeris);
  });
});

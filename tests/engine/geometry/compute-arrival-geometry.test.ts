import { describe, expect, it } from 'vitest';
import { TimingInputError } from '../../../worker/timing/engine-error';
import type { Observatory } from '../../../worker/timing/earth/observatory';
import { dtdbSiteFromItrf } from '../../../worker/timing/earth/dtdb-site-from-itrf';
import { loadDe405 } from '../../../worker/timing/ephemeris/de405-ephemeris';
import { computeArrivalGeometry } from '../../../worker/timing/pipeline/compute-arrival-geometry';
import { mjdDiffSeconds, mjdFromParts } from '../../../worker/timing/time/mjd-arithmetic';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { tdbMinusTtSeconds } from '../../../worker/timing/time/tdb-minus-tt';
import { expectWithin } from '../time/expect-within';

const C_KM_PER_S = 299_792.458;
const ephemeris = loadDe405();
const norm3 = (a: Float64Array, i: number) => Math.hypot(a[3 * i], a[3 * i + 1], a[3 * i + 2]);

// Invented observatories.
const site: Observatory = {
  code: 'test-site',
  name: 'Test site (invented)',
  itrfXM: 3_950_000,
  itrfYM: 1_320_000,
  itrfZM: 4_820_000,
  clockCorrections: [
    { mjd: parseMjd('57000'), correctionUs: 2 },
    { mjd: parseMjd('59000'), correctionUs: 4 },
  ],
};
const bare: Observatory = { code: 'bare', name: 'No clock table (invented)', itrfXM: -2_000_000, itrfYM: -5_000_000, itrfZM: -3_300_000, clockCorrections: [] };
const observatories = new Map([
  [site.code, site],
  [bare.code, bare],
]);
const toa = (row: number, mjd: string, observatory = site.code) => ({ row, mjd: parseMjd(mjd), observatory });

describe('computeArrivalGeometry', () => {
  const toas = [toa(1, '57400.25'), toa(2, '58000.123456789012'), toa(3, '57753.7', 'bare'), toa(4, '57754.2', 'bare'), toa(5, '60000.9')];
  const g = computeArrivalGeometry(toas, observatories);

  it('chains clock → UTC → TAI → TT → TDB: tdb = mjd + (clock + TT−UTC + TDB−TT)/86400 to 1e-15 s', () => {
    for (let i = 0; i < toas.length; i++) {
      const d = mjdDiffSeconds(g.tdb[i], toas[i].mjd);
      expectWithin(d[1] + d[0], g.clockS[i] + g.ttMinusUtcS[i] + g.tdbMinusTtS[i], 1e-15, `row ${toas[i].row} total correction (s)`);
    }
  });

  // Source: IERS Bulletin C (TAI−UTC 36 s in 2016, 37 s from 2017-01-01) and IAU 1991 Resolution A4 (32.184 s).
  it('uses TT − UTC = 68.184 s in 2016 and 69.184 s after 2017-01-01, across the leap second', () => {
    expect(g.ttMinusUtcS[0]).toBe(68.184);
    expect(g.ttMinusUtcS[2]).toBe(68.184); // 2016-12-31, the leap-second day
    expect(g.ttMinusUtcS[3]).toBe(69.184); // 2017-01-01
    expect(g.ttMinusUtcS[1]).toBe(69.184);
  });

  it('interpolates the clock table (hand-checkable: MJD 58000.12… is 50.0062 % of the way from 2 µs to 4 µs)', () => {
    expectWithin(g.clockS[1], (2 + (2 * 1000.123456789012) / 2000) * 1e-6, 1e-15, 'clock correction (s)');
    expect(g.clockS[2]).toBe(0);
  });

  it('TDB − TT agrees with direct eraDtdb at the observatory within 1 ns', () => {
    for (const i of [0, 1, 4]) {
      const tt = mjdFromParts(toas[i].mjd.day, [toas[i].mjd.frac[0], toas[i].mjd.frac[1] + (g.clockS[i] + g.ttMinusUtcS[i]) / 86400]);
      const utcFraction = toas[i].mjd.frac[1] + g.clockS[i] / 86400;
      const direct = tdbMinusTtSeconds(tt, utcFraction, dtdbSiteFromItrf(site.itrfXM, site.itrfYM, site.itrfZM));
      expectWithin(g.tdbMinusTtS[i], direct, 1e-9, `row ${toas[i].row} TDB−TT (s)`);
    }
  });

  it('puts the observatory at the ITRF radius from the geocentre (Earth from DE405 at the same TDB)', () => {
    for (let i = 0; i < toas.length; i++) {
      const earth = ephemeris.state('earth', g.tdb[i]).positionKm;
      const dx = [0, 1, 2].map((k) => g.observatoryPositionLs[3 * i + k] * C_KM_PER_S - earth[k]);
      const observatory = toas[i].observatory === 'bare' ? bare : site;
      expectWithin(Math.hypot(dx[0], dx[1], dx[2]), Math.hypot(observatory.itrfXM, observatory.itrfYM, observatory.itrfZM) / 1000, 1e-6, 'geocentric distance (km)');
    }
  });

  // Source: IAU 2012 Resolution B2 (au = 149 597 870 700 m) with c = 299 792 458 m/s: light time for 1 au = 499.004784 s.
  it('keeps the observatory within 1.02 au (509 light-seconds) of the barycentre and of the Sun', () => {
    const auLightSeconds = 499.004784;
    for (let i = 0; i < toas.length; i++) {
      expect(norm3(g.observatoryPositionLs, i)).toBeLessThanOrEqual(1.02 * auLightSeconds);
      const sunDistance = norm3(g.sunToObservatoryLs, i) / auLightSeconds;
      expect(sunDistance).toBeGreaterThan(0.983 - 1e-4);
      expect(sunDistance).toBeLessThan(1.0168);
      const jupiterDistance = norm3(g.jupiterToObservatoryLs, i) / auLightSeconds;
      expect(jupiterDistance).toBeGreaterThan(3.9); // Jupiter 4.2–6.5 au from Earth (from memory)
      expect(jupiterDistance).toBeLessThan(6.5);
      // Earth's orbital speed 29.3–30.3 km/s (from memory) plus ≤ 0.47 km/s of rotation and ~13 m/s of solar-system barycentre motion.
      expect(norm3(g.observatoryVelocityC, i)).toBeGreaterThan(28.8 / C_KM_PER_S);
      expect(norm3(g.observatoryVelocityC, i)).toBeLessThan(30.8 / C_KM_PER_S);
    }
  });

  it('states its settings and warns about UT1 = UTC and the leap-second day', () => {
    expect(g.settings).toEqual({
      ephemeris: 'DE405',
      clock: 'observatory clock corrections → UTC',
      timeScale: 'TDB via ERFA dtdb (topocentric)',
      earthOrientation: 'IAU 2006/2000A, UT1 = UTC, no polar motion',
    });
    expect(g.ephemeris.name).toBe('DE405');
    expect(g.warnings.some((w) => w.includes('UT1 = UTC'))).toBe(true);
    expect(g.warnings.some((w) => w.includes('leap second') && w.includes('row 3'))).toBe(true);
    expect(g.warnings.some((w) => w.includes('clock-correction table') && w.includes('row 5'))).toBe(true); // 60000.9 > 59000
  });
});

describe('computeArrivalGeometry: reserved codes', () => {
  it('ssb: the stamp is TDB at the barycentre, zero position and no corrections', () => {
    const g = computeArrivalGeometry([toa(1, '58000.5', 'ssb')], observatories);
    expect(g.tdb[0]).toEqual(parseMjd('58000.5'));
    expect([g.clockS[0], g.ttMinusUtcS[0], g.tdbMinusTtS[0]]).toEqual([0, 0, 0]);
    expect(Array.from(g.observatoryPositionLs)).toEqual([0, 0, 0]);
    expect(Array.from(g.observatoryVelocityC)).toEqual([0, 0, 0]);
    const sun = ephemeris.state('sun', g.tdb[0]).positionKm;
    for (let k = 0; k < 3; k++) expectWithin(g.sunToObservatoryLs[k], -sun[k] / C_KM_PER_S, 1e-15, 'SSB − Sun (ls)');
    expect(g.warnings).toEqual([]);
  });

  it('geocenter: the stamp is TT, only geocentric TDB − TT, position = Earth', () => {
    const g = computeArrivalGeometry([toa(1, '58000.5', 'geocenter')], observatories);
    expect(g.clockS[0]).toBe(0);
    expect(g.ttMinusUtcS[0]).toBe(0);
    expectWithin(g.tdbMinusTtS[0], tdbMinusTtSeconds(parseMjd('58000.5'), 0, { elongRad: 0, uKm: 0, vKm: 0 }), 1e-9, 'TDB−TT (s)');
    const earth = ephemeris.state('earth', g.tdb[0]).positionKm;
    for (let k = 0; k < 3; k++) expectWithin(g.observatoryPositionLs[k], earth[k] / C_KM_PER_S, 1e-12, 'position (ls)');
  });
});

describe('computeArrivalGeometry: Earth orientation', () => {
  it('rotates the site by ω·(UT1 − UTC) when a table is given, and says where UT1 came from', () => {
    const eo = {
      source: 'invented test table',
      points: [
        { mjd: 57990, ut1MinusUtcS: 0.3, xpArcsec: 0, ypArcsec: 0 },
        { mjd: 58010, ut1MinusUtcS: 0.3, xpArcsec: 0, ypArcsec: 0 },
      ],
    };
    const toas = [toa(1, '58000.3')];
    const without = computeArrivalGeometry(toas, observatories);
    const withTable = computeArrivalGeometry(toas, observatories, { earthOrientation: eo });
    const shiftKm = Math.hypot(...[0, 1, 2].map((k) => (withTable.observatoryPositionLs[k] - without.observatoryPositionLs[k]) * C_KM_PER_S));
    const expectedKm = 7.2921150e-5 * 0.3 * Math.hypot(site.itrfXM, site.itrfYM) / 1000; // ω·Δt·(distance from the axis)
    expectWithin(shiftKm, expectedKm, 0.01 * expectedKm, 'site shift (km)');
    expect(withTable.warnings.some((w) => w.includes('UT1 = UTC'))).toBe(false);
    expect(withTable.settings.earthOrientation).toContain('invented test table');
  });
});

describe('computeArrivalGeometry: bad input', () => {
  it('names the rows and the code of an unknown observatory', () => {
    const run = () => computeArrivalGeometry([toa(1, '58000'), toa(2, '58001', 'nowhere'), toa(7, '58002', 'nowhere')], observatories);
    expect(run).toThrow(TimingInputError);
    expect(run).toThrow(/"nowhere" \(rows 2, 7\)/);
    try {
      run();
    } catch (error) {
      expect((error as TimingInputError).details.map((d) => d.row)).toEqual([2, 7]);
    }
  });

  it('lists the rows outside the ephemeris (before 1960, after 2059, and an ssb row)', () => {
    const run = () =>
      computeArrivalGeometry([toa(1, '58000'), toa(2, '30000.5'), toa(3, '80000', 'bare'), toa(4, '36000', 'ssb')], observatories);
    expect(run).toThrow(TimingInputError);
    expect(run).toThrow(/DE405.*rows 2, 3, 4/);
    try {
      run();
    } catch (error) {
      expect((error as TimingInputError).details.map((d) => d.row)).toEqual([2, 3, 4]);
    }
  });

  it('warns when a TOA is beyond ERFA’s leap-second knowledge (2050)', () => {
    const g = computeArrivalGeometry([toa(1, '69807.5', 'bare')], observatories);
    expect(g.warnings.some((w) => w.includes('leap seconds known to ERFA') && w.includes('row 1'))).toBe(true);
  });

  it('returns an empty geometry for no TOAs', () => {
    const g = computeArrivalGeometry([], observatories);
    expect(g.count).toBe(0);
    expect(g.warnings).toEqual([]);
  });
});

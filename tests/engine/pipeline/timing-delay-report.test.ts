import { describe, expect, it } from 'vitest';
import Decimal from 'decimal.js';
import { toyGeometry } from './toy-geometry';
import { toyModel } from './toy-model';
import { timingDelayReport } from '../../../worker/timing/pipeline/timing-delay-report';
import { parseMjd, formatMjd } from '../../../worker/timing/time/mjd-string';
import type { Toa } from '../../../worker/timing/toas/toa';

function toa(mjd: string, row: number, observatory = 'toy-site'): Toa {
  return { row, line: row + 1, mjd: parseMjd(mjd), uncertaintyUs: 1, frequencyMhz: 1400, observatory, backend: 'default', pulseNumber: null, labels: {} };
}

describe('delay report', () => {
  it('ssb_tdb_mjd is mjd + (clock + TT−UTC + TDB−TT + Roemer − Shapiro − dispersion)/86400 (docs/formats.md §4) to 1e-18 day (0.1 ps)', () => {
    Decimal.set({ precision: 40 });
    const toas = [toa('58123.4567890123456789', 1), toa('58999.0000000000000001', 2)];
    const geometry = toyGeometry(toas);
    geometry.clockS[0] = 4.2e-7; // the toy geometry has no clock or time-scale terms; the report must not invent any
    const rows = timingDelayReport(toyModel(), toas, geometry);
    rows.forEach((r, i) => {
      const tdb = new Decimal(formatMjd(geometry.tdb[i], 30));
      const want = tdb.plus(new Decimal(r.roemer_s).minus(r.shapiro_s).minus(r.dispersion_s).div(86400));
      expect(new Decimal(r.ssb_tdb_mjd).minus(want).abs().toNumber()).toBeLessThan(1e-18);
      expect(r.row).toBe(i + 1);
      expect(r.companions_s).not.toBe(0); // the toy model has a companion; its delay is reported, not applied
    });
    expect(rows[0].clock_s).toBe(4.2e-7);
  });

  it('a barycentric (ssb) row has no Roemer, Shapiro or Doppler terms', () => {
    const toas = [toa('58123.5', 1, 'ssb')];
    const geometry = toyGeometry(toas);
    geometry.observatoryPositionLs.fill(0);
    geometry.observatoryVelocityC.fill(0);
    const [row] = timingDelayReport(toyModel(), toas, geometry);
    expect(row.roemer_s).toBe(0);
    expect(row.shapiro_s).toBe(0);
    expect(row.dispersion_s).toBeCloseTo((4.148808e3 * 21.7) / 1400 ** 2, 4); // DM(t) drifts by 1e-3/yr in the toy model
  });
});

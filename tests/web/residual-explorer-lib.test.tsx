import { describe, expect, it } from 'vitest';
import { addSeededCompanion } from '../../web/features/residual-explorer/components/residual-explorer';
import { EXCLUDED_GROUP_NAME, groupToas } from '../../web/features/residual-explorer/lib/explorer-groups';
import { residualSummary } from '../../web/features/residual-explorer/lib/residual-summary';
import { calendarYearFromMjd, dayOfYearFromMjd, orbitalPhaseTurns } from '../../web/features/residual-explorer/lib/x-quantities';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { parseMjd } from '../../worker/timing/time/mjd-string';

describe('explorer x quantities', () => {
  it('turns MJDs into calendar years and days of year (UTC)', () => {
    // MJD 51544 = 2000-01-01T00:00Z and MJD 51604 = 2000-03-01 (common practice: MJD 40587 = 1970-01-01).
    expect(calendarYearFromMjd(51544)).toBe(2000);
    expect(dayOfYearFromMjd(51544)).toBe(1);
    expect(dayOfYearFromMjd(51604.5)).toBe(61.5); // 2000 is a leap year: 31 + 29 days before 1 March
    expect(calendarYearFromMjd(51544 + 183)).toBeCloseTo(2000.5, 12); // 183 of 366 days
  });

  it('gives the orbital phase from periastron, in [0, 1)', () => {
    const [companion] = readModelFile({
      format: 'pulsekeeper-model/1', pulsar: 'T', epoch_mjd: '58000',
      spin: { frequency_hz: '100', frequency_derivatives: [] },
      astrometry: { ra_hms: '01:00:00', dec_dms: '+01:00:00', pm_ra_cosdec_mas_per_yr: 0, pm_dec_mas_per_yr: 0, parallax_mas: 0 },
      dispersion: { dm_pc_per_cm3: 1, dm_derivatives: [] },
      companions: [{ name: 'b', kind: 'keplerian', enabled: true, period_days: '10', projected_semimajor_axis_lt_s: '1', eccentricity: 0.1, periastron_longitude_deg: 0, periastron_epoch_mjd: '58005' }],
    }).companions;
    // days since 58000: 5 (periastron), 17.5 (1.25 orbits later), 2.5 (−0.25 orbits → 0.75)
    const phase = orbitalPhaseTurns(companion, { reference: parseMjd('58000'), hi: Float64Array.of(5, 17.5, 2.5), lo: new Float64Array(3) });
    expect(Array.from(phase).map((p) => Number(p.toFixed(12)))).toEqual([0, 0.25, 0.75]);
  });
});

describe('explorer groups and summary', () => {
  it('gives every backend its own colour and symbol and keeps excluded TOAs in a hollow group', () => {
    const groups = groupToas(['b', 'a', 'c', 'a', 'b'], (i) => i === 4);
    expect(groups.map((g) => [g.name, Array.from(g.indices)])).toEqual([['a', [1, 3]], ['b', [0]], ['c', [2]], [EXCLUDED_GROUP_NAME, [4]]]);
    const styles = groups.slice(0, 3).map((g) => g.style);
    expect(new Set(styles.map((s) => s.colour)).size).toBe(3);
    expect(new Set(styles.map((s) => s.symbol)).size).toBe(3);
    expect(groups[3].style.symbol).toMatch(/-open$/);
    // Excluding all of "b" does not repaint "c".
    expect(groupToas(['b', 'a', 'c', 'a', 'b'], (i) => i === 0 || i === 4).find((g) => g.name === 'c')!.style).toEqual(styles[2]);
  });

  it('counts used and excluded TOAs and leaves TOAs without a residual out of both', () => {
    const s = residualSummary([3, -4, 100, Number.NaN], [1, 1, 1, 1], (i) => i === 2, 1);
    expect(s).toMatchObject({ usedCount: 2, excludedCount: 1, unevaluatedCount: 1, chi2: 25, dof: 1, reducedChi2: 25 });
    expect(s.weightedRmsUs).toBeCloseTo(Math.sqrt(12.5), 12);
  });

  it('adds a seeded companion with its period, size and epoch to solve for', () => {
    const model = { companions: [{ name: 'b' }], solve_for: ['spin.frequency_hz'] };
    const seeded = { name: 'c', kind: 'keplerian' as const, enabled: true as const, period_days: '71.4', projected_semimajor_axis_lt_s: '4e-5', eccentricity: 0 as const, periastron_longitude_deg: 0 as const, periastron_epoch_mjd: '58010' };
    const next = addSeededCompanion(model, seeded);
    expect(next.companions).toEqual([{ name: 'b' }, seeded]);
    expect(next.solve_for).toEqual(['spin.frequency_hz', 'companions[c].period_days', 'companions[c].projected_semimajor_axis_lt_s', 'companions[c].periastron_epoch_mjd']);
    expect(model.companions).toHaveLength(1); // the input is not changed
  });
});

import { describe, expect, it } from 'vitest';
import { aliasFlags, dominantCadenceDays } from '../../../worker/timing/periodogram/alias-flags';

const codes = (flags: string[]) => flags.map((s) => s.slice(0, s.indexOf(':')));

describe('aliasFlags', () => {
  it('flags a peak near 1 year as a likely astrometric error (common practice)', () => {
    const flags = aliasFlags(360, {}); // 1/360 vs 1/365.25: 1.46 % off, inside 2 %
    expect(codes(flags)).toEqual(['one-year']);
    expect(flags[0]).toContain('likely a position or proper-motion error — fit astrometry first');
    expect(aliasFlags(350, {})).toEqual([]); // 4.4 % off
    expect(aliasFlags(350, { fractionalTolerance: 0.05 }).length).toBe(1);
  });

  it('flags half a year as parallax / annual harmonic', () => {
    expect(codes(aliasFlags(183, {}))).toEqual(['half-year']);
    expect(aliasFlags(183, {})[0]).toContain('parallax');
  });

  it('flags the sidereal and solar day; a tight tolerance separates them (0.27 % apart)', () => {
    expect(codes(aliasFlags(0.9973, {}))).toEqual(['sidereal-day', 'solar-day']);
    expect(codes(aliasFlags(0.9973, { fractionalTolerance: 0.001 }))).toEqual(['sidereal-day']);
    expect(codes(aliasFlags(1.0005, { fractionalTolerance: 0.001 }))).toEqual(['solar-day']);
  });

  it('flags the cadence and its harmonics k/cadence, k ≤ 4', () => {
    const ctx = { cadenceDays: 14 };
    expect(codes(aliasFlags(14.1, ctx))).toEqual(['cadence']);
    expect(aliasFlags(7, ctx)[0]).toContain('harmonic 2');
    expect(aliasFlags(3.5, ctx)[0]).toContain('harmonic 4');
    expect(aliasFlags(2.8, ctx)).toEqual([]); // k = 5 not screened
    expect(aliasFlags(10, ctx)).toEqual([]);
  });

  it('flags peaks at a window peak and at stronger-peak ± window-peak aliases', () => {
    const fw = 1 / 365.25; // window peak from annual gaps
    const g = 1 / 50; // a stronger peak at 50 d
    const ctx = { windowPeaksPerDay: [fw], strongerPeaksPerDay: [g], fractionalTolerance: 0.005 };
    expect(codes(aliasFlags(1 / (g + fw), ctx))).toEqual(['window-alias']); // 43.98 d
    expect(codes(aliasFlags(1 / (g - fw), ctx))).toEqual(['window-alias']); // 57.88 d
    expect(aliasFlags(30, ctx)).toEqual([]);
    expect(codes(aliasFlags(365.25, { windowPeaksPerDay: [fw] }))).toEqual(['one-year', 'window-peak']);
  });

  it('an absolute resolution widens "near" for long periods', () => {
    expect(aliasFlags(330, {})).toEqual([]);
    expect(codes(aliasFlags(330, { resolutionPerDay: 1 / 3000 }))).toEqual(['one-year']); // |1/330 − 1/365.25| = 2.9e-4
  });

  it('rejects non-positive periods and cadences', () => {
    expect(() => aliasFlags(0, {})).toThrow(RangeError);
    expect(() => aliasFlags(10, { cadenceDays: -1 })).toThrow(RangeError);
  });
});

describe('dominantCadenceDays', () => {
  it('is the median session gap, several arrival times per session counting once', () => {
    const t = Float64Array.of(0, 0.01, 0.02, 14, 14.01, 28, 42, 42.02, 70); // session starts 0, 14, 28, 42, 70
    expect(dominantCadenceDays(t)).toBe(14);
    expect(dominantCadenceDays(Float64Array.of(30, 0, 10))).toBe(15); // unsorted; gaps 10, 20
    expect(dominantCadenceDays(Float64Array.of(5, 5.1))).toBeNaN();
  });
});

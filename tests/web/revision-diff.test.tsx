import { describe, expect, it } from 'vitest';
import { canonicalDecimal, modelDiff } from '../../web/features/revisions/lib/model-diff';

// An invented model in the shape of docs/formats.md §2.
const BASE = {
  format: 'pulsekeeper-model/1',
  pulsar: 'J0101-0101',
  epoch_mjd: '58000',
  spin: { frequency_hz: '123.456789012345678901', frequency_derivatives: ['-1.5e-15', '0'] },
  astrometry: { ra_hms: '01:01:01.0', dec_dms: '-01:01:01', parallax_mas: 0 },
  companions: [
    { name: 'b', kind: 'keplerian', enabled: true, period_days: '10.5' },
    { name: 'c', kind: 'keplerian', enabled: true, period_days: '200' },
  ],
  offsets: [{ backend: 'wide-2', seconds: 0 }],
  solve_for: ['spin.frequency_hz', 'companions[b].period_days'],
};
const clone = () => structuredClone(BASE) as typeof BASE & Record<string, unknown>;

describe('modelDiff', () => {
  it('finds nothing between a model and its copy', () => {
    expect(modelDiff(BASE, clone())).toEqual([]);
  });

  it('reports a changed leaf with its dotted path and JSON before/after', () => {
    const next = clone();
    next.spin.frequency_hz = '123.456789012345678902';
    expect(modelDiff(BASE, next)).toEqual([
      { path: 'spin.frequency_hz', kind: 'changed', before: '"123.456789012345678901"', after: '"123.456789012345678902"' },
    ]);
  });

  it('treats a number and an equal decimal string as the same value, but not digits a double would merge', () => {
    const next = clone();
    next.astrometry.parallax_mas = '0.000' as unknown as number;
    next.companions[1].period_days = '200.0';
    next.spin.frequency_derivatives[0] = '-15e-16';
    expect(modelDiff(BASE, next)).toEqual([]);
    // These two strings parse to the same double (17th+ significant digit), yet they differ.
    expect(Number('123.456789012345678901')).toBe(Number('123.456789012345678902'));
  });

  it('names array items by index and companions/offsets by name or backend', () => {
    const next = clone();
    next.spin.frequency_derivatives[1] = '2e-25';
    next.companions = [next.companions[1], { ...next.companions[0], period_days: '10.6' }]; // reordered and changed
    next.offsets[0].seconds = 1e-6;
    expect(modelDiff(BASE, next).map((c) => c.path)).toEqual([
      'spin.frequency_derivatives[1]',
      'companions[b].period_days',
      'offsets[wide-2].seconds',
    ]);
  });

  it('reports whole companions added or removed at their own path', () => {
    const next = clone();
    next.companions = [next.companions[0], { name: 'd', kind: 'keplerian', enabled: false, period_days: '3' }];
    const changes = modelDiff(BASE, next);
    expect(changes).toHaveLength(2);
    expect(changes[0]).toMatchObject({ path: 'companions[c]', kind: 'removed', after: null });
    expect(JSON.parse(changes[0].before!)).toEqual(BASE.companions[1]);
    expect(changes[1]).toMatchObject({ path: 'companions[d]', kind: 'added', before: null });
  });

  it('reports solve_for as entries added and removed, ignoring their order', () => {
    const next = clone();
    next.solve_for = ['astrometry.parallax_mas', 'spin.frequency_hz'];
    expect(modelDiff(BASE, next)).toEqual([
      { path: 'solve_for', kind: 'removed', before: '"companions[b].period_days"', after: null },
      { path: 'solve_for', kind: 'added', before: null, after: '"astrometry.parallax_mas"' },
    ]);
    const reordered = clone();
    reordered.solve_for = [...BASE.solve_for].reverse();
    expect(modelDiff(BASE, reordered)).toEqual([]);
  });

  it('reports new and dropped keys, and a type change as one change', () => {
    const next = clone() as Record<string, unknown>;
    delete next.offsets;
    next.noise = [];
    (next.astrometry as Record<string, unknown>).parallax_mas = { value: 1 };
    expect(modelDiff(BASE, next)).toEqual([
      { path: 'astrometry.parallax_mas', kind: 'changed', before: '0', after: '{"value":1}' },
      { path: 'offsets', kind: 'removed', before: '[{"backend":"wide-2","seconds":0}]', after: null },
      { path: 'noise', kind: 'added', before: null, after: '[]' },
    ]);
  });
});

describe('canonicalDecimal', () => {
  it('normalises zeros, signs and exponents without a float', () => {
    expect(canonicalDecimal('0041.3000')).toBe('413e-1');
    expect(canonicalDecimal(41.3)).toBe('413e-1');
    expect(canonicalDecimal('4.13e1')).toBe('413e-1');
    expect(canonicalDecimal('-0.0')).toBe('0');
    expect(canonicalDecimal('.5')).toBe('5e-1');
    expect(canonicalDecimal('1200')).toBe('12e2');
  });
  it('is null for text that is not a number', () => {
    expect(canonicalDecimal('11:01:07.43')).toBeNull();
    expect(canonicalDecimal('J0101-0101')).toBeNull();
    expect(canonicalDecimal('.')).toBeNull();
    expect(canonicalDecimal(true)).toBeNull();
    expect(canonicalDecimal(Number.NaN)).toBeNull();
  });
});

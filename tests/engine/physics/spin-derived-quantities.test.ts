import { describe, expect, it } from 'vitest';
import { spinDerivedQuantities } from '../../../worker/timing/physics/spin-derived-quantities';
import { expectWithin } from '../time/expect-within';

describe('spinDerivedQuantities', () => {
  // P = 1 s, Ṗ = 1e−15 expressed as F = 1 Hz, Ḟ = −Ṗ/P² = −1e−15 Hz/s.
  const q = spinDerivedQuantities(1, -1e-15);

  it('converts F, Ḟ to P, Ṗ', () => {
    expectWithin(q.periodSeconds, 1, 0, 'P (s)');
    expectWithin(q.periodDerivative, 1e-15, 1e-30, 'Ṗ');
    const millisecond = spinDerivedQuantities(500, -5e-15); // Ṗ = 5e−15 / 500² = 2e−20 (hand check)
    expectWithin(millisecond.periodSeconds, 2e-3, 1e-18, 'P (s)');
    expectWithin(millisecond.periodDerivative, 2e-20, 1e-34, 'Ṗ');
  });
  it('gives a characteristic age of 15.8 Myr', () => {
    expectWithin(q.characteristicAgeYears / 1e6, 15.8, 0.05, 'τ (Myr), Lorimer & Kramer 2005 formula; common practice value');
  });
  it('gives a surface field of 1.0e12 G', () => {
    // 3.2e19 · √(1e−15) = 1.012e12 G (Lorimer & Kramer 2005, eq. 3.15; hand check)
    expectWithin(q.surfaceMagneticFieldGauss, 1.0119e12, 1e8, 'B (G)');
  });
  it('gives a spin-down luminosity of 3.9e31 erg/s with I = 1e45 g cm²', () => {
    expectWithin(q.spinDownLuminosityErgPerSecond, 3.9e31, 0.05e31, 'Ė (erg/s), Lorimer & Kramer 2005 formula; common practice value');
    expect(q.momentOfInertiaGCm2).toBe(1e45);
    expect(q.warnings).toEqual([]);
  });
  it('scales the luminosity with the moment of inertia', () => {
    expectWithin(spinDerivedQuantities(1, -1e-15, 2e45).spinDownLuminosityErgPerSecond / q.spinDownLuminosityErgPerSecond, 2, 1e-15, 'ratio');
  });
  it('warns and leaves age and field NaN for a spinning-up pulsar', () => {
    const up = spinDerivedQuantities(100, 1e-15);
    expect(up.warnings).toEqual(['period-derivative-not-positive']);
    expect(Number.isNaN(up.characteristicAgeYears)).toBe(true);
    expect(Number.isNaN(up.surfaceMagneticFieldGauss)).toBe(true);
    expect(up.spinDownLuminosityErgPerSecond).toBeLessThan(0);
  });
  it('rejects a non-positive frequency by name', () => {
    expect(() => spinDerivedQuantities(0, 0)).toThrow(/spinFrequencyHz/);
    expect(() => spinDerivedQuantities(1, Number.NaN)).toThrow(/spinFrequencyDerivativeHzPerSecond/);
  });
});

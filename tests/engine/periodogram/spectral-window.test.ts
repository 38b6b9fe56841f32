import { describe, expect, it } from 'vitest';
import { spectralWindow } from '../../../worker/timing/periodogram/spectral-window';

describe('spectralWindow', () => {
  it('is 1 at zero frequency and at multiples of the cadence for regular sampling (hand check)', () => {
    const t = Float64Array.from({ length: 50 }, (_, i) => 3 * i); // every 3 d
    const w = new Float64Array(50).fill(1);
    const win = spectralWindow(t, w, Float64Array.of(0, 1 / 3, 2 / 3));
    for (const v of win) expect(v).toBeCloseTo(1, 12);
  });

  it('matches the Dirichlet kernel sin²(πfNΔ)/(N² sin²(πfΔ)) for regular sampling (Deeming 1975)', () => {
    const n = 40;
    const dt = 1.5;
    const t = Float64Array.from({ length: n }, (_, i) => 1000 + dt * i);
    const w = new Float64Array(n).fill(2.5);
    const freqs = Float64Array.of(0.001, 0.013, 0.1, 0.31);
    const win = spectralWindow(t, w, freqs);
    freqs.forEach((f, k) => {
      const expected = Math.sin(Math.PI * f * n * dt) ** 2 / (n * n * Math.sin(Math.PI * f * dt) ** 2); // geometric sum
      expect(win[k]).toBeCloseTo(expected, 12);
    });
  });

  it('weights: one dominant sample gives a flat window near 1; two equal samples give cos²(πfΔt)', () => {
    const t = Float64Array.of(0, 0.7);
    const win = spectralWindow(t, Float64Array.of(1, 1), Float64Array.of(0.2, 0.5));
    expect(win[0]).toBeCloseTo(Math.cos(Math.PI * 0.2 * 0.7) ** 2, 14); // |1 + e^{iφ}|²/4 = cos²(φ/2)
    expect(win[1]).toBeCloseTo(Math.cos(Math.PI * 0.5 * 0.7) ** 2, 14);
    const flat = spectralWindow(t, Float64Array.of(1, 0), Float64Array.of(0.2, 0.5));
    expect(flat[0]).toBeCloseTo(1, 14);
    expect(flat[1]).toBeCloseTo(1, 14);
  });

  it('seasonal sampling (6 months on, 6 off) puts a strong window peak at 1 cycle per year (common practice)', () => {
    const t: number[] = [];
    for (let d = 0; d < 6 * 365.25; d += 3) if (d % 365.25 < 182) t.push(d);
    const tDays = Float64Array.from(t);
    const freqs = Float64Array.from({ length: 400 }, (_, k) => 0.0015 + k * 0.00001); // 0.0015–0.0055 per day
    const win = spectralWindow(tDays, new Float64Array(t.length).fill(1), freqs);
    let best = 0;
    for (let k = 1; k < win.length; k++) if (win[k] > win[best]) best = k;
    expect(Math.abs(freqs[best] - 1 / 365.25)).toBeLessThan(1e-4); // within the span's resolution 1/(6 yr)
    expect(win[best]).toBeGreaterThan(0.3); // square wave of 50 % duty: first harmonic (2/π)² ≈ 0.41
  });

  it('rejects bad weights', () => {
    const t = Float64Array.of(0, 1);
    expect(() => spectralWindow(t, Float64Array.of(1), Float64Array.of(0.1))).toThrow(RangeError);
    expect(() => spectralWindow(t, Float64Array.of(1, -1), Float64Array.of(0.1))).toThrow(RangeError);
    expect(() => spectralWindow(t, Float64Array.of(0, 0), Float64Array.of(0.1))).toThrow(RangeError);
  });
});

import { describe, expect, it } from 'vitest';
import Decimal from 'decimal.js';
import { toyGeometry } from './toy-geometry';
import { toyModel } from './toy-model';
import { prepareArrivals, effectiveUncertaintiesS } from '../../../worker/timing/pipeline/prepared-arrivals';
import { computeTimingResiduals } from '../../../worker/timing/pipeline/timing-residuals';
import { timingDesignMatrix } from '../../../worker/timing/pipeline/timing-design-matrix';
import { simulateArrivals } from '../../../worker/timing/simulate/simulate-arrivals';
import { parameterHandle, allParameterPaths } from '../../../worker/timing/model/parameter-paths';
import { writeToaCsv } from '../../../worker/timing/toas/write-toa-csv';
import { readToaCsv } from '../../../worker/timing/toas/read-toa-csv';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { mjdDiffSeconds } from '../../../worker/timing/time/mjd-arithmetic';
import { numericDerivativeColumn } from '../../../worker/timing/fit/numeric-derivative';
import { ddAddNumber } from '../../../worker/timing/time/double-double-typed';
import type { Toa } from '../../../worker/timing/toas/toa';
import type { TimingModel } from '../../../worker/timing/model/timing-model';
import { AU_LIGHT_SECONDS, SUN_MASS_SECONDS } from '../../../worker/timing/delays/physical-constants';

function toa(mjd: string, extra: Partial<Toa> = {}): Toa {
  return { row: 1, line: 2, mjd: parseMjd(mjd), uncertaintyUs: 1, frequencyMhz: 1400, observatory: 'toy-site', backend: 'default', pulseNumber: null, labels: {}, ...extra };
}

function exactDecimal(x: number): Decimal {
  let scaled = Math.abs(x);
  let exponent = 0;
  while (!Number.isInteger(scaled)) { scaled *= 2; exponent -= 1; }
  return new Decimal(BigInt(scaled).toString()).times(new Decimal(2).pow(exponent)).times(Math.sign(x) || 1);
}

describe('timing residuals', () => {
  it('match an independent 40-digit evaluation of the delay chain for one TOA', () => {
    Decimal.set({ precision: 40 });
    const model = toyModel({ companions: [], dispersion: { dmPcPerCm3: 30, dmDerivatives: [] }, astrometry: { raRad: 0.7, decRad: -0.2, pmRaCosDecMasPerYr: 0, pmDecMasPerYr: 0, parallaxMas: 0 } });
    const arrivals = [toa('58731.123456789012345678')];
    const g = toyGeometry(arrivals);
    const ev = computeTimingResiduals(model, prepareArrivals(arrivals, g, model.epochMjd));
    // independent chain, written out from docs/formats.md §2 and §4
    const n = [Math.cos(-0.2) * Math.cos(0.7), Math.cos(-0.2) * Math.sin(0.7), Math.sin(-0.2)];
    const r = Array.from(g.observatoryPositionLs);
    const v = Array.from(g.observatoryVelocityC);
    const along = r[0] * n[0] + r[1] * n[1] + r[2] * n[2];
    const shapiro = -2 * SUN_MASS_SECONDS * Math.log((Math.hypot(r[0], r[1], r[2]) + along) / AU_LIGHT_SECONDS);
    const fBary = 1400 * (1 - (v[0] * n[0] + v[1] * n[1] + v[2] * n[2]));
    const dispersion = (4.148808e3 * 30) / fBary ** 2; // Lorimer & Kramer 2005 eq. 4.7
    const dt = mjdDiffSeconds(arrivals[0].mjd, model.epochMjd);
    const dtDec = exactDecimal(dt[1]).plus(exactDecimal(dt[0])).plus(new Decimal(along)).minus(shapiro).minus(dispersion);
    const f = exactDecimal(model.spin.frequencyHz[1]).plus(exactDecimal(model.spin.frequencyHz[0]));
    const phase = f.times(dtDec).plus(new Decimal(model.spin.frequencyDerivatives[0]).times(dtDec.pow(2)).div(2));
    const frac = phase.minus(phase.toDecimalPlaces(0, Decimal.ROUND_HALF_EVEN));
    const freq = f.plus(new Decimal(model.spin.frequencyDerivatives[0]).times(dtDec));
    const wantS = frac.div(freq).toNumber();
    expect(Math.abs(ev.residualS[0] - wantS)).toBeLessThan(1e-12);
    expect(Math.abs(ev.roemerS[0] - along)).toBeLessThan(1e-12);
    expect(Math.abs(ev.shapiroS[0] - shapiro)).toBeLessThan(1e-15);
  });

  it('noise-free simulated TOAs, written to CSV and read back, have residuals < 1 ns with the true model', () => {
    const model = toyModel();
    const sim = simulateArrivals(model, { startMjd: parseMjd('58000'), endMjd: parseMjd('59800'), count: 300, observatory: 'toy-site', uncertaintyUs: 1, frequencyMhz: 820, addNoise: false }, toyGeometry);
    expect(sim.maxNoiseFreeResidualS).toBeLessThan(1e-11);
    const text = writeToaCsv(sim.toas, { fractionDigits: 22 });
    const read = readToaCsv(text, { knownObservatories: new Set(['toy-site']) });
    if (!read.ok) throw new Error(JSON.stringify(read.errors));
    const ev = computeTimingResiduals(model, prepareArrivals(read.toas, toyGeometry(read.toas), model.epochMjd));
    const worst = Math.max(...Array.from(ev.residualS, Math.abs));
    expect(worst).toBeLessThan(1e-9);
    // the model is not trivially satisfied: the same TOAs are microseconds off a slightly different model
    const other = toyModel({ astrometry: { ...model.astrometry, parallaxMas: 1.8 } });
    const evOther = computeTimingResiduals(other, prepareArrivals(read.toas, toyGeometry(read.toas), model.epochMjd));
    expect(Math.max(...Array.from(evOther.residualS, Math.abs))).toBeGreaterThan(3e-7);
  });

  it('uses given pulse numbers (and then a wrong one shows as a whole turn)', () => {
    const model = toyModel();
    const sim = simulateArrivals(model, { startMjd: parseMjd('58400'), endMjd: parseMjd('58600'), count: 20, observatory: 'toy-site', uncertaintyUs: 1, addNoise: false, withPulseNumbers: true }, toyGeometry);
    sim.toas[5].pulseNumber! += 1;
    const ev = computeTimingResiduals(model, prepareArrivals(sim.toas, toyGeometry(sim.toas), model.epochMjd));
    expect(Math.abs(ev.residualTurns[5] + 1)).toBeLessThan(1e-6);
    expect(Math.abs(ev.residualTurns[4])).toBeLessThan(1e-6);
  });

  it('applies backend offsets (subtracted) and noise settings', () => {
    const model = toyModel({ offsets: [{ backend: 'late', seconds: 2e-6 }], noise: [{ backend: 'late', uncertaintyScale: 2, addedJitterUs: 1.5 }] });
    const sim = simulateArrivals(toyModel(), { startMjd: parseMjd('58400'), endMjd: parseMjd('58600'), count: 10, observatory: 'toy-site', uncertaintyUs: 1, addNoise: false }, toyGeometry);
    sim.toas.forEach((t, i) => { if (i % 2 === 0) t.backend = 'late'; });
    const prepared = prepareArrivals(sim.toas, toyGeometry(sim.toas), model.epochMjd);
    const ev = computeTimingResiduals(model, prepared);
    // the backend's times are 2 µs late, so subtracting the offset leaves them 2 µs early of the model
    expect(Math.abs(ev.residualS[0] + 2e-6)).toBeLessThan(1e-10);
    expect(Math.abs(ev.residualS[1])).toBeLessThan(1e-10);
    const sigmas = effectiveUncertaintiesS(prepared, model.noise);
    expect(sigmas[0]).toBeCloseTo(Math.sqrt(4 + 2.25) * 1e-6, 15);
    expect(sigmas[1]).toBeCloseTo(1e-6, 15);
  });
});

describe('design matrix', () => {
  it('analytic and numeric partial derivatives agree to 1e-6 relative for every parameter', () => {
    const model = toyModel({
      dispersion: { dmPcPerCm3: 21.7, dmDerivatives: [1e-3, 2e-4] },
      offsets: [{ backend: 'b2', seconds: 1e-6 }],
      glitches: [{ epochMjd: parseMjd('58700.3'), phaseStepTurns: 0.01, frequencyStepHz: 1e-8, frequencyDerivativeStepHzPerS: -1e-17, decayingFrequencyStepHz: 3e-9, decayTimeDays: 40 }],
    });
    model.companions.push({ kind: 'low-eccentricity', name: 'c', enabled: true, periodDays: 41.3, projectedSemimajorAxisLtS: 0.0012, ascendingNodeEpochMjd: parseMjd('58510.1'), eSinOmega: 1e-3, eCosOmega: -2e-3, periodDerivative: 0 });
    const sim = simulateArrivals(model, { startMjd: parseMjd('58000'), endMjd: parseMjd('59100'), count: 120, observatory: 'toy-site', uncertaintyUs: 1, addNoise: false }, toyGeometry);
    sim.toas.forEach((t, i) => { t.frequencyMhz = i % 3 === 0 ? 430 : 1400; if (i % 4 === 0) t.backend = 'b2'; });
    const prepared = prepareArrivals(sim.toas, toyGeometry(sim.toas), model.epochMjd);
    const base = computeTimingResiduals(model, prepared);
    const paths = allParameterPaths(model);
    expect(paths.length).toBe(32); // every path of this model, including the companions' and the glitch's
    const design = timingDesignMatrix(model, prepared, base, paths, false);
    const n = prepared.count;
    paths.forEach((path, j) => {
      const handle = parameterHandle(model, path);
      const value = handle.get(model);
      const trial = structuredClone(model);
      const analytic = design.subarray(j * n, (j + 1) * n);
      const size = Math.max(...Array.from(analytic, Math.abs));
      // step: large enough that the residuals move by ~1e-5 s (far above rounding), small against
      // the scale on which the parameter acts non-linearly
      const nonlinearScale = path.endsWith('epoch_mjd') ? 0.5 : path.endsWith('period_days') ? 1e-3 : path.endsWith('decay_time_days') ? 10 : Infinity;
      const numeric = numericDerivativeColumn((offset) => {
        handle.set(trial, ddAddNumber(value, offset));
        return computeTimingResiduals(trial, prepared, { fixedPulseNumbers: base.pulseNumber }).residualS;
      }, Math.min(5e-3 / size, nonlinearScale));
      const worst = Math.max(...Array.from(analytic, (a, i) => Math.abs(a - numeric[i])));
      expect(size, path).toBeGreaterThan(0);
      expect(worst / size, path).toBeLessThan(1e-6);
    });
  });
});

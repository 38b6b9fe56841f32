import { describe, expect, it } from 'vitest';
import { simulateToas } from '../../../worker/timing/simulate/simulate-toas';
import { computeArrivalGeometry } from '../../../worker/timing/pipeline/compute-arrival-geometry';
import { prepareArrivals } from '../../../worker/timing/pipeline/prepared-arrivals';
import { computeTimingResiduals } from '../../../worker/timing/pipeline/timing-residuals';
import { timingDelayReport } from '../../../worker/timing/pipeline/timing-delay-report';
import { builtinObservatories } from '../../../worker/timing/earth/builtin-observatories';
import { writeToaCsv } from '../../../worker/timing/toas/write-toa-csv';
import { readToaCsv } from '../../../worker/timing/toas/read-toa-csv';
import { readModelText } from '../../../worker/timing/model/read-model-file';
import { parseMjd } from '../../../worker/timing/time/mjd-string';
import { mjdDiffSeconds } from '../../../worker/timing/time/mjd-arithmetic';
import { TimingInputError } from '../../../worker/timing/engine-error';
import { readFileSync } from 'node:fs';

const observatories = new Map(builtinObservatories().map((o) => [o.code, o]));
const model = readModelText(readFileSync('tests/fixtures/cli/demo-model.json', 'utf8'));
const request = { startMjd: parseMjd('58100'), endMjd: parseMjd('59100'), count: 150, observatory: 'cardenal-plateau', uncertaintyUs: 1, frequencyMhz: 650 };

describe('simulateToas with the full arrival geometry', () => {
  it('noise-free TOAs, printed and read back, have residuals < 1 ns with the true model', () => {
    const sim = simulateToas(model, { ...request, addNoise: false }, observatories);
    expect(sim.warnings).toEqual([]);
    const read = readToaCsv(writeToaCsv(sim.toas, { fractionDigits: 20 }), { knownObservatories: new Set(observatories.keys()) });
    if (!read.ok) throw new Error('unreadable');
    const geometry = computeArrivalGeometry(read.toas, observatories);
    const ev = computeTimingResiduals(model, prepareArrivals(read.toas, geometry, model.epochMjd));
    expect(Math.max(...Array.from(ev.residualS, Math.abs))).toBeLessThan(1e-9);
    // the delay report describes the same chain: its residual column agrees
    const report = timingDelayReport(model, read.toas, geometry);
    expect(Math.max(...report.map((r) => Math.abs(r.residual_us)))).toBeLessThan(1e-3);
  });

  it('adds Gaussian noise of the requested size, reproducibly from the seed', () => {
    const clean = simulateToas(model, { ...request, addNoise: false, seed: 9 }, observatories).toas;
    const a = simulateToas(model, { ...request, seed: 9 }, observatories).toas;
    const b = simulateToas(model, { ...request, seed: 9 }, observatories).toas;
    const c = simulateToas(model, { ...request, seed: 10 }, observatories).toas;
    const noiseUs = a.map((t, i) => mjdDiffSeconds(t.mjd, clean[i].mjd)[1] * 1e6);
    expect(a.map((t) => t.mjd)).toEqual(b.map((t) => t.mjd));
    expect(a[0].mjd).not.toEqual(c[0].mjd);
    const mean = noiseUs.reduce((s, x) => s + x, 0) / noiseUs.length;
    const sd = Math.sqrt(noiseUs.reduce((s, x) => s + (x - mean) ** 2, 0) / (noiseUs.length - 1));
    expect(Math.abs(mean)).toBeLessThan(4 / Math.sqrt(150)); // 4σ of the mean of 150 unit draws
    expect(Math.abs(sd - 1)).toBeLessThan(0.25);
  });

  it('writes pulse numbers on request and checks its arguments', () => {
    const sim = simulateToas(model, { ...request, count: 5, withPulseNumbers: true }, observatories);
    expect(sim.toas.every((t) => Number.isInteger(t.pulseNumber))).toBe(true);
    expect(() => simulateToas(model, { ...request, uncertaintyUs: 0 }, observatories)).toThrow(/uncertainty-us/);
    expect(() => simulateToas(model, { ...request, frequencyMhz: -1 }, observatories)).toThrow(/frequency-mhz/);
    expect(() => simulateToas(model, { ...request, endMjd: request.startMjd }, observatories)).toThrow(/end-mjd/);
    expect(() => simulateToas(model, { ...request, count: 0 }, observatories)).toThrow(TimingInputError);
  });
});

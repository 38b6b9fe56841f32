import { cleanup, render, screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { falseAlarmBaluev } from '../../worker/timing/periodogram/false-alarm-probability';
import { createSeededNormal, createSeededUniform } from '../../worker/timing/fit/seeded-normal';
import { expectWithin } from '../engine/time/expect-within';
import { PeriodogramPanel } from '../../web/features/residual-explorer/components/periodogram-panel';
import { powerAtFalseAlarm } from '../../web/features/residual-explorer/lib/panels/fap-power-level';
import { fitSinusoidAtFrequency, refinePeakFrequency } from '../../web/features/residual-explorer/lib/panels/sinusoid-fit';
import { addDaysToMjdText } from '../../web/features/residual-explorer/lib/panels/mjd-text';
import { computeResidualPeriodogram, type PeriodogramRequest } from '../../web/features/residual-explorer/lib/panels/residual-periodogram';
import { freeCompanionName, type SeededCompanion } from '../../web/features/residual-explorer/lib/panels/companion-seed';

vi.mock('plotly.js-dist-min', () => ({ default: {} }));
vi.mock('react-plotly.js/factory', () => ({
  default: () =>
    function FakePlot(props: { data: { name: string; x: number[] }[] }) {
      return <div data-testid="plotly" data-traces={props.data.map((t) => `${t.name}:${t.x.length}`).join(',')} />;
    },
}));

afterEach(() => {
  cleanup();
  vi.unstubAllGlobals();
  vi.restoreAllMocks();
});

/** A stand-in for the browser's module Worker: runs the same computation a tick later and answers by event. */
class FakeWorker extends EventTarget {
  static created: { url: string; type: string | undefined }[] = [];
  static jobs: number[] = [];
  constructor(url: URL | string, options?: { type?: string }) {
    super();
    FakeWorker.created.push({ url: String(url), type: options?.type });
  }
  postMessage(job: { id: number; request: PeriodogramRequest }) {
    FakeWorker.jobs.push(job.id);
    setTimeout(() => this.dispatchEvent(new MessageEvent('message', { data: { id: job.id, result: computeResidualPeriodogram(job.request) } })), 0);
  }
  terminate() {}
}

/** Invented sampling: `n` TOAs scattered over `spanDays`, Gaussian noise of `sigmaUs`, plus `signal(t)`. */
function residualSet(n: number, spanDays: number, sigmaUs: number, signal: (tDays: number) => number, seed = 7) {
  const uniform = createSeededUniform(seed);
  const normal = createSeededNormal(seed + 1);
  const t = Array.from({ length: n }, () => uniform() * spanDays).sort((a, b) => a - b);
  const tDays = Float64Array.from(t);
  const residualUs = Float64Array.from(t, (x) => signal(x) + sigmaUs * normal());
  const uncertaintyUs = new Float64Array(n).fill(sigmaUs);
  return { tDays, residualUs, uncertaintyUs };
}

describe('FAP level inversion', () => {
  const { tDays, uncertaintyUs } = residualSet(200, 1500, 1, () => 0);
  const weights = uncertaintyUs.map((s) => 1 / (s * s));
  it.each([1e-2, 1e-3, 1e-6])('powerAtFalseAlarm(%s) round-trips through falseAlarmBaluev', (fap) => {
    const p = powerAtFalseAlarm(fap, tDays.length, 1 / 1.5, tDays, weights);
    expect(p).toBeGreaterThan(0);
    expect(p).toBeLessThan(1);
    expectWithin(falseAlarmBaluev(p, tDays.length, 1 / 1.5, tDays, weights) / fap, 1, 1e-6, 'FAP(level)/target');
  });
  it('puts the stricter level higher and rejects targets outside (0, 1)', () => {
    const loose = powerAtFalseAlarm(1e-2, tDays.length, 1, tDays);
    const strict = powerAtFalseAlarm(1e-3, tDays.length, 1, tDays);
    expect(strict).toBeGreaterThan(loose);
    expect(() => powerAtFalseAlarm(0, tDays.length, 1, tDays)).toThrow(RangeError);
    expect(() => powerAtFalseAlarm(1, tDays.length, 1, tDays)).toThrow(RangeError);
  });
});

describe('fixed-frequency sinusoid and the seed', () => {
  it('recovers amplitude and zero crossing of a noise-free sinusoid far from the time origin', () => {
    const periodDays = 41.3;
    const zeroDays = 12.3;
    const tDays = Float64Array.from({ length: 60 }, (_, i) => 20_000 + i * 7.1 + (i % 3) * 0.4);
    const y = tDays.map((t) => 5 + 2.5 * Math.sin((2 * Math.PI * (t - zeroDays)) / periodDays));
    const fit = fitSinusoidAtFrequency(tDays, y, new Float64Array(60).fill(0.1), 1 / periodDays);
    expectWithin(fit.amplitude, 2.5, 1e-9, 'amplitude');
    expectWithin(fit.offset, 5, 1e-9, 'offset');
    const turns = (fit.zeroPhaseDays - zeroDays) / periodDays;
    expectWithin(turns, Math.round(turns), 1e-9, 'zero crossing − injected (whole periods)');
    expect(Math.abs(fit.zeroPhaseDays - 20_210)).toBeLessThanOrEqual(periodDays); // near the data's middle
    expectWithin(fitSinusoidAtFrequency(tDays, y, new Float64Array(60).fill(0.1), 1 / periodDays, true).zeroPhaseDays, zeroDays, 1e-7, 'zero crossing in [0, P)');
  });
  it('refines a grid peak to the best-fitting frequency', () => {
    const tDays = Float64Array.from({ length: 80 }, (_, i) => i * 9.7 + (i % 5) * 1.3);
    const y = tDays.map((t) => Math.sin(2 * Math.PI * t / 41.3 + 0.4));
    const step = 1 / (5 * 780);
    const refined = refinePeakFrequency(tDays, y, new Float64Array(80).fill(1), 1 / 41.3 + 0.7 * step, step);
    expectWithin(refined, 1 / 41.3, 1e-3 * step, 'refined frequency (per day), to 1e-3 of the grid step');
  });
  it('adds days to MJD text without touching the day count in floating point', () => {
    expect(addDaysToMjdText('58000.25', 10.5)).toBe('58010.750000000');
    expect(addDaysToMjdText('58000.9', 0.2, 3)).toBe('58001.100');
    expect(addDaysToMjdText('58000', -0.25, 2)).toBe('57999.75');
    expect(() => addDaysToMjdText('about 58000', 1)).toThrow(RangeError);
  });
  it('names a new companion with the first free letter', () => {
    expect(freeCompanionName([])).toBe('b');
    expect(freeCompanionName(['b', 'c'])).toBe('d');
  });
  it('flags a one-year peak as a likely astrometry error (common practice)', () => {
    const data = residualSet(300, 2000, 0.5, (t) => 4 * Math.sin((2 * Math.PI * t) / 365.25));
    const result = computeResidualPeriodogram(data);
    expectWithin(result.peaks[0].periodDays / 365.25, 1, 0.03, 'peak period / 1 yr');
    expect(result.peaks[0].warnings.join(' ')).toMatch(/fit astrometry first/);
  });
});

describe('PeriodogramPanel', () => {
  it('finds an injected 41.3 d sinusoid and seeds a circular companion with its period, amplitude and epoch', async () => {
    const periodDays = 41.3;
    const amplitudeUs = 3;
    const zeroDays = 12.3; // days after the reference epoch where the injected delay crosses zero upwards
    const data = residualSet(300, 1500, 0.5, (t) => amplitudeUs * Math.sin((2 * Math.PI * (t - zeroDays)) / periodDays));
    const onSeed = vi.fn<(c: SeededCompanion) => void>();
    const user = userEvent.setup();
    render(<PeriodogramPanel {...data} referenceMjd="58000" existingCompanionNames={['b']} onSeedCompanion={onSeed} />);

    const table = await screen.findByRole('table', { name: 'Strongest periodogram peaks' }, { timeout: 10_000 });
    const first = within(table).getAllByRole('row')[1];
    const listedPeriod = Number(within(first).getAllByRole('cell')[1].textContent);
    // A peak is ~P²/span wide (≈1.1 d here); the grid oversampling puts its top within a fraction of that.
    expectWithin(listedPeriod, periodDays, 0.3, 'listed period (days)');
    expect(within(first).getByText('(significant)')).toBeTruthy();
    expect(screen.queryByText('No significant periodicity')).toBeNull();
    expect((await screen.findByTestId('plotly')).getAttribute('data-traces')).toMatch(/^Power:\d+,FAP 1e-2:2,FAP 1e-3:2,Listed peaks:\d$/);

    await user.click(within(first).getByRole('button', { name: /^Choose peak 1 at/ }));
    await user.click(screen.getByRole('button', { name: 'Add a companion seeded from this peak' }));
    expect(onSeed).toHaveBeenCalledTimes(1);
    const companion = onSeed.mock.calls[0][0];
    expect(companion).toMatchObject({ name: 'c', kind: 'keplerian', eccentricity: 0, periastron_longitude_deg: 0 });
    expectWithin(Number(companion.period_days), periodDays, 0.05, 'seeded period (days), refined below the grid step');
    // x = amplitude in light-seconds (delay = x·sin(2π(t − T₀)/P) for e = 0, Blandford & Teukolsky 1976).
    expectWithin(Number(companion.projected_semimajor_axis_lt_s), amplitudeUs * 1e-6, 0.3e-6, 'x (lt-s)');
    const epochOffset = Number(companion.periastron_epoch_mjd) - 58000;
    const phaseError = ((epochOffset - zeroDays) / periodDays + 0.5) % 1 - 0.5; // wrap to (−½, ½] turns
    expectWithin(phaseError, 0, 0.01, 'epoch phase error (turns)');
    expect(await screen.findByText(/Companion c \(.* d\) is in the edited model/)).toBeTruthy();
  });

  it('computes in a module worker, once per burst of changes (debounced)', async () => {
    FakeWorker.created = [];
    FakeWorker.jobs = [];
    vi.stubGlobal('Worker', FakeWorker);
    const base = residualSet(200, 1000, 1, (t) => 2 * Math.sin((2 * Math.PI * t) / 23.4));
    const props = { tDays: base.tDays, uncertaintyUs: base.uncertaintyUs, referenceMjd: '58000', onSeedCompanion: () => {} };
    const { rerender } = render(<PeriodogramPanel {...props} residualUs={base.residualUs} />);
    // Three quick changes of the residuals (as when toggling companions) within the settling time.
    for (let k = 1; k <= 3; k++) rerender(<PeriodogramPanel {...props} residualUs={base.residualUs.map((y) => y + k * 1e-3)} />);
    expect(await screen.findByText(/in the background\./, {}, { timeout: 10_000 })).toBeTruthy();
    expect(FakeWorker.created).toHaveLength(1);
    expect(FakeWorker.created[0].url).toMatch(/periodogram\.worker\.ts(\?.*)?$/);
    expect(FakeWorker.created[0].type).toBe('module');
    expect(FakeWorker.jobs).toHaveLength(1);
  });

  it('warns when the best peak of pure noise is not significant', async () => {
    const data = residualSet(120, 900, 1, () => 0, 21);
    render(<PeriodogramPanel {...data} referenceMjd="58000" onSeedCompanion={() => {}} />);
    expect(await screen.findByText('No significant periodicity', {}, { timeout: 10_000 })).toBeTruthy();
  });

  it('asks for more TOAs below five and checks the period range', async () => {
    const few = residualSet(4, 100, 1, () => 0);
    const { unmount } = render(<PeriodogramPanel {...few} referenceMjd="58000" onSeedCompanion={() => {}} />);
    expect(screen.getByText('Not enough TOAs for a periodogram')).toBeTruthy();
    unmount();
    const user = userEvent.setup();
    render(<PeriodogramPanel {...residualSet(50, 500, 1, () => 0)} referenceMjd="58000" onSeedCompanion={() => {}} />);
    await user.type(screen.getByLabelText('Longest period (days)'), '1');
    expect(screen.getByText('Longest period: must be above the shortest period')).toBeTruthy();
  });
});

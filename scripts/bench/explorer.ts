/**
 * Speed of the residual explorer's companion switch: what the browser computes
 * when a companion is switched off (target ≤ 200 ms for 10 000 TOAs, issue 6),
 * for 10 000 and 100 000 TOAs of an invented pulsar with two companions:
 *   preview  = parse the edited model + preview residuals (companion-toggle-preview.ts)
 *   screen   = preview + summary line figures + the plot's trace arrays (everything but Plotly's drawing)
 *   prepare  = the one-off preparation when a fit (or the exclusions) load
 *
 * Run: npx tsx -e "import('./scripts/bench/explorer.ts').then(m=>m.bench())"
 */
import { cpus, loadavg } from 'node:os';
import type { ExplorerTable } from '../../api/contracts/explorer';
import { groupToas } from '../../web/features/residual-explorer/lib/explorer-groups';
import { explorerTraces, hoverDetails } from '../../web/features/residual-explorer/lib/explorer-traces';
import { residualSummary } from '../../web/features/residual-explorer/lib/residual-summary';
import { fittedResidualsUs, prepareShownPreview, shownResiduals } from '../../web/features/residual-explorer/lib/shown-residuals';
import { xValues } from '../../web/features/residual-explorer/lib/x-quantities';
import { barycentricDaysOf } from '../../web/features/residual-explorer/lib/companion-curve';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { companionDelaysFromDaysS } from '../../worker/timing/orbits/companion-delays';
import { parseMjd } from '../../worker/timing/time/mjd-string';

const SIZES = [10_000, 100_000];
const TARGET_MS = 200; // at 10 000 TOAs

const MODEL = {
  format: 'pulsekeeper-model/1',
  pulsar: 'BENCH-J0000+0000',
  epoch_mjd: '59000',
  spin: { frequency_hz: '189.9136207143', frequency_derivatives: ['-2.93e-16'] },
  astrometry: { ra_hms: '22:08:51.4470', dec_dms: '+41:21:03.590', pm_ra_cosdec_mas_per_yr: 0, pm_dec_mas_per_yr: 0, parallax_mas: 0 },
  dispersion: { dm_pc_per_cm3: 13.88, dm_derivatives: [] },
  companions: [
    { name: 'inner', kind: 'keplerian', enabled: true, period_days: '71.4', projected_semimajor_axis_lt_s: '4.2e-5', eccentricity: 0.04, periastron_longitude_deg: 48, periastron_epoch_mjd: '59010' },
    { name: 'outer', kind: 'keplerian', enabled: true, period_days: '283.6', projected_semimajor_axis_lt_s: '1.3e-4', eccentricity: 0.09, periastron_longitude_deg: 231, periastron_epoch_mjd: '59030' },
  ],
  solve_for: ['spin.frequency_hz', 'spin.frequency_derivatives[0]'],
};

/** Invented explorer table: n TOAs over 7 years, two backends, σ 0.5–1.5 µs, residuals small noise. */
function table(n: number): ExplorerTable {
  let state = 12345;
  const rnd = (): number => ((state = (state * 16807) % 2147483647), state / 2147483647);
  const hi = Array.from({ length: n }, (_, i) => -1200 + (2550 * i) / n + 0.3 * rnd());
  const days = { reference: parseMjd(MODEL.epoch_mjd), hi: Float64Array.from(hi), lo: new Float64Array(n) };
  const companionsS = Array.from(companionDelaysFromDaysS(readModelFile(MODEL).companions, days));
  const zeros = () => new Array<number>(n).fill(0);
  return {
    fitRunId: 1, pulsarId: 1, revisionId: 1, count: n,
    toaId: Array.from({ length: n }, (_, i) => i + 1), batchId: new Array<number>(n).fill(1), batchRow: Array.from({ length: n }, (_, i) => i + 1),
    mjd: hi.map((d) => (59000 + d).toFixed(12)),
    observatory: Array.from({ length: n }, (_, i) => (i % 3 ? 'site-a' : 'site-b')),
    backend: Array.from({ length: n }, (_, i) => (i % 2 ? 'wide' : 'narrow')),
    frequencyMhz: Array.from({ length: n }, (_, i) => (i % 2 ? 1400 : 820)),
    uncertaintyUs: Array.from({ length: n }, () => 0.5 + rnd()),
    residualUs: Array.from({ length: n }, () => rnd() - 0.5),
    excluded: new Array<boolean>(n).fill(false), evaluated: new Array<boolean>(n).fill(true), nearestPulse: new Array<boolean>(n).fill(true),
    referenceMjd: MODEL.epoch_mjd, barycentricDaysHi: hi, barycentricDaysLo: zeros(),
    delays: { clockS: zeros(), ttMinusUtcS: zeros(), tdbMinusTtS: zeros(), roemerS: zeros(), shapiroS: zeros(), dispersionS: zeros(), backendOffsetS: zeros(), companionsS },
    partials: [], phaseOffsetTurns: 0, spinFrequencyHz: MODEL.spin.frequency_hz, weightedRmsUs: 0.3, fittedModel: MODEL,
    settings: { ephemeris: 'DE405', clock: '-', timeScale: '-', earthOrientation: '-', jupiterShapiro: '-', engineVersion: '-' }, engineSettings: {},
  };
}

/** Median wall time of `repeats` runs after one warm-up run, ms. */
function timeMedianMs(run: () => void, repeats = 7): number {
  run();
  const times: number[] = [];
  for (let r = 0; r < repeats; r++) {
    const start = process.hrtime.bigint();
    run();
    times.push(Number(process.hrtime.bigint() - start) / 1e6);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

export async function bench(): Promise<void> {
  console.log(`explorer bench — ${cpus().length} cores, load ${loadavg()[0].toFixed(2)} (Node ${process.version}; browsers run the same V8 code)`);
  for (const n of SIZES) {
    const t = table(n);
    const excludedNow = new Uint8Array(n);
    const fitted = fittedResidualsUs(t);
    const prepareMs = timeMedianMs(() => void prepareShownPreview(t, excludedNow), 3);
    const prepared = prepareShownPreview(t, excludedNow);
    const off = { ...MODEL, companions: MODEL.companions.map((c) => (c.name === 'outer' ? { ...c, enabled: false } : c)) };
    let rmsOff = 0;
    const previewMs = timeMedianMs(() => {
      rmsOff = residualSummary(shownResiduals(t, fitted, prepared, off).residualUs, t.uncertaintyUs, () => false, 3).weightedRmsUs;
    });
    const days = barycentricDaysOf(t);
    const hover = hoverDetails(t);
    const x = xValues('mjd', { mjd: t.mjd, frequencyMhz: t.frequencyMhz, uncertaintyUs: t.uncertaintyUs, barycentricDays: days }, null);
    const screenMs = timeMedianMs(() => {
      const shown = shownResiduals(t, fitted, prepared, off);
      residualSummary(shown.residualUs, t.uncertaintyUs, () => false, 3);
      const groups = groupToas(t.backend, () => false);
      explorerTraces({ groups, x, residualUs: shown.residualUs, uncertaintyUs: t.uncertaintyUs, yUnit: 'us', spinFrequencyHz: 189.9, hover, selected: null });
    });
    const rmsOn = residualSummary(fitted, t.uncertaintyUs, () => false, 3).weightedRmsUs;
    const verdict = n === 10_000 ? ` (target ≤ ${TARGET_MS} ms: ${screenMs <= TARGET_MS ? 'met' : 'MISSED'})` : '';
    console.log(
      `${n.toLocaleString('en-GB')} TOAs: toggle preview ${previewMs.toFixed(1)} ms, whole screen update ${screenMs.toFixed(1)} ms${verdict}; ` +
        `one-off prepare ${prepareMs.toFixed(1)} ms; RMS on ${rmsOn.toFixed(3)} µs → outer off ${rmsOff.toFixed(1)} µs`,
    );
  }
}

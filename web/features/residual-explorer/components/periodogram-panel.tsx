import { lazy, Suspense, useMemo, useState } from 'react';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { EmptyState } from '../../../components/empty-state';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { LoadingPanel } from '../../../components/query-state';
import { Spinner } from '../../../components/spinner';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { cn } from '../../../lib/cn';
import { formatCount } from '../../../lib/format';
import { companionFromSinusoid, freeCompanionName, type CompanionSeed, type SeededCompanion } from '../lib/panels/companion-seed';
import {
  DEFAULT_MIN_PERIOD_DAYS,
  FAP_LEVELS,
  MIN_PERIODOGRAM_SAMPLES,
  SIGNIFICANT_FAP,
  warningText,
  type PeriodogramRequest,
} from '../lib/panels/residual-periodogram';
import { useResidualPeriodogram } from '../lib/panels/use-residual-periodogram';

// React.lazy keeps Plotly out of the screen's chunk until the periodogram is drawn.
const PeriodogramPlot = lazy(() => import('../lib/panels/periodogram-plot'));

export interface PeriodogramPanelProps {
  /** barycentric arrival times, days since `referenceMjd` (ExplorerTable.barycentricDaysHi + Lo), of the TOAs in use */
  tDays: Float64Array;
  /** the residuals being shown (after companion toggles and edits), µs */
  residualUs: Float64Array;
  /** their 1σ, µs */
  uncertaintyUs: Float64Array;
  /** the origin of tDays, MJD text (TDB) */
  referenceMjd: string;
  /** the edited model's companion names, so the seeded companion gets a free one (default: none taken) */
  existingCompanionNames?: readonly string[];
  /** "Add a companion seeded from this peak": a circular Keplerian companion for the edited model */
  onSeedCompanion(companion: SeededCompanion): void;
}

/** A false-alarm probability for reading: 2 significant digits, powers of ten below 1e-3. */
export function formatFalseAlarm(fap: number): string {
  if (!Number.isFinite(fap)) return '—';
  if (fap < 1e-99) return '< 1e-99';
  return fap < 1e-3 ? fap.toExponential(1) : fap.toPrecision(2);
}

const NO_NAMES: readonly string[] = [];
const formatPeriodDays = (days: number) => (days >= 1000 ? days.toFixed(0) : days.toPrecision(5));

function parsePeriod(text: string, label: string): { value?: number; error?: string } {
  const trimmed = text.trim();
  if (trimmed === '') return {};
  const value = Number(trimmed);
  if (!Number.isFinite(value) || value <= 0) return { error: `${label}: must be a number of days above 0` };
  return { value };
}

/**
 * The periodogram of the current residuals (generalized Lomb–Scargle, computed in the browser and
 * off the main thread), with the power levels where the false-alarm probability is 1e-2 and 1e-3,
 * the strongest peaks with their FAP and alias warnings, and, for a chosen peak, "Add a companion
 * seeded from this peak". Recomputes a moment after the residuals stop changing.
 */
export function PeriodogramPanel({ tDays, residualUs, uncertaintyUs, referenceMjd, existingCompanionNames = NO_NAMES, onSeedCompanion }: PeriodogramPanelProps) {
  const [minText, setMinText] = useState(String(DEFAULT_MIN_PERIOD_DAYS));
  const [maxText, setMaxText] = useState('');
  const [chosen, setChosen] = useState<number | null>(null);
  const [added, setAdded] = useState<{ name: string; periodDays: string } | null>(null);
  const min = parsePeriod(minText, 'Shortest period');
  const max = parsePeriod(maxText, 'Longest period');
  const rangeError =
    min.error ?? max.error ?? (min.value !== undefined && max.value !== undefined && max.value <= min.value ? 'Longest period: must be above the shortest period' : undefined);
  const enough = tDays.length >= MIN_PERIODOGRAM_SAMPLES;

  const request = useMemo<PeriodogramRequest | null>(
    () =>
      enough && !rangeError
        ? { tDays, residualUs, uncertaintyUs, minPeriodDays: min.value ?? DEFAULT_MIN_PERIOD_DAYS, ...(max.value !== undefined ? { maxPeriodDays: max.value } : {}) }
        : null,
    [enough, rangeError, tDays, residualUs, uncertaintyUs, min.value, max.value],
  );
  const { result, error, computing, ranIn } = useResidualPeriodogram(request);

  const peaks = result?.peaks ?? [];
  const chosenPeak = chosen !== null && chosen < peaks.length ? peaks[chosen] : null;
  const seed = useMemo<{ seed?: CompanionSeed; error?: string } | null>(() => {
    if (!chosenPeak) return null;
    if (!chosenPeak.sinusoid) return { error: 'The TOAs do not constrain a sinusoid at this period (all at nearly the same phase).' };
    return { seed: companionFromSinusoid(chosenPeak.sinusoid, referenceMjd, freeCompanionName(existingCompanionNames)) };
  }, [chosenPeak, referenceMjd, existingCompanionNames]);

  const pickPeriod = (periodDays: number) => {
    if (peaks.length === 0) return;
    let best = 0;
    for (let i = 1; i < peaks.length; i++) {
      if (Math.abs(Math.log(peaks[i].periodDays / periodDays)) < Math.abs(Math.log(peaks[best].periodDays / periodDays))) best = i;
    }
    setChosen(best);
  };

  if (!enough) {
    return (
      <EmptyState title="Not enough TOAs for a periodogram">
        A periodogram needs at least {MIN_PERIODOGRAM_SAMPLES} TOAs in use; {tDays.length === 0 ? 'none are' : `only ${tDays.length} are`}. Include more TOAs or
        choose a fit with more data.
      </EmptyState>
    );
  }

  const best = peaks[0];
  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end gap-3">
        <Field label="Shortest period (days)" className="w-44" error={min.error}>
          {(control) => <Input {...control} inputMode="decimal" className="font-mono" value={minText} onChange={(e) => setMinText(e.target.value)} />}
        </Field>
        <Field label="Longest period (days)" className="w-44" error={max.error ?? (rangeError && !min.error ? rangeError : undefined)}>
          {(control) => (
            <Input {...control} inputMode="decimal" className="font-mono" placeholder={result ? `${result.spanDays.toFixed(0)} (span)` : 'data span'} value={maxText} onChange={(e) => setMaxText(e.target.value)} />
          )}
        </Field>
        <div className="min-h-10 pb-2 text-xs text-night-400" aria-live="polite">
          {computing ? (
            <Spinner size="sm" label="Updating the periodogram…" />
          ) : result ? (
            `${formatCount(result.sampleCount)} TOAs, ${formatCount(result.grid.count)} trial periods from ${formatPeriodDays(result.minPeriodDays)} to ${formatPeriodDays(result.maxPeriodDays)} d; ${Math.round(result.elapsedMs)} ms in the ${ranIn === 'worker' ? 'background' : 'page'}.`
          ) : null}
        </div>
      </div>

      {error ? <Alert tone="error" title="No periodogram for these residuals">{error}</Alert> : null}
      {!result && !error ? <LoadingPanel label="Computing the periodogram…" /> : null}

      {result ? (
        <>
          {best && best.falseAlarmProbability > SIGNIFICANT_FAP ? (
            <Alert tone="info" title="No significant periodicity">
              The strongest peak ({formatPeriodDays(best.periodDays)} d) has a false-alarm probability of {formatFalseAlarm(best.falseAlarmProbability)}, above{' '}
              {SIGNIFICANT_FAP.toExponential(0)}: noise alone makes peaks this high. Do not add a companion on this evidence alone.
            </Alert>
          ) : null}
          <figure aria-label="Periodogram plot" className={cn(computing && 'opacity-70')}>
            <Suspense fallback={<LoadingPanel label="Loading the plot…" />}>
              <PeriodogramPlot periodogram={result} chosenPeak={chosen} onPickPeriod={pickPeriod} />
            </Suspense>
            <figcaption className="mt-1 text-xs text-night-400">
              Generalized Lomb–Scargle power of the residuals shown above (weights 1/σ²). Dashed line: false-alarm probability{' '}
              {FAP_LEVELS[0].toExponential(0)} (power {result.fapLevelPowers[0].toFixed(4)}); dotted line: {FAP_LEVELS[1].toExponential(0)} (power{' '}
              {result.fapLevelPowers[1].toFixed(4)}) — Baluev (2008) analytic bound. Numbered markers are the peaks listed below.
            </figcaption>
          </figure>

          {peaks.length === 0 ? (
            <p className="text-sm text-night-300">No peaks in this period range.</p>
          ) : (
            <Table aria-label="Strongest periodogram peaks">
              <THead>
                <tr>
                  <Th scope="col">#</Th>
                  <Th scope="col" className="text-right">Period <span className="normal-case">(d)</span></Th>
                  <Th scope="col" className="text-right">Power</Th>
                  <Th scope="col" className="text-right">False-alarm probability</Th>
                  <Th scope="col">Notes</Th>
                  <Th scope="col"><span className="sr-only">Choose</span></Th>
                </tr>
              </THead>
              <TBody>
                {peaks.map((p, i) => {
                  const significant = p.falseAlarmProbability <= SIGNIFICANT_FAP;
                  return (
                    <Tr key={p.freqPerDay} className={cn(i === chosen && 'bg-ember-500/10')}>
                      <Td className="font-mono">{i + 1}</Td>
                      <Td className="text-right font-mono tabular-nums">{formatPeriodDays(p.periodDays)}</Td>
                      <Td className="text-right font-mono tabular-nums">{p.power.toFixed(4)}</Td>
                      <Td className={cn('text-right font-mono tabular-nums', significant ? 'text-calm-400' : 'text-night-300')}>
                        {formatFalseAlarm(p.falseAlarmProbability)}
                        <span className="ml-1 font-sans text-xs">{significant ? '(significant)' : '(not significant)'}</span>
                      </Td>
                      <Td className="text-xs text-ember-200">
                        {p.warnings.length > 0 ? (
                          <ul className="list-none">
                            {p.warnings.map((w) => (
                              <li key={w}>⚠ {warningText(w)}</li>
                            ))}
                          </ul>
                        ) : (
                          <span className="text-night-400">—</span>
                        )}
                      </Td>
                      <Td>
                        <Button
                          size="sm"
                          variant={i === chosen ? 'primary' : 'secondary'}
                          aria-pressed={i === chosen}
                          aria-label={`Choose peak ${i + 1} at ${formatPeriodDays(p.periodDays)} days`}
                          onClick={() => setChosen(i === chosen ? null : i)}
                        >
                          {i === chosen ? 'Chosen' : 'Choose'}
                        </Button>
                      </Td>
                    </Tr>
                  );
                })}
              </TBody>
            </Table>
          )}

          {chosenPeak && seed ? (
            <section aria-label="Seed a companion" className="rounded-lg border border-night-600 bg-night-800/60 p-4 text-sm">
              {seed.error ? (
                <Alert tone="error" title="No sinusoid at this period">{seed.error}</Alert>
              ) : seed.seed ? (
                <>
                  <p className="text-night-100">
                    Peak {chosen! + 1} at {formatPeriodDays(chosenPeak.periodDays)} d: the residuals hold a sinusoid of {seed.seed.amplitudeUs.toPrecision(3)} ±{' '}
                    {seed.seed.amplitudeUncertaintyUs.toPrecision(2)} µs.
                  </p>
                  <p className="mt-1 text-night-300">
                    As a circular orbit (delay = x·sin(2π(t − T₀)/P), Blandford &amp; Teukolsky 1976): companion{' '}
                    <span className="font-mono">{seed.seed.companion.name}</span>, period <span className="font-mono">{seed.seed.companion.period_days}</span> d, projected
                    semi-major axis <span className="font-mono">{seed.seed.companion.projected_semimajor_axis_lt_s}</span> lt-s, eccentricity 0, epoch{' '}
                    <span className="font-mono">{seed.seed.companion.periastron_epoch_mjd}</span> MJD. A fit refines these.
                  </p>
                  {chosenPeak.falseAlarmProbability > SIGNIFICANT_FAP ? (
                    <p className="mt-1 font-medium text-ember-200">⚠ This peak is not significant (FAP {formatFalseAlarm(chosenPeak.falseAlarmProbability)}).</p>
                  ) : null}
                  <Button
                    className="mt-3"
                    onClick={() => {
                      const companion = seed.seed!.companion;
                      onSeedCompanion(companion);
                      setAdded({ name: companion.name, periodDays: companion.period_days });
                    }}
                  >
                    Add a companion seeded from this peak
                  </Button>
                </>
              ) : null}
            </section>
          ) : null}
          {added ? (
            <Alert tone="success">
              Companion {added.name} ({added.periodDays} d) is in the edited model; set which of its values to solve for, then queue a fit.
            </Alert>
          ) : null}
        </>
      ) : null}
    </div>
  );
}

import { Fact } from '../../../components/fact';
import type { SearchRun } from '../api/get-search-run';
import { formatCount } from '../../../lib/format';
import { formatFap, formatPeriodDays } from '../lib/format-search';

const SETTING_LABELS: Record<string, string> = {
  ephemeris: 'Solar-system ephemeris',
  clock: 'Clock chain',
  timeScale: 'Time scale',
  earthOrientation: 'Earth orientation',
  jupiterShapiro: 'Jupiter Shapiro delay',
  periodogram: 'Periodogram',
  falseAlarm: 'False-alarm probability',
  companionKind: 'Companion orbit model',
  engineVersion: 'Engine version',
};

function settingText(value: unknown): string {
  if (value === null || value === undefined || value === '') return '—';
  return typeof value === 'object' ? JSON.stringify(value) : String(value);
}

/**
 * Which settings produced the result: the search options as resolved, then the engine settings
 * (the named ones first, then any others the run or the engine reports).
 */
export function SearchSettingsList({ run }: { run: Pick<SearchRun, 'options' | 'settings'> & { result: Pick<NonNullable<SearchRun['result']>, 'engineSettings' | 'searchSettings'> | null } }) {
  const settings: Record<string, unknown> = { ...run.settings, ...(run.result?.engineSettings ?? {}) };
  const keys = [...Object.keys(SETTING_LABELS).filter((k) => k in settings), ...Object.keys(settings).filter((k) => !(k in SETTING_LABELS))];
  const o = run.options;
  const resolved = run.result?.searchSettings;
  return (
    <div className="flex flex-col gap-4">
      {resolved ? (
        <dl className="grid grid-cols-2 gap-3 text-sm sm:grid-cols-3" aria-label="Search options">
          <Fact label="Shortest period">
            {formatPeriodDays(resolved.minPeriodDays)}
            {o.minPeriodDays === null ? ' (from the data)' : ''}
          </Fact>
          <Fact label="Longest period">
            {formatPeriodDays(resolved.maxPeriodDays)}
            {o.maxPeriodDays === null ? ' (from the data)' : ''}
          </Fact>
          <Fact label="Most companions">{resolved.maxCompanions}</Fact>
          <Fact label="False-alarm threshold">{formatFap(resolved.falseAlarmThreshold)}</Fact>
          <Fact label="Eccentricity F-test threshold">{formatFap(resolved.eccentricityThreshold)}</Fact>
          <Fact label="Assumed pulsar mass">{resolved.pulsarMassSolar} M☉</Fact>
          <Fact label="Oversampling">{resolved.oversampling} × the natural resolution</Fact>
          <Fact label="Trial frequencies">{formatCount(resolved.frequencyCount)}</Fact>
          <Fact label="Span of the TOAs">{formatPeriodDays(resolved.spanDays)}</Fact>
        </dl>
      ) : (
        <dl className="grid grid-cols-2 gap-3 text-sm sm:grid-cols-3" aria-label="Search options">
          <Fact label="Shortest period">{o.minPeriodDays === null ? 'from the data (twice the cadence)' : `${o.minPeriodDays} d`}</Fact>
          <Fact label="Longest period">{o.maxPeriodDays === null ? 'from the data (the span)' : `${o.maxPeriodDays} d`}</Fact>
          <Fact label="Most companions">{o.maxCompanions}</Fact>
          <Fact label="False-alarm threshold">{formatFap(o.falseAlarmThreshold)}</Fact>
          <Fact label="Assumed pulsar mass">{o.assumedPulsarMassSolar} M☉</Fact>
        </dl>
      )}
      <dl className="grid grid-cols-1 gap-3 text-sm sm:grid-cols-2" aria-label="Engine settings">
        {keys.map((key) => (
          <Fact key={key} label={SETTING_LABELS[key] ?? key}>
            {settingText(settings[key])}
          </Fact>
        ))}
      </dl>
    </div>
  );
}

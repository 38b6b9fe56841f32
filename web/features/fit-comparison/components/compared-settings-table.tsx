import type { FitComparison } from '../../../../api/contracts/comparisons';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { cn } from '../../../lib/cn';

const SETTING_LABELS: Record<string, string> = {
  ephemeris: 'Solar-system ephemeris',
  clock: 'Clock chain',
  timeScale: 'Time scale',
  earthOrientation: 'Earth orientation',
  jupiterShapiro: 'Jupiter Shapiro delay',
  engineVersion: 'Engine version',
};

/** Each run's engine settings side by side; a setting in which the runs differ says so in words. */
export function ComparedSettingsTable({ comparison }: { comparison: FitComparison }) {
  const { runs, differingSettings } = comparison;
  const keys = [...new Set([...Object.keys(SETTING_LABELS), ...runs.flatMap((r) => Object.keys(r.settings))])].filter((key) =>
    runs.some((r) => (r.settings as Record<string, string | undefined>)[key] !== undefined),
  );
  return (
    <Table aria-label="Engine settings of the compared runs">
      <THead>
        <tr>
          <Th scope="col">Setting</Th>
          {runs.map((run) => (
            <Th key={run.fitRunId} scope="col">
              <span className="normal-case tracking-normal">Run #{run.fitRunId}</span>
            </Th>
          ))}
        </tr>
      </THead>
      <TBody>
        {keys.map((key) => {
          const differs = differingSettings.includes(key);
          return (
            <Tr key={key} className={cn(differs && 'bg-ember-500/10')}>
              <Th scope="row" className="whitespace-nowrap text-night-300">
                {SETTING_LABELS[key] ?? key}
                {differs ? (
                  <span className="ml-2 text-xs font-semibold text-ember-300">
                    <span aria-hidden="true">⚠ </span>differs
                  </span>
                ) : null}
              </Th>
              {runs.map((run) => (
                <Td key={run.fitRunId} className="text-xs">
                  {(run.settings as Record<string, string | undefined>)[key] ?? '—'}
                </Td>
              ))}
            </Tr>
          );
        })}
      </TBody>
    </Table>
  );
}

import type { ReactNode } from 'react';
import type { FitComparison } from '../../../../api/contracts/comparisons';
import { Card, CardTitle } from '../../../components/card';
import { ComparedParametersTable } from './compared-parameters-table';
import { ComparedRunsTable } from './compared-runs-table';
import { ComparedSettingsTable } from './compared-settings-table';
import { ComparisonWarnings } from './comparison-warnings';
import { NestedTests } from './nested-tests';
import { StackedResidualsPanel } from './stacked-residuals-panel';

function Section({ title, children }: { title: string; children: ReactNode }) {
  return (
    <Card aria-label={title}>
      <CardTitle>{title}</CardTitle>
      {children}
    </Card>
  );
}

/**
 * The whole comparison: warnings first, then statistics (AIC/BIC), F-tests, parameters, settings and
 * the stacked residuals. `aside` (e.g. the save form) goes after the statistics.
 */
export function ComparisonView({ comparison, onMakeReference, aside }: { comparison: FitComparison; onMakeReference?: (fitRunId: number) => void; aside?: ReactNode }) {
  return (
    <div className="flex flex-col gap-6">
      <ComparisonWarnings comparison={comparison} />
      <Section title="Fit statistics">
        <ComparedRunsTable comparison={comparison} onMakeReference={onMakeReference} />
        <p className="mt-3 text-xs text-night-400">
          AIC = χ² + 2k (Akaike 1974) and BIC = χ² + k ln N (Schwarz 1978), k free parameters (phase offset included), N TOAs fitted;
          the lower value is preferred. Δ is the distance to the lowest.
        </p>
      </Section>
      <Section title="Nested models">
        <NestedTests comparison={comparison} />
      </Section>
      {aside}
      <Section title="Parameters">
        <p className="mb-3 text-xs text-night-400">
          Value ± formal 1σ per run. Below each value: its difference to the reference run in units of the combined uncertainty √(σ² +
          σ_ref²); differences over 3σ are marked ▲ and named.
        </p>
        {comparison.parameters.length === 0 ? (
          <p className="text-sm text-night-300">None of the runs fitted any parameter besides the phase offset.</p>
        ) : (
          <ComparedParametersTable comparison={comparison} />
        )}
      </Section>
      <Section title="Engine settings">
        <p className="mb-3 text-xs text-night-400">The ephemeris, clock chain and time scale that produced each run’s result.</p>
        <ComparedSettingsTable comparison={comparison} />
      </Section>
      <Section title="Residuals">
        <StackedResidualsPanel runs={comparison.runs} />
      </Section>
      {comparison.references.length > 0 ? (
        <Section title="Sources">
          <ul className="list-disc pl-5 text-xs text-night-300">
            {comparison.references.map((r) => (
              <li key={r}>{r}</li>
            ))}
          </ul>
        </Section>
      ) : null}
    </div>
  );
}

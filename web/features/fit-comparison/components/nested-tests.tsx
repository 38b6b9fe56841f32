import type { FitComparison } from '../../../../api/contracts/comparisons';
import { formatProbability } from '../lib/comparison-format';

/** The source the API computes the F-test from (api/contracts/comparisons.ts, NestedPairTest). */
export const F_TEST_SOURCE =
  'Bevington & Robinson, Data Reduction and Error Analysis for the Physical Sciences, 3rd ed. (2003), §11.4';

/**
 * One line per nested pair: the F statistic and the chance of an F this large if the added
 * parameters were not needed; an explanation naming the source above; empty states say why none.
 */
export function NestedTests({ comparison }: { comparison: FitComparison }) {
  return (
    <div className="flex flex-col gap-3 text-sm">
      <p className="text-xs text-night-300">
        F-test for nested models ({F_TEST_SOURCE}): F = (Δχ²/Δk) / (χ²/ν of the larger model); the probability is the chance of an F
        this large if the added parameters were not needed, so a small probability (say below 0.01) supports the larger model.
      </p>
      {comparison.nestedTests.length === 0 ? (
        <p className="text-night-300">
          {comparison.statisticsComparable
            ? 'No pair of these runs is nested (one run’s free parameters a strict subset of another’s), so no F-test applies. Compare a run with one whose model adds parameters to it.'
            : 'No F-test: the runs did not fit the same TOAs with the same settings (see the warnings above).'}
        </p>
      ) : (
        <ul aria-label="F-tests of nested pairs" className="flex flex-col gap-1">
          {comparison.nestedTests.map((t) => (
            <li key={`${t.smallerFitRunId}-${t.largerFitRunId}`} className="font-mono text-xs text-night-100">
              Run #{t.largerFitRunId} adds {t.addedParameters} parameter{t.addedParameters === 1 ? '' : 's'} to run #{t.smallerFitRunId}: F ={' '}
              {t.statistic.toPrecision(4)} on ({t.addedParameters}, {t.dof}) degrees of freedom, probability {formatProbability(t.probability)}
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}

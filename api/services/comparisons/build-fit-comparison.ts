/**
 * The comparison of 2–4 loaded fit runs, as plain data in and out: per-run
 * statistics (χ², dof, weighted RMS, free parameters, AIC, BIC), whether the
 * runs are comparable at all (same engine settings, same TOAs, same weights),
 * the parameter table, and the F-test of every nested pair.
 */
import type { ComparedRun, ComparisonWarning, FitComparison, NestedPairTest } from '../../contracts/comparisons';
import { PHASE_OFFSET_PARAMETER } from '../../contracts/comparisons';
import {
  akaikeInformationCriterion,
  bayesianInformationCriterion,
  nestedFTest,
  type FitSummary,
} from '../../../worker/timing/fit/model-selection';
import { allParameterPaths, parameterHandle, parameterPathProblem } from '../../../worker/timing/model/parameter-paths';
import type { TimingModel } from '../../../worker/timing/model/timing-model';
import { compareParameters, fittedModels } from './compare-parameters';
import type { LoadedRun } from './load-compared-runs';

export const COMPARISON_REFERENCES = [
  'AIC = χ² + 2k: Akaike 1974, IEEE Trans. Autom. Control 19, 716',
  'BIC = χ² + k ln N: Schwarz 1978, Ann. Stat. 6, 461',
  'F-test for additional terms: Bevington & Robinson, Data Reduction and Error Analysis for the Physical Sciences, 3rd ed. 2003, §11.4',
];

/** k of a run: its fitted solve_for paths plus the implicit phase offset. */
function freeParametersOf(run: LoadedRun): { count: number; paths: string[] } {
  const paths = [...Object.keys(run.result.parameters), PHASE_OFFSET_PARAMETER];
  return { count: paths.length, paths };
}

const summaryOf = (run: LoadedRun): FitSummary => ({ chi2: run.result.chi2, count: run.toaCount, freeParameters: freeParametersOf(run).count });

function comparedRun(run: LoadedRun): ComparedRun {
  const r = run.result;
  return {
    fitRunId: run.fitRunId,
    revision: run.revision,
    finishedAt: run.finishedAt,
    toaCount: run.toaCount,
    excludedCount: run.excludedCount,
    chi2: r.chi2,
    dof: r.dof,
    reducedChi2: r.reducedChi2,
    weightedRmsUs: r.weightedRmsUs,
    converged: r.converged,
    warnings: r.warnings,
    freeParameters: freeParametersOf(run),
    aic: akaikeInformationCriterion(summaryOf(run)),
    bic: bayesianInformationCriterion(summaryOf(run)),
    settings: run.settings,
  };
}

/** The settings keys whose values are not the same in every run. */
function differingSettingKeys(runs: readonly LoadedRun[]): string[] {
  const keys = [...new Set(runs.flatMap((r) => Object.keys(r.settings)))];
  return keys.filter((k) => new Set(runs.map((r) => (r.settings as Record<string, string | undefined>)[k] ?? '(not set)')).size > 1);
}

interface ToaSetDifference {
  onlyInFirst: number;
  onlyInSecond: number;
  /** TOAs in both whose effective uncertainty differs */
  reweighted: number;
  known: boolean;
}

function toaSetDifference(a: LoadedRun, b: LoadedRun): ToaSetDifference {
  if (a.fittedToas === null || b.fittedToas === null) return { onlyInFirst: 0, onlyInSecond: 0, reweighted: 0, known: false };
  const sigmaA = new Map<number, number>();
  a.fittedToas.toaIds.forEach((id, i) => sigmaA.set(id, (a.fittedToas as NonNullable<LoadedRun['fittedToas']>).uncertaintyUs[i]));
  let onlyInSecond = 0;
  let reweighted = 0;
  let shared = 0;
  b.fittedToas.toaIds.forEach((id, i) => {
    const sigma = sigmaA.get(id);
    if (sigma === undefined) onlyInSecond++;
    else {
      shared++;
      if (sigma !== (b.fittedToas as NonNullable<LoadedRun['fittedToas']>).uncertaintyUs[i]) reweighted++;
    }
  });
  return { onlyInFirst: sigmaA.size - shared, onlyInSecond, reweighted, known: true };
}

const sameToas = (d: ToaSetDifference): boolean => d.known && d.onlyInFirst === 0 && d.onlyInSecond === 0;

/**
 * Whether `smaller`'s free parameters are a strict subset of `larger`'s and the two
 * models agree on every parameter both hold fixed (then `smaller` is `larger` with
 * the added parameters pinned). Returns the reason when they only nest by free sets.
 */
function nesting(smaller: LoadedRun, larger: LoadedRun, models: Map<number, TimingModel>): 'nested' | 'no' | { fixedDiffer: string[] } {
  const small = new Set(Object.keys(smaller.result.parameters));
  const large = new Set(Object.keys(larger.result.parameters));
  if (small.size >= large.size || ![...small].every((p) => large.has(p))) return 'no';
  const smallModel = models.get(smaller.fitRunId) as TimingModel;
  const largeModel = models.get(larger.fitRunId) as TimingModel;
  const fixedDiffer: string[] = [];
  for (const path of allParameterPaths(smallModel)) {
    if (large.has(path)) continue;
    if (parameterPathProblem(largeModel, path) !== null) {
      fixedDiffer.push(path); // the smaller model has a component the larger one lacks
      continue;
    }
    const a = parameterHandle(smallModel, path);
    const b = parameterHandle(largeModel, path);
    if (a.formatValue(a.get(smallModel)) !== b.formatValue(b.get(largeModel))) fixedDiffer.push(path);
  }
  return fixedDiffer.length === 0 ? 'nested' : { fixedDiffer };
}

/**
 * @param runs  2–4 runs of one pulsar, reference first (loadComparedRuns)
 * @returns     the comparison; statistics are always given, `statisticsComparable` and
 *              the warnings say whether χ², AIC, BIC and F-tests may be compared across runs
 */
export function buildFitComparison(pulsarId: number, runs: readonly LoadedRun[]): FitComparison {
  const models = fittedModels(runs.map((r) => r.result));
  const modelById = new Map(runs.map((r, i) => [r.fitRunId, models[i]]));
  const warnings: ComparisonWarning[] = [];
  const ids = runs.map((r) => r.fitRunId);

  const differingSettings = differingSettingKeys(runs);
  if (differingSettings.length > 0) {
    const listed = differingSettings.map((k) => `${k} (${runs.map((r) => `${r.fitRunId}: ${(r.settings as Record<string, string | undefined>)[k] ?? 'not set'}`).join('; ')})`);
    warnings.push({
      code: 'settings-differ',
      message: `The runs used different engine settings: ${listed.join(', ')}. χ², AIC, BIC and F-tests are not comparable across them.`,
      fitRunIds: ids,
    });
  }

  const reference = runs[0];
  const toaDifferences = runs.slice(1).map((run) => ({ run, d: toaSetDifference(reference, run) }));
  const toasDiffer = toaDifferences.filter(({ d }) => !sameToas(d));
  if (toasDiffer.length > 0) {
    const parts = toasDiffer.map(({ run, d }) =>
      d.known
        ? `fit run ${run.fitRunId} (${d.onlyInSecond} TOAs not in ${reference.fitRunId}, ${d.onlyInFirst} of ${reference.fitRunId}'s left out)`
        : `fit run ${run.fitRunId} (its TOA set is not stored)`,
    );
    warnings.push({
      code: 'toas-differ',
      message: `Not the same TOAs as the reference run ${reference.fitRunId}: ${parts.join('; ')}. χ², AIC, BIC and F-tests are not comparable across different TOA sets.`,
      fitRunIds: [reference.fitRunId, ...toasDiffer.map(({ run }) => run.fitRunId)],
    });
  }
  const reweighted = toaDifferences.filter(({ d }) => sameToas(d) && d.reweighted > 0);
  if (reweighted.length > 0) {
    warnings.push({
      code: 'weights-differ',
      message: `Same TOAs as the reference run ${reference.fitRunId}, but different effective uncertainties (noise settings) in ${reweighted
        .map(({ run, d }) => `fit run ${run.fitRunId} (${d.reweighted} TOAs)`)
        .join('; ')}. χ² weighs the TOAs differently, so χ², AIC, BIC and F-tests are not comparable.`,
      fitRunIds: [reference.fitRunId, ...reweighted.map(({ run }) => run.fitRunId)],
    });
  }
  const sameToaSets = toasDiffer.length === 0;
  const statisticsComparable = differingSettings.length === 0 && sameToaSets && reweighted.length === 0;

  const unconverged = runs.filter((r) => !r.result.converged).map((r) => r.fitRunId);
  if (unconverged.length > 0) {
    warnings.push({ code: 'not-converged', message: `${unconverged.length === 1 ? 'Fit run' : 'Fit runs'} ${unconverged.join(', ')} did not converge; its figures are those of the last iteration.`, fitRunIds: unconverged });
  }
  const warned = runs.filter((r) => r.result.warnings.length > 0).map((r) => r.fitRunId);
  if (warned.length > 0) {
    warnings.push({ code: 'fit-warnings', message: `Fit ${warned.length === 1 ? 'run' : 'runs'} ${warned.join(', ')} reported warnings (listed with each run).`, fitRunIds: warned });
  }

  const nestedTests: NestedPairTest[] = [];
  if (statisticsComparable) {
    for (let i = 0; i < runs.length; i++) {
      for (let j = 0; j < runs.length; j++) {
        if (i === j) continue;
        const smaller = runs[i];
        const larger = runs[j];
        const nest = nesting(smaller, larger, modelById);
        if (nest === 'no') continue;
        if (nest !== 'nested') {
          warnings.push({
            code: 'not-nested',
            message: `Fit run ${larger.fitRunId} frees every parameter of ${smaller.fitRunId} and more, but they hold ${nest.fixedDiffer.join(', ')} differently; no F-test.`,
            fitRunIds: [smaller.fitRunId, larger.fitRunId],
          });
          continue;
        }
        try {
          const f = nestedFTest(summaryOf(smaller), summaryOf(larger));
          nestedTests.push({ smallerFitRunId: smaller.fitRunId, largerFitRunId: larger.fitRunId, ...f });
        } catch (error) {
          if (!(error instanceof RangeError)) throw error; // no dof left: no test
        }
      }
    }
  }

  return {
    pulsarId,
    runs: runs.map(comparedRun),
    parameters: compareParameters(
      runs.map((r) => r.result),
      models,
    ),
    sameSettings: differingSettings.length === 0,
    sameToas: sameToaSets,
    statisticsComparable,
    nestedTests,
    warnings,
    differingSettings,
    references: COMPARISON_REFERENCES,
  };
}

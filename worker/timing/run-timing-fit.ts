/**
 * The fit result in the product's public JSON shape (docs/formats.md §4,
 * `fit`), shared by the command line and any job that stores fit results.
 */
import type { TimingFitResult } from './pipeline/fit-prepared-arrivals';
import { writeModelFile } from './model/write-model-file';

export interface FitReportJson {
  model: Record<string, unknown>;
  parameters: Record<string, { value: string; uncertainty: number; unit: string }>;
  chi2: number;
  dof: number;
  reduced_chi2: number;
  weighted_rms_us: number;
  residuals: { row: number; residual_us: number; uncertainty_us: number }[];
  converged: boolean;
  iterations: number;
  phase_offset_turns: number;
  condition_number: number;
  uncertainties_scaled_by_reduced_chi2: false;
  warnings: string[];
  settings: Record<string, string>;
  ephemeris: TimingFitResult['ephemeris'];
}

/**
 * TimingFitResult → the `fit` output object (ready for JSON.stringify).
 *
 * @param fit  fitTimingModel(…) or fitPreparedArrivals(…)
 * @returns    the documented keys (model in file format, parameters with decimal-string values and
 *             1σ in the file key's unit, χ², dof, reduced χ², weighted RMS in µs, residuals per row)
 *             plus converged, iterations, phase offset, condition number, warnings and settings
 */
export function fitReportJson(fit: TimingFitResult): FitReportJson {
  const parameters: FitReportJson['parameters'] = {};
  for (const [path, p] of Object.entries(fit.parameters)) parameters[path] = { value: p.value, uncertainty: p.uncertainty, unit: p.fileUnit };
  return {
    model: writeModelFile(fit.model),
    parameters,
    chi2: fit.chi2,
    dof: fit.dof,
    reduced_chi2: fit.reducedChi2,
    weighted_rms_us: fit.weightedRmsUs,
    residuals: fit.residuals.map((r) => ({ row: r.row, residual_us: r.residualUs, uncertainty_us: r.uncertaintyUs })),
    converged: fit.converged,
    iterations: fit.iterations,
    phase_offset_turns: fit.phaseOffsetTurns,
    condition_number: fit.conditionNumber,
    uncertainties_scaled_by_reduced_chi2: false,
    warnings: fit.warnings,
    settings: fit.settings,
    ephemeris: fit.ephemeris,
  };
}

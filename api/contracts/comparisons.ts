/**
 * Fit comparisons as the API sends and accepts them (docs/api.md, "Fit
 * comparisons"): the comparison of 2–4 finished fit runs of one pulsar,
 * computed on demand from the stored results, and comparisons saved with a
 * comment. Shared by api/ and web/.
 */
import { z } from 'zod';
import type { FitEngineSettings, UserRef } from './fit-runs';

export const MIN_COMPARED_RUNS = 2;
export const MAX_COMPARED_RUNS = 4;
export const MAX_COMPARISON_COMMENT_LENGTH = 2000;

const RUN_COUNT_MESSAGE = `choose ${MIN_COMPARED_RUNS} to ${MAX_COMPARED_RUNS} fit runs`;

const FitRunIds = z
  .array(z.number({ error: 'each fit run id must be a number' }).int().positive().max(2 ** 31 - 1), { error: 'must be a list of fit run ids' })
  .min(MIN_COMPARED_RUNS, RUN_COUNT_MESSAGE)
  .max(MAX_COMPARED_RUNS, RUN_COUNT_MESSAGE)
  .refine((ids) => new Set(ids).size === ids.length, 'must not name the same fit run twice');

/** GET /api/pulsars/:id/fit-comparison?runs=12,15[,…]: the first id is the reference run. */
export const FitComparisonQuery = z.strictObject({
  runs: z
    .string({ error: `${RUN_COUNT_MESSAGE}, as comma-separated ids (runs=12,15)` })
    .regex(/^\d+(,\d+)*$/, 'must be comma-separated fit run ids, e.g. runs=12,15')
    .transform((text) => text.split(',').map(Number))
    .pipe(FitRunIds),
});
export type FitComparisonQuery = z.infer<typeof FitComparisonQuery>;

/** POST /api/pulsars/:id/comparisons: the first id is the reference run. */
export const SaveComparisonBody = z.strictObject({
  fitRunIds: FitRunIds,
  comment: z
    .string({ error: 'must be text' })
    .trim()
    .min(1, 'must not be empty')
    .max(MAX_COMPARISON_COMMENT_LENGTH, `must be at most ${MAX_COMPARISON_COMMENT_LENGTH} characters`),
});
export type SaveComparisonBody = z.infer<typeof SaveComparisonBody>;

/** The path name of the implicit phase offset in `freeParameters.paths` (always free, never in `parameters`). */
export const PHASE_OFFSET_PARAMETER = 'phase_offset_turns';

/** One compared run: its revision, TOA counts, fit statistics and settings. */
export interface ComparedRun {
  fitRunId: number;
  revision: {
    id: number;
    /** 1-based position among the pulsar's revisions, oldest first */
    number: number;
    message: string;
    released: boolean;
    releasedAt: string | null;
  };
  finishedAt: string | null;
  toaCount: number; // TOAs used by the fit
  excludedCount: number; // TOAs left out by an active exclusion when the run was fitted
  chi2: number;
  dof: number;
  reducedChi2: number;
  weightedRmsUs: number;
  converged: boolean;
  warnings: string[]; // the fit's own warnings
  /** the revision's solve_for paths that were fitted, in table order, plus PHASE_OFFSET_PARAMETER */
  freeParameters: { count: number; paths: string[] };
  /** χ² + 2k (Akaike 1974); k = freeParameters.count */
  aic: number;
  /** χ² + k ln N (Schwarz 1978); N = toaCount */
  bic: number;
  settings: FitEngineSettings; // ephemeris, clock, timeScale, earthOrientation, jupiterShapiro, engineVersion
}

/** One run's value of one parameter (null in `values` when the run's model has no such parameter). */
export interface ComparedValue {
  value: string; // file notation (sexagesimal for RA/Dec, MJD text for epochs)
  /** 1σ in the parameter's file unit; null when the run held the parameter fixed */
  uncertainty: number | null;
  free: boolean;
  /**
   * (value − reference value) / √(σ² + σ_ref²), with a fixed value's σ taken as 0;
   * null for the reference run itself, when either run lacks the parameter, or when both σ are 0
   */
  differenceSigma: number | null;
  /** value − reference value in the file unit (seconds of time for RA, arcsec for Dec, days for epochs); null as above */
  difference: number | null;
}

/** One row of the parameter table: the union of the runs' free parameters, in model file order. */
export interface ComparedParameter {
  path: string; // as in solve_for
  unit: string; // file unit of uncertainty and difference
  values: (ComparedValue | null)[]; // one per run, in `runs` order
}

/** F-test of a nested pair (Bevington & Robinson 2003, 3rd ed., §11.4). */
export interface NestedPairTest {
  /** the run with fewer free parameters and the run whose free parameters contain all of its */
  smallerFitRunId: number;
  largerFitRunId: number;
  addedParameters: number; // Δk
  dof: number; // ν of the larger model
  statistic: number; // F = (Δχ²/Δk) / (χ²_larger/ν)
  /** chance of an F this large if the added parameters are not needed */
  probability: number;
}

export type ComparisonWarningCode =
  | 'settings-differ' // ephemeris, clock, time-scale or other engine settings differ
  | 'toas-differ' // the runs fitted different TOA sets
  | 'weights-differ' // same TOAs, but different effective uncertainties (noise settings), so χ² weighs them differently
  | 'not-nested' // a pair nests by free parameters but holds a shared fixed parameter at different values (no F-test)
  | 'not-converged' // at least one fit did not converge
  | 'fit-warnings'; // at least one fit reported warnings

export interface ComparisonWarning {
  code: ComparisonWarningCode;
  message: string;
  fitRunIds: number[]; // the runs concerned
}

/** GET /api/pulsars/:id/fit-comparison (and `comparison` of a saved one). */
export interface FitComparison {
  pulsarId: number;
  /** runs in the order asked for; runs[0] is the reference of every difference */
  runs: ComparedRun[];
  parameters: ComparedParameter[];
  /** true when every run used the same engine settings */
  sameSettings: boolean;
  /** true when every run fitted exactly the same TOAs */
  sameToas: boolean;
  /** sameSettings && sameToas: only then are χ², AIC, BIC and F-tests comparable across runs */
  statisticsComparable: boolean;
  /** one entry per pair of runs (any two, not only vs runs[0]) whose free-parameter sets nest strictly; empty when not comparable */
  nestedTests: NestedPairTest[];
  warnings: ComparisonWarning[];
  /** the settings keys in which the runs differ (empty when sameSettings) */
  differingSettings: string[];
  references: string[]; // the published sources of AIC, BIC and the F-test
}

/** A saved comparison's metadata (GET /api/pulsars/:id/comparisons lists these). */
export interface SavedComparison {
  id: number;
  pulsarId: number;
  fitRunIds: number[]; // reference first
  comment: string;
  createdBy: UserRef | null;
  createdAt: string;
}

/** GET /api/comparisons/:id and the answer of POST /api/pulsars/:id/comparisons. */
export interface SavedComparisonWithResult extends SavedComparison {
  comparison: FitComparison;
}

/**
 * Companion-search runs as the API sends them and the worker stores them
 * (docs/api.md, "Companion search runs"): the request body schemas, the
 * response shapes and the settings every search of this build uses. Shared by
 * api/, worker/ and web/.
 *
 * A search run takes one model revision and the pulsar's current TOA
 * selection, fits, then repeats: residual periodogram → strongest peak and its
 * false-alarm probability → while below the threshold, a `keplerian` companion
 * seeded from the peak is added and everything is refitted. Every round's peak
 * is kept (the last one is the peak that stopped the search), every candidate
 * with its fitted elements ± uncertainties, its χ² change and derived masses.
 */
import { z } from 'zod';
import { FIT_ENGINE_SETTINGS, type UserRef } from './fit-runs';

export const SEARCH_RUN_STATUSES = ['queued', 'running', 'succeeded', 'failed', 'cancelled'] as const;
export type SearchRunStatus = (typeof SEARCH_RUN_STATUSES)[number];
export const FINAL_SEARCH_RUN_STATUSES: readonly SearchRunStatus[] = ['succeeded', 'failed', 'cancelled'];

/**
 * Most trial frequencies a search may ask for per round: 5 (the grid's oversampling) × span × (1/min − 1/max period).
 * A request beyond it is refused up front (400 on minPeriodDays) instead of running for hours.
 */
export const MAX_SEARCH_FREQUENCIES = 2_000_000;

/** Defaults of the search options (docs/formats.md §4 `search`). */
export const SEARCH_DEFAULTS = {
  maxCompanions: 3,
  falseAlarmThreshold: 0.001,
  assumedPulsarMassSolar: 1.4, // canonical neutron-star mass (common practice)
} as const;

/**
 * The engine settings of a search (part of the inputs hash): those of a fit
 * plus the periodogram's. `engineVersion` changes whenever a change of the
 * engine may change results, so old results are not reused after it.
 */
export const SEARCH_ENGINE_SETTINGS = {
  ...FIT_ENGINE_SETTINGS,
  periodogram: 'generalized Lomb–Scargle, floating mean, TOA weights',
  falseAlarm: 'Baluev 2008 analytic approximation',
  companionKind: 'keplerian (Blandford–Teukolsky 1976)',
} as const;
export type SearchEngineSettings = { [K in keyof typeof SEARCH_ENGINE_SETTINGS]: string };

const positiveDays = (field: string) =>
  z.number({ error: `${field}: must be a number of days` }).positive({ error: `${field}: must be > 0` });

/** POST /api/pulsars/:id/search-runs. Unset periods default to the data (shortest: twice the cadence; longest: the span). */
export const CreateSearchRunBody = z
  .strictObject({
    revisionId: z.number({ error: 'revisionId: must be a number' }).int().positive(),
    minPeriodDays: positiveDays('minPeriodDays').optional(),
    maxPeriodDays: positiveDays('maxPeriodDays').optional(),
    maxCompanions: z
      .number({ error: 'maxCompanions: must be a whole number' })
      .int({ error: 'maxCompanions: must be a whole number' })
      .min(1, { error: 'maxCompanions: must be 1–10' })
      .max(10, { error: 'maxCompanions: must be 1–10' })
      .optional(),
    falseAlarmThreshold: z
      .number({ error: 'falseAlarmThreshold: must be a number' })
      .gt(0, { error: 'falseAlarmThreshold: must be > 0 and < 1' })
      .lt(1, { error: 'falseAlarmThreshold: must be > 0 and < 1' })
      .optional(),
    assumedPulsarMassSolar: z
      .number({ error: 'assumedPulsarMassSolar: must be a number' })
      .gt(0, { error: 'assumedPulsarMassSolar: must be > 0 and ≤ 5' })
      .max(5, { error: 'assumedPulsarMassSolar: must be > 0 and ≤ 5' })
      .optional(),
    recompute: z.boolean().optional(),
  })
  .refine((b) => b.minPeriodDays === undefined || b.maxPeriodDays === undefined || b.maxPeriodDays > b.minPeriodDays, {
    path: ['maxPeriodDays'],
    message: 'must be greater than minPeriodDays',
  });
export type CreateSearchRunBody = z.infer<typeof CreateSearchRunBody>;

/** POST /api/search-runs/:id/save-revision. */
export const SaveSearchRevisionBody = z.strictObject({
  message: z
    .string({ error: 'message: must be text' })
    .trim()
    .min(1, { error: 'message: must be 1–500 characters' })
    .max(500, { error: 'message: must be 1–500 characters' }),
});
export type SaveSearchRevisionBody = z.infer<typeof SaveSearchRevisionBody>;

/** The options of a run as resolved (every default filled in; periods null = chosen from the data by the engine). */
export interface SearchOptions {
  minPeriodDays: number | null;
  maxPeriodDays: number | null;
  maxCompanions: number;
  falseAlarmThreshold: number;
  assumedPulsarMassSolar: number;
}

/** One value: file notation, 1σ uncertainty in `unit` (null: held fixed, not fitted). */
export interface SearchValue {
  value: string;
  uncertainty: number | null;
  unit: string;
}

/** The strongest peak of one round's periodogram. */
export interface SearchPeak {
  round: number; // 1-based
  periodDays: number;
  frequencyPerDay: number;
  power: number; // generalized Lomb–Scargle power, 0–1
  falseAlarmProbability: number;
  significant: boolean; // falseAlarmProbability < the run's falseAlarmThreshold
  aliasWarnings: string[]; // each starts with a stable code and a colon (one-year:, half-year:, cadence:, …)
  thresholdPower?: number; // power at which this round's Baluev FAP equals falseAlarmThreshold (absent in runs stored before it was kept)
}

/** Physics derived from a candidate's elements (mass function, minimum mass, separation). */
export interface SearchDerivedMasses {
  massFunctionSolar: number | null; // null (like every figure below) when the orbit fit failed
  assumedPulsarMassSolar: number;
  minimumCompanionMass: { solarMasses: number | null; jupiterMasses: number | null; earthMasses: number | null };
  separationAu: number | null; // Kepler's third law with pulsar mass + minimum companion mass
}

/** The F-test deciding whether eccentricity and periastron longitude are fitted. */
export interface SearchEccentricityTest {
  attempted: boolean; // false when the eccentric fit could not be done (statistic 0, probability 1)
  statistic: number;
  probability: number;
  kept: boolean; // the eccentric orbit was kept
}

export const SEARCH_CANDIDATE_STATUSES = ['accepted', 'unstable', 'degenerate'] as const;
export type SearchCandidateStatus = (typeof SEARCH_CANDIDATE_STATUSES)[number];

/**
 * A companion candidate from one round. Only `accepted` candidates are in the
 * resulting model; an `unstable` or `degenerate` one (eccentricity → 1, period
 * beyond the span, …) is reported with `reason` and is not a discovery.
 */
export interface SearchCandidate {
  round: number;
  name: string; // the companion's name (in the resulting model when accepted)
  kind: string; // 'keplerian'
  status: SearchCandidateStatus;
  reason: string | null; // why unstable or degenerate; null when accepted
  falseAlarmProbability: number; // of the peak that seeded it
  seedPeriodDays: number; // the seeding peak's period
  elements: Record<string, SearchValue>; // fitted elements keyed by the companion's file field names (period_days, …)
  chi2Before: number;
  chi2After: number | null; // null when the orbit fit failed
  chi2Change: number | null; // chi2After − chi2Before (negative: better)
  eccentricityTest: SearchEccentricityTest;
  converged: boolean;
  derived: SearchDerivedMasses;
}

export const SEARCH_STOP_REASONS = ['false-alarm-above-threshold', 'max-companions', 'candidate-rejected', 'no-frequencies'] as const;
export type SearchStopReason = (typeof SEARCH_STOP_REASONS)[number];

/** The settings the engine actually used (periods resolved from the data when not given). */
export interface SearchResolvedSettings {
  minPeriodDays: number;
  maxPeriodDays: number;
  maxCompanions: number;
  falseAlarmThreshold: number;
  eccentricityThreshold: number;
  pulsarMassSolar: number;
  oversampling: number;
  frequencyCount: number;
  spanDays: number;
}

export interface SearchResult {
  peaks: SearchPeak[]; // one per round; the last is the one that stopped the search
  candidates: SearchCandidate[]; // round order, accepted or not
  companionsFound: number; // accepted candidates
  stopReason: SearchStopReason;
  finalFit: {
    chi2: number;
    dof: number;
    reducedChi2: number;
    weightedRmsUs: number;
    converged: boolean;
    iterations: number;
    parameters: Record<string, SearchValue>; // every fitted parameter of the resulting model, by solve_for path
  };
  warnings: string[]; // the search's and the final fit's
  searchSettings: SearchResolvedSettings;
  engineSettings: Record<string, string>; // periodogram method, ephemeris, clock, time scale, … as the engine reported them
  resultingModel: Record<string, unknown>; // the model file JSON (docs/formats.md §2) with the accepted companions
}

export interface SearchRun {
  id: number;
  pulsarId: number;
  revisionId: number;
  status: SearchRunStatus;
  progress: { percent: number; stage: string };
  inputsHash: string;
  options: SearchOptions;
  settings: SearchEngineSettings;
  toaCount: number | null;
  excludedCount: number | null;
  requestedBy: UserRef | null;
  queuedAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  durationMs: number | null;
  errorMessage: string | null;
  savedRevisionId: number | null; // the revision saved from this run's resulting model (null until saved)
  result: SearchResult | null;
}

/** SearchRun in lists: the result without candidates' elements, the final fit's parameters and the resulting model. */
export type SearchRunSummary = Omit<SearchRun, 'result'> & {
  result:
    | (Omit<SearchResult, 'candidates' | 'resultingModel' | 'finalFit'> & {
        candidates: Omit<SearchCandidate, 'elements'>[];
        finalFit: Omit<SearchResult['finalFit'], 'parameters'>;
      })
    | null;
};

/**
 * One round's periodogram on its regular frequency grid f_k = minFrequencyPerDay + k·stepPerDay.
 * `pointsPerBin` 1: every frequency the engine evaluated. k > 1 (periodograms longer than
 * MAX_STORED_PERIODOGRAM_POINTS): each power is the highest of k consecutive engine frequencies
 * starting at f_k, and stepPerDay spans those k, so peaks keep their height.
 */
export interface SearchPeriodogram {
  round: number;
  grid: { minFrequencyPerDay: number; stepPerDay: number; count: number };
  pointsPerBin: number;
  power: number[]; // count entries
  thresholdPower?: number | null; // power at which the round's Baluev FAP equals the run's falseAlarmThreshold (null: run stored before it was kept)
}

/** Longest periodogram stored point for point (0.8 MB of Float64 per round). */
export const MAX_STORED_PERIODOGRAM_POINTS = 100_000;

/** GET /api/search-runs/:id/periodograms. */
export interface SearchPeriodograms {
  searchRunId: number;
  falseAlarmThreshold: number; // the run's threshold, the level thresholdPower stands for
  rounds: SearchPeriodogram[];
}

/** POST /api/pulsars/:id/search-runs → data. */
export interface CreateSearchRunResponse {
  searchRun: SearchRun;
  reused: boolean;
}

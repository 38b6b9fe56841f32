/**
 * Types of the iterative companion search (docs/formats.md §4 `search`,
 * docs/timing.md "Companion search"): its options, the per-round periodogram
 * peaks, the candidate companions with their fitted elements, uncertainties and
 * derived masses, and the report the search returns.
 *
 * The entry point is `searchCompanions(model, toas, geometry, options)` in
 * companion-search.ts (synchronous and pure: no I/O, the geometry from
 * computeArrivalGeometry is computed once by the caller).
 */
import type { KeplerianCompanion, TimingModel } from '../model/timing-model';
import type { TimingFitOptions, TimingFitResult } from '../pipeline/fit-prepared-arrivals';
import type { FrequencyGrid } from '../periodogram/frequency-grid';
import type { CompanionMass } from '../physics/minimum-companion-mass';

/** Progress of a running search, for job progress bars. */
export interface CompanionSearchProgress {
  /** 1-based round (one round = fit, periodogram, peak, maybe a new companion) */
  round: number;
  /** 'fit' | 'periodogram' | 'seed' | 'companion-fit' | 'eccentricity-test' | 'final-fit' | 'done' */
  stage: string;
  /** overall completion in [0, 1] (rough: rounds done over rounds possible) */
  fraction: number;
}

export interface CompanionSearchOptions {
  /** shortest trial period, days; default max(1 d, 2 × median TOA spacing) (docs/timing.md) */
  minPeriodDays?: number;
  /** longest trial period, days; default the data span */
  maxPeriodDays?: number;
  /** most companions to add; default 3 */
  maxCompanions?: number;
  /** a peak is a discovery when its false-alarm probability is below this; default 0.001 */
  falseAlarmThreshold?: number;
  /** F-test probability below which eccentricity and periastron longitude are kept; default 0.001 */
  eccentricityThreshold?: number;
  /** assumed pulsar mass for the minimum companion mass, solar masses; default 1.4 */
  pulsarMassSolar?: number;
  /** periodogram oversampling (points per natural resolution 1/span); ≥ 5, default 5 */
  oversampling?: number;
  /** options of every timing fit (iterations, Jupiter Shapiro delay) */
  fitOptions?: Omit<TimingFitOptions, 'onIteration'>;
  onProgress?(progress: CompanionSearchProgress): void;
  /** polled between steps; when it returns true the search throws CompanionSearchCancelled */
  isCancelled?(): boolean;
}

/** The highest periodogram peak of one round. */
export interface SearchPeak {
  /** 1-based round */
  round: number;
  periodDays: number;
  frequencyPerDay: number;
  /** normalised generalized Lomb–Scargle power p ∈ [0, 1] */
  power: number;
  /** Baluev 2008 analytic false-alarm probability of this highest peak */
  falseAlarmProbability: number;
  /** alias and systematics warnings (periodogram/alias-flags.ts codes) */
  aliasWarnings: string[];
}

/** The residual periodogram of one round, on the regular grid `grid`. */
export interface SearchPeriodogram {
  round: number;
  grid: FrequencyGrid;
  /** grid frequencies, cycles per day (grid.minFreqPerDay + k·grid.stepPerDay) */
  frequencyPerDay: Float64Array;
  /** normalised power per grid frequency */
  power: Float64Array;
  /**
   * the power at which this round's Baluev 2008 false-alarm probability equals the search's
   * falseAlarmThreshold (same N, weights and highest frequency as the peak's FAP): the threshold line
   */
  thresholdPower: number;
}

export type SearchCandidateStatus = 'accepted' | 'unstable' | 'degenerate';

/** The F-test deciding whether eccentricity and periastron longitude are fitted. */
export interface EccentricityTest {
  /** false when the eccentric fit could not be done (then statistic = 0, probability = 1) */
  attempted: boolean;
  statistic: number;
  probability: number;
  /** true when the eccentric orbit was kept */
  kept: boolean;
}

/** Physical quantities derived from the fitted elements. */
export interface CandidateDerivedQuantities {
  massFunctionSolar: number;
  /** for the assumed pulsar mass (options.pulsarMassSolar) */
  pulsarMassSolar: number;
  minimumCompanionMass: CompanionMass;
  /** Kepler's third law for pulsar mass + minimum companion mass, au */
  separationAu: number;
}

/** A companion the search fitted, accepted or not. */
export interface SearchCandidate {
  round: number;
  name: string;
  status: SearchCandidateStatus;
  /** why a candidate is unstable or degenerate (absent when accepted) */
  reason?: string;
  /** the fitted companion (for a rejected candidate: the fit that was rejected) */
  companion: KeplerianCompanion;
  /** 1σ of each fitted element, keyed by the companion's file field names (period_days, …) */
  uncertainties: Record<string, number>;
  /** FAP of the peak that seeded it */
  falseAlarmProbability: number;
  /** the seeding peak's period, days */
  seedPeriodDays: number;
  chi2Before: number;
  chi2After: number;
  eccentricityTest: EccentricityTest;
  derived: CandidateDerivedQuantities;
  converged: boolean;
}

export type SearchStopReason =
  | 'false-alarm-above-threshold'
  | 'max-companions'
  | 'candidate-rejected'
  | 'no-frequencies';

export interface CompanionSearchSettings {
  minPeriodDays: number;
  maxPeriodDays: number;
  maxCompanions: number;
  falseAlarmThreshold: number;
  eccentricityThreshold: number;
  pulsarMassSolar: number;
  oversampling: number;
  frequencyCount: number;
  spanDays: number;
  /** the periodogram method and the fit's settings (ephemeris, clock, time scale, …) */
  periodogram: string;
  fit: Record<string, string>;
}

export interface CompanionSearchReport {
  /** one per round; the last one is the peak that stopped the search */
  peaks: SearchPeak[];
  periodograms: SearchPeriodogram[];
  /** accepted, unstable and degenerate candidates in round order */
  candidates: SearchCandidate[];
  /** the final model: the start model plus every accepted companion, fitted */
  model: TimingModel;
  finalFit: TimingFitResult;
  stopReason: SearchStopReason;
  warnings: string[];
  settings: CompanionSearchSettings;
}

/** Thrown when options.isCancelled() returns true. */
export class CompanionSearchCancelled extends Error {
  constructor() {
    super('companion search cancelled');
    this.name = 'CompanionSearchCancelled';
  }
}

/** Signature of the entry point (companion-search.ts). */
export type SearchCompanions = (
  model: TimingModel,
  toas: readonly import('../toas/toa').Toa[],
  geometry: import('../pipeline/arrival-geometry').ArrivalGeometry,
  options?: CompanionSearchOptions,
) => CompanionSearchReport;

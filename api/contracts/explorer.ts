/**
 * GET /api/fit-runs/:id/explorer: everything the residual explorer needs to show
 * a fit and to preview edits in the browser without queueing a fit, columnar
 * (one array per quantity, all of length `count`, sorted by MJD then TOA id).
 * Stored by the fit-run job at the end of a fit; runs fitted before the
 * explorer table existed have none (404 `explorer_not_stored`: re-run the fit).
 *
 * Sign conventions (checked against worker/timing/pipeline/timing-residuals.ts):
 * 1. residual = observed − predicted arrival time (positive when the pulse is
 *    late), in µs, with the fit's phase offset applied.
 * 2. Barycentric arrival at infinite frequency t_b = t_TDB + Roemer − Shapiro −
 *    dispersion (delays.roemerS is added, shapiroS and dispersionS subtracted);
 *    the emission time is t_b − backend offset − Σ companion delays.
 * 3. Turning a companion OFF removes its delay D from that subtraction: the
 *    emission time grows by D, so residual_us += D·1e6 (to first order in the
 *    spin phase, exact as long as the pulse number does not change; when
 *    `nearestPulse[i]` the residual re-wraps to the nearest pulse). Turning it
 *    back ON subtracts it again. `delays.companionsS` is the sum over the
 *    companions enabled in the fitted model.
 * 4. partials: ∂residual_s/∂parameter per file unit at the fitted values, so a
 *    first-order preview is residual_s + Σ secondsPerUnit·Δp (Δp in `fileUnit`;
 *    right ascension in seconds of time, declination in arcseconds, epochs in
 *    days). worker/timing/pipeline/companion-toggle-preview.ts does the full
 *    preview (companion, spin, offset and glitch changes exactly from the
 *    barycentric days; astrometry and dispersion first-order from partials).
 */
import type { FitEngineSettings } from './fit-runs';

/** Per-TOA delay chain (seconds), as the `delays` command reports it (docs/formats.md §4). */
export interface ExplorerDelays {
  clockS: number[]; // observatory clock corrections → UTC
  ttMinusUtcS: number[];
  tdbMinusTtS: number[];
  roemerS: number[]; // added
  shapiroS: number[]; // subtracted (solar; Jupiter per settings)
  dispersionS: number[]; // subtracted, at the Doppler-corrected frequency
  backendOffsetS: number[]; // subtracted (with the companions, after t_b)
  companionsS: number[]; // sum of the enabled companions' delays, subtracted
}

/** One column of the design matrix in the unit of the model file key. */
export interface ExplorerPartial {
  parameter: string; // parameter path (docs/formats.md §2, "Parameter paths")
  fileUnit: string; // unit Δp is given in ('s (of time)' for ra_hms, 'arcsec' for dec_dms, 'days' for epochs)
  fitted: boolean; // in the fit's solve_for (otherwise computed for preview only)
  secondsPerUnit: number[]; // ∂residual_s/∂p per TOA (stored as Float32: ~7 significant digits)
}

export interface ExplorerTable {
  fitRunId: number;
  pulsarId: number;
  revisionId: number;
  count: number;
  toaId: number[];
  batchId: number[];
  batchRow: number[]; // 1-based data row in its upload
  mjd: string[]; // exact stored decimal text (UTC or the observatory's scale, as uploaded)
  observatory: string[];
  backend: string[];
  frequencyMhz: (number | null)[]; // null = infinite frequency
  uncertaintyUs: number[]; // effective (noise settings of the fitted model applied)
  /** Fitted model; TOAs excluded at fit time are evaluated, not fitted. null only where `evaluated` is false. */
  residualUs: (number | null)[];
  excluded: boolean[]; // excluded at fit time (left out of the fit)
  /**
   * false for an excluded TOA the engine cannot evaluate (outside the ephemeris, unknown site):
   * its residual is null and its barycentric days, delays and partials are 0.
   */
  evaluated: boolean[];
  nearestPulse: boolean[]; // true: residual taken against the nearest pulse; false: against the file's pulse number
  /** The model epoch (TDB) the barycentric days count from, MJD text. */
  referenceMjd: string;
  /**
   * SSB TDB arrival at infinite frequency, BEFORE backend offsets and companion
   * delays, as days since referenceMjd in double-double: value = hi + lo exactly
   * (hi/lo of worker/timing/orbits/barycentric-days.ts BarycentricDays).
   */
  barycentricDaysHi: number[];
  barycentricDaysLo: number[];
  delays: ExplorerDelays;
  partials: ExplorerPartial[];
  phaseOffsetTurns: number; // the fitted phase offset (applied in residualUs)
  spinFrequencyHz: string; // fitted spin frequency, decimal text
  weightedRmsUs: number | null; // of the fitted (not excluded) TOAs, as the fit reported it
  fittedModel: Record<string, unknown>; // the model file JSON (docs/formats.md §2)
  settings: FitEngineSettings; // which ephemeris, clock and time scale produced these numbers
  engineSettings: Record<string, string>; // as the engine reported them
}

/**
 * Warnings for periodogram peaks that sit near periods the sampling or an unmodelled
 * astrometric term would produce: 1 year, half a year, the sidereal and the solar day,
 * the observing cadence and its harmonics, and the aliases f ± f_w of strong spectral-window
 * peaks f_w (Deeming 1975, Ap&SS 36, 137, §3). Common practice in residual periodograms.
 */

export const JULIAN_YEAR_DAYS = 365.25; // IAU Julian year
export const SIDEREAL_DAY_DAYS = 86_164.0905 / 86_400; // mean sidereal day 23 h 56 min 4.0905 s of mean solar time (from memory)
export const SOLAR_DAY_DAYS = 1;
export const DEFAULT_ALIAS_FRACTIONAL_TOLERANCE = 0.02;
const CADENCE_HARMONICS = 4;

/** What is known about the sampling; every field is optional. */
export interface AliasContext {
  /** typical spacing of observing sessions, days (see `dominantCadenceDays`) */
  cadenceDays?: number;
  /** frequencies of strong spectral-window peaks, cycles per day (f = 0 excluded) */
  windowPeaksPerDay?: number[];
  /** frequencies of stronger peaks already found, cycles per day (Note 3) */
  strongerPeaksPerDay?: number[];
  /** fractional tolerance on frequency, default 0.02 (Note 1) */
  fractionalTolerance?: number;
  /** absolute tolerance on frequency, cycles per day, e.g. the grid resolution (Note 1) */
  resolutionPerDay?: number;
}

/**
 * Alias and systematics warnings for a peak at `periodDays`.
 *
 * @param periodDays  period of the peak, days (> 0)
 * @param context     sampling facts (AliasContext)
 * @returns           warnings, each starting with a stable code and a colon
 *                    (one-year, half-year, sidereal-day, solar-day, cadence, window-peak,
 *                    window-alias); empty when nothing applies
 *
 * Notes:
 * 1. "Near" compares frequencies: |f − f₀| ≤ max(tol·f₀, resolutionPerDay), f = 1/periodDays.
 * 2. Cadence harmonics are f₀ = k/cadenceDays for k = 1…4.
 * 3. A peak at g ± f_w for a stronger peak g and a window peak f_w may be the alias of g
 *    (Deeming 1975, §3). Without stronger peaks only a peak at a window peak itself is flagged.
 * Accuracy: a heuristic screen, not a test; the one-year wording is common practice.
 */
export function aliasFlags(periodDays: number, context: AliasContext): string[] {
  if (!(periodDays > 0) || !Number.isFinite(periodDays)) {
    throw new RangeError(`aliasFlags: periodDays must be positive and finite, got ${periodDays}`);
  }
  const tol = context.fractionalTolerance ?? DEFAULT_ALIAS_FRACTIONAL_TOLERANCE;
  const resolution = context.resolutionPerDay ?? 0;
  const f = 1 / periodDays;
  const near = (f0: number): boolean => Math.abs(f - f0) <= Math.max(tol * Math.abs(f0), resolution);
  const at = `peak at ${formatDays(periodDays)} d`;
  const flags: string[] = [];
  if (near(1 / JULIAN_YEAR_DAYS)) {
    flags.push(`one-year: ${at} is near 1 year (365.25 d): likely a position or proper-motion error — fit astrometry first`);
  }
  if (near(2 / JULIAN_YEAR_DAYS)) {
    flags.push(`half-year: ${at} is near half a year (182.6 d): parallax or an annual harmonic — check the astrometry`);
  }
  if (near(1 / SIDEREAL_DAY_DAYS)) {
    flags.push(`sidereal-day: ${at} is near 1 sidereal day (0.99727 d): likely an alias of the daily observing pattern`);
  }
  if (near(1 / SOLAR_DAY_DAYS)) {
    flags.push(`solar-day: ${at} is near 1 solar day: likely an alias of the daily observing pattern`);
  }
  flags.push(...cadenceFlags(context.cadenceDays, near, at));
  flags.push(...windowFlags(context, near, at));
  return flags;
}

function cadenceFlags(cadenceDays: number | undefined, near: (f0: number) => boolean, at: string): string[] {
  if (cadenceDays === undefined) return [];
  if (!(cadenceDays > 0)) throw new RangeError(`aliasFlags: cadenceDays must be > 0, got ${cadenceDays}`);
  const flags: string[] = [];
  for (let k = 1; k <= CADENCE_HARMONICS; k++) {
    if (near(k / cadenceDays)) {
      const which = k === 1 ? 'the observing cadence' : `harmonic ${k} of the observing cadence`;
      flags.push(`cadence: ${at} is near ${which} (${formatDays(cadenceDays / k)} d): likely a sampling alias`);
    }
  }
  return flags;
}

function windowFlags(context: AliasContext, near: (f0: number) => boolean, at: string): string[] {
  const flags: string[] = [];
  for (const fw of context.windowPeaksPerDay ?? []) {
    if (near(fw)) flags.push(`window-peak: ${at} coincides with a spectral-window peak (${formatDays(1 / fw)} d)`);
    for (const g of context.strongerPeaksPerDay ?? []) {
      for (const alias of [g + fw, g - fw, fw - g]) {
        if (alias > 0 && near(alias)) {
          flags.push(
            `window-alias: ${at} may be an alias of the stronger peak at ${formatDays(1 / g)} d ` +
              `through the window peak at ${formatDays(1 / fw)} d`,
          );
          break;
        }
      }
    }
  }
  return flags;
}

/**
 * Typical spacing of observing sessions: times closer than `minGapDays` to the previous
 * time belong to the same session; the result is the median gap between session starts.
 *
 * @param tDays       sample times, days (any order)
 * @param minGapDays  gaps at or below this are within one session, default 0.5 d
 * @returns           median spacing of session starts, days; NaN when fewer than two sessions
 * Accuracy: exact median (mean of the two middle gaps for an even count).
 */
export function dominantCadenceDays(tDays: Float64Array, minGapDays = 0.5): number {
  const sorted = Float64Array.from(tDays).sort();
  const gaps: number[] = [];
  let sessionStart = sorted[0];
  for (let i = 1; i < sorted.length; i++) {
    if (sorted[i] - sorted[i - 1] > minGapDays) {
      gaps.push(sorted[i] - sessionStart);
      sessionStart = sorted[i];
    }
  }
  if (gaps.length === 0) return Number.NaN;
  gaps.sort((a, b) => a - b);
  const mid = gaps.length >> 1;
  return gaps.length % 2 === 1 ? gaps[mid] : 0.5 * (gaps[mid - 1] + gaps[mid]);
}

function formatDays(days: number): string {
  return days >= 100 ? days.toFixed(1) : days.toPrecision(5);
}

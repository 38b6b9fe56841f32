import { fitSinusoidAtFrequency, refinePeakFrequency } from './sinusoid-fit';
import { addDaysToMjdText } from './mjd-text';

const MICROSECONDS_PER_SECOND = 1e6;

/** A companion of the model file (docs/formats.md §2) seeded from a periodogram peak: circular Keplerian orbit. */
export interface SeededCompanion {
  name: string;
  kind: 'keplerian';
  enabled: true;
  period_days: string;
  projected_semimajor_axis_lt_s: string;
  eccentricity: 0;
  periastron_longitude_deg: 0;
  periastron_epoch_mjd: string;
}

/** The seed and how well the residuals fix it. */
export interface CompanionSeed {
  companion: SeededCompanion;
  /** fitted semi-amplitude of the residual sinusoid, µs, and its 1σ */
  amplitudeUs: number;
  amplitudeUncertaintyUs: number;
}

/**
 * A circular Keplerian companion whose delay matches the sinusoid in the residuals at `freqPerDay`.
 *
 * @param tDays         sample times, days since `referenceMjd` (TDB at the barycentre)
 * @param residualUs    residuals, µs (observed − model, so a missing companion shows as +delay, Note 1)
 * @param uncertaintyUs residual 1σ, µs
 * @param freqPerDay    frequency of the chosen peak, cycles per day
 * @param gridStepPerDay the periodogram's grid step; the frequency is refined within ± one step (Note 2)
 * @param referenceMjd  MJD text of tDays' origin
 * @param name          the new companion's name
 * @returns             the companion (period, projected semi-major axis, e = 0, ω = 0, epoch) and the amplitude
 *
 * Notes: 1. For e = 0 and ω = 0 the orbital (Roemer) delay is x·sin(2π(t − T₀)/P_b)
 *    (Blandford & Teukolsky 1976, ApJ 205, 580, their orbit delay with e = 0); the engine subtracts it
 *    from the arrival time, so residuals without the companion carry +delay. Hence x = A (µs → lt-s)
 *    and T₀ = the upward zero crossing of the fitted sinusoid nearest the middle of the data, where
 *    the phase is best known (a small period error would shift a T₀ far from the data).
 *    The fitted sinusoid amplitude is the seed; a fit refines it (the timing model's other terms
 *    may have absorbed part of the signal).
 * 2. The grid samples a peak every 1/(5·span); the best-fitting frequency within one step
 *    (golden-section search on the sinusoid fit's χ²) is the seeded period.
 * References: Blandford & Teukolsky 1976, ApJ 205, 580.
 */
export function seedCompanionFromPeak(
  tDays: Float64Array,
  residualUs: Float64Array,
  uncertaintyUs: Float64Array,
  freqPerDay: number,
  gridStepPerDay: number,
  referenceMjd: string,
  name: string,
): CompanionSeed {
  return companionFromSinusoid(peakSinusoid(tDays, residualUs, uncertaintyUs, freqPerDay, gridStepPerDay), referenceMjd, name);
}

/** The sinusoid behind a periodogram peak: frequency refined within ± one grid step (Note 2 above), then fitted. */
export interface PeakSinusoid {
  freqPerDay: number;
  amplitudeUs: number;
  amplitudeUncertaintyUs: number;
  /** upward zero crossing, days since the origin of tDays, near the middle of the data */
  zeroPhaseDays: number;
}

/** The refined, fitted sinusoid of a peak (the costly part of the seed: ~30 fits of N samples). */
export function peakSinusoid(
  tDays: Float64Array,
  residualUs: Float64Array,
  uncertaintyUs: Float64Array,
  freqPerDay: number,
  gridStepPerDay: number,
): PeakSinusoid {
  const refinedPerDay = refinePeakFrequency(tDays, residualUs, uncertaintyUs, freqPerDay, gridStepPerDay);
  const fit = fitSinusoidAtFrequency(tDays, residualUs, uncertaintyUs, refinedPerDay);
  return { freqPerDay: refinedPerDay, amplitudeUs: fit.amplitude, amplitudeUncertaintyUs: fit.amplitudeUncertainty, zeroPhaseDays: fit.zeroPhaseDays };
}

/** The circular companion of a fitted peak sinusoid (see seedCompanionFromPeak, Note 1). */
export function companionFromSinusoid(sinusoid: PeakSinusoid, referenceMjd: string, name: string): CompanionSeed {
  const periodDays = 1 / sinusoid.freqPerDay;
  const xLtS = sinusoid.amplitudeUs / MICROSECONDS_PER_SECOND; // delay = x·sin(2π(t − T₀)/P_b) for e = 0: Blandford & Teukolsky 1976
  return {
    companion: {
      name,
      kind: 'keplerian',
      enabled: true,
      period_days: periodDays.toPrecision(9),
      projected_semimajor_axis_lt_s: xLtS.toPrecision(4),
      eccentricity: 0,
      periastron_longitude_deg: 0,
      periastron_epoch_mjd: addDaysToMjdText(referenceMjd, sinusoid.zeroPhaseDays, 6),
    },
    amplitudeUs: sinusoid.amplitudeUs,
    amplitudeUncertaintyUs: sinusoid.amplitudeUncertaintyUs,
  };
}

/** The first free one-letter companion name from "b" on ("b", "c", …), or "companion-N" past "z". */
export function freeCompanionName(taken: readonly string[]): string {
  for (let code = 'b'.charCodeAt(0); code <= 'z'.charCodeAt(0); code++) {
    const name = String.fromCharCode(code);
    if (!taken.includes(name)) return name;
  }
  let k = 1;
  while (taken.includes(`companion-${k}`)) k++;
  return `companion-${k}`;
}

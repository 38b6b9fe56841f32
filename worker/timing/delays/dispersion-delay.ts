/**
 * Cold-plasma dispersion delay, with the frequency Doppler-corrected to the
 * solar-system barycentre.
 */
import { DM_DELAY_CONSTANT_S_MHZ2 } from './physical-constants';

/**
 * Dispersion delay in seconds relative to infinite frequency.
 *
 * @param dmPcPerCm3         dispersion measure at this time, pc cm⁻³
 * @param barycentricFreqMhz frequency in the barycentric frame, MHz; Infinity → 0 (Note 1)
 * @returns                  seconds, DM·4.148808 × 10³ / f² (subtracted from arrival times)
 *
 * Notes: 1. Infinite frequency means "no dispersion"; f ≤ 0 or NaN returns NaN (callers validate).
 * References: Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, eq. 4.7.
 */
export function dispersionDelayS(dmPcPerCm3: number, barycentricFreqMhz: number): number {
  if (barycentricFreqMhz === Infinity) return 0;
  if (!(barycentricFreqMhz > 0)) return NaN;
  return (DM_DELAY_CONSTANT_S_MHZ2 * dmPcPerCm3) / (barycentricFreqMhz * barycentricFreqMhz); // L&K 2005 eq. 4.7
}

/**
 * Observing frequency referred to the barycentre: f_bary = f_obs · (1 − v·n̂/c).
 *
 * @param observedFreqMhz  frequency at the observatory, MHz (Infinity passes through)
 * @param vDotNOverC       observatory barycentric velocity along n̂, in units of c
 * Notes: first order in v/c (|v|/c ≤ 1e-4, so the dropped term is ≤ 1e-8 relative). An observatory
 *        moving toward the pulsar sees a blue-shifted frequency, hence the minus sign.
 * References: Edwards, Hobbs & Manchester 2006, MNRAS 372, 1549 (Doppler-corrected frequency).
 */
export function barycentricFrequencyMhz(observedFreqMhz: number, vDotNOverC: number): number {
  return observedFreqMhz * (1 - vDotNOverC); // first-order Doppler shift
}

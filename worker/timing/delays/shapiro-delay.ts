/**
 * Shapiro delay of a solar-system body on the line of sight to the pulsar.
 */
import { AU_LIGHT_SECONDS } from './physical-constants';

/**
 * Gravitational (Shapiro) delay of a body of mass `massSeconds` (GM/c³).
 *
 * @param rxLs,ryLs,rzLs  observatory position relative to the body, light-seconds
 * @param nx,ny,nz        unit vector toward the pulsar
 * @param massSeconds     GM/c³ of the body, seconds (SUN_MASS_SECONDS, JUPITER_MASS_SECONDS)
 * @returns               seconds, the delay −2·GM/c³·ln((|r| + r·n̂)/1 au); subtracted from arrival times
 *
 * Notes: 1. The 1 au scale only adds a constant (absorbed by the phase offset); it follows the
 *           product's published form (docs/formats.md §4).
 *        2. Positive and largest (~112 µs at the solar limb) when the pulsar is behind the body.
 *        3. Undefined when the pulsar lies exactly behind the body's centre (|r| + r·n̂ = 0):
 *           returns +Infinity there.
 * Accuracy: first post-Newtonian order; bending and higher orders are ≪ 1 ns except within a few
 *           solar radii of the limb.
 * References: Shapiro 1964, PRL 13, 789; Edwards, Hobbs & Manchester 2006, MNRAS 372, 1549.
 */
export function shapiroDelayS(
  rxLs: number,
  ryLs: number,
  rzLs: number,
  nx: number,
  ny: number,
  nz: number,
  massSeconds: number,
): number {
  const distanceLs = Math.sqrt(rxLs * rxLs + ryLs * ryLs + rzLs * rzLs);
  const along = rxLs * nx + ryLs * ny + rzLs * nz;
  return -2 * massSeconds * Math.log((distanceLs + along) / AU_LIGHT_SECONDS); // Shapiro 1964, PRL 13, 789
}

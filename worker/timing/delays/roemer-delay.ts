/**
 * Solar-system Roemer delay: the light-travel time between the observatory
 * and the solar-system barycentre along the line of sight, with the
 * wavefront-curvature (parallax) term.
 */
import { AU_LIGHT_SECONDS, RAD_PER_MAS } from './physical-constants';

/**
 * Roemer delay in seconds (barycentric arrival = observatory arrival + this).
 *
 * @param rxLs,ryLs,rzLs  observatory position relative to the barycentre, light-seconds, ICRF
 * @param nx,ny,nz        unit vector toward the pulsar
 * @param parallaxMas     annual parallax, mas (0: plane wavefront)
 * @returns               seconds; positive when the observatory is on the pulsar's side (Note 1)
 *
 * Notes: 1. With the pulsar at distance d along n̂, the path from pulsar to observatory is
 *           |d n̂ − r| ≈ d − r·n̂ + (|r|² − (r·n̂)²)/(2d), so the barycentric arrival is later by
 *           r·n̂ − (|r|² − (r·n̂)²)/(2d); d = 1 au / parallax (in light-seconds).
 *        2. Terms of order |r|³/d² (≪ 1 ps for any pulsar) are dropped.
 * Accuracy: exact to Note 2 given r and n̂.
 * References: Edwards, Hobbs & Manchester 2006, MNRAS 372, 1549, §2 (Roemer delay with the
 *             wavefront-curvature term); Lorimer & Kramer 2005, Handbook of Pulsar Astronomy, ch. 8.
 */
export function roemerDelayS(
  rxLs: number,
  ryLs: number,
  rzLs: number,
  nx: number,
  ny: number,
  nz: number,
  parallaxMas: number,
): number {
  const along = rxLs * nx + ryLs * ny + rzLs * nz;
  if (parallaxMas === 0) return along;
  return along - curvatureTermPerMas(rxLs, ryLs, rzLs, along) * parallaxMas; // Note 1
}

/**
 * The wavefront-curvature term per mas of parallax: (|r|² − (r·n̂)²)·ϖ/(2 au), seconds per mas
 * (Edwards, Hobbs & Manchester 2006, MNRAS 372, 1549). Subtracted from r·n̂; also ∂(Roemer)/∂ϖ with a minus sign.
 */
export function curvatureTermPerMas(rxLs: number, ryLs: number, rzLs: number, alongLs: number): number {
  const perpendicularSquared = rxLs * rxLs + ryLs * ryLs + rzLs * rzLs - alongLs * alongLs;
  return (perpendicularSquared * RAD_PER_MAS) / (2 * AU_LIGHT_SECONDS); // d = 1 au/ϖ: Edwards, Hobbs & Manchester 2006, MNRAS 372, 1549
}

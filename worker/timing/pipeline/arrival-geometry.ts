/**
 * What the engine knows about each arrival before any pulsar-specific model is
 * applied: the arrival instant in TDB at the observatory, the time-scale
 * corrections that produced it, and where the observatory was relative to the
 * solar-system barycentre and the Sun. Computed once per TOA set and reused by
 * every fit iteration (the pulsar's position only enters through n̂ later).
 *
 * Axes: ICRF (the ephemeris' axes). Lengths in light-seconds, velocities as v/c.
 */
import type { Mjd } from '../time/epoch';

export interface EphemerisInfo {
  name: string; // 'DE405'
  firstMjdTdb: number;
  lastMjdTdb: number;
  source: string; // where it was read from
}

export interface ArrivalGeometry {
  count: number;
  /** Arrival at the observatory in TDB (the observed time after clock and time-scale corrections). */
  tdb: Mjd[];
  clockS: Float64Array; // observatory clock correction (added to reach UTC)
  ttMinusUtcS: Float64Array; // TAI−UTC + 32.184 s
  tdbMinusTtS: Float64Array; // full TDB−TT including topocentric terms
  observatoryPositionLs: Float64Array; // 3·count, barycentric position of the observatory, x,y,z per TOA
  observatoryVelocityC: Float64Array; // 3·count, barycentric velocity / c
  sunToObservatoryLs: Float64Array; // 3·count, observatory position relative to the Sun
  jupiterToObservatoryLs: Float64Array; // 3·count, observatory position relative to Jupiter
  ephemeris: EphemerisInfo;
  /** Soft problems (stale leap-second table, assumed UT1 = UTC, ...), as plain sentences. */
  warnings: string[];
  /** The choices that produced this geometry, for reporting beside every result. */
  settings: Record<string, string>;
}

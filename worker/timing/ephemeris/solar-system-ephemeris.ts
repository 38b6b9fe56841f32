/**
 * What the engine asks of a solar-system ephemeris: barycentric states of the
 * major bodies at an instant in TDB. Implemented by worker/timing/ephemeris/de405-ephemeris.ts.
 */
import type { Mjd } from '../time/epoch';
import type { EphemerisInfo } from '../pipeline/arrival-geometry';

export type SolarSystemBody =
  | 'sun'
  | 'earth'
  | 'moon'
  | 'earth-moon-barycentre'
  | 'mercury'
  | 'venus'
  | 'mars'
  | 'jupiter'
  | 'saturn'
  | 'uranus'
  | 'neptune';

export interface BodyState {
  /** Position relative to the solar-system barycentre, km, ICRF axes. */
  positionKm: [number, number, number];
  /** Velocity relative to the solar-system barycentre, km per second of TDB. */
  velocityKmPerS: [number, number, number];
}

export interface SolarSystemEphemeris {
  info: EphemerisInfo;
  /** Constants of the ephemeris (e.g. AU in km, EMRAT, CLIGHT in km/s), as the source lists them. */
  constants: Readonly<Record<string, number>>;
  /** Barycentric state of `body` at `tdb`; throws RangeError outside [info.firstMjdTdb, info.lastMjdTdb). */
  state(body: SolarSystemBody, tdb: Mjd): BodyState;
  /** The same state written to out[0..2] (position, km) and out[3..5] (velocity, km/s), without allocating. */
  stateInto(body: SolarSystemBody, tdb: Mjd, out: Float64Array): void;
}

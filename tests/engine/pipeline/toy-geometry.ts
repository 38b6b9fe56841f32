/**
 * A synthetic arrival geometry for pipeline tests that must not depend on the
 * ephemeris or time-scale code: the observatory moves on a circular 1-au
 * orbit in a plane tilted by 23.44° (a stand-in for the ecliptic), the Sun
 * sits at the barycentre and the observatory clock already reads TDB.
 */
import type { ArrivalGeometry } from '../../../worker/timing/pipeline/arrival-geometry';
import type { Toa } from '../../../worker/timing/toas/toa';
import { AU_LIGHT_SECONDS } from '../../../worker/timing/delays/physical-constants';

const TILT_RAD = (23.44 * Math.PI) / 180;
const YEAR_DAYS = 365.25;

export function toyGeometry(toas: readonly Pick<Toa, 'mjd'>[]): ArrivalGeometry {
  const n = toas.length;
  const position = new Float64Array(3 * n);
  const velocity = new Float64Array(3 * n);
  const jupiter = new Float64Array(3 * n);
  const speedC = (2 * Math.PI * AU_LIGHT_SECONDS) / (YEAR_DAYS * 86_400);
  toas.forEach((toa, i) => {
    const days = toa.mjd.day - 51_544 + toa.mjd.frac[1];
    const theta = (2 * Math.PI * days) / YEAR_DAYS;
    const [c, s] = [Math.cos(theta), Math.sin(theta)];
    position.set([AU_LIGHT_SECONDS * c, AU_LIGHT_SECONDS * s * Math.cos(TILT_RAD), AU_LIGHT_SECONDS * s * Math.sin(TILT_RAD)], 3 * i);
    velocity.set([-speedC * s, speedC * c * Math.cos(TILT_RAD), speedC * c * Math.sin(TILT_RAD)], 3 * i);
    jupiter.set([position[3 * i] - 5.2 * AU_LIGHT_SECONDS, position[3 * i + 1], position[3 * i + 2]], 3 * i);
  });
  return {
    count: n,
    tdb: toas.map((t) => t.mjd),
    clockS: new Float64Array(n),
    ttMinusUtcS: new Float64Array(n),
    tdbMinusTtS: new Float64Array(n),
    observatoryPositionLs: position,
    observatoryVelocityC: velocity,
    sunToObservatoryLs: Float64Array.from(position),
    jupiterToObservatoryLs: jupiter,
    ephemeris: { name: 'toy circular orbit', firstMjdTdb: 0, lastMjdTdb: 100_000, source: 'tests/engine/pipeline/toy-geometry.ts' },
    warnings: [],
    settings: { geometry: 'toy' },
  };
}

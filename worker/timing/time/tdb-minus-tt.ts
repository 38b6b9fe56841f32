/**
 * TDB − TT at an observatory: ERFA's eraDtdb (Fairhead & Bretagnon 1990
 * geocentric series plus the Moyer 1981 / Murray 1983 topocentric terms), and a
 * fast equivalent for many arrival times.
 *
 * The fast path (Note 1) splits eraDtdb exactly as its own header describes
 * (ERFA dtdb.c, Note 6: "by supplying zeroes for u and v, the topocentric part
 * of the model can be nullified"):
 *   - geocentric part: eraDtdb(t, ut = 0, 0, 0, 0) at nodes one day apart,
 *     interpolated with 6-point Lagrange polynomials (the series' shortest
 *     periods are ~2 weeks; measured interpolation error ~4e-12 s, test in
 *     tests/engine/time/tdb-minus-tt.test.ts);
 *   - topocentric part: the ten closed-form terms of eraDtdb, evaluated here per
 *     instant (they depend on the observatory's local solar time and vary daily).
 * eraDtdb costs ~14 µs per call (STACK.md §9); the fast path ~0.5 µs.
 */
import { erfaLibrary } from '../erfa/erfa-library';
import type { Mjd } from './epoch';
import { UniformGridInterpolator } from './uniform-grid-interpolator';

/** The observatory terms eraDtdb needs (see worker/timing/earth/dtdb-site-from-itrf.ts). */
export interface DtdbSite {
  /** East longitude, radians. */
  elongRad: number;
  /** Distance from the Earth's spin axis, km. */
  uKm: number;
  /** Distance north of the equatorial plane, km. */
  vKm: number;
}

const MJD_ZERO_AS_JD = 2400000.5;
const J2000_MJD = 51544.5;
const DAYS_PER_JULIAN_MILLENNIUM = 365_250;
const DEGREES_TO_RADIANS = Math.PI / 180;
const GRID_STEP_DAYS = 1;
const GRID_POINTS = 6;

/**
 * TDB − TT from ERFA directly (one eraDtdb call, ~14 µs).
 *
 * @param tt               the instant in TT (eraDtdb's TDB argument; TT is allowed, ERFA dtdb Note 1)
 * @param ut1FractionOfDay UT1 as a fraction of its day (UTC when no Earth-orientation table is given)
 * @param site             observatory terms; zeros give the geocentric value
 * @returns                TDB − TT in seconds
 * Accuracy: ±3 ns versus numerically integrated DE405 time ephemerides, 1950–2050 (ERFA dtdb Note 7).
 * References: Fairhead & Bretagnon 1990, A&A 229, 240; Moyer 1981, Cel. Mech. 23, 33.
 */
export function tdbMinusTtSeconds(tt: Mjd, ut1FractionOfDay: number, site: DtdbSite): number {
  return erfaLibrary().eraDtdb(MJD_ZERO_AS_JD, tt.day + (tt.frac[1] + tt.frac[0]), ut1FractionOfDay, site.elongRad, site.uKm, site.vKm);
}

/**
 * The topocentric part of eraDtdb, evaluated in JavaScript with the same ten
 * terms and fundamental arguments (ERFA dtdb.c "Topocentric terms").
 *
 * @param tt               instant in TT
 * @param ut1FractionOfDay UT1 fraction of day
 * @param site             observatory terms
 * @returns                seconds; ≈ 3.2e-10·u·sin(local solar time) (≤ 2.1 µs)
 * References: Moyer 1981, Cel. Mech. 23, 33; Murray 1983, Vectorial Astrometry;
 *   fundamental arguments Simon et al. 1994, A&A 282, 663.
 */
export function topocentricTdbMinusTtSeconds(tt: Mjd, ut1FractionOfDay: number, site: DtdbSite): number {
  const t = (tt.day - J2000_MJD + (tt.frac[1] + tt.frac[0])) / DAYS_PER_JULIAN_MILLENNIUM; // Julian millennia since J2000 (ERFA dtdb)
  const tsol = (ut1FractionOfDay % 1) * 2 * Math.PI + site.elongRad; // local solar time, radians (ERFA dtdb)
  const w = t / 3600;
  // Fundamental arguments, Simon et al. 1994 (as used by ERFA dtdb), degrees → radians.
  const elsun = ((280.46645683 + 1296027711.03429 * w) % 360) * DEGREES_TO_RADIANS; // Sun mean longitude
  const emsun = ((357.52910918 + 1295965810.481 * w) % 360) * DEGREES_TO_RADIANS; // Sun mean anomaly
  const d = ((297.85019547 + 16029616012.09 * w) % 360) * DEGREES_TO_RADIANS; // Moon mean elongation from the Sun
  const elj = ((34.35151874 + 109306899.89453 * w) % 360) * DEGREES_TO_RADIANS; // Jupiter mean longitude
  const els = ((50.0774443 + 44046398.47038 * w) % 360) * DEGREES_TO_RADIANS; // Saturn mean longitude
  const u = site.uKm;
  const v = site.vKm;
  // Topocentric terms: Moyer 1981 and Murray 1983 (ERFA dtdb, same order and coefficients).
  return (
    0.00029e-10 * u * Math.sin(tsol + elsun - els) +
    0.001e-10 * u * Math.sin(tsol - 2 * emsun) +
    0.00133e-10 * u * Math.sin(tsol - d) +
    0.00133e-10 * u * Math.sin(tsol + elsun - elj) -
    0.00229e-10 * u * Math.sin(tsol + 2 * elsun + emsun) -
    0.022e-10 * v * Math.cos(elsun + emsun) +
    0.05312e-10 * u * Math.sin(tsol - emsun) -
    0.13677e-10 * u * Math.sin(tsol + 2 * elsun) -
    1.3184e-10 * v * Math.cos(elsun) +
    3.17679e-10 * u * Math.sin(tsol)
  );
}

/**
 * A fast evaluator of TDB − TT (module Note): geocentric part from a lazily
 * filled one-day grid shared by the whole process, topocentric part in closed form.
 *
 * Accuracy: ≤ 1e-11 s from direct eraDtdb (measured; tests/engine/time/tdb-minus-tt.test.ts).
 */
// One grid per process: a node's value depends only on its date, so every evaluator shares it.
let sharedGeocentricGrid: UniformGridInterpolator | undefined;
function geocentricGridOfProcess(): UniformGridInterpolator {
  sharedGeocentricGrid ??= new UniformGridInterpolator(GRID_STEP_DAYS, GRID_POINTS, 1, (nodeMjd, out) => {
    out[0] = erfaLibrary().eraDtdb(MJD_ZERO_AS_JD, nodeMjd, 0, 0, 0, 0);
  });
  return sharedGeocentricGrid;
}

export class TdbMinusTtEvaluator {
  private readonly grid = geocentricGridOfProcess();
  private readonly value = new Float64Array(1);

  /** Geocentric TDB − TT (seconds) at `tt`. */
  geocentricSeconds(tt: Mjd): number {
    this.grid.evaluate(tt, this.value);
    return this.value[0];
  }

  /** Full TDB − TT (seconds) at `tt` for an observatory. */
  seconds(tt: Mjd, ut1FractionOfDay: number, site: DtdbSite): number {
    return this.geocentricSeconds(tt) + topocentricTdbMinusTtSeconds(tt, ut1FractionOfDay, site);
  }

  /** Number of eraDtdb calls made so far in this process (the grid is shared). */
  get erfaCallCount(): number {
    return this.grid.evaluatedNodeCount;
  }
}

/**
 * The arrival geometry of a TOA set (worker/timing/pipeline/arrival-geometry.ts):
 * each arrival's TDB at the observatory and the observatory's barycentric
 * position and velocity, with the Sun and Jupiter for the Shapiro delays.
 *
 * Chain per arrival at a registered observatory (Notes refer to this header):
 *   observatory clock → UTC        clock correction (FORMATS.md §3)
 *   UTC → TAI                       + TAI−UTC from ERFA eraDat (IERS Bulletin C leap seconds)
 *   TAI → TT                        + 32.184 s (IAU 1991 Resolution A4)
 *   TT → TDB                        + TDB−TT, ERFA dtdb with topocentric terms (Fairhead & Bretagnon 1990)
 *   r_obs = r_Earth(TDB) + r_GCRS   DE405 Earth + ITRF site rotated with IAU 2006/2000A (Note 2)
 *   v_obs = v_Earth(TDB) + v_GCRS
 * `tdb` = mjd + (clock + (TT−UTC) + (TDB−TT)) / 86 400, summed in double-double,
 * the same sum FORMATS.md §4 prints.
 *
 * Notes:
 * 1. Reserved codes: `ssb` — the stamp is TDB at the barycentre already: zero
 *    position and velocity, no corrections. `geocenter` — the stamp is TT at the
 *    geocentre: only the geocentric TDB−TT; the position is the Earth's.
 * 2. The GCRS site vector is added to the barycentric Earth on ICRF axes; the
 *    GCRS and BCRS axes differ only by relativistic terms of order v²/c² ≈ 1e-8
 *    (≲ 6 cm on the 6400 km site vector, 0.2 ns of light time), neglected.
 *    Likewise the site velocity is in GCRS metres per TT second.
 * 3. Without an Earth-orientation table UT1 = UTC and xp = yp = 0, reported in
 *    `warnings` and `settings` (up to ~420 m of site error, ~1.4 µs of light time).
 * 4. The slow parts use grids (geocentric TDB−TT: 1 day, 6-point Lagrange,
 *    ~4e-12 s; precession–nutation: 1 day, 8-point, ≤ 0.14 mm); see
 *    worker/timing/time/tdb-minus-tt.ts and worker/timing/earth/observatory-gcrs.ts.
 * Throws TimingInputError naming the rows for unknown observatory codes and for
 * TOAs outside the ephemeris (or before UTC, 1960).
 */
import { TimingInputError, type EngineErrorDetail } from '../engine-error';
import { dtdbSiteFromItrf } from '../earth/dtdb-site-from-itrf';
import { earthOrientationAt, type EarthOrientation } from '../earth/earth-orientation';
import { ObservatoryGcrsEvaluator, type PolarMotion } from '../earth/observatory-gcrs';
import type { Observatory } from '../earth/observatory';
import { loadDe405 } from '../ephemeris/de405-ephemeris';
import type { SolarSystemEphemeris } from '../ephemeris/solar-system-ephemeris';
import { clockCorrection } from '../time/clock-correction';
import { ddAddNumber, ddFromSum } from '../time/double-double-typed';
import type { Mjd } from '../time/epoch';
import { mjdAddSeconds, mjdToApproxNumber } from '../time/mjd-arithmetic';
import { taiMinusUtc } from '../time/tai-minus-utc';
import { TdbMinusTtEvaluator, type DtdbSite } from '../time/tdb-minus-tt';
import { TT_MINUS_TAI_SECONDS } from '../time/tt-from-tai';
import type { ArrivalGeometry } from './arrival-geometry';
import { describeRows } from './geometry-row-list';

const SPEED_OF_LIGHT_KM_PER_S = 299_792.458; // exact by definition of the metre (CGPM 1983)
const METRES_PER_KM = 1000;

export interface ArrivalGeometryInput {
  row: number;
  mjd: Mjd;
  observatory: string;
}

export interface ArrivalGeometryOptions {
  ephemeris?: SolarSystemEphemeris;
  earthOrientation?: EarthOrientation;
}

interface SiteInfo {
  observatory: Observatory;
  itrfM: [number, number, number];
  dtdbSite: DtdbSite;
}

/**
 * Computes the arrival geometry of a TOA set (header notes 1–4).
 *
 * @param toas           rows with their time stamp and observatory code
 * @param observatories  registered observatories by code (`ssb`, `geocenter` need no entry)
 * @param options        ephemeris (default DE405 from Debian's casacore table) and an
 *                       optional Earth-orientation table (Note 3)
 * @returns              ArrivalGeometry in the TOAs' order
 */
export function computeArrivalGeometry(
  toas: ReadonlyArray<ArrivalGeometryInput>,
  observatories: ReadonlyMap<string, Observatory>,
  options: ArrivalGeometryOptions = {},
): ArrivalGeometry {
  const ephemeris = options.ephemeris ?? loadDe405();
  const sites = resolveSites(toas, observatories);
  const count = toas.length;
  const clockS = new Float64Array(count);
  const ttMinusUtcS = new Float64Array(count);
  const tdbMinusTtS = new Float64Array(count);
  const observatoryPositionLs = new Float64Array(3 * count);
  const observatoryVelocityC = new Float64Array(3 * count);
  const sunToObservatoryLs = new Float64Array(3 * count);
  const jupiterToObservatoryLs = new Float64Array(3 * count);
  const tdb: Mjd[] = new Array(count);
  const tt: Mjd[] = new Array(count);
  const ut1: Mjd[] = new Array(count);
  const polar: Array<PolarMotion | undefined> = new Array(count);
  const tdbEvaluator = new TdbMinusTtEvaluator();
  const gcrs = new ObservatoryGcrsEvaluator();
  const notes = new GeometryNotes();
  const badRows: EngineErrorDetail[] = [];

  for (let i = 0; i < count; i++) {
    const toa = toas[i];
    const code = toa.observatory;
    if (code === 'ssb') {
      tdb[i] = toa.mjd;
      continue;
    }
    try {
      if (code === 'geocenter') {
        tt[i] = toa.mjd;
        tdbMinusTtS[i] = tdbEvaluator.geocentricSeconds(toa.mjd);
      } else {
        const site = sites.get(code)!;
        const clock = clockCorrection(site.observatory.clockCorrections, toa.mjd);
        if (clock.outsideTable) notes.clockOutside(code, toa.row);
        clockS[i] = clock.seconds;
        const utc = mjdAddSeconds(toa.mjd, clock.seconds);
        const leap = taiMinusUtc(utc);
        if (leap.dubiousYear) notes.dubiousYear.push(toa.row);
        if (leap.leapSecondAtEndOfDay) notes.leapSecondDay.push(toa.row);
        ttMinusUtcS[i] = leap.seconds + TT_MINUS_TAI_SECONDS; // TAI−UTC + 32.184 s (IAU 1991 Resolution A4)
        tt[i] = mjdAddSeconds(utc, ttMinusUtcS[i]);
        ut1[i] = utc; // UT1 = UTC unless a table is given (Note 3)
        if (options.earthOrientation !== undefined) {
          const eo = earthOrientationAt(options.earthOrientation, utc);
          if (eo.outsideTable) notes.earthOrientationOutside.push(toa.row);
          ut1[i] = mjdAddSeconds(utc, eo.ut1MinusUtcS);
          polar[i] = { xpRad: eo.xpRad, ypRad: eo.ypRad };
        }
        const ut1Fraction = ut1[i].frac[1] + ut1[i].frac[0];
        tdbMinusTtS[i] = tdbEvaluator.seconds(tt[i], ut1Fraction, site.dtdbSite);
      }
    } catch (error) {
      if (!(error instanceof RangeError)) throw error;
      badRows.push({ row: toa.row, message: `row ${toa.row}: ${error.message}` });
      continue;
    }
    // tdb = mjd + (clock + (TT−UTC) + (TDB−TT)) / 86400, the corrections summed in double-double
    const correctionS = ddAddNumber(ddFromSum(clockS[i], ttMinusUtcS[i]), tdbMinusTtS[i]);
    tdb[i] = mjdAddSeconds(toa.mjd, correctionS);
    const approx = mjdToApproxNumber(tdb[i]);
    if (!(approx >= ephemeris.info.firstMjdTdb && approx < ephemeris.info.lastMjdTdb)) {
      badRows.push({
        row: toa.row,
        message: `row ${toa.row}: TDB MJD ${approx.toFixed(6)} is outside the ephemeris ${ephemeris.info.name} (MJD ${ephemeris.info.firstMjdTdb}–${ephemeris.info.lastMjdTdb})`,
      });
    }
  }
  for (let i = 0; i < count; i++) {
    if (toas[i].observatory !== 'ssb') continue;
    const approx = mjdToApproxNumber(toas[i].mjd);
    if (!(approx >= ephemeris.info.firstMjdTdb && approx < ephemeris.info.lastMjdTdb)) {
      badRows.push({ row: toas[i].row, message: `row ${toas[i].row}: TDB MJD ${approx.toFixed(6)} is outside the ephemeris ${ephemeris.info.name} (MJD ${ephemeris.info.firstMjdTdb}–${ephemeris.info.lastMjdTdb})` });
    }
  }
  if (badRows.length > 0) {
    badRows.sort((a, b) => (a.row ?? 0) - (b.row ?? 0));
    throw new TimingInputError(
      `TOAs outside the ephemeris ${ephemeris.info.name} range MJD ${ephemeris.info.firstMjdTdb}–${ephemeris.info.lastMjdTdb} (TDB) or before UTC: ${describeRows(badRows.map((d) => d.row!))}`,
      badRows,
    );
  }

  const earth = new Float64Array(6);
  const siteState = new Float64Array(6);
  const sun = new Float64Array(6);
  const jupiter = new Float64Array(6);
  for (let i = 0; i < count; i++) {
    const code = toas[i].observatory;
    let px = 0;
    let py = 0;
    let pz = 0;
    let vx = 0;
    let vy = 0;
    let vz = 0;
    if (code !== 'ssb') {
      ephemeris.stateInto('earth', tdb[i], earth);
      px = earth[0];
      py = earth[1];
      pz = earth[2];
      vx = earth[3];
      vy = earth[4];
      vz = earth[5];
      if (code !== 'geocenter') {
        gcrs.stateInto(sites.get(code)!.itrfM, tt[i], ut1[i], polar[i], siteState); // Note 2: GCRS ≈ BCRS axes
        px += siteState[0] / METRES_PER_KM;
        py += siteState[1] / METRES_PER_KM;
        pz += siteState[2] / METRES_PER_KM;
        vx += siteState[3] / METRES_PER_KM;
        vy += siteState[4] / METRES_PER_KM;
        vz += siteState[5] / METRES_PER_KM;
      }
    }
    ephemeris.stateInto('sun', tdb[i], sun);
    ephemeris.stateInto('jupiter', tdb[i], jupiter);
    const k = 3 * i;
    observatoryPositionLs[k] = px / SPEED_OF_LIGHT_KM_PER_S;
    observatoryPositionLs[k + 1] = py / SPEED_OF_LIGHT_KM_PER_S;
    observatoryPositionLs[k + 2] = pz / SPEED_OF_LIGHT_KM_PER_S;
    observatoryVelocityC[k] = vx / SPEED_OF_LIGHT_KM_PER_S;
    observatoryVelocityC[k + 1] = vy / SPEED_OF_LIGHT_KM_PER_S;
    observatoryVelocityC[k + 2] = vz / SPEED_OF_LIGHT_KM_PER_S;
    sunToObservatoryLs[k] = (px - sun[0]) / SPEED_OF_LIGHT_KM_PER_S;
    sunToObservatoryLs[k + 1] = (py - sun[1]) / SPEED_OF_LIGHT_KM_PER_S;
    sunToObservatoryLs[k + 2] = (pz - sun[2]) / SPEED_OF_LIGHT_KM_PER_S;
    jupiterToObservatoryLs[k] = (px - jupiter[0]) / SPEED_OF_LIGHT_KM_PER_S;
    jupiterToObservatoryLs[k + 1] = (py - jupiter[1]) / SPEED_OF_LIGHT_KM_PER_S;
    jupiterToObservatoryLs[k + 2] = (pz - jupiter[2]) / SPEED_OF_LIGHT_KM_PER_S;
  }

  const usesSites = toas.some((t) => t.observatory !== 'ssb' && t.observatory !== 'geocenter');
  return {
    count,
    tdb,
    clockS,
    ttMinusUtcS,
    tdbMinusTtS,
    observatoryPositionLs,
    observatoryVelocityC,
    sunToObservatoryLs,
    jupiterToObservatoryLs,
    ephemeris: ephemeris.info,
    warnings: notes.sentences(usesSites, options.earthOrientation),
    settings: {
      ephemeris: ephemeris.info.name,
      clock: 'observatory clock corrections → UTC',
      timeScale: 'TDB via ERFA dtdb (topocentric)',
      earthOrientation:
        options.earthOrientation === undefined
          ? 'IAU 2006/2000A, UT1 = UTC, no polar motion'
          : `IAU 2006/2000A, UT1 and polar motion from ${options.earthOrientation.source}`,
    },
  };
}

/** Observatory records for every code used; TimingInputError naming rows and codes for unknown ones. */
function resolveSites(toas: ReadonlyArray<ArrivalGeometryInput>, observatories: ReadonlyMap<string, Observatory>): Map<string, SiteInfo> {
  const sites = new Map<string, SiteInfo>();
  const unknown = new Map<string, number[]>();
  for (const toa of toas) {
    const code = toa.observatory;
    if (code === 'ssb' || code === 'geocenter' || sites.has(code)) continue;
    const observatory = observatories.get(code);
    if (observatory === undefined) {
      const rows = unknown.get(code) ?? [];
      rows.push(toa.row);
      unknown.set(code, rows);
      continue;
    }
    sites.set(code, {
      observatory,
      itrfM: [observatory.itrfXM, observatory.itrfYM, observatory.itrfZM],
      dtdbSite: dtdbSiteFromItrf(observatory.itrfXM, observatory.itrfYM, observatory.itrfZM),
    });
  }
  if (unknown.size > 0) {
    const details: EngineErrorDetail[] = [];
    for (const [code, rows] of unknown) for (const row of rows) details.push({ row, column: 'observatory', message: `row ${row}: unknown observatory code "${code}"` });
    const summary = [...unknown].map(([code, rows]) => `"${code}" (${describeRows(rows)})`).join(', ');
    throw new TimingInputError(`observatory: unknown observatory code ${summary}`, details);
  }
  return sites;
}

/** Collects the soft problems met on the way and words them once. */
class GeometryNotes {
  readonly dubiousYear: number[] = [];
  readonly leapSecondDay: number[] = [];
  readonly earthOrientationOutside: number[] = [];
  private readonly clockOutsideRows = new Map<string, number[]>();

  clockOutside(code: string, row: number): void {
    const rows = this.clockOutsideRows.get(code) ?? [];
    rows.push(row);
    this.clockOutsideRows.set(code, rows);
  }

  sentences(usesSites: boolean, earthOrientation: EarthOrientation | undefined): string[] {
    const out: string[] = [];
    for (const [code, rows] of this.clockOutsideRows) {
      out.push(`${rows.length} TOAs (${describeRows(rows)}) lie outside the clock-correction table of observatory "${code}"; its end value was held.`);
    }
    if (this.dubiousYear.length > 0) {
      out.push(`${this.dubiousYear.length} TOAs (${describeRows(this.dubiousYear)}) are beyond the leap seconds known to ERFA; TAI−UTC may be missing a later leap second.`);
    }
    if (this.leapSecondDay.length > 0) {
      out.push(`${this.leapSecondDay.length} TOAs (${describeRows(this.leapSecondDay)}) fall on a UTC day that ends with a leap second; a TOA inside the leap second itself cannot be written as an MJD and would be read one second late.`);
    }
    if (usesSites && earthOrientation === undefined) {
      out.push('No Earth-orientation table: UT1 = UTC and no polar motion assumed (site position error up to ~420 m, ~1.4 µs of light time).');
    }
    if (this.earthOrientationOutside.length > 0) {
      out.push(`${this.earthOrientationOutside.length} TOAs (${describeRows(this.earthOrientationOutside)}) lie outside the Earth-orientation table; its end values were held.`);
    }
    return out;
  }
}

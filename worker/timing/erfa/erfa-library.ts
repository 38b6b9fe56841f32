/**
 * The engine's one native loader: liberfa (ERFA 2.0, the BSD-licensed
 * derivative of the IAU SOFA library) through koffi, loaded lazily on the
 * first call and then reused.
 *
 * Conventions of the binding (STACK.md §9): out-parameters are Float64Array /
 * Int32Array buffers, which koffi fills in place (~200 ns per call against
 * ~900 ns with JS arrays). ERFA's `double m[3][3]` arguments are passed as one
 * row-major Float64Array(9), which is the same memory layout. Dates are
 * two-part Julian Dates as ERFA documents them (date1 + date2).
 *
 * Only routines the engine or its tests call are bound. Their meaning and
 * accuracy are documented in the ERFA headers (github.com/liberfa/erfa, src/*.c).
 */
import koffi from 'koffi';

export const LIBERFA_PATH = '/usr/lib/x86_64-linux-gnu/liberfa.so.1';

/** The bound routines; argument names follow the ERFA headers. */
export interface ErfaLibrary {
  /** TAI−UTC in seconds for a UTC calendar date; status 1 = dubious year, <0 = error. */
  eraDat(iy: number, im: number, id: number, fd: number, deltatS: Float64Array): number;
  /** TDB−TT in seconds (Fairhead & Bretagnon 1990 + topocentric terms); see worker/timing/time/tdb-minus-tt.ts. */
  eraDtdb(date1: number, date2: number, ut: number, elong: number, uKm: number, vKm: number): number;
  /** Celestial-to-intermediate matrix, IAU 2006/2000A (TT two-part JD). */
  eraC2i06a(date1: number, date2: number, rc2i: Float64Array): void;
  /** Celestial-to-terrestrial matrix, IAU 2006/2000A (TT, UT1 two-part JDs; polar motion in radians). */
  eraC2t06a(tta: number, ttb: number, uta: number, utb: number, xp: number, yp: number, rc2t: Float64Array): void;
  /** Earth rotation angle, radians (UT1 two-part JD). */
  eraEra00(dj1: number, dj2: number): number;
  /** TIO locator s′, radians (TT two-part JD). */
  eraSp00(date1: number, date2: number): number;
  /** Polar-motion matrix from xp, yp, s′ (radians). */
  eraPom00(xp: number, yp: number, sp: number, rpom: Float64Array): void;
  /** Celestial-to-terrestrial matrix from its CIO-based components. */
  eraC2tcio(rc2i: Float64Array, era: number, rpom: Float64Array, rc2t: Float64Array): void;
  /** Earth heliocentric/barycentric position (au) and velocity (au/day), analytic model (TDB two-part JD). */
  eraEpv00(date1: number, date2: number, pvh: Float64Array, pvb: Float64Array): number;
  /** Gregorian calendar → two-part MJD (djm0 = 2400000.5, djm = MJD). */
  eraCal2jd(iy: number, im: number, id: number, djm0: Float64Array, djm: Float64Array): number;
  /** Two-part JD → Gregorian year, month, day and fraction of day. */
  eraJd2cal(dj1: number, dj2: number, iy: Int32Array, im: Int32Array, id: Int32Array, fd: Float64Array): number;
}

let loaded: ErfaLibrary | undefined;

/**
 * The ERFA binding, loading liberfa on first use.
 * Throws Error("liberfa1 not installed: apt-get install liberfa1") when the library is missing.
 */
export function erfaLibrary(): ErfaLibrary {
  loaded ??= bindErfaLibrary(LIBERFA_PATH);
  return loaded;
}

/**
 * Loads liberfa from `path` and binds the routines (erfaLibrary() calls this once
 * with the Debian path; exported for the missing-library test).
 */
export function bindErfaLibrary(path: string): ErfaLibrary {
  let lib: ReturnType<typeof koffi.load>;
  try {
    lib = koffi.load(path);
  } catch (cause) {
    throw new Error(`liberfa1 not installed: apt-get install liberfa1 (could not load ${path})`, { cause });
  }
  return {
    eraDat: lib.func('int eraDat(int iy, int im, int id, double fd, _Out_ double *deltat)'),
    eraDtdb: lib.func('double eraDtdb(double date1, double date2, double ut, double elong, double u, double v)'),
    eraC2i06a: lib.func('void eraC2i06a(double date1, double date2, _Out_ double *rc2i)'),
    eraC2t06a: lib.func('void eraC2t06a(double tta, double ttb, double uta, double utb, double xp, double yp, _Out_ double *rc2t)'),
    eraEra00: lib.func('double eraEra00(double dj1, double dj2)'),
    eraSp00: lib.func('double eraSp00(double date1, double date2)'),
    eraPom00: lib.func('void eraPom00(double xp, double yp, double sp, _Out_ double *rpom)'),
    eraC2tcio: lib.func('void eraC2tcio(double *rc2i, double era, double *rpom, _Out_ double *rc2t)'),
    eraEpv00: lib.func('int eraEpv00(double date1, double date2, _Out_ double *pvh, _Out_ double *pvb)'),
    eraCal2jd: lib.func('int eraCal2jd(int iy, int im, int id, _Out_ double *djm0, _Out_ double *djm)'),
    eraJd2cal: lib.func('int eraJd2cal(double dj1, double dj2, _Out_ int *iy, _Out_ int *im, _Out_ int *id, _Out_ double *fd)'),
  } as ErfaLibrary;
}

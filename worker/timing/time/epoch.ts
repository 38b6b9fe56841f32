/**
 * The engine's representation of an instant: an integer Modified Julian Day
 * plus the fraction of that day in double-double precision.
 *
 * A double-double is the `[lo, hi]` pair of the npm package `double-double`
 * (value = hi + lo, |lo| ≤ ulp(hi)/2). A fraction of a day held this way keeps
 * ~1e-32 day ≈ 1e-27 s, far below the picosecond the product promises; a lone
 * float64 MJD would keep only ~1 µs. No MJD ever passes through one float64.
 */
export type DoubleDouble = [lo: number, hi: number];

/** An MJD as integer day plus fraction; `day` is an integer, 0 ≤ frac < 1 after normalisation. */
export interface Mjd {
  readonly day: number;
  readonly frac: DoubleDouble;
}

export const SECONDS_PER_DAY = 86_400;

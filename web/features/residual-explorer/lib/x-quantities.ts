/**
 * The quantities the residual explorer can put on its x axis, computed per TOA
 * for drawing only (never fed back into a computation).
 */
import type { BarycentricDays, OrbitCount } from '../../../../worker/timing/orbits/barycentric-days';
import { epochOffsetDays, orbitCountAt } from '../../../../worker/timing/orbits/barycentric-days';
import type { Companion } from '../../../../worker/timing/model/timing-model';

export const X_QUANTITIES = ['mjd', 'year', 'orbital-phase', 'frequency', 'day-of-year', 'uncertainty'] as const;
export type XQuantity = (typeof X_QUANTITIES)[number];

export const X_QUANTITY_LABELS: Record<XQuantity, string> = {
  mjd: 'Date (MJD)',
  year: 'Date (calendar year)',
  'orbital-phase': 'Orbital phase of a companion',
  frequency: 'Observing frequency',
  'day-of-year': 'Day of year',
  uncertainty: 'TOA uncertainty',
};

/** Axis titles with their units. */
export const X_AXIS_TITLES: Record<XQuantity, string> = {
  mjd: 'MJD (day)',
  year: 'Calendar year (UTC)',
  'orbital-phase': 'Orbital phase (turns from periastron or ascending node)',
  frequency: 'Observing frequency (MHz)',
  'day-of-year': 'Day of year (UTC)',
  uncertainty: 'TOA uncertainty (µs)',
};

const MJD_OF_UNIX_EPOCH = 40_587; // 1970-01-01T00:00Z is MJD 40587 (common practice)
const MS_PER_DAY = 86_400_000;

/**
 * An MJD string as one double for drawing. 1e-11 day of rounding is far below a pixel on a span
 * of years; values are never computed from it.
 */
export function mjdForPlot(mjd: string): number {
  return Number(mjd);
}

/** UTC calendar parts of an MJD (UTC scale; leap seconds ignored, far below a pixel). */
function utcParts(mjd: number): { year: number; startOfYearMs: number; startOfNextYearMs: number; ms: number } {
  const ms = (mjd - MJD_OF_UNIX_EPOCH) * MS_PER_DAY;
  const year = new Date(ms).getUTCFullYear();
  return { year, startOfYearMs: Date.UTC(year, 0, 1), startOfNextYearMs: Date.UTC(year + 1, 0, 1), ms };
}

/** Decimal Gregorian year, e.g. 2021.5 at mid-year: year + elapsed share of that calendar year. */
export function calendarYearFromMjd(mjd: number): number {
  const p = utcParts(mjd);
  return p.year + (p.ms - p.startOfYearMs) / (p.startOfNextYearMs - p.startOfYearMs);
}

/** Day of year counted from 1 at 1 January 00:00 UTC, with the fraction of the day (1 ≤ value < 367). */
export function dayOfYearFromMjd(mjd: number): number {
  const p = utcParts(mjd);
  return 1 + (p.ms - p.startOfYearMs) / MS_PER_DAY;
}

/**
 * Orbital phase in turns, in [0, 1), for every barycentric time: counted from periastron for
 * eccentric kinds and from the ascending node for `low-eccentricity`.
 *
 * @param companion  the companion whose orbit sets the phase
 * @param days       barycentric arrival days (TDB, before companion delays), double-double
 * @returns          phase per TOA, turns
 *
 * Notes: 1. φ = (t−T₀)/Pb − ½Ṗb((t−T₀)/Pb)² (Blandford & Teukolsky 1976, ApJ 205, 580), with the
 *           elapsed orbits split into whole and fraction so the phase keeps its digits.
 */
export function orbitalPhaseTurns(companion: Companion, days: BarycentricDays): Float64Array {
  const epoch = companion.kind === 'low-eccentricity' ? companion.ascendingNodeEpochMjd : companion.periastronEpochMjd;
  const epochDays = epochOffsetDays(epoch, days.reference);
  const count: OrbitCount = { wholeOrbits: 0, fractionalOrbits: 0, elapsedDays: 0 };
  const out = new Float64Array(days.hi.length);
  for (let i = 0; i < out.length; i += 1) {
    orbitCountAt(days, i, epochDays, companion.periodDays, count);
    const orbits = count.elapsedDays / companion.periodDays;
    const phase = count.fractionalOrbits - 0.5 * companion.periodDerivative * orbits * orbits; // Note 1
    out[i] = phase - Math.floor(phase);
  }
  return out;
}

/** Inputs the x values are computed from (a view on the explorer data). */
export interface XSource {
  mjd: readonly string[];
  frequencyMhz: readonly (number | null)[];
  uncertaintyUs: ArrayLike<number>;
  barycentricDays: BarycentricDays;
}

/**
 * The x value of every TOA for the chosen quantity. Infinite frequencies (null) become NaN, which
 * the plot leaves out; `orbital-phase` needs a companion (NaN everywhere without one).
 */
export function xValues(quantity: XQuantity, source: XSource, companion: Companion | null): Float64Array {
  const n = source.mjd.length;
  const out = new Float64Array(n);
  switch (quantity) {
    case 'mjd':
      for (let i = 0; i < n; i++) out[i] = mjdForPlot(source.mjd[i]);
      return out;
    case 'year':
      for (let i = 0; i < n; i++) out[i] = calendarYearFromMjd(mjdForPlot(source.mjd[i]));
      return out;
    case 'day-of-year':
      for (let i = 0; i < n; i++) out[i] = dayOfYearFromMjd(mjdForPlot(source.mjd[i]));
      return out;
    case 'frequency':
      for (let i = 0; i < n; i++) out[i] = source.frequencyMhz[i] ?? Number.NaN;
      return out;
    case 'uncertainty':
      for (let i = 0; i < n; i++) out[i] = source.uncertaintyUs[i];
      return out;
    case 'orbital-phase':
      if (!companion) return out.fill(Number.NaN);
      return orbitalPhaseTurns(companion, source.barycentricDays);
    default: {
      const unknown: never = quantity;
      throw new RangeError(`xValues: unknown quantity ${String(unknown)}`);
    }
  }
}

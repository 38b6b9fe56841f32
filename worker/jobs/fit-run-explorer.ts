/**
 * The explorer's per-TOA arrays of a finished fit (api/contracts/explorer.ts):
 * the fitted model evaluated once more on the fitted TOAs and, separately, on
 * the TOAs excluded at fit time, keeping the barycentric days, the delay chain
 * and the design matrix in file units, so the browser can preview edits
 * without a fit.
 */
import type { TimingModel } from '../timing/model/timing-model';
import { parameterHandle } from '../timing/model/parameter-paths';
import type { ArrivalGeometry } from '../timing/pipeline/arrival-geometry';
import { effectiveUncertaintiesS, prepareArrivals } from '../timing/pipeline/prepared-arrivals';
import { computeTimingResiduals } from '../timing/pipeline/timing-residuals';
import { timingDesignMatrix } from '../timing/pipeline/timing-design-matrix';
import type { Toa } from '../timing/toas/toa';

/** Per-TOA explorer arrays of one TOA set, in the order of its TOAs. */
export interface ExplorerEngineColumns {
  count: number;
  residualUs: Float64Array;
  uncertaintyUs: Float64Array; // effective
  nearestPulse: Uint8Array; // 1: residual wraps to the nearest pulse (the set lacks some pulse numbers); 0: the file's pulse number
  barycentricDaysHi: Float64Array;
  barycentricDaysLo: Float64Array;
  clockS: Float64Array;
  ttMinusUtcS: Float64Array;
  tdbMinusTtS: Float64Array;
  roemerS: Float64Array;
  shapiroS: Float64Array;
  dispersionS: Float64Array;
  backendOffsetS: Float64Array;
  companionsS: Float64Array;
  /** ∂residual_s/∂p per file unit, one column per `partialPaths` entry. */
  partials: Float64Array[];
}

/** A parameter column of the explorer: its path, file unit and whether the fit solved for it. */
export interface ExplorerPartialInfo {
  parameter: string;
  fileUnit: string;
  fitted: boolean;
}

const ASTROMETRY_PATHS = [
  'astrometry.ra_hms',
  'astrometry.dec_dms',
  'astrometry.pm_ra_cosdec_mas_per_yr',
  'astrometry.pm_dec_mas_per_yr',
  'astrometry.parallax_mas',
];

/**
 * The parameter columns the explorer keeps: every `solve_for` path, then every
 * astrometry and dispersion path not fitted (these move the barycentric times,
 * so a browser preview of them needs a derivative; the others are re-evaluated
 * exactly there).
 *
 * @param model  the fitted model
 */
export function explorerPartialPaths(model: TimingModel): ExplorerPartialInfo[] {
  const fitted = new Set(model.solveFor);
  const dispersion = ['dispersion.dm_pc_per_cm3', ...model.dispersion.dmDerivatives.map((_, k) => `dispersion.dm_derivatives[${k}]`)];
  const extra = [...ASTROMETRY_PATHS, ...dispersion].filter((path) => !fitted.has(path));
  return [...model.solveFor, ...extra].map((path) => ({ parameter: path, fileUnit: parameterHandle(model, path).fileUnit, fitted: fitted.has(path) }));
}

/**
 * Evaluates the fitted model on one TOA set for the explorer.
 *
 * @param model             the fitted model (in memory, not re-read from its file text)
 * @param toas              the arrivals, same order as `geometry` (may be empty)
 * @param geometry          computeArrivalGeometry(toas, …)
 * @param phaseOffsetTurns  the fitted phase offset
 * @param paths             explorerPartialPaths(model)
 * @param options           Jupiter Shapiro delay as in the fit
 * @returns                 ExplorerEngineColumns in the order of `toas`
 *
 * Notes: 1. Residuals, delays and barycentric days are those of computeTimingResiduals; the
 *           partials are timingDesignMatrix columns divided by the handle's file-units-per-internal-
 *           unit factor (toFileUncertainty(1)): ∂r/∂p_file = (∂r/∂p_internal)/(dp_file/dp_internal).
 *        2. Pulse numbering follows the engine per set: the file's pulse numbers when every TOA of
 *           the set has one, else the nearest pulse; so excluded TOAs never change how the fitted
 *           TOAs are numbered.
 */
export function explorerColumns(
  model: TimingModel,
  toas: readonly Toa[],
  geometry: ArrivalGeometry,
  phaseOffsetTurns: number,
  paths: readonly ExplorerPartialInfo[],
  options: { includeJupiterShapiro?: boolean } = {},
): ExplorerEngineColumns {
  const n = toas.length;
  if (n === 0) return emptyColumns(paths.length);
  const prepared = prepareArrivals(toas, geometry, model.epochMjd);
  const ev = computeTimingResiduals(model, prepared, { includeJupiterShapiro: options.includeJupiterShapiro, phaseOffsetTurns });
  const sigmasS = effectiveUncertaintiesS(prepared, model.noise);
  const design = timingDesignMatrix(model, prepared, ev, paths.map((p) => p.parameter), false);
  const partials = paths.map((p, j) => {
    const perFileUnit = parameterHandle(model, p.parameter).toFileUncertainty(1); // file units per internal unit
    return Float64Array.from(design.subarray(j * n, (j + 1) * n), (x) => x / perFileUnit); // Note 1
  });
  return {
    count: n,
    residualUs: Float64Array.from(ev.residualS, (r) => r * 1e6),
    uncertaintyUs: Float64Array.from(sigmasS, (s) => s * 1e6),
    nearestPulse: new Uint8Array(n).fill(prepared.everyRowHasPulseNumber ? 0 : 1),
    barycentricDaysHi: ev.barycentricDays.hi,
    barycentricDaysLo: ev.barycentricDays.lo,
    clockS: Float64Array.from(geometry.clockS),
    ttMinusUtcS: Float64Array.from(geometry.ttMinusUtcS),
    tdbMinusTtS: Float64Array.from(geometry.tdbMinusTtS),
    roemerS: ev.roemerS,
    shapiroS: ev.shapiroS,
    dispersionS: ev.dispersionS,
    backendOffsetS: ev.offsetS,
    companionsS: ev.companionS,
    partials,
  };
}

function emptyColumns(partialCount: number): ExplorerEngineColumns {
  const e = () => new Float64Array(0);
  return {
    count: 0, residualUs: e(), uncertaintyUs: e(), nearestPulse: new Uint8Array(0), barycentricDaysHi: e(), barycentricDaysLo: e(),
    clockS: e(), ttMinusUtcS: e(), tdbMinusTtS: e(), roemerS: e(), shapiroS: e(), dispersionS: e(), backendOffsetS: e(), companionsS: e(),
    partials: Array.from({ length: partialCount }, e),
  };
}

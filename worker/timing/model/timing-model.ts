/**
 * The engine's in-memory timing model: the model file of docs/formats.md §2
 * after parsing. High-precision quantities (spin frequency, epochs) are kept
 * as double-double or as an `Mjd`; everything else is a float64 in the unit
 * its name carries. Field names mirror the file keys in camelCase.
 */
import type { DoubleDouble, Mjd } from '../time/epoch';

export interface KeplerianCompanion {
  readonly kind: 'keplerian';
  name: string;
  enabled: boolean;
  periodDays: number;
  projectedSemimajorAxisLtS: number;
  eccentricity: number;
  periastronLongitudeDeg: number;
  periastronEpochMjd: Mjd;
  periodDerivative: number; // dimensionless dPb/dt, optional in the file (0)
  periastronAdvanceDegPerYr: number; // optional (0)
  einsteinDelayS: number; // optional (0)
}

export interface LowEccentricityCompanion {
  readonly kind: 'low-eccentricity';
  name: string;
  enabled: boolean;
  periodDays: number;
  projectedSemimajorAxisLtS: number;
  ascendingNodeEpochMjd: Mjd;
  eSinOmega: number;
  eCosOmega: number;
  periodDerivative: number; // optional (0)
}

/** Room for Damour & Deruelle 1986; the companion issue fills in its delay. */
export interface DamourDeruelleCompanion {
  readonly kind: 'damour-deruelle';
  name: string;
  enabled: boolean;
  periodDays: number;
  projectedSemimajorAxisLtS: number;
  eccentricity: number;
  periastronLongitudeDeg: number;
  periastronEpochMjd: Mjd;
  periodDerivative: number;
  periastronAdvanceDegPerYr: number;
  einsteinDelayS: number;
  shapiroRangeS: number; // r = T☉·m_c, seconds
  shapiroShape: number; // s = sin i
}

export type Companion = KeplerianCompanion | LowEccentricityCompanion | DamourDeruelleCompanion;

export interface Glitch {
  epochMjd: Mjd;
  phaseStepTurns: number;
  frequencyStepHz: number;
  frequencyDerivativeStepHzPerS: number;
  decayingFrequencyStepHz: number;
  decayTimeDays: number;
}

export interface BackendOffset { backend: string; seconds: number }
export interface BackendNoise { backend: string; uncertaintyScale: number; addedJitterUs: number }

export interface TimingModel {
  pulsar: string;
  epochMjd: Mjd; // TDB
  spin: {
    frequencyHz: DoubleDouble;
    frequencyDerivatives: number[]; // k-th entry: (k+1)-th derivative, Hz/s^(k+1)
  };
  astrometry: {
    raRad: number; // ICRS at epochMjd
    decRad: number;
    pmRaCosDecMasPerYr: number;
    pmDecMasPerYr: number;
    parallaxMas: number;
  };
  dispersion: {
    dmPcPerCm3: number;
    dmDerivatives: number[]; // k-th entry: pc cm^-3 yr^-(k+1)
  };
  companions: Companion[];
  offsets: BackendOffset[];
  noise: BackendNoise[];
  glitches: Glitch[];
  solveFor: string[]; // parameter paths exactly as in the file
  /** Keys the file carried beyond the known ones are rejected, so nothing else lives here. */
}

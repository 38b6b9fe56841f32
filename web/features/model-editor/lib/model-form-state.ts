import type { CompanionKind } from './companion-fields';

/**
 * The model editor's state: the model file of docs/formats.md §2 with every value as the text the
 * user sees (so no digit is lost to a float while editing) and, beside each fittable value, whether
 * the fit solves for it. Keys mirror the file's snake_case keys, so a server error path
 * (`['model', 'spin', 'frequency_hz']`) names its field directly. `extra` objects keep keys the form
 * has no control for, written back unchanged. `uid`s are React keys only, never written.
 */
export interface ParamField {
  text: string;
  solve: boolean;
}

export interface CompanionForm {
  uid: string;
  name: string;
  /** One of COMPANION_KINDS, or whatever unknown kind the file had. */
  kind: CompanionKind | string;
  enabled: boolean;
  /** Values of every kind's keys seen or typed; only the current kind's keys are written. */
  fields: Record<string, ParamField>;
  extra: Record<string, unknown>;
}

export interface OffsetForm {
  uid: string;
  backend: string;
  seconds: ParamField;
  extra: Record<string, unknown>;
}

export interface NoiseForm {
  uid: string;
  backend: string;
  uncertainty_scale: string;
  added_jitter_us: string;
  extra: Record<string, unknown>;
}

export interface ModelFormState {
  format: string;
  pulsar: string;
  epoch_mjd: string;
  spin: { frequency_hz: ParamField; frequency_derivatives: ParamField[]; extra: Record<string, unknown> };
  astrometry: {
    ra_hms: ParamField;
    dec_dms: ParamField;
    pm_ra_cosdec_mas_per_yr: ParamField;
    pm_dec_mas_per_yr: ParamField;
    parallax_mas: ParamField;
    extra: Record<string, unknown>;
  };
  dispersion: { dm_pc_per_cm3: ParamField; dm_derivatives: ParamField[]; extra: Record<string, unknown> };
  companions: CompanionForm[];
  offsets: OffsetForm[];
  noise: NoiseForm[];
  /** Glitches have no controls yet; kept as read. */
  glitches: unknown[];
  /** `solve_for` entries with no switch in the form (glitch paths, unknown paths); kept in order. */
  otherSolveFor: string[];
  extra: Record<string, unknown>;
}

export const ASTROMETRY_KEYS = ['ra_hms', 'dec_dms', 'pm_ra_cosdec_mas_per_yr', 'pm_dec_mas_per_yr', 'parallax_mas'] as const;
export type AstrometryKey = (typeof ASTROMETRY_KEYS)[number];

export const MODEL_FORMAT = 'pulsekeeper-model/1';

let uidCounter = 0;
/** A fresh React key for a list entry. */
export function nextUid(prefix: string): string {
  uidCounter += 1;
  return `${prefix}-${uidCounter}`;
}

export const param = (text = '', solve = false): ParamField => ({ text, solve });

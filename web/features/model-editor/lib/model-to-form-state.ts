import { ALL_COMPANION_FIELD_KEYS, COMPANION_FIELDS, isCompanionKind } from './companion-fields';
import {
  ASTROMETRY_KEYS,
  nextUid,
  param,
  type CompanionForm,
  type ModelFormState,
  type NoiseForm,
  type OffsetForm,
  type ParamField,
} from './model-form-state';
import { textOfJsonValue } from './model-number-text';
import { parseParameterPath } from './parameter-paths';

type Json = Record<string, unknown>;

const asObject = (value: unknown): Json => (typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Json) : {});
const asArray = (value: unknown): unknown[] => (Array.isArray(value) ? value : []);

function rest(object: Json, known: readonly string[]): Json {
  return Object.fromEntries(Object.entries(object).filter(([key]) => !known.includes(key)));
}

function companionForm(raw: unknown): CompanionForm {
  const c = asObject(raw);
  const kind = typeof c.kind === 'string' ? c.kind : '';
  const ownKeys = isCompanionKind(kind) ? COMPANION_FIELDS[kind].map((s) => s.key) : [];
  const fields: Record<string, ParamField> = {};
  const extra: Json = {};
  for (const [key, value] of Object.entries(c)) {
    if (key === 'name' || key === 'kind' || key === 'enabled') continue;
    // Keys of the companion's own kind become fields; anything else is written back untouched.
    if (ownKeys.includes(key) && ALL_COMPANION_FIELD_KEYS.has(key)) fields[key] = param(textOfJsonValue(value));
    else extra[key] = value;
  }
  for (const key of ownKeys) fields[key] ??= param();
  return {
    uid: nextUid('companion'),
    name: textOfJsonValue(c.name),
    kind,
    enabled: c.enabled !== false,
    fields,
    extra: { ...extra, ...(c.enabled !== undefined && typeof c.enabled !== 'boolean' ? { enabled: c.enabled } : {}) },
  };
}

function offsetForm(raw: unknown): OffsetForm {
  const o = asObject(raw);
  return { uid: nextUid('offset'), backend: textOfJsonValue(o.backend), seconds: param(textOfJsonValue(o.seconds)), extra: rest(o, ['backend', 'seconds']) };
}

function noiseForm(raw: unknown): NoiseForm {
  const n = asObject(raw);
  return {
    uid: nextUid('noise'),
    backend: textOfJsonValue(n.backend),
    uncertainty_scale: textOfJsonValue(n.uncertainty_scale),
    added_jitter_us: textOfJsonValue(n.added_jitter_us),
    extra: rest(n, ['backend', 'uncertainty_scale', 'added_jitter_us']),
  };
}

/** Sets the solve switch a `solve_for` path names; false when the form has no such switch. */
function applySolve(state: ModelFormState, path: string): boolean {
  const parsed = parseParameterPath(path);
  if (!parsed) return false;
  switch (parsed.section) {
    case 'spin':
      state.spin.frequency_hz.solve = true;
      return true;
    case 'frequency_derivatives': {
      const field = state.spin.frequency_derivatives[parsed.index];
      if (field) field.solve = true;
      return field !== undefined;
    }
    case 'astrometry':
      state.astrometry[parsed.key as (typeof ASTROMETRY_KEYS)[number]].solve = true;
      return true;
    case 'dm':
      state.dispersion.dm_pc_per_cm3.solve = true;
      return true;
    case 'dm_derivatives': {
      const field = state.dispersion.dm_derivatives[parsed.index];
      if (field) field.solve = true;
      return field !== undefined;
    }
    case 'companion': {
      const companion = state.companions.find((c) => c.name === parsed.name);
      if (!companion || !isCompanionKind(companion.kind)) return false;
      if (!COMPANION_FIELDS[companion.kind].some((s) => s.key === parsed.key)) return false;
      companion.fields[parsed.key].solve = true;
      return true;
    }
    case 'offset': {
      const offset = state.offsets.find((o) => o.backend === parsed.backend);
      if (offset) offset.seconds.solve = true;
      return offset !== undefined;
    }
  }
}

/**
 * Model file JSON (docs/formats.md §2, already parsed) → editor state. Tolerant: whatever the file
 * holds is kept (unknown keys in `extra`, unmatched `solve_for` paths in `otherSolveFor`), so a file
 * with mistakes can still be opened, fixed and saved; the server is the judge of validity.
 */
export function modelToFormState(model: unknown): ModelFormState {
  const m = asObject(model);
  const spin = asObject(m.spin);
  const astrometry = asObject(m.astrometry);
  const dispersion = asObject(m.dispersion);
  const state: ModelFormState = {
    format: textOfJsonValue(m.format),
    pulsar: textOfJsonValue(m.pulsar),
    epoch_mjd: textOfJsonValue(m.epoch_mjd),
    spin: {
      frequency_hz: param(textOfJsonValue(spin.frequency_hz)),
      frequency_derivatives: asArray(spin.frequency_derivatives).map((v) => param(textOfJsonValue(v))),
      extra: rest(spin, ['frequency_hz', 'frequency_derivatives']),
    },
    astrometry: {
      ra_hms: param(textOfJsonValue(astrometry.ra_hms)),
      dec_dms: param(textOfJsonValue(astrometry.dec_dms)),
      pm_ra_cosdec_mas_per_yr: param(textOfJsonValue(astrometry.pm_ra_cosdec_mas_per_yr)),
      pm_dec_mas_per_yr: param(textOfJsonValue(astrometry.pm_dec_mas_per_yr)),
      parallax_mas: param(textOfJsonValue(astrometry.parallax_mas)),
      extra: rest(astrometry, ASTROMETRY_KEYS),
    },
    dispersion: {
      dm_pc_per_cm3: param(textOfJsonValue(dispersion.dm_pc_per_cm3)),
      dm_derivatives: asArray(dispersion.dm_derivatives).map((v) => param(textOfJsonValue(v))),
      extra: rest(dispersion, ['dm_pc_per_cm3', 'dm_derivatives']),
    },
    companions: asArray(m.companions).map(companionForm),
    offsets: asArray(m.offsets).map(offsetForm),
    noise: asArray(m.noise).map(noiseForm),
    glitches: asArray(m.glitches),
    otherSolveFor: [],
    extra: rest(m, ['format', 'pulsar', 'epoch_mjd', 'spin', 'astrometry', 'dispersion', 'companions', 'offsets', 'noise', 'glitches', 'solve_for']),
  };
  const seen = new Set<string>();
  for (const entry of asArray(m.solve_for)) {
    const path = typeof entry === 'string' ? entry : JSON.stringify(entry);
    if (seen.has(path)) continue;
    seen.add(path);
    if (!applySolve(state, path)) state.otherSolveFor.push(path);
  }
  return state;
}

import { COMPANION_FIELDS, isCompanionKind } from './companion-fields';
import { ASTROMETRY_KEYS, type CompanionForm, type ModelFormState, type ParamField } from './model-form-state';
import { isPreciseKey, jsonValueOfText } from './model-number-text';
import { parameterPath } from './parameter-paths';

type Json = Record<string, unknown>;

/**
 * Writes `key` when its text is not blank, or always when it is required (a blank required value
 * is written as "" so the server's error names the field). Blank optional values are left out,
 * which is how a file without that key reads back.
 */
function put(target: Json, key: string, text: string, required = false): void {
  const trimmed = text.trim();
  if (trimmed === '' && !required) return;
  target[key] = trimmed === '' ? '' : key === 'ra_hms' || key === 'dec_dms' ? trimmed : jsonValueOfText(trimmed, isPreciseKey(key));
}

const listValue = (field: ParamField) => jsonValueOfText(field.text.trim(), false);

function companionJson(c: CompanionForm): Json {
  const out: Json = { name: c.name.trim(), kind: c.kind, enabled: c.enabled };
  if (isCompanionKind(c.kind)) {
    for (const spec of COMPANION_FIELDS[c.kind]) put(out, spec.key, c.fields[spec.key]?.text ?? '', spec.required);
  }
  return { ...out, ...c.extra };
}

/** Every path whose switch is on, in the form's order, then the paths kept from the file. */
export function solveForPaths(state: ModelFormState): string[] {
  const paths: string[] = [];
  if (state.spin.frequency_hz.solve) paths.push(parameterPath.spin('frequency_hz'));
  state.spin.frequency_derivatives.forEach((f, k) => f.solve && paths.push(parameterPath.frequencyDerivative(k)));
  for (const key of ASTROMETRY_KEYS) if (state.astrometry[key].solve) paths.push(parameterPath.astrometry(key));
  if (state.dispersion.dm_pc_per_cm3.solve) paths.push(parameterPath.dm());
  state.dispersion.dm_derivatives.forEach((f, k) => f.solve && paths.push(parameterPath.dmDerivative(k)));
  for (const c of state.companions) {
    if (!isCompanionKind(c.kind)) continue;
    for (const spec of COMPANION_FIELDS[c.kind]) if (c.fields[spec.key]?.solve) paths.push(parameterPath.companion(c.name.trim(), spec.key));
  }
  for (const o of state.offsets) if (o.seconds.solve) paths.push(parameterPath.offset(o.backend.trim()));
  return [...paths, ...state.otherSolveFor.filter((p) => !paths.includes(p))];
}

/**
 * Editor state → model file JSON (docs/formats.md §2). Text is written back digit for digit
 * (model-number-text.ts); keys the form had no control for come back unchanged.
 */
export function formStateToModel(state: ModelFormState): Json {
  const model: Json = {};
  put(model, 'format', state.format, true);
  put(model, 'pulsar', state.pulsar, true);
  put(model, 'epoch_mjd', state.epoch_mjd, true);

  const spin: Json = {};
  put(spin, 'frequency_hz', state.spin.frequency_hz.text, true);
  spin.frequency_derivatives = state.spin.frequency_derivatives.map(listValue);
  model.spin = { ...spin, ...state.spin.extra };

  const astrometry: Json = {};
  for (const key of ASTROMETRY_KEYS) put(astrometry, key, state.astrometry[key].text, key === 'ra_hms' || key === 'dec_dms');
  model.astrometry = { ...astrometry, ...state.astrometry.extra };

  const d = state.dispersion;
  if (d.dm_pc_per_cm3.text.trim() !== '' || d.dm_derivatives.length > 0 || Object.keys(d.extra).length > 0) {
    const dispersion: Json = {};
    put(dispersion, 'dm_pc_per_cm3', d.dm_pc_per_cm3.text);
    dispersion.dm_derivatives = d.dm_derivatives.map(listValue);
    model.dispersion = { ...dispersion, ...d.extra };
  }

  model.companions = state.companions.map(companionJson);
  model.offsets = state.offsets.map((o) => {
    const out: Json = { backend: o.backend.trim() };
    put(out, 'seconds', o.seconds.text);
    return { ...out, ...o.extra };
  });
  model.noise = state.noise.map((n) => {
    const out: Json = { backend: n.backend.trim() };
    put(out, 'uncertainty_scale', n.uncertainty_scale);
    put(out, 'added_jitter_us', n.added_jitter_us);
    return { ...out, ...n.extra };
  });
  model.glitches = state.glitches;
  model.solve_for = solveForPaths(state);
  return { ...model, ...state.extra };
}

import { COMPANION_FIELDS, isCompanionKind } from '../../../model-editor/lib/companion-fields';
import { isPreciseKey, jsonValueOfText, textOfJsonValue } from '../../../model-editor/lib/model-number-text';

/** The timing-model file as JSON (docs/formats.md §2): numbers or decimal strings, keys as in the file. */
export type ModelFileJson = Record<string, unknown>;

/** One editable value of the model, addressed by its parameter path (docs/formats.md §2, "Parameter paths"). */
export interface ParameterSpec {
  /** parameter path, e.g. `spin.frequency_hz`, `companions[b].period_days`; noise uses `noise[backend].key` */
  path: string;
  label: string;
  unit: string;
  /** may appear in `solve_for` (noise settings may not) */
  solvable: boolean;
  /** blank means "not set" and the key is left out (else a blank is written so the server names it) */
  optional: boolean;
}

export interface ParameterGroup {
  id: string;
  title: string;
  /** companion name, offset or noise backend for per-item groups */
  item?: string;
  parameters: ParameterSpec[];
}

type Json = Record<string, unknown>;
const asObject = (value: unknown): Json => (typeof value === 'object' && value !== null && !Array.isArray(value) ? (value as Json) : {});
const asArray = (value: unknown): unknown[] => (Array.isArray(value) ? value : []);

const ASTROMETRY: ParameterSpec[] = [
  { path: 'astrometry.ra_hms', label: 'Right ascension', unit: 'hh:mm:ss', solvable: true, optional: false },
  { path: 'astrometry.dec_dms', label: 'Declination', unit: '±dd:mm:ss', solvable: true, optional: false },
  { path: 'astrometry.pm_ra_cosdec_mas_per_yr', label: 'Proper motion, RA · cos dec', unit: 'mas/yr', solvable: true, optional: true },
  { path: 'astrometry.pm_dec_mas_per_yr', label: 'Proper motion, declination', unit: 'mas/yr', solvable: true, optional: true },
  { path: 'astrometry.parallax_mas', label: 'Parallax', unit: 'mas', solvable: true, optional: true },
];

/**
 * The model's parameters in the explorer's groups: spin, position, dispersion, one group per
 * companion (its kind's keys), offsets, noise. Derivative lists show the entries the file has.
 */
export function parameterGroups(model: ModelFileJson): ParameterGroup[] {
  const spin = asObject(model.spin);
  const dispersion = asObject(model.dispersion);
  const groups: ParameterGroup[] = [
    {
      id: 'spin',
      title: 'Spin',
      parameters: [
        { path: 'spin.frequency_hz', label: 'Spin frequency', unit: 'Hz', solvable: true, optional: false },
        ...asArray(spin.frequency_derivatives).map((_, k) => ({
          path: `spin.frequency_derivatives[${k}]`,
          label: `Frequency derivative ${k + 1}`,
          unit: k === 0 ? 'Hz/s' : `Hz/s^${k + 1}`,
          solvable: true,
          optional: false,
        })),
      ],
    },
    { id: 'position', title: 'Position', parameters: ASTROMETRY },
    {
      id: 'dispersion',
      title: 'Dispersion',
      parameters: [
        { path: 'dispersion.dm_pc_per_cm3', label: 'Dispersion measure', unit: 'pc/cm³', solvable: true, optional: true },
        ...asArray(dispersion.dm_derivatives).map((_, k) => ({
          path: `dispersion.dm_derivatives[${k}]`,
          label: `DM derivative ${k + 1}`,
          unit: k === 0 ? 'pc/cm³/yr' : `pc/cm³/yr^${k + 1}`,
          solvable: true,
          optional: false,
        })),
      ],
    },
  ];
  for (const raw of asArray(model.companions)) {
    const c = asObject(raw);
    const name = textOfJsonValue(c.name);
    const kind = textOfJsonValue(c.kind);
    const specs = isCompanionKind(kind) ? COMPANION_FIELDS[kind] : [];
    groups.push({
      id: `companion:${name}`,
      title: `Companion ${name}`,
      item: name,
      parameters: specs.map((s) => ({ path: `companions[${name}].${s.key}`, label: s.label, unit: s.unit, solvable: true, optional: !s.required })),
    });
  }
  const offsets = asArray(model.offsets).map(asObject);
  if (offsets.length > 0) {
    groups.push({
      id: 'offsets',
      title: 'Offsets',
      parameters: offsets.map((o) => ({ path: `offsets[${textOfJsonValue(o.backend)}].seconds`, label: `Offset of ${textOfJsonValue(o.backend)}`, unit: 's', solvable: true, optional: true })),
    });
  }
  const noise = asArray(model.noise).map(asObject);
  if (noise.length > 0) {
    groups.push({
      id: 'noise',
      title: 'Noise',
      parameters: noise.flatMap((n) => {
        const backend = textOfJsonValue(n.backend);
        return [
          { path: `noise[${backend}].uncertainty_scale`, label: `Uncertainty scale, ${backend}`, unit: '×', solvable: false, optional: true },
          { path: `noise[${backend}].added_jitter_us`, label: `Added jitter, ${backend}`, unit: 'µs', solvable: false, optional: true },
        ];
      }),
    });
  }
  return groups;
}

type Step = { key: string } | { index: number } | { member: string; by: 'name' | 'backend' };

const SEGMENT = /^([a-z][a-z0-9_]*)(?:\[([^\]]+)\])?$/;

/** `companions[b].period_days` → steps; null for paths outside the shapes above. */
function stepsOf(path: string): Step[] | null {
  const steps: Step[] = [];
  // Split at dots outside brackets (backend names may hold dots).
  const parts = path.match(/[^.[\]]+(?:\[[^\]]*\])?/g);
  if (!parts || parts.join('.') !== path) return null;
  for (const part of parts) {
    const m = SEGMENT.exec(part);
    if (!m) return null;
    steps.push({ key: m[1] });
    if (m[2] !== undefined) {
      if (/^(0|[1-9]\d*)$/.test(m[2])) steps.push({ index: Number(m[2]) });
      else steps.push({ member: m[2], by: m[1] === 'companions' ? 'name' : 'backend' });
    }
  }
  return steps;
}

function childOf(container: unknown, step: Step): unknown {
  if ('key' in step) return asObject(container)[step.key];
  if ('index' in step) return asArray(container)[step.index];
  return asArray(container).find((item) => asObject(item)[step.by] === step.member);
}

/** The raw JSON value at `path` (undefined when absent). */
export function valueAt(model: ModelFileJson, path: string): unknown {
  const steps = stepsOf(path);
  if (!steps) return undefined;
  let node: unknown = model;
  for (const step of steps) node = childOf(node, step);
  return node;
}

/** The value at `path` as the text an input shows: strings as they are, numbers in shortest form, '' when absent. */
export function textAt(model: ModelFileJson, path: string): string {
  return textOfJsonValue(valueAt(model, path));
}

/**
 * A copy of `model` with the value at `path` set from `text`, digit for digit: epochs and the
 * spin frequency stay decimal strings; other text becomes a JSON number only when that number
 * prints back as the same text (model-number-text.ts). Blank optional values remove the key.
 * Throws RangeError when the path does not name a place in the model.
 */
export function withText(model: ModelFileJson, path: string, text: string, optional: boolean): ModelFileJson {
  const steps = stepsOf(path);
  const last = steps?.[steps.length - 1];
  if (!steps || !last) throw new RangeError(`path: "${path}" is not a parameter path of this model`);
  const copy = structuredClone(model);
  let node: unknown = copy;
  for (const step of steps.slice(0, -1)) {
    const next = childOf(node, step);
    if (next === undefined && 'key' in step && typeof node === 'object' && node !== null) {
      (node as Json)[step.key] = {};
      node = (node as Json)[step.key];
      continue;
    }
    if (typeof next !== 'object' || next === null) throw new RangeError(`path: "${path}" is not a parameter path of this model`);
    node = next;
  }
  const trimmed = text.trim();
  if ('key' in last) {
    const target = node as Json;
    const sexagesimal = last.key === 'ra_hms' || last.key === 'dec_dms';
    if (trimmed === '' && optional) delete target[last.key];
    else target[last.key] = sexagesimal ? trimmed : jsonValueOfText(trimmed, isPreciseKey(last.key));
  } else if ('index' in last && Array.isArray(node)) {
    node[last.index] = jsonValueOfText(trimmed, false);
  } else {
    throw new RangeError(`path: "${path}" is not a parameter path of this model`);
  }
  return copy;
}

/** The model's `solve_for` list (strings only). */
export function solveForOf(model: ModelFileJson): string[] {
  return asArray(model.solve_for).filter((p): p is string => typeof p === 'string');
}

/** A copy of `model` with `path` added to (appended) or removed from `solve_for`. */
export function withSolveFor(model: ModelFileJson, path: string, solve: boolean): ModelFileJson {
  const current = solveForOf(model);
  const next = solve ? (current.includes(path) ? current : [...current, path]) : current.filter((p) => p !== path);
  return { ...structuredClone(model), solve_for: next };
}

/** A copy of `model` without the companion `name` (its solve-for paths go too). */
export function withoutCompanion(model: ModelFileJson, name: string): ModelFileJson {
  const copy = structuredClone(model);
  copy.companions = asArray(copy.companions).filter((c) => asObject(c).name !== name);
  copy.solve_for = solveForOf(copy).filter((p) => !p.startsWith(`companions[${name}].`));
  return copy;
}

/** Names of the model's companions, in file order. */
export function companionNames(model: ModelFileJson): string[] {
  return asArray(model.companions).map((c) => textOfJsonValue(asObject(c).name));
}

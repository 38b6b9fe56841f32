import { COMPANION_FIELDS, isCompanionKind, type CompanionKind } from './companion-fields';
import { nextUid, param, type CompanionForm, type NoiseForm, type OffsetForm } from './model-form-state';

/** A new enabled companion of `kind`, named with the first free letter from "b" (the usual first companion letter). */
export function newCompanion(kind: CompanionKind, takenNames: readonly string[]): CompanionForm {
  let name = 'b';
  for (let code = 'b'.charCodeAt(0); code <= 'z'.charCodeAt(0); code++) {
    name = String.fromCharCode(code);
    if (!takenNames.includes(name)) break;
  }
  const fields = Object.fromEntries(COMPANION_FIELDS[kind].map((s) => [s.key, param()]));
  return { uid: nextUid('companion'), name, kind, enabled: true, fields, extra: {} };
}

/** The same companion under another kind; values already typed for any kind are kept for switching back. */
export function withCompanionKind(companion: CompanionForm, kind: string): CompanionForm {
  const fields = { ...companion.fields };
  if (isCompanionKind(kind)) for (const spec of COMPANION_FIELDS[kind]) fields[spec.key] ??= param();
  return { ...companion, kind, fields };
}

export const newOffset = (): OffsetForm => ({ uid: nextUid('offset'), backend: '', seconds: param(), extra: {} });
export const newNoise = (): NoiseForm => ({ uid: nextUid('noise'), backend: '', uncertainty_scale: '', added_jitter_us: '', extra: {} });

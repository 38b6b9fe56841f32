import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Select } from '../../../components/select';
import { COMPANION_FIELDS, COMPANION_KIND_LABELS, COMPANION_KINDS, isCompanionKind } from '../lib/companion-fields';
import { param, type CompanionForm } from '../lib/model-form-state';
import { withCompanionKind } from '../lib/model-edits';
import { ParamRow, TextRow } from './param-row';
import { Switch } from './solve-switch';

/** One companion: name, kind (which decides the fields shown), enabled switch, its values with solve switches. */
export function CompanionCard({
  companion,
  index,
  onChange,
  onRemove,
  errors,
}: {
  companion: CompanionForm;
  index: number;
  onChange: (companion: CompanionForm) => void;
  onRemove: () => void;
  errors: Record<string, string>;
}) {
  const prefix = `companions.${index}`;
  const title = `Companion ${companion.name.trim() || index + 1}`;
  const specs = isCompanionKind(companion.kind) ? COMPANION_FIELDS[companion.kind] : [];
  return (
    <section aria-label={title} className="rounded-lg border border-night-700 bg-night-950/40 p-4">
      <div className="mb-4 flex flex-wrap items-center justify-between gap-3">
        <h4 className="text-sm font-semibold text-night-100">{title}</h4>
        <div className="flex items-center gap-4">
          <Switch
            checked={companion.enabled}
            onChange={(enabled) => onChange({ ...companion, enabled })}
            label={`${title} enabled`}
            visibleLabel={companion.enabled ? 'enabled' : 'disabled'}
          />
          <Button variant="danger" size="sm" onClick={onRemove}>
            Remove
          </Button>
        </div>
      </div>
      <div className="mb-4 grid grid-cols-1 gap-4 sm:grid-cols-2">
        <TextRow label="Name" value={companion.name} onChange={(name) => onChange({ ...companion, name })} error={errors[`${prefix}.name`]} hint="Used in solve-for paths, e.g. companions[b].period_days" />
        <Field label="Kind" error={errors[`${prefix}.kind`]}>
          {(control) => (
            <Select {...control} value={companion.kind} onChange={(event) => onChange(withCompanionKind(companion, event.target.value))}>
              {COMPANION_KINDS.map((kind) => (
                <option key={kind} value={kind}>
                  {COMPANION_KIND_LABELS[kind]}
                </option>
              ))}
              {isCompanionKind(companion.kind) ? null : <option value={companion.kind}>Unknown kind “{companion.kind}”</option>}
            </Select>
          )}
        </Field>
      </div>
      {!companion.enabled ? <p className="mb-3 text-xs text-night-400">Disabled: kept in the file, contributes no delay.</p> : null}
      <div className="grid grid-cols-1 gap-4 md:grid-cols-2">
        {specs.map((spec) => (
          <ParamRow
            key={spec.key}
            label={spec.label}
            unit={spec.unit}
            field={companion.fields[spec.key] ?? param()}
            error={errors[`${prefix}.${spec.key}`]}
            placeholder={spec.required ? 'required' : '0'}
            onChange={(field) => onChange({ ...companion, fields: { ...companion.fields, [spec.key]: field } })}
          />
        ))}
      </div>
    </section>
  );
}

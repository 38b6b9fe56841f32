import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import type { ParamField } from '../lib/model-form-state';
import { Switch } from './solve-switch';

/**
 * One model value as text, with its unit and, for fittable values, the "solve for" switch beside it.
 * `error` is the server's message for this field, if any.
 */
export function ParamRow({
  label,
  unit,
  field,
  onChange,
  error,
  hint,
  fittable = true,
  placeholder,
}: {
  label: string;
  unit?: string;
  field: ParamField;
  onChange: (field: ParamField) => void;
  error?: string;
  hint?: string;
  fittable?: boolean;
  placeholder?: string;
}) {
  const fullLabel = unit ? `${label} (${unit})` : label;
  return (
    <div className="flex items-start gap-3">
      <Field label={fullLabel} error={error} hint={hint} className="min-w-0 flex-1">
        {(control) => (
          <Input
            {...control}
            className="font-mono"
            inputMode="decimal"
            spellCheck={false}
            autoComplete="off"
            placeholder={placeholder}
            value={field.text}
            onChange={(event) => onChange({ ...field, text: event.target.value })}
          />
        )}
      </Field>
      {fittable ? (
        <div className="pt-8">
          <Switch checked={field.solve} onChange={(solve) => onChange({ ...field, solve })} label={`Solve for ${label}`} visibleLabel="fit" />
        </div>
      ) : null}
    </div>
  );
}

/** A plain text value (names, backends, noise settings) with no solve switch. */
export function TextRow({
  label,
  value,
  onChange,
  error,
  hint,
  mono = true,
}: {
  label: string;
  value: string;
  onChange: (value: string) => void;
  error?: string;
  hint?: string;
  mono?: boolean;
}) {
  return (
    <Field label={label} error={error} hint={hint} className="min-w-0 flex-1">
      {(control) => (
        <Input {...control} className={mono ? 'font-mono' : undefined} spellCheck={false} autoComplete="off" value={value} onChange={(event) => onChange(event.target.value)} />
      )}
    </Field>
  );
}

import { zodResolver } from '@hookform/resolvers/zod';
import { useFieldArray, useForm, useWatch, type Path } from 'react-hook-form';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { controlClasses } from '../../../components/input';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { applyServerErrors } from '../../../lib/apply-server-errors';
import { cn } from '../../../lib/cn';
import { useCreateObservatory } from '../api/create-observatory';
import type { Observatory } from '../api/get-observatories';
import { useUpdateObservatory } from '../api/update-observatory';
import { geocentricDistanceKm, geocentricDistanceProblem, ObservatoryFormValues } from '../observatory-rules';

const EMPTY: ObservatoryFormValues = {
  code: '',
  name: '',
  itrf_x_m: Number.NaN,
  itrf_y_m: Number.NaN,
  itrf_z_m: Number.NaN,
  clock_corrections: [],
};

function toFormValues(o: Observatory): ObservatoryFormValues {
  return {
    code: o.code,
    name: o.name,
    itrf_x_m: o.itrf_x_m,
    itrf_y_m: o.itrf_y_m,
    itrf_z_m: o.itrf_z_m,
    clock_corrections: (o.clock_corrections ?? []).map((p) => ({ mjd: String(p.mjd), correction_us: p.correction_us })),
  };
}

function DistanceReadout({ control }: { control: ReturnType<typeof useForm<ObservatoryFormValues>>['control'] }) {
  const [x, y, z] = useWatch({ control, name: ['itrf_x_m', 'itrf_y_m', 'itrf_z_m'] });
  if (![x, y, z].every((v) => typeof v === 'number' && Number.isFinite(v))) {
    return <p className="text-xs text-night-400">Enter x, y and z to see the distance from the geocentre.</p>;
  }
  const distanceKm = geocentricDistanceKm(x, y, z);
  const ok = geocentricDistanceProblem(x, y, z) === null;
  return (
    <p className={cn('text-xs', ok ? 'text-calm-400' : 'text-ember-300')}>
      Distance from the geocentre: <span className="font-mono">{distanceKm.toFixed(1)} km</span>
      {ok ? '' : ' (must be 6350–6400 km)'}
    </p>
  );
}

/**
 * Create (no `observatory`) or edit an observatory. Checks on the client that the point lies
 * 6350–6400 km from the geocentre before sending; server field errors land on the fields.
 */
export function ObservatoryForm({ observatory, onDone }: { observatory?: Observatory; onDone?: (saved: Observatory) => void }) {
  const editing = observatory !== undefined;
  const create = useCreateObservatory();
  const update = useUpdateObservatory();
  const form = useForm<ObservatoryFormValues>({
    resolver: zodResolver(ObservatoryFormValues),
    defaultValues: observatory ? toFormValues(observatory) : EMPTY,
  });
  const points = useFieldArray({ control: form.control, name: 'clock_corrections' });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    const problem = geocentricDistanceProblem(values.itrf_x_m, values.itrf_y_m, values.itrf_z_m);
    if (problem) {
      form.setError('root.distance', { type: 'distance', message: problem });
      return;
    }
    const fields: Path<ObservatoryFormValues>[] = ['code', 'name', 'itrf_x_m', 'itrf_y_m', 'itrf_z_m', 'clock_corrections'];
    values.clock_corrections.forEach((_, i) => fields.push(`clock_corrections.${i}.mjd`, `clock_corrections.${i}.correction_us`));
    try {
      const saved = editing
        ? await update.mutateAsync({
            code: observatory.code,
            patch: {
              name: values.name,
              itrf_x_m: values.itrf_x_m,
              itrf_y_m: values.itrf_y_m,
              itrf_z_m: values.itrf_z_m,
              clock_corrections: values.clock_corrections,
            },
          })
        : await create.mutateAsync(values);
      if (!editing) form.reset(EMPTY);
      onDone?.(saved);
    } catch (error) {
      applyServerErrors(error, form.setError, fields, describeError);
    }
  });

  const numberField = (name: 'itrf_x_m' | 'itrf_y_m' | 'itrf_z_m', label: string) => (
    <Field label={label} error={errors[name]?.message}>
      {(control) => (
        <Input
          {...control}
          type="number"
          step="any"
          inputMode="decimal"
          className="font-mono"
          {...form.register(name, { valueAsNumber: true, onChange: () => form.clearErrors('root.distance') })}
        />
      )}
    </Field>
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label={editing ? `Edit observatory ${observatory.code}` : 'Add an observatory'}>
      {errors.root?.server ? <Alert tone="error">{errors.root.server.message}</Alert> : null}
      <div className="grid grid-cols-1 gap-4 md:grid-cols-[10rem_1fr]">
        <Field label="Code" hint={editing ? 'The code cannot change.' : '2–16 of a–z 0–9 - _'} error={errors.code?.message}>
          {(control) => <Input {...control} className="font-mono" readOnly={editing} autoComplete="off" {...form.register('code')} />}
        </Field>
        <Field label="Name" error={errors.name?.message}>
          {(control) => <Input {...control} autoComplete="off" {...form.register('name')} />}
        </Field>
      </div>
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-2 text-sm font-medium text-night-100">ITRF position (metres from the geocentre)</legend>
        <div className="grid grid-cols-1 gap-4 md:grid-cols-3">
          {numberField('itrf_x_m', 'ITRF x (m)')}
          {numberField('itrf_y_m', 'ITRF y (m)')}
          {numberField('itrf_z_m', 'ITRF z (m)')}
        </div>
        <DistanceReadout control={form.control} />
        {errors.root?.distance ? <Alert tone="error">{errors.root.distance.message}</Alert> : null}
      </fieldset>
      <fieldset className="flex flex-col gap-2">
        <legend className="mb-1 text-sm font-medium text-night-100">Clock-correction points (optional)</legend>
        <p className="text-xs text-night-300">Each point is added to this observatory's arrival times to bring them to UTC; values between points are interpolated linearly.</p>
        {errors.clock_corrections?.message ? <p className="text-xs text-alarm-300">{errors.clock_corrections.message}</p> : null}
        {points.fields.map((point, index) => {
          const rowErrors = errors.clock_corrections?.[index];
          const mjdId = `clock-${point.id}-mjd`;
          const corrId = `clock-${point.id}-us`;
          return (
            <div key={point.id} className="grid grid-cols-[1fr_1fr_auto] items-start gap-3">
              <div className="flex flex-col gap-1">
                <label htmlFor={mjdId} className="text-xs text-night-300">
                  MJD <span className="sr-only">of point {index + 1}</span>
                </label>
                <input
                  id={mjdId}
                  inputMode="decimal"
                  autoComplete="off"
                  className={cn(controlClasses, 'font-mono')}
                  aria-invalid={rowErrors?.mjd ? true : undefined}
                  {...form.register(`clock_corrections.${index}.mjd`)}
                />
                {rowErrors?.mjd ? <p className="text-xs text-alarm-300">{rowErrors.mjd.message}</p> : null}
              </div>
              <div className="flex flex-col gap-1">
                <label htmlFor={corrId} className="text-xs text-night-300">
                  Correction (µs) <span className="sr-only">of point {index + 1}</span>
                </label>
                <input
                  id={corrId}
                  type="number"
                  step="any"
                  className={cn(controlClasses, 'font-mono')}
                  aria-invalid={rowErrors?.correction_us ? true : undefined}
                  {...form.register(`clock_corrections.${index}.correction_us`, { valueAsNumber: true })}
                />
                {rowErrors?.correction_us ? <p className="text-xs text-alarm-300">{rowErrors.correction_us.message}</p> : null}
              </div>
              <Button variant="ghost" size="sm" className="mt-6" onClick={() => points.remove(index)} aria-label={`Remove point ${index + 1}`}>
                Remove
              </Button>
            </div>
          );
        })}
        <div>
          <Button variant="secondary" size="sm" onClick={() => points.append({ mjd: '', correction_us: Number.NaN })}>
            Add clock-correction point
          </Button>
        </div>
      </fieldset>
      <div className="flex gap-2">
        <Button type="submit" busy={form.formState.isSubmitting}>
          {editing ? 'Save changes' : 'Add observatory'}
        </Button>
      </div>
    </form>
  );
}

import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { applyServerErrors } from '../../../lib/apply-server-errors';
import { useCreatePulsar } from '../api/create-pulsar';
import type { Pulsar } from '../api/get-pulsars';
import { CreatePulsarBody } from '../pulsar-rules';

export function CreatePulsarForm({ onCreated }: { onCreated?: (pulsar: Pulsar) => void }) {
  const create = useCreatePulsar();
  const form = useForm<CreatePulsarBody>({
    resolver: zodResolver(CreatePulsarBody),
    defaultValues: { name: '', raHms: '', decDms: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      const pulsar = await create.mutateAsync(values);
      form.reset();
      onCreated?.(pulsar);
    } catch (error) {
      applyServerErrors(error, form.setError, ['name', 'raHms', 'decDms'], describeError);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Add a pulsar">
      {errors.root?.server ? <Alert tone="error">{errors.root.server.message}</Alert> : null}
      {create.isSuccess && !form.formState.isDirty ? <Alert tone="success">Pulsar {create.data.name} added.</Alert> : null}
      <Field label="Name" hint="For example J1101-4417" error={errors.name?.message}>
        {(control) => <Input {...control} className="font-mono" autoComplete="off" {...form.register('name')} />}
      </Field>
      <Field label="Right ascension" hint="hh:mm:ss.s" error={errors.raHms?.message}>
        {(control) => <Input {...control} className="font-mono" placeholder="11:01:07.43" autoComplete="off" {...form.register('raHms')} />}
      </Field>
      <Field label="Declination" hint="±dd:mm:ss" error={errors.decDms?.message}>
        {(control) => <Input {...control} className="font-mono" placeholder="-44:17:21.9" autoComplete="off" {...form.register('decDms')} />}
      </Field>
      <Button type="submit" busy={form.formState.isSubmitting}>
        Add pulsar
      </Button>
    </form>
  );
}

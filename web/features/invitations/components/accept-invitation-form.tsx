import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { applyServerErrors } from '../../../lib/apply-server-errors';
import { NewPassword, PASSWORD_MIN_LENGTH, PASSWORDS_DIFFER, passwordsMatch } from '../../auth/password-rules';
import { useAcceptInvitation } from '../api/accept-invitation';

const AcceptValues = z
  .object({
    displayName: z
      .string()
      .trim()
      .min(1, 'Display name: enter the name colleagues will see')
      .max(100, 'Display name: use at most 100 characters'),
    password: NewPassword,
    confirmPassword: z.string(),
  })
  .refine(passwordsMatch, PASSWORDS_DIFFER);
type AcceptValues = z.infer<typeof AcceptValues>;

export function AcceptInvitationForm({ token, onAccepted }: { token: string; onAccepted: () => void }) {
  const accept = useAcceptInvitation(token);
  const form = useForm<AcceptValues>({
    resolver: zodResolver(AcceptValues),
    defaultValues: { displayName: '', password: '', confirmPassword: '' },
  });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async ({ displayName, password }) => {
    try {
      await accept.mutateAsync({ displayName, password });
      onAccepted();
    } catch (error) {
      applyServerErrors(error, form.setError, ['displayName', 'password'], describeError);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {errors.root?.server ? <Alert tone="error">{errors.root.server.message}</Alert> : null}
      <Field label="Display name" error={errors.displayName?.message}>
        {(control) => <Input {...control} autoComplete="name" {...form.register('displayName')} />}
      </Field>
      <Field label="Password" hint={`At least ${PASSWORD_MIN_LENGTH} characters.`} error={errors.password?.message}>
        {(control) => <Input {...control} type="password" autoComplete="new-password" {...form.register('password')} />}
      </Field>
      <Field label="Confirm password" error={errors.confirmPassword?.message}>
        {(control) => <Input {...control} type="password" autoComplete="new-password" {...form.register('confirmPassword')} />}
      </Field>
      <Button type="submit" busy={form.formState.isSubmitting} className="w-full">
        Join Pulsekeeper
      </Button>
    </form>
  );
}

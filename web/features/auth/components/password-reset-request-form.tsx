import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { applyServerErrors } from '../../../lib/apply-server-errors';
import { PasswordResetBody, useRequestPasswordReset } from '../api/request-password-reset';

// Shown whether or not the address has an account (the API answers the same either way).
export const RESET_SENT_MESSAGE = 'If that address has an account, a message is on its way.';

export function PasswordResetRequestForm() {
  const request = useRequestPasswordReset();
  const form = useForm<PasswordResetBody>({ resolver: zodResolver(PasswordResetBody), defaultValues: { email: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await request.mutateAsync(values);
    } catch (error) {
      applyServerErrors(error, form.setError, ['email'], describeError);
    }
  });

  if (request.isSuccess) {
    return (
      <Alert tone="success" title="Check your inbox">
        {RESET_SENT_MESSAGE} The link in it lets you choose a new password.
      </Alert>
    );
  }
  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {errors.root?.server ? <Alert tone="error">{errors.root.server.message}</Alert> : null}
      <Field label="E-mail" error={errors.email?.message}>
        {(control) => <Input {...control} type="email" autoComplete="email" {...form.register('email')} />}
      </Field>
      <Button type="submit" busy={form.formState.isSubmitting} className="w-full">
        Send reset link
      </Button>
    </form>
  );
}

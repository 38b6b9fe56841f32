import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { z } from 'zod';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { applyServerErrors } from '../../../lib/apply-server-errors';
import { isApiError } from '../../../lib/api-client';
import { useCompletePasswordReset } from '../api/complete-password-reset';
import { NewPasswordPair, PASSWORD_MIN_LENGTH } from '../password-rules';

type Values = z.infer<typeof NewPasswordPair>;

export const RESET_LINK_GONE_MESSAGE = 'This reset link is no longer valid. Ask for a new one.';

// The API answers an unknown, used or expired token with 400 and a detail on path ["token"] (docs/api.md).
function isDeadResetLink(error: unknown): boolean {
  return isApiError(error) && (error.status === 404 || error.details.some((d) => d.path[0] === 'token'));
}

/** New password + confirmation for the reset link `token`; the API signs the user in on success. */
export function PasswordResetCompleteForm({ token, onDone }: { token: string; onDone: () => void }) {
  const complete = useCompletePasswordReset();
  const form = useForm<Values>({ resolver: zodResolver(NewPasswordPair), defaultValues: { password: '', confirmPassword: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async ({ password }) => {
    try {
      await complete.mutateAsync({ token, password });
      onDone();
    } catch (error) {
      if (isDeadResetLink(error)) form.setError('root.server', { type: 'server', message: RESET_LINK_GONE_MESSAGE });
      else applyServerErrors(error, form.setError, ['password'], describeError);
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {errors.root?.server ? <Alert tone="error">{errors.root.server.message}</Alert> : null}
      <Field label="New password" hint={`At least ${PASSWORD_MIN_LENGTH} characters.`} error={errors.password?.message}>
        {(control) => <Input {...control} type="password" autoComplete="new-password" {...form.register('password')} />}
      </Field>
      <Field label="Confirm password" error={errors.confirmPassword?.message}>
        {(control) => <Input {...control} type="password" autoComplete="new-password" {...form.register('confirmPassword')} />}
      </Field>
      <Button type="submit" busy={form.formState.isSubmitting} className="w-full">
        Set new password
      </Button>
    </form>
  );
}

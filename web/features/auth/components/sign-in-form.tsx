import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { TextLink } from '../../../components/text-link';
import { paths } from '../../../config/paths';
import { applyServerErrors } from '../../../lib/apply-server-errors';
import { isApiError } from '../../../lib/api-client';
import { SignInBody, useSignIn } from '../api/sign-in';

// One wording for every credential failure, so the form never reveals which addresses exist.
export const WRONG_CREDENTIALS_MESSAGE = 'E-mail or password is not right.';
export const TOO_MANY_ATTEMPTS_MESSAGE = 'Too many attempts — wait a minute and try again.';

function signInErrorMessage(error: unknown): string {
  if (isApiError(error) && error.status === 401) return WRONG_CREDENTIALS_MESSAGE;
  if (isApiError(error) && error.status === 429) return TOO_MANY_ATTEMPTS_MESSAGE;
  return describeError(error);
}

/** E-mail + password form; calls `onSignedIn` after the API accepted the credentials. */
export function SignInForm({ onSignedIn }: { onSignedIn: () => void }) {
  const signIn = useSignIn();
  const form = useForm<SignInBody>({ resolver: zodResolver(SignInBody), defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await signIn.mutateAsync(values);
      onSignedIn();
    } catch (error) {
      if (isApiError(error) && error.code === 'validation_failed') {
        applyServerErrors(error, form.setError, ['email', 'password'], signInErrorMessage);
      } else {
        form.setError('root.server', { type: 'server', message: signInErrorMessage(error) });
      }
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4">
      {errors.root?.server ? <Alert tone="error">{errors.root.server.message}</Alert> : null}
      <Field label="E-mail" error={errors.email?.message}>
        {(control) => <Input {...control} type="email" autoComplete="username" {...form.register('email')} />}
      </Field>
      <Field label="Password" error={errors.password?.message}>
        {(control) => <Input {...control} type="password" autoComplete="current-password" {...form.register('password')} />}
      </Field>
      <Button type="submit" busy={form.formState.isSubmitting} className="mt-2 w-full">
        Sign in
      </Button>
      <p className="text-center text-sm">
        <TextLink to={paths.resetPassword.href()}>Forgot your password?</TextLink>
      </p>
    </form>
  );
}

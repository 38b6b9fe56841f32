import { zodResolver } from '@hookform/resolvers/zod';
import { useForm } from 'react-hook-form';
import { Alert } from '../../../components/alert';
import { Button } from '../../../components/button';
import { Field } from '../../../components/field';
import { Input } from '../../../components/input';
import { describeError } from '../../../components/query-state';
import { Select } from '../../../components/select';
import { ROLE_LABELS, ROLES } from '../../../config/permissions';
import { applyServerErrors } from '../../../lib/apply-server-errors';
import { isApiError } from '../../../lib/api-client';
import { formatDateTimeUtc } from '../../../lib/format';
import { InviteUserBody, useInviteUser } from '../api/invite-user';

export function InviteUserForm() {
  const invite = useInviteUser();
  const form = useForm<InviteUserBody>({ resolver: zodResolver(InviteUserBody), defaultValues: { email: '', role: 'viewer' } });
  const { errors } = form.formState;

  const onSubmit = form.handleSubmit(async (values) => {
    try {
      await invite.mutateAsync(values);
      form.reset({ email: '', role: values.role });
    } catch (error) {
      // 409: the address already has an account (docs/api.md).
      if (isApiError(error) && error.code === 'conflict') {
        form.setError('email', { type: 'server', message: 'E-mail: this address already has an account' });
      } else {
        applyServerErrors(error, form.setError, ['email', 'role'], describeError);
      }
    }
  });

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-4" aria-label="Invite a user">
      {errors.root?.server ? <Alert tone="error">{errors.root.server.message}</Alert> : null}
      {invite.isSuccess && !form.formState.isDirty ? (
        <Alert tone="success" title="Invitation sent">
          {invite.data.email} can join as {ROLE_LABELS[invite.data.role as keyof typeof ROLE_LABELS] ?? invite.data.role} until{' '}
          {formatDateTimeUtc(invite.data.expiresAt)}.
        </Alert>
      ) : null}
      <Field label="E-mail" error={errors.email?.message}>
        {(control) => <Input {...control} type="email" autoComplete="off" {...form.register('email')} />}
      </Field>
      <Field label="Role" error={errors.role?.message}>
        {(control) => (
          <Select {...control} {...form.register('role')}>
            {ROLES.map((role) => (
              <option key={role} value={role}>
                {ROLE_LABELS[role]}
              </option>
            ))}
          </Select>
        )}
      </Field>
      <Button type="submit" busy={form.formState.isSubmitting}>
        Send invitation
      </Button>
    </form>
  );
}

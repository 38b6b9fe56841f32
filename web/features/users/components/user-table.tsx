import { Button } from '../../../components/button';
import { describeError } from '../../../components/query-state';
import { Select } from '../../../components/select';
import { Table, TBody, Td, Th, THead, Tr } from '../../../components/table';
import { ROLE_LABELS, ROLES } from '../../../config/permissions';
import { cn } from '../../../lib/cn';
import type { User } from '../api/get-users';
import { useUpdateUser } from '../api/update-user';

function UserRow({ user, isSelf }: { user: User; isSelf: boolean }) {
  const update = useUpdateUser();
  const selectId = `role-${user.id}`;
  return (
    <Tr className={cn(!user.active && 'opacity-60')}>
      <Td className="font-mono text-xs">{user.email}</Td>
      <Td>
        {user.displayName}
        {isSelf ? <span className="ml-2 text-xs text-night-400">(you)</span> : null}
      </Td>
      <Td>
        <label htmlFor={selectId} className="sr-only">
          Role of {user.email}
        </label>
        <Select
          id={selectId}
          className="h-8 w-40"
          value={user.role}
          disabled={update.isPending || isSelf}
          onChange={(e) => update.mutate({ id: user.id, patch: { role: e.target.value } })}
        >
          {ROLES.map((role) => (
            <option key={role} value={role}>
              {ROLE_LABELS[role]}
            </option>
          ))}
        </Select>
      </Td>
      <Td>
        <span className={cn('rounded-full px-2 py-0.5 text-xs', user.active ? 'bg-calm-500/15 text-calm-400' : 'bg-night-700 text-night-300')}>
          {user.active ? 'Active' : 'Deactivated'}
        </span>
      </Td>
      <Td className="text-right">
        <Button
          variant={user.active ? 'danger' : 'secondary'}
          size="sm"
          busy={update.isPending}
          disabled={isSelf}
          onClick={() => update.mutate({ id: user.id, patch: { active: !user.active } })}
          aria-label={`${user.active ? 'Deactivate' : 'Reactivate'} ${user.email}`}
        >
          {user.active ? 'Deactivate' : 'Reactivate'}
        </Button>
        {update.isError ? (
          <p role="alert" className="mt-1 text-xs text-alarm-300">
            {describeError(update.error)}
          </p>
        ) : null}
      </Td>
    </Tr>
  );
}

/** Every account; an administrator cannot demote or deactivate their own account from here. */
export function UserTable({ users, currentUserId }: { users: User[]; currentUserId: number | string }) {
  return (
    <Table aria-label="Users">
      <THead>
        <tr>
          <Th>E-mail</Th>
          <Th>Name</Th>
          <Th>Role</Th>
          <Th>Status</Th>
          <Th>
            <span className="sr-only">Actions</span>
          </Th>
        </tr>
      </THead>
      <TBody>
        {users.map((user) => (
          <UserRow key={user.id} user={user} isSelf={String(user.id) === String(currentUserId)} />
        ))}
      </TBody>
    </Table>
  );
}

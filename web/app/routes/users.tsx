import { Card, CardTitle } from '../../components/card';
import { Page } from '../../components/page';
import { ErrorPanel, LoadingPanel } from '../../components/query-state';
import { PERMISSIONS } from '../../config/permissions';
import { useMe } from '../../features/auth/api/get-me';
import { useUsers } from '../../features/users/api/get-users';
import { InviteUserForm } from '../../features/users/components/invite-user-form';
import { UserTable } from '../../features/users/components/user-table';
import { RequirePermission } from '../require-permission';

function UsersPanel() {
  const me = useMe();
  const users = useUsers();
  return (
    <div className="grid grid-cols-1 gap-6 lg:grid-cols-[1fr_20rem]">
      <div>
        {users.isPending ? (
          <LoadingPanel label="Loading users…" />
        ) : users.isError ? (
          <ErrorPanel error={users.error} onRetry={() => void users.refetch()} title="Could not load the users" />
        ) : (
          <UserTable users={users.data} currentUserId={me.data?.user.id ?? ''} />
        )}
      </div>
      <Card>
        <CardTitle>Invite someone</CardTitle>
        <InviteUserForm />
      </Card>
    </div>
  );
}

export default function UsersRoute() {
  return (
    <Page title="Users" description="Who can sign in, and with which role.">
      <RequirePermission permission={PERMISSIONS.manageUsers}>
        <UsersPanel />
      </RequirePermission>
    </Page>
  );
}

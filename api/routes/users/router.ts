/** /api/users: administrators list accounts, invite people, change roles and deactivate. */
import type { AppDeps, MailDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { validate } from '../../middleware/validate';
import { inviteUser } from '../../services/invitations/invite-user';
import { listUsers } from '../../services/users/list-users';
import { updateUser } from '../../services/users/update-user';
import type { RouteTable } from '../route-table';
import { InviteUserBody, UpdateUserBody, UserParams } from './schema';

export function addUserRoutes(routes: RouteTable, deps: AppDeps, mail: MailDeps): void {
  routes.add({ method: 'get', path: '/api/users', access: 'users:manage' }, async (_req, res) => {
    res.json({ data: await listUsers(deps.knex) });
  });

  routes.add({ method: 'post', path: '/api/users/invitations', access: 'users:manage' }, validate({ body: InviteUserBody }), async (_req, res) => {
    const invitation = await inviteUser(mail, res.locals.body as InviteUserBody, currentUser(res).id);
    res.status(201).json({ data: invitation });
  });

  routes.add(
    { method: 'patch', path: '/api/users/:id', access: 'users:manage' },
    validate({ params: UserParams, body: UpdateUserBody }),
    async (_req, res) => {
      const { id } = res.locals.params as UserParams;
      res.json({ data: await updateUser(deps.knex, currentUser(res).id, id, res.locals.body as UpdateUserBody) });
    },
  );
}

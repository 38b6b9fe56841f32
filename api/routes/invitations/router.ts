/** /api/invitations/:token: what an invitation is for, and accepting it (creates the account, signs in). */
import type { AppDeps } from '../../app-deps';
import { signInSession } from '../../auth/session-data';
import { presentUser } from '../../db/users';
import { validate } from '../../middleware/validate';
import { acceptInvitation } from '../../services/invitations/accept-invitation';
import { findOpenInvitation } from '../../services/invitations/find-open-invitation';
import type { RouteTable } from '../route-table';
import { AcceptInvitationBody, InvitationParams } from './schema';

export function addInvitationRoutes(routes: RouteTable, deps: AppDeps): void {
  routes.add({ method: 'get', path: '/api/invitations/:token', access: 'public' }, validate({ params: InvitationParams }), async (_req, res) => {
    const invitation = await findOpenInvitation(deps.knex, (res.locals.params as InvitationParams).token);
    res.json({ data: { email: invitation.email, role: invitation.role } });
  });

  routes.add(
    { method: 'post', path: '/api/invitations/:token/accept', access: 'public' },
    validate({ params: InvitationParams, body: AcceptInvitationBody }),
    async (req, res) => {
      const { token } = res.locals.params as InvitationParams;
      const user = await acceptInvitation(deps.knex, token, res.locals.body as AcceptInvitationBody);
      await signInSession(req, user.id);
      res.status(201).json({ data: { user: presentUser(user) } });
    },
  );
}

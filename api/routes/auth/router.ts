/** /api/auth: CSRF token, sign-in/out, the current user, password reset. */
import type { AppDeps, MailDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { permissionsOf } from '../../auth/permissions';
import { destroySession, signInSession } from '../../auth/session-data';
import { presentUser } from '../../db/users';
import type { Csrf } from '../../middleware/csrf';
import type { createRateLimits } from '../../middleware/rate-limits';
import { validate } from '../../middleware/validate';
import { completePasswordReset } from '../../services/auth/complete-password-reset';
import { requestPasswordReset } from '../../services/auth/request-password-reset';
import { signIn } from '../../services/auth/sign-in';
import type { RouteTable } from '../route-table';
import { PasswordResetBody, PasswordResetCompleteBody, SignInBody } from './schema';

export function addAuthRoutes(
  routes: RouteTable,
  deps: AppDeps,
  mail: MailDeps,
  csrf: Csrf,
  limits: ReturnType<typeof createRateLimits>,
): void {
  routes.add({ method: 'get', path: '/api/auth/csrf', access: 'public' }, (req, res) => {
    res.json({ data: { token: csrf.tokenFor(req) } });
  });

  routes.add(
    { method: 'post', path: '/api/auth/sign-in', access: 'public' },
    ...limits.signIn,
    validate({ body: SignInBody }),
    async (req, res) => {
      const user = await signIn(deps.knex, res.locals.body as SignInBody);
      await signInSession(req, user.id);
      res.json({ data: { user: presentUser(user) } });
    },
  );

  routes.add({ method: 'post', path: '/api/auth/sign-out', access: 'signed-in' }, async (req, res) => {
    await destroySession(req);
    res.status(204).end();
  });

  routes.add({ method: 'get', path: '/api/auth/me', access: 'signed-in' }, (_req, res) => {
    const user = currentUser(res);
    res.json({ data: { user: presentUser(user), permissions: permissionsOf(user.role) } });
  });

  routes.add(
    { method: 'post', path: '/api/auth/password-reset', access: 'public' },
    ...limits.passwordReset,
    validate({ body: PasswordResetBody }),
    (_req, res) => {
      requestPasswordReset(mail, (res.locals.body as PasswordResetBody).email);
      res.status(202).json({ data: { sent: true } });
    },
  );

  routes.add(
    { method: 'post', path: '/api/auth/password-reset/complete', access: 'public' },
    validate({ body: PasswordResetCompleteBody }),
    async (req, res) => {
      const user = await completePasswordReset(deps.knex, res.locals.body as PasswordResetCompleteBody);
      await signInSession(req, user.id);
      res.json({ data: { user: presentUser(user) } });
    },
  );
}

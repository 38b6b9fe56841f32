/** E-mail subscriptions: the caller's list and the per-pulsar switch (the per-campaign one is in routes/campaigns). */
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { validate } from '../../middleware/validate';
import { listSubscriptions } from '../../services/notifications/list-subscriptions';
import { setSubscription } from '../../services/notifications/set-subscription';
import { SubscriptionBody } from '../campaigns/schema';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';

export function addNotificationRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex } = deps;

  routes.add({ method: 'get', path: '/api/notifications', access: 'signed-in' }, async (_req, res) => {
    res.json({ data: await listSubscriptions(knex, currentUser(res).id) });
  });

  routes.add(
    { method: 'put', path: '/api/pulsars/:id/notification', access: 'signed-in' },
    validate({ params: PulsarParams, body: SubscriptionBody }),
    async (_req, res) => {
      const { id } = res.locals.params as PulsarParams;
      const { subscribed } = res.locals.body as SubscriptionBody;
      res.json({ data: await setSubscription(knex, currentUser(res).id, { kind: 'pulsar', id }, subscribed) });
    },
  );
}

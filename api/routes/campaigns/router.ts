/** /api/campaigns: start, list, read and cancel campaigns; subscribe to a campaign's e-mail. */
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { validate } from '../../middleware/validate';
import { cancelCampaign } from '../../services/campaigns/cancel-campaign';
import { createCampaign } from '../../services/campaigns/create-campaign';
import { getCampaign } from '../../services/campaigns/get-campaign';
import { listCampaigns } from '../../services/campaigns/list-campaigns';
import { setSubscription } from '../../services/notifications/set-subscription';
import type { RouteTable } from '../route-table';
import { CampaignParams, CreateCampaignBody, SubscriptionBody } from './schema';

export function addCampaignRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex, queue } = deps;

  routes.add({ method: 'post', path: '/api/campaigns', access: 'campaigns:start' }, validate({ body: CreateCampaignBody }), async (_req, res) => {
    res.status(202).json({ data: await createCampaign({ knex, queue }, res.locals.body as CreateCampaignBody, currentUser(res).id) });
  });

  routes.add({ method: 'get', path: '/api/campaigns', access: 'campaigns:read' }, async (_req, res) => {
    res.json({ data: await listCampaigns(knex) });
  });

  routes.add({ method: 'get', path: '/api/campaigns/:id', access: 'campaigns:read' }, validate({ params: CampaignParams }), async (_req, res) => {
    res.json({ data: await getCampaign(knex, (res.locals.params as CampaignParams).id) });
  });

  routes.add(
    { method: 'post', path: '/api/campaigns/:id/cancel', access: 'campaigns:start' },
    validate({ params: CampaignParams }),
    async (_req, res) => {
      res.json({ data: await cancelCampaign({ knex, queue }, (res.locals.params as CampaignParams).id) });
    },
  );

  routes.add(
    { method: 'put', path: '/api/campaigns/:id/notification', access: 'signed-in' },
    validate({ params: CampaignParams, body: SubscriptionBody }),
    async (_req, res) => {
      const { id } = res.locals.params as CampaignParams;
      const { subscribed } = res.locals.body as SubscriptionBody;
      res.json({ data: await setSubscription(knex, currentUser(res).id, { kind: 'campaign', id }, subscribed) });
    },
  );
}

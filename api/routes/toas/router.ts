/** /api/pulsars/:id/toas: a pulsar's stored arrival times as columns. */
import type { AppDeps } from '../../app-deps';
import { validate } from '../../middleware/validate';
import { listToas } from '../../services/toas/list-toas';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';

export function addToaRoutes(routes: RouteTable, deps: AppDeps): void {
  routes.add({ method: 'get', path: '/api/pulsars/:id/toas', access: 'pulsars:read' }, validate({ params: PulsarParams }), async (_req, res) => {
    res.json({ data: await listToas(deps.knex, (res.locals.params as PulsarParams).id) });
  });
}

/** /api/outbox: mail captured by the local sink (dev/test), for administrators. */
import type { AppDeps } from '../../app-deps';
import { listOutbox } from '../../services/outbox/list-outbox';
import type { RouteTable } from '../route-table';

export function addOutboxRoutes(routes: RouteTable, deps: AppDeps): void {
  routes.add({ method: 'get', path: '/api/outbox', access: 'outbox:read' }, async (_req, res) => {
    res.json({ data: await listOutbox(deps.knex) });
  });
}

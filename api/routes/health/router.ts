/** /api/health: 200 when MariaDB and Redis answer, else 503 service_unavailable (with the same data). */
import type { AppDeps } from '../../app-deps';
import { checkHealth } from '../../services/health/check-health';
import type { RouteTable } from '../route-table';

export function addHealthRoutes(routes: RouteTable, deps: AppDeps): void {
  routes.add({ method: 'get', path: '/api/health', access: 'public' }, async (_req, res) => {
    const health = await checkHealth(deps.knex, deps.redis);
    const down = (['database', 'redis'] as const).filter((part) => health[part] === 'down');
    if (down.length === 0) {
      res.json({ data: health });
      return;
    }
    // A failure keeps the one error shape; `data` says which part is down.
    res.status(503).json({ error: { code: 'service_unavailable', message: `${down.join(' and ')} not answering` }, data: health });
  });
}

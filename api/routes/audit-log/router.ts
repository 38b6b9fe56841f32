/** GET /api/pulsars/:id/audit-log: who did what when to one pulsar, newest first, paginated (analyst and up). */
import type { AppDeps } from '../../app-deps';
import { AuditLogQuery } from '../../contracts/audit-log';
import { validate } from '../../middleware/validate';
import { listAuditLog } from '../../services/audit-log/list-audit-log';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';

export function addAuditLogRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex } = deps;

  routes.add(
    { method: 'get', path: '/api/pulsars/:id/audit-log', access: 'audit-log:read' },
    validate({ params: PulsarParams, query: AuditLogQuery }),
    async (_req, res) => {
      const { entries, meta } = await listAuditLog(knex, (res.locals.params as PulsarParams).id, res.locals.query as AuditLogQuery);
      res.json({ data: entries, meta });
    },
  );
}

/** /api/pulsars/:id/exclusions: leaving TOAs out of fits, taking them back, and the history. */
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { ExcludeToasBody, RestoreToasBody } from '../../contracts/toas';
import { validate } from '../../middleware/validate';
import { excludeToas } from '../../services/toas/exclude-toas';
import { listExclusions } from '../../services/toas/list-exclusions';
import { restoreToas } from '../../services/toas/restore-toas';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';

export function addExclusionRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex } = deps;

  routes.add(
    { method: 'post', path: '/api/pulsars/:id/exclusions', access: 'toas:exclude' },
    validate({ params: PulsarParams, body: ExcludeToasBody }),
    async (_req, res) => {
      const result = await excludeToas(knex, (res.locals.params as PulsarParams).id, res.locals.body as ExcludeToasBody, currentUser(res).id);
      res.status(201).json({ data: result });
    },
  );

  routes.add(
    { method: 'post', path: '/api/pulsars/:id/exclusions/restore', access: 'toas:exclude' },
    validate({ params: PulsarParams, body: RestoreToasBody }),
    async (_req, res) => {
      res.json({ data: await restoreToas(knex, (res.locals.params as PulsarParams).id, res.locals.body as RestoreToasBody, currentUser(res).id) });
    },
  );

  routes.add({ method: 'get', path: '/api/pulsars/:id/exclusions', access: 'pulsars:read' }, validate({ params: PulsarParams }), async (_req, res) => {
    res.json({ data: await listExclusions(knex, (res.locals.params as PulsarParams).id) });
  });
}

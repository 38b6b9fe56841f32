/** /api/observatories: everyone reads, administrators manage. */
import type { AppDeps } from '../../app-deps';
import type { Observatory } from '../../../worker/timing/earth/observatory';
import { validate } from '../../middleware/validate';
import { createObservatory } from '../../services/observatories/create-observatory';
import { deleteObservatory } from '../../services/observatories/delete-observatory';
import { getObservatory } from '../../services/observatories/get-observatory';
import { listObservatories } from '../../services/observatories/list-observatories';
import { updateObservatory } from '../../services/observatories/update-observatory';
import type { RouteTable } from '../route-table';
import { CreateObservatoryBody, ObservatoryParams, UpdateObservatoryBody } from './schema';

export function addObservatoryRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex } = deps;
  const code = (locals: Record<string, unknown>) => (locals.params as ObservatoryParams).code;

  routes.add({ method: 'get', path: '/api/observatories', access: 'observatories:read' }, async (_req, res) => {
    res.json({ data: await listObservatories(knex) });
  });

  routes.add(
    { method: 'post', path: '/api/observatories', access: 'observatories:manage' },
    validate({ body: CreateObservatoryBody }),
    async (_req, res) => {
      res.status(201).json({ data: await createObservatory(knex, res.locals.body as Observatory) });
    },
  );

  routes.add(
    { method: 'get', path: '/api/observatories/:code', access: 'observatories:read' },
    validate({ params: ObservatoryParams }),
    async (_req, res) => {
      res.json({ data: await getObservatory(knex, code(res.locals)) });
    },
  );

  routes.add(
    { method: 'patch', path: '/api/observatories/:code', access: 'observatories:manage' },
    validate({ params: ObservatoryParams, body: UpdateObservatoryBody }),
    async (_req, res) => {
      res.json({ data: await updateObservatory(knex, code(res.locals), res.locals.body as UpdateObservatoryBody) });
    },
  );

  routes.add(
    { method: 'delete', path: '/api/observatories/:code', access: 'observatories:manage' },
    validate({ params: ObservatoryParams }),
    async (_req, res) => {
      await deleteObservatory(knex, code(res.locals));
      res.status(204).end();
    },
  );
}

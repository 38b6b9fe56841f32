/** /api/pulsars: the dashboard list, adding pulsars, and queueing their statistics job. */
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { CreatePulsarBody } from '../../contracts/pulsar';
import { validate } from '../../middleware/validate';
import { startToaStatisticsJob } from '../../services/jobs/start-toa-statistics-job';
import { createPulsar } from '../../services/pulsars/create-pulsar';
import { getPulsar } from '../../services/pulsars/get-pulsar';
import { listPulsars } from '../../services/pulsars/list-pulsars';
import type { RouteTable } from '../route-table';
import { PulsarParams } from './schema';

export function addPulsarRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex } = deps;

  routes.add({ method: 'get', path: '/api/pulsars', access: 'pulsars:read' }, async (_req, res) => {
    res.json({ data: await listPulsars(knex) });
  });

  routes.add({ method: 'post', path: '/api/pulsars', access: 'pulsars:create' }, validate({ body: CreatePulsarBody }), async (_req, res) => {
    res.status(201).json({ data: await createPulsar(knex, res.locals.body as CreatePulsarBody, currentUser(res).id) });
  });

  routes.add({ method: 'get', path: '/api/pulsars/:id', access: 'pulsars:read' }, validate({ params: PulsarParams }), async (_req, res) => {
    res.json({ data: await getPulsar(knex, (res.locals.params as PulsarParams).id) });
  });

  routes.add(
    { method: 'post', path: '/api/pulsars/:id/statistics-jobs', access: 'jobs:start' },
    validate({ params: PulsarParams }),
    async (_req, res) => {
      res.status(202).json({ data: await startToaStatisticsJob(knex, deps.queue, (res.locals.params as PulsarParams).id) });
    },
  );
}

/** Fit runs: queue (or reuse) per pulsar, list, read one, residuals (columnar or CSV), explorer columns, fitted model download, cancel. */
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { CreateFitRunBody } from '../../contracts/fit-runs';
import { validate } from '../../middleware/validate';
import { cancelFitRun } from '../../services/fit-runs/cancel-fit-run';
import { createFitRun } from '../../services/fit-runs/create-fit-run';
import { loadFitResiduals, residualCsv, residualTable } from '../../services/fit-runs/get-fit-residuals';
import { getFitExplorer } from '../../services/fit-runs/get-fit-explorer';
import { getFitRun } from '../../services/fit-runs/get-fit-run';
import { getFittedModel } from '../../services/fit-runs/get-fitted-model';
import { listFitRuns } from '../../services/fit-runs/list-fit-runs';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';
import { FitRunParams, ResidualsQuery } from './schema';

export function addFitRunRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex, queue } = deps;

  routes.add(
    { method: 'post', path: '/api/pulsars/:id/fit-runs', access: 'fits:run' },
    validate({ params: PulsarParams, body: CreateFitRunBody }),
    async (_req, res) => {
      const body = res.locals.body as CreateFitRunBody;
      const outcome = await createFitRun(
        { knex, queue },
        { pulsarId: (res.locals.params as PulsarParams).id, revisionId: body.revisionId, recompute: body.recompute, requestedBy: currentUser(res).id },
      );
      res.status(outcome.reused ? 200 : 202).json({ data: outcome });
    },
  );

  routes.add({ method: 'get', path: '/api/pulsars/:id/fit-runs', access: 'pulsars:read' }, validate({ params: PulsarParams }), async (_req, res) => {
    res.json({ data: await listFitRuns(knex, (res.locals.params as PulsarParams).id) });
  });

  routes.add({ method: 'get', path: '/api/fit-runs/:id', access: 'pulsars:read' }, validate({ params: FitRunParams }), async (_req, res) => {
    res.json({ data: await getFitRun(knex, (res.locals.params as FitRunParams).id) });
  });

  routes.add(
    { method: 'get', path: '/api/fit-runs/:id/residuals', access: 'pulsars:read' },
    validate({ params: FitRunParams, query: ResidualsQuery }),
    async (_req, res) => {
      const id = (res.locals.params as FitRunParams).id;
      const columns = await loadFitResiduals(knex, id);
      if ((res.locals.query as ResidualsQuery).format === 'csv') {
        res.type('text/csv; charset=utf-8').attachment(`fit-${id}-residuals.csv`).send(residualCsv(columns));
        return;
      }
      res.json({ data: residualTable(columns) });
    },
  );

  // Residual explorer columns (api/contracts/explorer.ts): TOAs, barycentric days, delays, partials.
  routes.add({ method: 'get', path: '/api/fit-runs/:id/explorer', access: 'pulsars:read' }, validate({ params: FitRunParams }), async (_req, res) => {
    res.json({ data: await getFitExplorer(knex, (res.locals.params as FitRunParams).id) });
  });

  routes.add({ method: 'get', path: '/api/fit-runs/:id/fitted-model', access: 'pulsars:read' }, validate({ params: FitRunParams }), async (_req, res) => {
    const { model, fileName } = await getFittedModel(knex, (res.locals.params as FitRunParams).id);
    res.type('application/json').attachment(fileName).send(`${JSON.stringify(model, null, 2)}\n`);
  });

  routes.add({ method: 'post', path: '/api/fit-runs/:id/cancel', access: 'fits:run' }, validate({ params: FitRunParams }), async (_req, res) => {
    res.json({ data: await cancelFitRun({ knex, queue }, (res.locals.params as FitRunParams).id) });
  });
}

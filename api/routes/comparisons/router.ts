/**
 * Fit comparisons: computed on demand for 2–4 runs of a pulsar (readable by every role),
 * saved with a comment (lead and up), listed per pulsar and read back by id (linkable).
 */
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { FitComparisonQuery, SaveComparisonBody } from '../../contracts/comparisons';
import { validate } from '../../middleware/validate';
import { getFitComparison } from '../../services/comparisons/get-fit-comparison';
import { getSavedComparison } from '../../services/comparisons/get-saved-comparison';
import { listComparisons } from '../../services/comparisons/list-comparisons';
import { saveComparison } from '../../services/comparisons/save-comparison';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';
import { ComparisonParams } from './schema';

export function addComparisonRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex } = deps;

  routes.add(
    { method: 'get', path: '/api/pulsars/:id/fit-comparison', access: 'pulsars:read' },
    validate({ params: PulsarParams, query: FitComparisonQuery }),
    async (_req, res) => {
      const { runs } = res.locals.query as FitComparisonQuery;
      res.json({ data: await getFitComparison(knex, (res.locals.params as PulsarParams).id, runs) });
    },
  );

  routes.add(
    { method: 'post', path: '/api/pulsars/:id/comparisons', access: 'fits:compare' },
    validate({ params: PulsarParams, body: SaveComparisonBody }),
    async (_req, res) => {
      const pulsarId = (res.locals.params as PulsarParams).id;
      res.status(201).json({ data: await saveComparison(knex, pulsarId, currentUser(res).id, res.locals.body as SaveComparisonBody) });
    },
  );

  routes.add({ method: 'get', path: '/api/pulsars/:id/comparisons', access: 'pulsars:read' }, validate({ params: PulsarParams }), async (_req, res) => {
    res.json({ data: await listComparisons(knex, (res.locals.params as PulsarParams).id) });
  });

  routes.add({ method: 'get', path: '/api/comparisons/:id', access: 'pulsars:read' }, validate({ params: ComparisonParams }), async (_req, res) => {
    res.json({ data: await getSavedComparison(knex, (res.locals.params as ComparisonParams).id) });
  });
}

/** Companion-search runs: queue (or reuse) per pulsar, list, read one, its periodograms, cancel, save the resulting model as a revision. */
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { CreateSearchRunBody, SaveSearchRevisionBody } from '../../contracts/search-runs';
import { validate } from '../../middleware/validate';
import { cancelSearchRun } from '../../services/search-runs/cancel-search-run';
import { createSearchRun } from '../../services/search-runs/create-search-run';
import { getSearchPeriodograms } from '../../services/search-runs/get-search-periodograms';
import { getSearchRun } from '../../services/search-runs/get-search-run';
import { listSearchRuns } from '../../services/search-runs/list-search-runs';
import { saveSearchRevision } from '../../services/search-runs/save-search-revision';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';
import { SearchRunParams } from './schema';

export function addSearchRunRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex, queue } = deps;

  routes.add(
    { method: 'post', path: '/api/pulsars/:id/search-runs', access: 'searches:run' },
    validate({ params: PulsarParams, body: CreateSearchRunBody }),
    async (_req, res) => {
      const body = res.locals.body as CreateSearchRunBody;
      const outcome = await createSearchRun({ knex, queue }, { ...body, pulsarId: (res.locals.params as PulsarParams).id, requestedBy: currentUser(res).id });
      res.status(outcome.reused ? 200 : 202).json({ data: outcome });
    },
  );

  routes.add({ method: 'get', path: '/api/pulsars/:id/search-runs', access: 'pulsars:read' }, validate({ params: PulsarParams }), async (_req, res) => {
    res.json({ data: await listSearchRuns(knex, (res.locals.params as PulsarParams).id) });
  });

  routes.add({ method: 'get', path: '/api/search-runs/:id', access: 'pulsars:read' }, validate({ params: SearchRunParams }), async (_req, res) => {
    res.json({ data: await getSearchRun(knex, (res.locals.params as SearchRunParams).id) });
  });

  routes.add({ method: 'get', path: '/api/search-runs/:id/periodograms', access: 'pulsars:read' }, validate({ params: SearchRunParams }), async (_req, res) => {
    res.json({ data: await getSearchPeriodograms(knex, (res.locals.params as SearchRunParams).id) });
  });

  routes.add({ method: 'post', path: '/api/search-runs/:id/cancel', access: 'searches:run' }, validate({ params: SearchRunParams }), async (_req, res) => {
    res.json({ data: await cancelSearchRun({ knex, queue }, (res.locals.params as SearchRunParams).id) });
  });

  routes.add(
    { method: 'post', path: '/api/search-runs/:id/save-revision', access: 'models:edit' },
    validate({ params: SearchRunParams, body: SaveSearchRevisionBody }),
    async (_req, res) => {
      const body = res.locals.body as SaveSearchRevisionBody;
      res.status(201).json({ data: await saveSearchRevision(knex, (res.locals.params as SearchRunParams).id, currentUser(res).id, body.message) });
    },
  );
}

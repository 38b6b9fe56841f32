/** Model revisions: list and save per pulsar, read one, release and withdraw a release (lead and up). */
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { validate } from '../../middleware/validate';
import { createRevision } from '../../services/revisions/create-revision';
import { getRevision } from '../../services/revisions/get-revision';
import { listRevisions } from '../../services/revisions/list-revisions';
import { releaseRevision } from '../../services/revisions/release-revision';
import { withdrawRevisionRelease } from '../../services/revisions/withdraw-revision-release';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';
import { CreateRevisionBody, ReleaseRevisionBody, RevisionParams } from './schema';

export function addRevisionRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex } = deps;

  routes.add({ method: 'get', path: '/api/pulsars/:id/revisions', access: 'pulsars:read' }, validate({ params: PulsarParams }), async (_req, res) => {
    res.json({ data: await listRevisions(knex, (res.locals.params as PulsarParams).id) });
  });

  routes.add(
    { method: 'post', path: '/api/pulsars/:id/revisions', access: 'models:edit' },
    validate({ params: PulsarParams, body: CreateRevisionBody }),
    async (_req, res) => {
      const pulsarId = (res.locals.params as PulsarParams).id;
      res.status(201).json({ data: await createRevision(knex, pulsarId, currentUser(res).id, res.locals.body as CreateRevisionBody) });
    },
  );

  routes.add({ method: 'get', path: '/api/revisions/:id', access: 'pulsars:read' }, validate({ params: RevisionParams }), async (_req, res) => {
    res.json({ data: await getRevision(knex, (res.locals.params as RevisionParams).id) });
  });

  routes.add(
    { method: 'post', path: '/api/revisions/:id/release', access: 'models:release' },
    validate({ params: RevisionParams, body: ReleaseRevisionBody }),
    async (_req, res) => {
      const { note } = res.locals.body as ReleaseRevisionBody;
      res.json({ data: await releaseRevision(knex, (res.locals.params as RevisionParams).id, currentUser(res).id, note) });
    },
  );

  routes.add(
    { method: 'post', path: '/api/revisions/:id/withdraw-release', access: 'models:release' },
    validate({ params: RevisionParams }),
    async (_req, res) => {
      res.json({ data: await withdrawRevisionRelease(knex, (res.locals.params as RevisionParams).id, currentUser(res).id) });
    },
  );
}

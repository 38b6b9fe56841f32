/** /api/jobs/:id: state and progress of a queued job. */
import type { AppDeps } from '../../app-deps';
import { validate } from '../../middleware/validate';
import { getJobStatus } from '../../services/jobs/get-job-status';
import type { RouteTable } from '../route-table';
import { JobParams } from './schema';

export function addJobRoutes(routes: RouteTable, deps: AppDeps): void {
  routes.add({ method: 'get', path: '/api/jobs/:id', access: 'jobs:read' }, validate({ params: JobParams }), async (_req, res) => {
    res.json({ data: await getJobStatus(deps.queue, (res.locals.params as JobParams).id) });
  });
}

/**
 * TOA batches: streaming multipart upload of an arrival-time file, the list of
 * a pulsar's batches, and deleting a batch with its TOAs.
 *
 * The upload limits default to 50 MiB / 500 000 rows (api/contracts/toas.ts);
 * tests lower them through `app.locals.toaUploadLimits = { maxBytes?, maxRows? }`.
 */
import type { Application } from 'express';
import type { AppDeps } from '../../app-deps';
import { currentUser } from '../../auth/current-user';
import { MAX_TOA_ROWS, MAX_TOA_UPLOAD_BYTES } from '../../contracts/toas';
import { validate } from '../../middleware/validate';
import { deleteToaBatch } from '../../services/toas/delete-toa-batch';
import { listToaBatches } from '../../services/toas/list-toa-batches';
import { receiveToaUpload } from '../../services/toas/receive-toa-upload';
import { storeToaBatch } from '../../services/toas/store-toa-batch';
import { PulsarParams } from '../pulsars/schema';
import type { RouteTable } from '../route-table';
import { ToaBatchParams } from './schema';

export interface ToaUploadLimits {
  maxBytes: number;
  maxRows: number;
}

function uploadLimits(app: Application): ToaUploadLimits {
  const override = (app.locals.toaUploadLimits ?? {}) as Partial<ToaUploadLimits>;
  return { maxBytes: override.maxBytes ?? MAX_TOA_UPLOAD_BYTES, maxRows: override.maxRows ?? MAX_TOA_ROWS };
}

export function addToaBatchRoutes(routes: RouteTable, deps: AppDeps): void {
  const { knex } = deps;

  routes.add(
    { method: 'post', path: '/api/pulsars/:id/toa-batches', access: 'toas:upload' },
    validate({ params: PulsarParams }),
    async (req, res) => {
      const limits = uploadLimits(req.app);
      const upload = await receiveToaUpload(req, limits.maxBytes);
      const batch = await storeToaBatch(knex, {
        pulsarId: (res.locals.params as PulsarParams).id,
        fileName: upload.fileName,
        uploadedBy: currentUser(res).id,
        bytes: upload.bytes,
        checksumSha256: upload.checksumSha256,
        confirmDuplicate: upload.confirmDuplicate,
        maxRows: limits.maxRows,
      });
      res.status(201).json({ data: batch });
    },
  );

  routes.add({ method: 'get', path: '/api/pulsars/:id/toa-batches', access: 'pulsars:read' }, validate({ params: PulsarParams }), async (_req, res) => {
    res.json({ data: await listToaBatches(knex, (res.locals.params as PulsarParams).id) });
  });

  routes.add({ method: 'delete', path: '/api/toa-batches/:id', access: 'toa-batches:delete' }, validate({ params: ToaBatchParams }), async (_req, res) => {
    await deleteToaBatch(knex, (res.locals.params as ToaBatchParams).id, currentUser(res).id);
    res.status(204).end();
  });
}

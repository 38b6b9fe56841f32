/** Path of /api/toa-batches/:id (the upload itself is multipart, read by services/toas/receive-toa-upload.ts). */
import { z } from 'zod';

export const ToaBatchParams = z.strictObject({ id: z.coerce.number().int().positive().max(2 ** 31 - 1) });
export type ToaBatchParams = z.infer<typeof ToaBatchParams>;

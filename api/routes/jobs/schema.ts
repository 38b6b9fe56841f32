/** Path of /api/jobs/:id (a BullMQ job id). */
import { z } from 'zod';

export const JobParams = z.strictObject({ id: z.string().regex(/^[A-Za-z0-9:_-]{1,100}$/, 'is not a job id') });
export type JobParams = z.infer<typeof JobParams>;

/** Path of /api/pulsars/:id (the create body is in api/contracts/pulsar.ts, shared with the client). */
import { z } from 'zod';

export const PulsarParams = z.strictObject({ id: z.coerce.number().int().positive().max(2 ** 31 - 1) });
export type PulsarParams = z.infer<typeof PulsarParams>;

/** Paths of the comparison routes; the query and body schemas are in api/contracts/comparisons.ts (shared with the client). */
import { z } from 'zod';

export const ComparisonParams = z.strictObject({ id: z.coerce.number().int().positive().max(2 ** 31 - 1) });
export type ComparisonParams = z.infer<typeof ComparisonParams>;

/** Paths of the search-run routes (the bodies are CreateSearchRunBody and SaveSearchRevisionBody in api/contracts/search-runs.ts). */
import { z } from 'zod';

export const SearchRunParams = z.strictObject({ id: z.coerce.number().int().positive().max(2 ** 31 - 1) });
export type SearchRunParams = z.infer<typeof SearchRunParams>;

/** Paths and queries of the fit-run routes (the create body is CreateFitRunBody in api/contracts/fit-runs.ts). */
import { z } from 'zod';

export const FitRunParams = z.strictObject({ id: z.coerce.number().int().positive().max(2 ** 31 - 1) });
export type FitRunParams = z.infer<typeof FitRunParams>;

export const ResidualsQuery = z.strictObject({ format: z.enum(['json', 'csv'], { error: 'must be json or csv' }).optional() });
export type ResidualsQuery = z.infer<typeof ResidualsQuery>;

/**
 * Path and bodies of /api/observatories. A new observatory is checked by the
 * engine's own schema (worker/timing/earth/read-observatories.ts: code rules,
 * 6350–6400 km from the geocentre, strictly increasing clock MJDs), so the API
 * and the command line accept exactly the same objects.
 */
import { z } from 'zod';
import { observatoryFileSchema } from '../../../worker/timing/earth/read-observatories';

export const ObservatoryParams = z.strictObject({ code: z.string().min(1).max(64) });
export type ObservatoryParams = z.infer<typeof ObservatoryParams>;

export const CreateObservatoryBody = observatoryFileSchema;

/**
 * A patch names any fields but `code`; their values are checked when the
 * merged observatory is parsed with the same schema (update-observatory.ts).
 */
export const UpdateObservatoryBody = z.strictObject({
  name: z.unknown(),
  itrf_x_m: z.unknown(),
  itrf_y_m: z.unknown(),
  itrf_z_m: z.unknown(),
  clock_corrections: z.unknown(),
}).partial();
export type UpdateObservatoryBody = z.infer<typeof UpdateObservatoryBody>;

/** Bodies and paths of the model-revision routes (docs/api-workflow.md, "Model revisions"). */
import { z } from 'zod';

export const RevisionParams = z.strictObject({ id: z.coerce.number().int().positive().max(2 ** 31 - 1) });
export type RevisionParams = z.infer<typeof RevisionParams>;

export const CreateRevisionBody = z.strictObject({
  model: z.record(z.string(), z.unknown(), { error: 'must be the model file as a JSON object' }),
  message: z.string({ error: 'must be text' }).trim().min(1, 'must not be empty').max(500, 'must be at most 500 characters'),
  parentId: z.number({ error: 'must be a revision id' }).int().positive().optional(),
});
export type CreateRevisionBody = z.infer<typeof CreateRevisionBody>;

export const ReleaseRevisionBody = z.strictObject({
  note: z.string({ error: 'must be text' }).trim().min(1, 'must not be empty').max(500, 'must be at most 500 characters'),
});
export type ReleaseRevisionBody = z.infer<typeof ReleaseRevisionBody>;

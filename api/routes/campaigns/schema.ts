/** Bodies and params of /api/campaigns (docs/api-workflow.md "Campaigns"). */
import { z } from 'zod';

const Id = z.coerce.number().int().positive().max(2 ** 31 - 1);

export const CampaignParams = z.strictObject({ id: Id });
export type CampaignParams = z.infer<typeof CampaignParams>;

export const CreateCampaignBody = z.strictObject({
  name: z.string().trim().min(1, 'must not be empty').max(120, 'must be at most 120 characters'),
  pulsarIds: z.union([
    z.literal('all'),
    z.array(z.number().int().positive().max(2 ** 31 - 1)).min(1, 'must list at least one pulsar').max(10_000, 'must list at most 10000 pulsars'),
  ], { error: "must be 'all' or a list of pulsar ids" }),
  revisionChoice: z.enum(['latest', 'released'], { error: "must be 'latest' or 'released'" }),
  notifyMe: z.boolean().optional(),
  recompute: z.boolean().optional(),
});
export type CreateCampaignBody = z.infer<typeof CreateCampaignBody>;

export const SubscriptionBody = z.strictObject({ subscribed: z.boolean({ error: 'must be true or false' }) });
export type SubscriptionBody = z.infer<typeof SubscriptionBody>;

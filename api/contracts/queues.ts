/**
 * Queue names and job payload schemas shared by the API (which queues) and the
 * worker (which re-parses every payload with the same schema).
 */
import { z } from 'zod';

export const QUEUE_NAME = 'pulsekeeper';

export const ToaStatisticsJob = z.object({ pulsarId: z.number().int().positive() }).strict();
export type ToaStatisticsJob = z.infer<typeof ToaStatisticsJob>;

/** Payload of the `fit-run` job: the fit_runs row holds everything else (api/services/fit-runs/create-fit-run.ts). */
export const FitRunJob = z.object({ fitRunId: z.number().int().positive() }).strict();
export type FitRunJob = z.infer<typeof FitRunJob>;

export const JOB_TYPES = { toaStatistics: 'toa-statistics', fitRun: 'fit-run' } as const;

/** Payload of the `campaign` job: the campaign row holds everything else (the job is re-entrant, see worker/jobs/campaign.ts). */
export const CampaignJob = z.object({ campaignId: z.number().int().positive() }).strict();
export type CampaignJob = z.infer<typeof CampaignJob>;
export const CAMPAIGN_JOB_TYPE = 'campaign';

/** Payload of the `search-run` job (companion search): the search_runs row holds everything else (api/services/search-runs/create-search-run.ts). */
export const SearchRunJob = z.object({ searchRunId: z.number().int().positive() }).strict();
export type SearchRunJob = z.infer<typeof SearchRunJob>;
export const SEARCH_RUN_JOB_TYPE = 'search-run';

/** Progress as reported by every job: a percentage and a stage name for the progress bar. */
export const JobProgress = z.object({ percent: z.number().min(0).max(100), stage: z.string() });
export type JobProgress = z.infer<typeof JobProgress>;

/** Result of the toa-statistics job. */
export const ToaStatisticsResult = z.object({
  pulsarId: z.number(),
  toaCount: z.number(),
  firstMjd: z.string().nullable(),
  lastMjd: z.string().nullable(),
  observatories: z.array(z.string()),
  backends: z.array(z.string()),
});
export type ToaStatisticsResult = z.infer<typeof ToaStatisticsResult>;

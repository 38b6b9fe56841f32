/**
 * BullMQ processor `campaign`: batch reprocessing of many pulsars. The job is
 * a re-entrant step function over the database; each pass
 *
 *   1. plans the campaign once (campaign-plan.ts: pulsars, revisions, skips, "before"),
 *   2. creates the fit run of every planned pulsar that has none yet (through
 *      createFitRun with the campaign's id; Note 1),
 *   3. copies the fit runs' statuses onto the campaign and reports progress,
 *   4. finishes (summary + final status in one update, then the e-mail) when
 *      every run is final, or else moves itself to the delayed set for
 *      `pollIntervalMs` and returns its worker slot (BullMQ DelayedError).
 *
 * Notes:
 * 1. Re-runs with unchanged inputs reuse the identical succeeded result (the
 *    fit engine is deterministic, so recomputing would give the same
 *    numbers) unless the campaign asked for `recompute`. A fit run created
 *    before a crash is found again by (campaign_id, pulsar_id) and adopted, so
 *    no pulsar gets two runs.
 * 2. Why polling rows rather than a BullMQ flow: all state lives in MariaDB,
 *    so a worker restart (stalled job picked up again) or a Redis blip
 *    (ioredis reconnects; the step simply runs again) cannot lose track of a
 *    fit run, and a delayed campaign job holds no worker slot, so fit runs can
 *    use every slot even at concurrency 1.
 * 3. The campaign is `failed` when at least one of its fit runs failed (the
 *    summary still lists every pulsar), `succeeded` otherwise; skipped pulsars
 *    do not fail it.
 */
import { DelayedError, UnrecoverableError, type Job, type Queue } from 'bullmq';
import type { Knex } from 'knex';
import type { MailDeps } from '../../api/app-deps';
import { CampaignJob, type JobProgress } from '../../api/contracts/queues';
import { findCampaign, type CampaignRow, type CampaignStatus } from '../../api/db/campaigns';
import { planCampaignRuns } from './campaign-plan';
import { syncCampaignState, type CampaignState } from './campaign-summary';
import { notifyCampaignFinished } from './notify-campaign-finished';

/** The fit-run service's signature (api/services/fit-runs/create-fit-run.ts). */
export type StartFitRun = (
  deps: { knex: Knex; queue: Queue },
  input: { pulsarId: number; revisionId: number; requestedBy: number | null; recompute?: boolean; campaignId?: number },
) => Promise<{ fitRun: { id: number; status: string }; reused: boolean }>;

export interface CampaignDeps {
  knex: Knex;
  queue: Queue;
  createFitRun: StartFitRun;
  mail: MailDeps;
  pollIntervalMs?: number;
}

export const DEFAULT_CAMPAIGN_POLL_MS = 1_000;

export interface CampaignResult {
  campaignId: number;
  status: CampaignStatus;
  done: number;
  total: number;
}

export async function processCampaign(job: Job, token: string | undefined, deps: CampaignDeps): Promise<CampaignResult> {
  const parsed = CampaignJob.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError(`campaign: bad payload: ${parsed.error.issues[0]?.message}`);
  const { campaignId } = parsed.data;
  const { knex } = deps;

  let campaign = await findCampaign(knex, campaignId);
  if (!campaign) throw new UnrecoverableError(`campaign: campaign ${campaignId} does not exist`);
  if (campaign.status === 'cancelled') return finishCancelled(deps, campaign);
  if (campaign.status === 'succeeded' || campaign.status === 'failed') {
    return { campaignId, status: campaign.status, done: campaign.progress_done, total: campaign.progress_total };
  }
  if (campaign.status === 'queued') {
    await knex('campaigns').where({ id: campaignId, status: 'queued' }).update({ status: 'running', started_at: knex.fn.now(3), progress_stage: 'planning' });
    await report(job, 0, 'planning');
  }

  await planCampaignRuns(knex, campaign);
  await startPendingRuns(deps, campaign);

  const state = await syncCampaignState(knex, campaignId);
  campaign = (await findCampaign(knex, campaignId))!;
  if (campaign.status === 'cancelled') return finishCancelled(deps, campaign);

  const stage = `fitting: ${state.done} of ${state.total} pulsars done`;
  await knex('campaigns').where({ id: campaignId, status: 'running' }).update({ progress_done: state.done, progress_total: state.total, progress_stage: stage });
  await report(job, state.total === 0 ? 100 : Math.round((100 * state.done) / state.total), stage);

  if (state.done < state.total) {
    await job.moveToDelayed(Date.now() + (deps.pollIntervalMs ?? DEFAULT_CAMPAIGN_POLL_MS), token);
    throw new DelayedError();
  }
  return finish(deps, campaignId, state);
}

/** Creates the fit run of every planned pulsar without one (Note 1). */
async function startPendingRuns(deps: CampaignDeps, campaign: CampaignRow): Promise<void> {
  const { knex, queue } = deps;
  const pending: { id: number; pulsar_id: number; revision_id: number }[] = await knex('campaign_runs')
    .where({ campaign_id: campaign.id, status: 'pending' })
    .whereNull('fit_run_id')
    .orderBy('id')
    .select('id', 'pulsar_id', 'revision_id');
  for (const run of pending) {
    const adopted = await knex('fit_runs').where({ campaign_id: campaign.id, pulsar_id: run.pulsar_id }).orderBy('id', 'desc').first('id', 'status');
    const fitRun: { id: number; status: string } = adopted
      ? { id: Number(adopted.id), status: adopted.status }
      : (
          await deps.createFitRun(
            { knex, queue },
            {
              pulsarId: run.pulsar_id,
              revisionId: run.revision_id,
              requestedBy: campaign.created_by,
              recompute: Boolean(campaign.recompute),
              campaignId: campaign.id,
            },
          )
        ).fitRun;
    // Conditional on 'pending': a cancellation in between wins (its queued fit runs are swept in finishCancelled).
    await knex('campaign_runs').where({ id: run.id, status: 'pending' }).update({ fit_run_id: fitRun.id, status: fitRun.status });
  }
}

/** Writes the summary and the final status in one update; mails the followers if this pass made it final. */
async function finish(deps: CampaignDeps, campaignId: number, state: CampaignState): Promise<CampaignResult> {
  const { knex } = deps;
  const status: CampaignStatus = state.failures.length > 0 ? 'failed' : 'succeeded';
  const errorMessage =
    state.failures.length > 0
      ? `${state.failures.length} of ${state.total} fit runs failed; first: ${state.failures[0].pulsarName}: ${state.failures[0].message}`.slice(0, 2000)
      : null;
  const changed = await knex('campaigns')
    .where({ id: campaignId, status: 'running' })
    .update({
      status,
      error_message: errorMessage,
      summary_json: JSON.stringify(state.summary),
      progress_done: state.done,
      progress_total: state.total,
      progress_stage: status,
      finished_at: knex.fn.now(3),
    });
  if (changed === 1) await notifyCampaignFinished(deps.mail, campaignId);
  const final = (await findCampaign(knex, campaignId))!;
  return { campaignId, status: final.status, done: state.done, total: state.total };
}

/**
 * A cancelled campaign: fit runs it created after the cancellation swept the
 * queued ones are cancelled too, and the summary of what had finished is written once.
 */
async function finishCancelled(deps: CampaignDeps, campaign: CampaignRow): Promise<CampaignResult> {
  const { knex } = deps;
  await knex('fit_runs').where({ campaign_id: campaign.id, status: 'queued' }).update({ status: 'cancelled', stage: 'cancelled', finished_at: knex.fn.now(3) });
  await knex('campaign_runs').where({ campaign_id: campaign.id, status: 'pending' }).update({ status: 'cancelled' });
  const state = await syncCampaignState(knex, campaign.id);
  const changed = await knex('campaigns')
    .where({ id: campaign.id, status: 'cancelled' })
    .whereNull('summary_json')
    .update({ summary_json: JSON.stringify(state.summary), progress_done: state.done, progress_total: state.total });
  if (changed === 1) await notifyCampaignFinished(deps.mail, campaign.id);
  return { campaignId: campaign.id, status: 'cancelled', done: state.done, total: state.total };
}

async function report(job: Job, percent: number, stage: string): Promise<void> {
  const progress: JobProgress = { percent, stage };
  await job.updateProgress(progress);
}

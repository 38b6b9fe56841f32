/**
 * BullMQ processor `search-run`: searches one pulsar's residuals for companions
 * with one model revision over its current TOA selection, and stores the outputs.
 *
 * Notes:
 * 1. Stages (job progress and the search_runs row): 'loading TOAs',
 *    'barycentring', 'round k: <engine stage>' (fit, periodogram, seed,
 *    companion-fit, eccentricity-test, final-fit), 'storing results'. At each
 *    report the row's status is read back; a run cancelled meanwhile stops
 *    (UnrecoverableError 'cancelled', the thread terminated) without touching
 *    the status or storing anything.
 * 2. Exactly once: every output (the search_periodograms rows, result and
 *    listing columns on search_runs, status 'succeeded') is written in ONE
 *    transaction, delete-then-insert keyed by the run id, and only while the
 *    run is still 'running'. A job re-run after a crash (stall detection)
 *    redoes the search and commits once; a re-run that finds the run already
 *    succeeded returns at once.
 * 3. Engine input errors (TimingInputError, RangeError) mark the run failed
 *    with the engine's message and are not retried. Anything else (database,
 *    Redis) is thrown for BullMQ to retry with the queue's backoff; the last
 *    attempt marks the run failed.
 * 4. The engine runs in a worker thread (search-run-thread.ts), so BullMQ's lock
 *    renewal and the cancel checks go on while it computes.
 * 5. Claim, progress, cancel, commit guard and failure marking are
 *    queued-run-lifecycle.ts, shared with the fit-run job.
 */
import { UnrecoverableError, type Job } from 'bullmq';
import type { Knex } from 'knex';
import { SearchRunJob, type JobProgress } from '../../api/contracts/queues';
import type { SearchOptions } from '../../api/contracts/search-runs';
import { loadToasForFit } from '../../api/db/load-toas-for-fit';
import { loadObservatories } from '../../api/db/observatories';
import { findRevision } from '../../api/db/revisions';
import { encodeSearchPeriodogram, findSearchRun, type SearchRunRow } from '../../api/db/search-runs';
import { loadFitSelection } from '../../api/services/fit-runs/fit-inputs';
import { searchInputsHash } from '../../api/services/search-runs/search-inputs';
import { parseObservatory } from '../timing/earth/read-observatories';
import type { SearchEngineInput, SearchEngineOutput } from './search-run-engine';
import { alreadySucceeded, claimRun, engineResult, failRunWhenFinal, lockRunningRow, type QueuedRunRef } from './queued-run-lifecycle';
import { runSearchInThread } from './search-run-thread';

export interface SearchRunDeps {
  knex: Knex;
}

export interface SearchRunJobResult {
  searchRunId: number;
  status: 'succeeded';
  reusedEarlierCommit: boolean; // true when an earlier attempt had already committed the outputs
}

const runRef = (searchRunId: number): QueuedRunRef => ({ table: 'search_runs', label: 'search', id: searchRunId });

const optionsOf = (row: SearchRunRow): SearchOptions => (typeof row.options === 'string' ? JSON.parse(row.options) : row.options) as SearchOptions;

export async function processSearchRun(job: Job, deps: SearchRunDeps): Promise<SearchRunJobResult> {
  const parsed = SearchRunJob.safeParse(job.data);
  if (!parsed.success) throw new UnrecoverableError(`search-run: bad payload: ${parsed.error.issues[0]?.message}`);
  const { searchRunId } = parsed.data;
  const { knex } = deps;

  const run = await findSearchRun(knex, searchRunId);
  if (alreadySucceeded(runRef(searchRunId), run)) return { searchRunId, status: 'succeeded', reusedEarlierCommit: true };
  const found = run as SearchRunRow;
  return failRunWhenFinal(job, knex, runRef(searchRunId), () => searchAndStore(job, knex, found));
}

async function searchAndStore(job: Job, knex: Knex, run: SearchRunRow): Promise<SearchRunJobResult> {
  const searchRunId = run.id;
  const options = optionsOf(run);
  const { startedAtMs, report } = await claimRun(job, knex, runRef(searchRunId));

  const inputs = await knex.transaction(async (trx) => {
    const revision = await findRevision(trx as unknown as Knex, run.revision_id);
    if (!revision) throw new UnrecoverableError(`search-run: revision ${run.revision_id} does not exist`);
    const loaded = await loadToasForFit(trx as unknown as Knex, run.pulsar_id);
    const selection = await loadFitSelection(trx, run.pulsar_id);
    // Only the sites these TOAs use: an unrelated observatory row can never fail this search.
    const usedCodes = new Set(loaded.toas.map((toa) => toa.observatory));
    const observatories = (await loadObservatories(trx as unknown as Knex))
      .filter((o) => usedCodes.has(o.code))
      .map((o) => parseObservatory(o));
    return { revision, loaded, selection, observatories };
  });
  // The stored hash describes what is searched now (TOAs may have changed since the run was queued).
  await knex('search_runs')
    .where({ id: searchRunId })
    .update({
      inputs_hash: searchInputsHash(inputs.revision.model_json, inputs.selection, options),
      toa_count: inputs.loaded.toas.length,
      excluded_count: inputs.loaded.excludedIds.length,
    });

  const engineInput: SearchEngineInput = {
    modelJson: JSON.parse(inputs.revision.model_json) as Record<string, unknown>,
    toas: inputs.loaded.toas,
    observatories: inputs.observatories,
    options,
  };
  const thread = runSearchInThread(engineInput, async (event) => {
    if (event.type === 'stage') await report(event.stage === 'barycentring' ? 2 : 5, event.stage === 'barycentring' ? 'barycentring' : 'round 1: fit');
    else await report(Math.min(95, 5 + 90 * Math.max(0, Math.min(1, event.fraction))), `round ${event.round}: ${event.stage}`);
  });
  const output: SearchEngineOutput = await engineResult(thread);
  await report(96, 'storing results');

  const periodogramRows = output.periodograms.map((p) => encodeSearchPeriodogram(searchRunId, p));
  const finishedAtMs = Date.now();
  await knex.transaction(async (trx) => {
    await lockRunningRow(trx, runRef(searchRunId));
    await trx('search_periodograms').where({ search_run_id: searchRunId }).del();
    for (const row of periodogramRows) await trx('search_periodograms').insert(row); // one row at a time: each may be MBs
    await trx('search_runs')
      .where({ id: searchRunId })
      .update({
        status: 'succeeded',
        progress_percent: 100,
        stage: 'done',
        finished_at: new Date(finishedAtMs),
        duration_ms: finishedAtMs - startedAtMs,
        result_json: JSON.stringify(output.result),
        companions_found: output.result.companionsFound,
        final_chi2: Number.isFinite(output.result.finalFit.chi2) ? output.result.finalFit.chi2 : null,
        error_message: null,
      });
  });
  await job.updateProgress({ percent: 100, stage: 'done' } satisfies JobProgress);
  return { searchRunId, status: 'succeeded', reusedEarlierCommit: false };
}

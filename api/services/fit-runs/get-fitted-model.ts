/** The fitted model file of a succeeded run (docs/formats.md §2), with the pulsar's name for the download's file name. */
import type { Knex } from 'knex';
import type { FitResult } from '../../contracts/fit-runs';
import { AppError, notFound } from '../../errors';

export async function getFittedModel(knex: Knex, fitRunId: number): Promise<{ model: Record<string, unknown>; fileName: string }> {
  const run = (await knex('fit_runs')
    .join('pulsars', 'pulsars.id', 'fit_runs.pulsar_id')
    .where('fit_runs.id', fitRunId)
    .first('fit_runs.status as status', 'fit_runs.result_json as result_json', 'pulsars.name as name')) as
    | { status: string; result_json: string | null; name: string }
    | undefined;
  if (!run) throw notFound('fit run');
  if (run.result_json === null) throw new AppError(409, 'no_result', `fit run ${fitRunId} has no fitted model (status ${run.status})`);
  const result = JSON.parse(run.result_json) as FitResult;
  const safeName = run.name.replace(/[^A-Za-z0-9+._-]/g, '_');
  return { model: result.fittedModel, fileName: `${safeName}-fit-${fitRunId}.json` };
}

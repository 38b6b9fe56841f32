/**
 * Loads the fit runs of a comparison with what the comparison needs: the stored
 * result, the revision (its 1-based number among the pulsar's revisions), and
 * the fitted TOA ids with their effective uncertainties (from fit_residuals).
 * Checks that every run is a succeeded run of this pulsar.
 */
import type { Knex } from 'knex';
import type { ComparedRun } from '../../contracts/comparisons';
import type { FitEngineSettings, FitResult } from '../../contracts/fit-runs';
import type { FitRunRow } from '../../db/fit-runs';
import { decodeFloat64Column } from '../../db/residual-columns';
import { fieldError, notFound } from '../../errors';

/** One run as the comparison builder takes it (plain data, no database). */
export interface LoadedRun {
  fitRunId: number;
  revision: ComparedRun['revision'];
  finishedAt: string | null;
  toaCount: number;
  excludedCount: number;
  settings: FitEngineSettings;
  result: FitResult;
  /** fitted TOA ids and the effective uncertainty of each (µs); null when the run has no stored residuals */
  fittedToas: { toaIds: Float64Array; uncertaintyUs: Float64Array } | null;
}

const plural = (ids: number[]): string => (ids.length === 1 ? `fit run ${ids[0]} is` : `fit runs ${ids.join(', ')} are`);

/**
 * @param pulsarId   the pulsar all runs must belong to
 * @param fitRunIds  2–4 distinct ids (checked by the contract's schema), reference first
 * @param field      the request path the ids came from, for error details (['query', 'runs'] or ['fitRunIds'])
 * @returns          the runs in the order asked for
 * Throws 404 for an unknown pulsar; 400 validation_failed at `field` for ids that are
 * not runs of this pulsar, or runs that have not succeeded (queued, running, failed, cancelled).
 */
export async function loadComparedRuns(knex: Knex, pulsarId: number, fitRunIds: readonly number[], field: (string | number)[]): Promise<LoadedRun[]> {
  const pulsar = await knex('pulsars').where({ id: pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const rows = (await knex<FitRunRow>('fit_runs').whereIn('id', [...fitRunIds])) as FitRunRow[];
  const byId = new Map(rows.map((r) => [Number(r.id), r]));
  const foreign = fitRunIds.filter((id) => byId.get(id)?.pulsar_id !== pulsarId);
  if (foreign.length > 0) throw fieldError(field, `${plural(foreign)} not a fit run of this pulsar`);
  for (const id of fitRunIds) {
    const row = byId.get(id) as FitRunRow;
    if (row.status !== 'succeeded' || row.result_json === null) {
      const state = row.status === 'failed' ? 'failed' : row.status === 'cancelled' ? 'was cancelled' : `is still ${row.status}`;
      throw fieldError(field, `fit run ${id} ${state}: only succeeded fit runs have results to compare`);
    }
  }

  const revisionIds = (await knex('model_revisions').where({ pulsar_id: pulsarId }).orderBy('id').select('id', 'message', 'released_at')) as {
    id: number;
    message: string;
    released_at: Date | null;
  }[];
  const revisionById = new Map(revisionIds.map((r, index) => [Number(r.id), { ...r, number: index + 1 }]));
  const residualRows = (await knex('fit_residuals').whereIn('fit_run_id', [...fitRunIds]).select('fit_run_id', 'count', 'toa_ids', 'uncertainty_us')) as {
    fit_run_id: number;
    count: number;
    toa_ids: Buffer;
    uncertainty_us: Buffer;
  }[];
  const residualsById = new Map(residualRows.map((r) => [Number(r.fit_run_id), r]));

  return fitRunIds.map((id) => {
    const row = byId.get(id) as FitRunRow;
    const revision = revisionById.get(Number(row.revision_id));
    if (!revision) throw new Error(`fit run ${id}: revision ${row.revision_id} is not a revision of pulsar ${pulsarId}`);
    const result = JSON.parse(row.result_json as string) as FitResult;
    const residuals = residualsById.get(id);
    const count = residuals ? Number(residuals.count) : 0;
    return {
      fitRunId: id,
      revision: {
        id: Number(revision.id),
        number: revision.number,
        message: revision.message,
        released: revision.released_at !== null,
        releasedAt: revision.released_at ? revision.released_at.toISOString() : null,
      },
      finishedAt: row.finished_at ? row.finished_at.toISOString() : null,
      toaCount: residuals ? count : (row.toa_count ?? 0), // the residual rows are exactly the TOAs fitted
      excludedCount: row.excluded_count ?? 0,
      settings: (typeof row.settings === 'string' ? JSON.parse(row.settings) : row.settings) as FitEngineSettings,
      result,
      fittedToas: residuals
        ? { toaIds: decodeFloat64Column(residuals.toa_ids, count), uncertaintyUs: decodeFloat64Column(residuals.uncertainty_us, count) }
        : null,
    };
  });
}

/**
 * What a fit run's inputs are, and their hash: the revision's model JSON, the
 * included TOA ids with the checksums of the batches they came from, the
 * excluded ids and the engine settings. Identical inputs give the same hash,
 * so a finished run can be offered instead of a recomputation.
 */
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { FIT_ENGINE_SETTINGS, type FitEngineSettings } from '../../contracts/fit-runs';
import { mjdTextFromStored } from '../../db/toas';

export interface FitSelection {
  /** included TOA ids, ascending, each with its batch's SHA-256 */
  included: { id: number; batchChecksum: string }[];
  /** TOA ids left out by an active exclusion, ascending */
  excludedIds: number[];
}

/**
 * A pulsar's TOA selection as the hash sees it (one query; no TOA values).
 * Pass a transaction to read it in the same snapshot as the TOAs themselves.
 */
export async function loadFitSelection(knex: Knex | Knex.Transaction, pulsarId: number): Promise<FitSelection> {
  const rows = (await knex('toas')
    .join('toa_batches', 'toa_batches.id', 'toas.batch_id')
    .where('toas.pulsar_id', pulsarId)
    .orderBy('toas.id')
    .select(
      'toas.id as id',
      'toa_batches.checksum_sha256 as checksum',
      knex.raw('EXISTS (SELECT 1 FROM toa_exclusions e WHERE e.toa_id = toas.id AND e.restored_at IS NULL) AS excluded'),
    )) as { id: number | string; checksum: string; excluded: number | string }[];
  const included: FitSelection['included'] = [];
  const excludedIds: number[] = [];
  for (const r of rows) {
    if (Number(r.excluded) === 1) excludedIds.push(Number(r.id));
    else included.push({ id: Number(r.id), batchChecksum: r.checksum });
  }
  return { included, excludedIds };
}

/** Decimal MJD text of each of the pulsar's TOAs as stored (for the residual table). */
export async function loadStoredMjdTexts(knex: Knex | Knex.Transaction, pulsarId: number): Promise<Map<number, string>> {
  const rows = (await knex('toas').where({ pulsar_id: pulsarId }).select('id', 'mjd_day', 'mjd_fraction')) as {
    id: number | string;
    mjd_day: number;
    mjd_fraction: string;
  }[];
  return new Map(rows.map((r) => [Number(r.id), mjdTextFromStored(r.mjd_day, r.mjd_fraction)]));
}

/** JSON with object keys sorted at every level (arrays keep their order). */
export function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value !== null && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value);
}

/**
 * SHA-256 (hex) over the canonical JSON of
 * `{ model, included: [[id, batchChecksum]…], excludedIds, settings }`.
 *
 * @param modelJson  the revision's stored model JSON text
 * @param selection  loadFitSelection(…)
 * @param settings   engine settings (default: this build's FIT_ENGINE_SETTINGS)
 */
export function fitInputsHash(modelJson: string, selection: FitSelection, settings: FitEngineSettings = FIT_ENGINE_SETTINGS): string {
  const included = [...selection.included].sort((a, b) => a.id - b.id).map((t) => [t.id, t.batchChecksum]);
  const excludedIds = [...selection.excludedIds].sort((a, b) => a - b);
  const canonical = canonicalJson({ model: JSON.parse(modelJson) as unknown, included, excludedIds, settings });
  return createHash('sha256').update(canonical, 'utf8').digest('hex');
}

/** Row type of `fit_comparisons` and its presentation (SavedComparison of api/contracts/comparisons.ts). */
import type { Knex } from 'knex';
import type { SavedComparison } from '../contracts/comparisons';
import { userRefs } from './revisions';

export interface ComparisonRow {
  id: number;
  pulsar_id: number;
  fit_run_ids: string | number[]; // JSON column: text from MariaDB
  comment: string;
  created_by: number | null;
  created_at: Date;
}

const runIdsOf = (row: ComparisonRow): number[] =>
  (typeof row.fit_run_ids === 'string' ? (JSON.parse(row.fit_run_ids) as number[]) : row.fit_run_ids).map(Number);

export async function presentComparisons(knex: Knex, rows: readonly ComparisonRow[]): Promise<SavedComparison[]> {
  const users = await userRefs(knex, rows.map((r) => r.created_by));
  return rows.map((row) => ({
    id: row.id,
    pulsarId: row.pulsar_id,
    fitRunIds: runIdsOf(row),
    comment: row.comment,
    createdBy: row.created_by === null ? null : (users.get(row.created_by) ?? null),
    createdAt: row.created_at.toISOString(),
  }));
}

export async function findComparison(knex: Knex | Knex.Transaction, id: number): Promise<ComparisonRow | undefined> {
  return (await knex<ComparisonRow>('fit_comparisons').where({ id }).first()) as ComparisonRow | undefined;
}

/** A pulsar's saved comparisons, newest first. */
export async function listComparisonRows(knex: Knex, pulsarId: number): Promise<ComparisonRow[]> {
  return (await knex<ComparisonRow>('fit_comparisons').where({ pulsar_id: pulsarId }).orderBy('id', 'desc')) as ComparisonRow[];
}

export async function insertComparison(
  trx: Knex | Knex.Transaction,
  c: { pulsarId: number; fitRunIds: readonly number[]; comment: string; createdBy: number },
): Promise<number> {
  const [id] = await trx('fit_comparisons').insert({
    pulsar_id: c.pulsarId,
    fit_run_ids: JSON.stringify(c.fitRunIds),
    comment: c.comment,
    created_by: c.createdBy,
  });
  return Number(id);
}

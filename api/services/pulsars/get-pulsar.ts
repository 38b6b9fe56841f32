/** One pulsar by id (with its newest fit and revision count), or 404. */
import type { Knex } from 'knex';
import { loadWorkflowSummaries } from '../../db/pulsar-workflow-summary';
import { presentPulsar, type Pulsar, type PulsarRow } from '../../db/pulsars';
import { notFound } from '../../errors';

export async function getPulsar(knex: Knex, id: number): Promise<Pulsar> {
  const row = (await knex<PulsarRow>('pulsars').where({ id }).first()) as PulsarRow | undefined;
  if (!row) throw notFound('pulsar');
  const summaries = await loadWorkflowSummaries(knex, [row.id]);
  return presentPulsar(row, summaries.get(row.id));
}

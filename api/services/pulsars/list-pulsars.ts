/** Every pulsar with its TOA statistics, newest fit and revision count, by name (the dashboard). */
import type { Knex } from 'knex';
import { loadWorkflowSummaries } from '../../db/pulsar-workflow-summary';
import { presentPulsar, type Pulsar, type PulsarRow } from '../../db/pulsars';

export async function listPulsars(knex: Knex): Promise<Pulsar[]> {
  const rows = (await knex<PulsarRow>('pulsars').orderBy('name')) as PulsarRow[];
  const summaries = await loadWorkflowSummaries(knex, rows.map((r) => r.id));
  return rows.map((row) => presentPulsar(row, summaries.get(row.id)));
}

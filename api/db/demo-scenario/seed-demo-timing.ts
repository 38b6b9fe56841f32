/**
 * Seeds the demo timing scenario (build-demo-scenario.ts) into the database:
 * each demo pulsar's simulated TOA files, uploaded by the demo observer, and
 * its starting model as the first revision, authored by the demo analyst.
 * Both go through the same services as the app's routes (storeToaBatch,
 * createRevision), so the demo data are checked exactly like an upload.
 */
import type { Knex } from 'knex';
import { storeToaBatch } from '../../services/toas/store-toa-batch';
import { createRevision } from '../../services/revisions/create-revision';
import { buildDemoScenario, type DemoPulsarData } from './build-demo-scenario';
import { DEMO_PULSAR_POSITIONS, STARTING_REVISION_MESSAGE } from './demo-pulsars';

export interface DemoTimingAuthors {
  /** user id of the demo observer (uploads the TOA files) */
  uploaderId: number;
  /** user id of the demo analyst (authors the starting revision) */
  authorId: number;
}

interface PulsarState {
  id: number;
  name: string;
  needsToas: boolean;
  needsRevision: boolean;
}

/**
 * Stores the demo TOAs and starting models.
 *
 * @param knex     connection
 * @param authors  who uploads and who authors
 *
 * Notes: 1. Idempotent per part: a pulsar that already has TOA batches gets no new ones,
 *           one that already has a revision gets no starting revision; a missing demo
 *           pulsar row is created with its catalogue position.
 *        2. The scenario is simulated (about a second) only when something is missing.
 *        3. Each batch is stored in its own transaction (storeToaBatch); a seed stopped
 *           halfway leaves whole batches only, and the next run skips that pulsar's TOAs.
 */
export async function seedDemoTiming(knex: Knex, authors: DemoTimingAuthors): Promise<void> {
  const states: PulsarState[] = [];
  for (const position of DEMO_PULSAR_POSITIONS) {
    const id = await ensurePulsar(knex, position, authors.uploaderId);
    const batches = await knex('toa_batches').where({ pulsar_id: id }).count({ n: '*' });
    const revisions = await knex('model_revisions').where({ pulsar_id: id }).count({ n: '*' });
    states.push({ id, name: position.name, needsToas: Number(batches[0].n) === 0, needsRevision: Number(revisions[0].n) === 0 });
  }
  if (!states.some((s) => s.needsToas || s.needsRevision)) return; // Note 2
  const scenario = new Map<string, DemoPulsarData>(buildDemoScenario().map((p) => [p.name, p]));
  for (const state of states) {
    const data = scenario.get(state.name)!;
    if (state.needsToas) {
      for (const batch of data.batches) {
        await storeToaBatch(knex, { pulsarId: state.id, fileName: batch.fileName, uploadedBy: authors.uploaderId, bytes: new TextEncoder().encode(batch.csv) });
      }
    }
    if (state.needsRevision) {
      await createRevision(knex, state.id, authors.authorId, { model: data.startingModel, message: STARTING_REVISION_MESSAGE });
    }
  }
}

async function ensurePulsar(knex: Knex, position: { name: string; ra_hms: string; dec_dms: string }, createdBy: number): Promise<number> {
  const existing = await knex('pulsars').where({ name: position.name }).first('id');
  if (existing) return Number(existing.id);
  const [id] = await knex('pulsars').insert({ ...position, created_by: createdBy });
  return Number(id);
}

/**
 * Saves a new model revision: the model is checked by the engine's reader and
 * stored exactly as the engine re-writes it (readModelFile → writeModelFile),
 * so every stored revision reads back to the same model. The save is
 * audit-logged (`revision.create`) in the same transaction.
 */
import type { Knex } from 'knex';
import { recordAudit } from '../../db/audit-log';
import { findRevision, insertRevision, presentRevisionWithModel, type RevisionWithModel } from '../../db/revisions';
import { fieldError, notFound, validationError } from '../../errors';
import { TimingInputError } from '../../../worker/timing/engine-error';
import { readModelFile } from '../../../worker/timing/model/read-model-file';
import { writeModelFile } from '../../../worker/timing/model/write-model-file';
import { modelErrorDetails } from './model-error-details';

export interface CreateRevisionInput {
  model: unknown;
  message: string;
  parentId?: number;
}

/**
 * @returns the stored revision with its model
 * Throws 404 for an unknown pulsar; 400 validation_failed with details under
 * ['model', …] for model problems (the engine's paths split into parts), under
 * ['model', 'pulsar'] when the model names another pulsar, and under
 * ['parentId'] for a parent that is not a revision of this pulsar.
 */
export async function createRevision(knex: Knex, pulsarId: number, authorId: number, input: CreateRevisionInput): Promise<RevisionWithModel> {
  const pulsar = (await knex('pulsars').where({ id: pulsarId }).first('id', 'name')) as { id: number; name: string } | undefined;
  if (!pulsar) throw notFound('pulsar');
  let model;
  try {
    model = readModelFile(input.model);
  } catch (error) {
    if (error instanceof TimingInputError) throw validationError(modelErrorDetails(error.message, error.details));
    throw error;
  }
  if (model.pulsar !== pulsar.name) throw fieldError(['model', 'pulsar'], `must be this pulsar's name "${pulsar.name}", not "${model.pulsar}"`);
  if (input.parentId !== undefined) {
    const parent = await findRevision(knex, input.parentId);
    if (!parent || parent.pulsar_id !== pulsarId) throw fieldError(['parentId'], 'not a revision of this pulsar');
  }
  const modelJson = JSON.stringify(writeModelFile(model));
  const id = await knex.transaction(async (trx) => {
    const newId = await insertRevision(trx, { pulsarId, parentId: input.parentId ?? null, authorId, message: input.message, modelJson });
    await recordAudit(trx, { pulsarId, userId: authorId, action: 'revision.create', details: { revisionId: newId, message: input.message, parentId: input.parentId ?? null } });
    return newId;
  });
  const row = await findRevision(knex, id);
  if (!row) throw new Error(`revision ${id} vanished after insert`);
  return presentRevisionWithModel(knex, row);
}

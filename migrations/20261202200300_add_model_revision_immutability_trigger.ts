/**
 * Model revisions are immutable once saved: a trigger refuses any UPDATE that
 * changes the model, message, pulsar, parent, author or creation time (only the
 * release columns may change). The service layer never issues such an update;
 * this makes the rule hold for every client of the database.
 */
import type { Knex } from 'knex';

export async function up(knex: Knex): Promise<void> {
  await knex.raw(`
    CREATE TRIGGER model_revisions_immutable BEFORE UPDATE ON model_revisions FOR EACH ROW
    BEGIN
      IF NOT (NEW.model_json <=> OLD.model_json) OR NOT (NEW.message <=> OLD.message)
         OR NOT (NEW.pulsar_id <=> OLD.pulsar_id) OR NOT (NEW.parent_id <=> OLD.parent_id)
         OR NOT (NEW.author_id <=> OLD.author_id) OR NOT (NEW.created_at <=> OLD.created_at) THEN
        SIGNAL SQLSTATE '45000' SET MESSAGE_TEXT = 'model revisions are immutable: only the release columns may change';
      END IF;
    END`);
}

export async function down(knex: Knex): Promise<void> {
  await knex.raw('DROP TRIGGER IF EXISTS model_revisions_immutable');
}

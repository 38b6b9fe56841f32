/**
 * What the residual explorer needs of a finished fit run (api/contracts/explorer.ts),
 * one row per run, stored by the fit-run job in the same transaction as
 * fit_residuals: every TOA of the pulsar at fit time (fitted and excluded) as
 * compressed columns (api/db/explorer-columns.ts). Runs fitted before this
 * table existed have no row (the explorer route asks for a re-run).
 */
import type { Knex } from 'knex';

const FLOAT64_COLUMNS = [
  'toa_ids', 'batch_ids', 'batch_rows', 'frequency_mhz', 'uncertainty_us', 'residual_us', 'barycentric_days_hi', 'barycentric_days_lo',
  'clock_s', 'tt_minus_utc_s', 'tdb_minus_tt_s', 'roemer_s', 'shapiro_s', 'dispersion_s', 'backend_offset_s', 'companions_s',
];

export async function up(knex: Knex): Promise<void> {
  await knex.schema.createTable('fit_explorer_columns', (t) => {
    t.integer('fit_run_id').unsigned().primary().references('fit_runs.id').onDelete('CASCADE');
    t.integer('count').unsigned().notNullable();
    for (const name of FLOAT64_COLUMNS) t.specificType(name, 'LONGBLOB').notNullable(); // Float64 little-endian, deflated
    t.specificType('mjd', 'LONGBLOB').notNullable(); // decimal MJD text, one per line
    t.specificType('backend', 'LONGBLOB').notNullable(); // dictionary: labels JSON + Int32 indexes
    t.specificType('observatory', 'LONGBLOB').notNullable(); // dictionary, as backend
    t.specificType('flags', 'LONGBLOB').notNullable(); // Uint8 per TOA: 1 excluded, 2 nearest pulse, 4 evaluated
    t.text('partial_paths_json').notNullable(); // [{ parameter, fileUnit, fitted }]
    t.specificType('partials', 'LONGBLOB').notNullable(); // Float32 little-endian, column-major count × paths
    t.string('reference_mjd', 64).notNullable(); // model epoch, TDB
    t.string('spin_frequency_hz', 64).notNullable();
    t.double('phase_offset_turns').notNullable();
  });
}

export async function down(knex: Knex): Promise<void> {
  await knex.schema.dropTableIfExists('fit_explorer_columns');
}

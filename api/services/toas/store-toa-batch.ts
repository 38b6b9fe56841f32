/**
 * Stores one arrival-time file as a TOA batch: validates it with the engine's
 * reader (docs/formats.md §1) plus the ephemeris range and the row limit,
 * refuses a second copy of a stored file unless confirmed, then writes the
 * batch, its TOAs (multi-row INSERTs) and the pulsar's statistics in ONE
 * transaction. Also used by the demo seed.
 */
import { createHash } from 'node:crypto';
import type { Knex } from 'knex';
import { MAX_TOA_FILE_ERRORS, MAX_TOA_ROWS, type TOABatch, type ToaFileErrorDetail } from '../../contracts/toas';
import { presentToaBatch, selectToaBatches, type ToaBatchRow } from '../../db/toa-batches';
import { insertToaRows, mjdTextFromStored, storedMjdFromMjd, storedMjdFromText, type StoredMjd, type ToaInsert } from '../../db/toas';
import { AppError, notFound } from '../../errors';
import { formatToaFileErrors, readToaCsv, type ToaFileError } from '../../../worker/timing/toas/read-toa-csv';
import type { Toa } from '../../../worker/timing/toas/toa';
import { ephemerisRangeErrors } from './check-ephemeris-range';
import { recomputeToaStatistics } from './recompute-toa-statistics';

export const TOA_INSERT_CHUNK_ROWS = 1_000; // rows per INSERT: 500–5 000 equal within noise, 20 000 slower (scripts/bench/upload.ts)

export interface StoreToaBatchInput {
  pulsarId: number;
  fileName: string;
  uploadedBy: number | null;
  bytes: Uint8Array;
  confirmDuplicate?: boolean;
  checksumSha256?: string; // when the caller hashed the bytes while receiving them
  maxRows?: number; // default MAX_TOA_ROWS (tests lower it)
  insertChunkRows?: number; // rows per INSERT, default TOA_INSERT_CHUNK_ROWS (the bench compares sizes)
}

/** Timings of the last call's stages, milliseconds (read by the upload bench). */
export interface StoreTimings {
  parseMs: number; // reading and checking the file
  storeMs: number; // the whole transaction, commit included
  insertMs?: number; // of which: the TOA INSERTs
  statisticsMs?: number; // of which: recounting the pulsar's statistics
}

function invalidFile(errors: ToaFileError[], count: number): AppError {
  const details: ToaFileErrorDetail[] = errors.map((e) => ({ path: [], line: e.line, column: e.column, message: e.message }));
  const first = formatToaFileErrors(errors.slice(0, 1))[0] ?? 'invalid file';
  const message = count === 1 ? `1 problem: ${first}` : `${count} problems; first: ${first}`;
  return new AppError(400, 'invalid_toa_file', message, details);
}

/** Reads and checks the file: every error of the reader, then the ephemeris range and the row limit. */
function readChecked(bytes: Uint8Array, knownObservatories: ReadonlySet<string>, maxRows: number): Toa[] {
  const result = readToaCsv(bytes, { knownObservatories, maxErrors: MAX_TOA_FILE_ERRORS, keepMjdText: true });
  if (!result.ok) throw invalidFile(result.errors, result.errorCount);
  const range = ephemerisRangeErrors(result.toas, MAX_TOA_FILE_ERRORS);
  if (range.count > 0) throw invalidFile(range.errors, range.count);
  if (result.toas.length > maxRows) {
    const line = result.toas[maxRows].line;
    throw invalidFile([{ line, column: null, message: `the file has ${result.toas.length} data rows; at most ${maxRows} are accepted per file` }], 1);
  }
  return result.toas;
}

async function rejectDuplicate(knex: Knex, pulsarId: number, checksum: string): Promise<void> {
  const existing = await knex('toa_batches').where({ pulsar_id: pulsarId, checksum_sha256: checksum }).orderBy('id').first('id', 'file_name');
  if (!existing) return;
  const message = `this file was already uploaded for this pulsar (batch ${existing.id}, "${existing.file_name}"); send confirmDuplicate=true to store it again`;
  throw new AppError(409, 'duplicate_upload', message, [{ path: ['file'], message, existingBatchId: existing.id }]);
}

function compareStored(a: StoredMjd, b: StoredMjd): number {
  return a.day !== b.day ? a.day - b.day : a.fraction < b.fraction ? -1 : a.fraction > b.fraction ? 1 : 0; // fixed-width fractions
}

function toaRowOf(toa: Toa, mjd: StoredMjd, pulsarId: number, batchId: number): ToaInsert {
  const hasLabels = Object.keys(toa.labels).length > 0;
  return {
    pulsar_id: pulsarId,
    batch_id: batchId,
    row_number: toa.row,
    line_number: toa.line,
    mjd_day: mjd.day,
    mjd_fraction: mjd.fraction,
    uncertainty_us: toa.uncertaintyUs,
    frequency_mhz: toa.frequencyMhz === Infinity ? null : toa.frequencyMhz,
    observatory: toa.observatory,
    backend: toa.backend,
    pulse_number: toa.pulseNumber,
    labels: hasLabels ? JSON.stringify(toa.labels) : null,
  };
}

/**
 * Validates and stores an arrival-time file for a pulsar.
 *
 * @param knex   connection (the store opens its own transaction)
 * @param input  pulsar, file name, uploader, the file's bytes; `confirmDuplicate` to store a second copy
 * @param timings  optional: filled with the parse and store durations
 * @returns      the stored batch
 *
 * Throws AppError 404 not_found (pulsar), 400 invalid_toa_file (every problem
 * of the file, first 100 in details; nothing stored), 409 duplicate_upload.
 * Notes: 1. MJDs are stored from the file's text: up to 38 fractional digits
 *           exactly, more rounded half to even at the 38th (api/db/toas.ts).
 *        2. Ephemeris-range errors are reported when the file has no other errors
 *           (the reader yields no rows for a file with errors).
 */
export async function storeToaBatch(knex: Knex, input: StoreToaBatchInput, timings?: StoreTimings): Promise<TOABatch> {
  const pulsar = await knex('pulsars').where({ id: input.pulsarId }).first('id');
  if (!pulsar) throw notFound('pulsar');
  const checksum = input.checksumSha256 ?? createHash('sha256').update(input.bytes).digest('hex');
  if (input.confirmDuplicate !== true) await rejectDuplicate(knex, input.pulsarId, checksum);

  const parseStart = performance.now();
  const known = new Set((await knex('observatories').select('code')).map((r) => r.code as string));
  const toas = readChecked(input.bytes, known, input.maxRows ?? MAX_TOA_ROWS);
  const stored = toas.map((t) => (t.mjdText === undefined ? storedMjdFromMjd(t.mjd) : storedMjdFromText(t.mjdText)));
  let first = stored[0];
  let last = stored[0];
  for (const m of stored) {
    if (compareStored(m, first) < 0) first = m;
    if (compareStored(m, last) > 0) last = m;
  }
  const storeStart = performance.now();

  const batchId = await knex.transaction(async (trx) => {
    const [id] = await trx('toa_batches').insert({
      pulsar_id: input.pulsarId,
      file_name: input.fileName.slice(0, 255),
      uploaded_by: input.uploadedBy,
      checksum_sha256: checksum,
      row_count: toas.length,
      first_mjd: mjdTextFromStored(first.day, first.fraction),
      last_mjd: mjdTextFromStored(last.day, last.fraction),
      observatories: JSON.stringify([...new Set(toas.map((t) => t.observatory))].sort()),
      backends: JSON.stringify([...new Set(toas.map((t) => t.backend))].sort()),
      status: 'stored',
    });
    const insertStart = performance.now();
    const rows = toas.map((toa, i) => toaRowOf(toa, stored[i], input.pulsarId, id));
    await insertToaRows(trx, rows, input.insertChunkRows ?? TOA_INSERT_CHUNK_ROWS);
    const statisticsStart = performance.now();
    await recomputeToaStatistics(trx, input.pulsarId);
    if (timings) {
      timings.insertMs = statisticsStart - insertStart;
      timings.statisticsMs = performance.now() - statisticsStart;
    }
    return Number(id);
  });
  if (timings) {
    timings.parseMs = storeStart - parseStart;
    timings.storeMs = performance.now() - storeStart;
  }
  const row = (await selectToaBatches(knex).where('toa_batches.id', batchId).first()) as ToaBatchRow;
  return presentToaBatch(row);
}

/** Row type of `toa_batches` and its JSON presentation (TOABatch of api/contracts/toas.ts). */
import type { Knex } from 'knex';
import type { TOABatch } from '../contracts/toas';

export interface ToaBatchRow {
  id: number;
  pulsar_id: number;
  file_name: string;
  uploaded_by: number | null;
  uploader_display_name?: string | null; // joined from users
  checksum_sha256: string;
  row_count: number;
  first_mjd: string;
  last_mjd: string;
  observatories: string | string[];
  backends: string | string[];
  status: 'stored';
  created_at: Date;
}

function stringList(value: string | string[]): string[] {
  const parsed: unknown = typeof value === 'string' ? JSON.parse(value) : value;
  return Array.isArray(parsed) ? parsed.filter((c): c is string => typeof c === 'string') : [];
}

export function presentToaBatch(row: ToaBatchRow): TOABatch {
  return {
    id: row.id,
    pulsarId: row.pulsar_id,
    fileName: row.file_name,
    uploadedBy: row.uploaded_by === null ? null : { id: row.uploaded_by, displayName: row.uploader_display_name ?? '' },
    checksumSha256: row.checksum_sha256,
    rowCount: Number(row.row_count),
    firstMjd: row.first_mjd,
    lastMjd: row.last_mjd,
    observatories: stringList(row.observatories),
    backends: stringList(row.backends),
    status: row.status,
    createdAt: row.created_at.toISOString(),
  };
}

/** Batches with the uploader's display name joined; narrow with `.where(...)`. */
export function selectToaBatches(knex: Knex | Knex.Transaction): Knex.QueryBuilder {
  return knex('toa_batches')
    .leftJoin('users', 'users.id', 'toa_batches.uploaded_by')
    .select('toa_batches.*', 'users.display_name as uploader_display_name');
}

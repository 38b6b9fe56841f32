/**
 * TOA batches, TOAs and exclusions as the API sends and accepts them
 * (docs/api-workflow.md), shared with the client.
 */
import { z } from 'zod';

export const MAX_TOA_UPLOAD_BYTES = 50 * 1024 * 1024; // 50 MiB per file
export const MAX_TOA_ROWS = 500_000; // data rows per file
export const MAX_TOA_FILE_ERRORS = 100; // errors listed in an invalid_toa_file answer (all are counted)
export const MAX_TOA_IDS_PER_REQUEST = 100_000;

export interface UserRef {
  id: number;
  displayName: string;
}

export interface TOABatch {
  id: number;
  pulsarId: number;
  fileName: string;
  uploadedBy: UserRef | null; // null once the uploader's account is deleted
  checksumSha256: string; // lower-case hex
  rowCount: number;
  firstMjd: string;
  lastMjd: string;
  observatories: string[];
  backends: string[];
  status: 'stored';
  createdAt: string;
}

/** GET /api/pulsars/:id/toas: one array per column, all of length `count`, sorted by MJD. */
export interface ToaColumns {
  count: number;
  id: number[];
  batchId: number[];
  row: number[]; // 1-based data row in the uploaded file
  mjd: string[]; // exact stored decimal (up to 38 fractional digits, trailing zeros dropped)
  uncertaintyUs: number[];
  frequencyMhz: (number | null)[]; // null = infinite frequency
  observatory: string[];
  backend: string[];
  pulseNumber: (number | null)[];
  excluded: boolean[];
}

export interface ToaExclusion {
  id: number;
  toaId: number;
  reason: string;
  excludedBy: UserRef | null;
  excludedAt: string;
  restoredBy: UserRef | null;
  restoredAt: string | null;
}

/** One problem of an invalid_toa_file answer (`column` null: the whole line or file). */
export interface ToaFileErrorDetail {
  path: [];
  line: number | null;
  column: string | null;
  message: string;
}

const ToaIds = z
  .array(z.number().int().positive(), { error: 'toaIds must be an array of TOA ids' })
  .min(1, 'toaIds must name at least one TOA')
  .max(MAX_TOA_IDS_PER_REQUEST, `toaIds may name at most ${MAX_TOA_IDS_PER_REQUEST} TOAs per request`);

export const ExcludeToasBody = z.strictObject({
  toaIds: ToaIds,
  reason: z.string().trim().min(1, 'reason must not be empty').max(500, 'reason must be at most 500 characters'),
});
export type ExcludeToasBody = z.infer<typeof ExcludeToasBody>;

export const RestoreToasBody = z.strictObject({ toaIds: ToaIds });
export type RestoreToasBody = z.infer<typeof RestoreToasBody>;

/**
 * The fit_explorer_columns row (migrations/20261203200000_create_fit_explorer_columns.ts):
 * the explorer's per-TOA arrays as deflated columns, with the encoders of
 * api/db/residual-columns.ts for Float64, text and label columns, plus Float32
 * (partial derivatives: ~7 digits are plenty for a first-order preview) and
 * Uint8 (flags).
 */
import { deflateSync, inflateSync } from 'node:zlib';
import {
  decodeFloat64Column,
  decodeLabelColumn,
  decodeTextColumn,
  encodeFloat64Column,
  encodeLabelColumn,
  encodeTextColumn,
} from './residual-columns';

export const EXPLORER_FLAG_EXCLUDED = 1;
export const EXPLORER_FLAG_NEAREST_PULSE = 2;
export const EXPLORER_FLAG_EVALUATED = 4;

export const EXPLORER_FLOAT64_KEYS = [
  'toaIds', 'batchIds', 'batchRows', 'frequencyMhz', 'uncertaintyUs', 'residualUs', 'barycentricDaysHi', 'barycentricDaysLo',
  'clockS', 'ttMinusUtcS', 'tdbMinusTtS', 'roemerS', 'shapiroS', 'dispersionS', 'backendOffsetS', 'companionsS',
] as const;
export type ExplorerFloat64Key = (typeof EXPLORER_FLOAT64_KEYS)[number];

export interface ExplorerPartialPath {
  parameter: string;
  fileUnit: string;
  fitted: boolean;
}

/** The explorer columns of one fit run (every array has `count` entries, sorted by MJD then TOA id). */
export type ExplorerColumns = Record<ExplorerFloat64Key, Float64Array> & {
  count: number;
  mjd: string[];
  backend: string[];
  observatory: string[];
  flags: Uint8Array; // EXPLORER_FLAG_* bits
  partialPaths: ExplorerPartialPath[];
  partials: Float32Array[]; // one per partialPaths entry
  referenceMjd: string;
  spinFrequencyHz: string;
  phaseOffsetTurns: number;
};

/** The row without fit_run_id: snake_case column names. */
export type EncodedExplorerColumns = Record<string, Buffer | number | string>;

const DEFLATE_OPTIONS = { level: 1 };
const HOST_IS_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

const snake = (key: string): string => key.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`);
const COLUMN_OF: Record<ExplorerFloat64Key, string> = Object.fromEntries(
  EXPLORER_FLOAT64_KEYS.map((k) => [k, k === 'toaIds' ? 'toa_ids' : k === 'batchIds' ? 'batch_ids' : snake(k)]),
) as Record<ExplorerFloat64Key, string>;

/** Float32 columns one after the other, little-endian, deflated. */
export function encodeFloat32Columns(columns: readonly Float32Array[], count: number): Buffer {
  const all = new Float32Array(columns.length * count);
  columns.forEach((c, j) => {
    if (c.length !== count) throw new RangeError(`encodeFloat32Columns: column ${j} has ${c.length} values for ${count} rows`);
    all.set(c, j * count);
  });
  const bytes = Buffer.from(all.buffer, all.byteOffset, all.byteLength);
  if (!HOST_IS_LITTLE_ENDIAN) bytes.swap32();
  return deflateSync(bytes, DEFLATE_OPTIONS);
}

export function decodeFloat32Columns(blob: Buffer, columnCount: number, count: number): Float32Array[] {
  const bytes = Buffer.from(inflateSync(blob));
  if (bytes.byteLength !== columnCount * count * 4) throw new RangeError(`decodeFloat32Columns: ${bytes.byteLength} bytes for ${columnCount} × ${count} values`);
  if (!HOST_IS_LITTLE_ENDIAN) bytes.swap32();
  const all = new Float32Array(columnCount * count);
  new Uint8Array(all.buffer).set(bytes);
  return Array.from({ length: columnCount }, (_, j) => all.subarray(j * count, (j + 1) * count));
}

export function encodeExplorerColumns(c: ExplorerColumns): EncodedExplorerColumns {
  const lengths = [...EXPLORER_FLOAT64_KEYS.map((k) => c[k].length), c.mjd.length, c.backend.length, c.observatory.length, c.flags.length];
  if (lengths.some((n) => n !== c.count)) throw new RangeError(`encodeExplorerColumns: column lengths ${lengths.join(', ')} differ from count ${c.count}`);
  if (c.partials.length !== c.partialPaths.length) throw new RangeError(`encodeExplorerColumns: ${c.partials.length} partial columns for ${c.partialPaths.length} paths`);
  const row: EncodedExplorerColumns = {
    count: c.count,
    mjd: encodeTextColumn(c.mjd),
    backend: encodeLabelColumn(c.backend),
    observatory: encodeLabelColumn(c.observatory),
    flags: deflateSync(Buffer.from(c.flags.buffer, c.flags.byteOffset, c.flags.byteLength), DEFLATE_OPTIONS),
    partial_paths_json: JSON.stringify(c.partialPaths),
    partials: encodeFloat32Columns(c.partials, c.count),
    reference_mjd: c.referenceMjd,
    spin_frequency_hz: c.spinFrequencyHz,
    phase_offset_turns: c.phaseOffsetTurns,
  };
  for (const key of EXPLORER_FLOAT64_KEYS) row[COLUMN_OF[key]] = encodeFloat64Column(c[key]);
  return row;
}

export function decodeExplorerColumns(row: EncodedExplorerColumns): ExplorerColumns {
  const count = Number(row.count);
  const blob = (name: string): Buffer => {
    const value = row[name];
    if (!Buffer.isBuffer(value)) throw new RangeError(`decodeExplorerColumns: column ${name} is not binary`);
    return value;
  };
  const flags = new Uint8Array(inflateSync(blob('flags')));
  if (flags.length !== count) throw new RangeError(`decodeExplorerColumns: ${flags.length} flags for ${count} rows`);
  const partialPaths = JSON.parse(String(row.partial_paths_json)) as ExplorerPartialPath[];
  const floats = Object.fromEntries(EXPLORER_FLOAT64_KEYS.map((k) => [k, decodeFloat64Column(blob(COLUMN_OF[k]), count)])) as Record<ExplorerFloat64Key, Float64Array>;
  return {
    ...floats,
    count,
    mjd: decodeTextColumn(blob('mjd'), count),
    backend: decodeLabelColumn(blob('backend'), count),
    observatory: decodeLabelColumn(blob('observatory'), count),
    flags,
    partialPaths,
    partials: decodeFloat32Columns(blob('partials'), partialPaths.length, count),
    referenceMjd: String(row.reference_mjd),
    spinFrequencyHz: String(row.spin_frequency_hz),
    phaseOffsetTurns: Number(row.phase_offset_turns),
  };
}

/**
 * The compact column encoding of fit_residuals: each column is a typed array
 * (Float64 little-endian) or text (one value per line), deflated with zlib.
 * Repeated labels (backend, observatory) are dictionary-encoded: a JSON list of
 * the distinct labels, a newline, then one Int32 index per row.
 *
 * Float64 keeps residuals and uncertainties bit for bit, TOA ids exactly up to
 * 2^53 (they are BIGINT in `toas`) and Infinity for an infinite frequency.
 */
import { deflateSync, inflateSync } from 'node:zlib';

/** Level 1: residual bytes are nearly incompressible noise; the fast level costs little in size. */
const DEFLATE_OPTIONS = { level: 1 };

/** The residuals of one fit, columnar (every array has `count` entries). */
export interface ResidualColumns {
  count: number;
  toaIds: Float64Array;
  mjd: string[]; // decimal MJD text as stored for the TOA
  residualUs: Float64Array;
  uncertaintyUs: Float64Array;
  frequencyMhz: Float64Array; // Infinity = infinite frequency
  backend: string[];
  observatory: string[];
}

/** The fit_residuals row (without fit_run_id). */
export interface EncodedResidualColumns {
  count: number;
  toa_ids: Buffer;
  mjd: Buffer;
  residual_us: Buffer;
  uncertainty_us: Buffer;
  frequency_mhz: Buffer;
  backend: Buffer;
  observatory: Buffer;
}

export function encodeFloat64Column(values: Float64Array): Buffer {
  const bytes = Buffer.from(values.buffer, values.byteOffset, values.byteLength);
  return deflateSync(littleEndian(bytes), DEFLATE_OPTIONS);
}

export function decodeFloat64Column(blob: Buffer, count: number): Float64Array {
  const bytes = littleEndian(inflateSync(blob));
  if (bytes.byteLength !== count * 8) throw new RangeError(`decodeFloat64Column: ${bytes.byteLength} bytes for ${count} values`);
  const out = new Float64Array(count);
  new Uint8Array(out.buffer).set(bytes);
  return out;
}

/** Text values, none containing a line break. */
export function encodeTextColumn(values: readonly string[]): Buffer {
  for (const v of values) if (v.includes('\n')) throw new RangeError(`encodeTextColumn: value contains a line break: ${JSON.stringify(v)}`);
  return deflateSync(Buffer.from(values.join('\n'), 'utf8'), DEFLATE_OPTIONS);
}

export function decodeTextColumn(blob: Buffer, count: number): string[] {
  if (count === 0) return [];
  const values = inflateSync(blob).toString('utf8').split('\n');
  if (values.length !== count) throw new RangeError(`decodeTextColumn: ${values.length} values, expected ${count}`);
  return values;
}

/** Labels as a dictionary: JSON list of distinct labels, '\n', Int32 indexes (little-endian). */
export function encodeLabelColumn(values: readonly string[]): Buffer {
  const labels: string[] = [];
  const indexOf = new Map<string, number>();
  const indexes = new Int32Array(values.length);
  values.forEach((v, i) => {
    let k = indexOf.get(v);
    if (k === undefined) {
      k = labels.length;
      labels.push(v);
      indexOf.set(v, k);
    }
    indexes[i] = k;
  });
  const head = Buffer.from(`${JSON.stringify(labels)}\n`, 'utf8');
  const body = littleEndian(Buffer.from(indexes.buffer, indexes.byteOffset, indexes.byteLength), 4);
  return deflateSync(Buffer.concat([head, body]), DEFLATE_OPTIONS);
}

export function decodeLabelColumn(blob: Buffer, count: number): string[] {
  const bytes = inflateSync(blob);
  const split = bytes.indexOf(0x0a);
  if (split < 0) throw new RangeError('decodeLabelColumn: no label list');
  const labels = JSON.parse(bytes.subarray(0, split).toString('utf8')) as string[];
  const body = littleEndian(bytes.subarray(split + 1), 4);
  if (body.byteLength !== count * 4) throw new RangeError(`decodeLabelColumn: ${body.byteLength} index bytes for ${count} rows`);
  const indexes = new Int32Array(count);
  new Uint8Array(indexes.buffer).set(body);
  const out = new Array<string>(count);
  for (let i = 0; i < count; i++) {
    const label = labels[indexes[i]];
    if (label === undefined) throw new RangeError(`decodeLabelColumn: index ${indexes[i]} outside the ${labels.length} labels`);
    out[i] = label;
  }
  return out;
}

export function encodeResidualColumns(c: ResidualColumns): EncodedResidualColumns {
  const lengths = [c.toaIds.length, c.mjd.length, c.residualUs.length, c.uncertaintyUs.length, c.frequencyMhz.length, c.backend.length, c.observatory.length];
  if (lengths.some((n) => n !== c.count)) throw new RangeError(`encodeResidualColumns: column lengths ${lengths.join(', ')} differ from count ${c.count}`);
  return {
    count: c.count,
    toa_ids: encodeFloat64Column(c.toaIds),
    mjd: encodeTextColumn(c.mjd),
    residual_us: encodeFloat64Column(c.residualUs),
    uncertainty_us: encodeFloat64Column(c.uncertaintyUs),
    frequency_mhz: encodeFloat64Column(c.frequencyMhz),
    backend: encodeLabelColumn(c.backend),
    observatory: encodeLabelColumn(c.observatory),
  };
}

export function decodeResidualColumns(row: EncodedResidualColumns): ResidualColumns {
  const count = Number(row.count);
  return {
    count,
    toaIds: decodeFloat64Column(row.toa_ids, count),
    mjd: decodeTextColumn(row.mjd, count),
    residualUs: decodeFloat64Column(row.residual_us, count),
    uncertaintyUs: decodeFloat64Column(row.uncertainty_us, count),
    frequencyMhz: decodeFloat64Column(row.frequency_mhz, count),
    backend: decodeLabelColumn(row.backend, count),
    observatory: decodeLabelColumn(row.observatory, count),
  };
}

const HOST_IS_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** The bytes in little-endian order (a copy with each `width`-byte word reversed on a big-endian host). */
function littleEndian(bytes: Buffer, width = 8): Buffer {
  if (HOST_IS_LITTLE_ENDIAN) return bytes;
  const out = Buffer.from(bytes);
  if (width === 8) out.swap64();
  else out.swap32();
  return out;
}

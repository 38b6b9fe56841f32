/**
 * A small reader for the three files of the casacore table that Debian ships as
 * casacore-data-jpl-de405 (/usr/share/casacore/data/ephemerides/DE405).
 *
 * Why our own code: no npm package reads casacore tables, and the engine needs
 * only a fixed, simple layout — table-level scalar keywords from `table.dat`,
 * one scalar double column and one fixed-length double-array column kept by the
 * incremental storage manager (`table.f0`, `table.f0i`). Everything outside that
 * layout is rejected with an Error naming the byte offset, so a different table
 * fails loudly instead of being misread. The result is checked against
 * python-casacore (tests/fixtures/scripts/de405_coefficients.py).
 *
 * Layout, as found in these files (casacore's AipsIO serialisation):
 * - `table.dat` is canonical AipsIO (big-endian): magic 0xBEBEBEBE, object
 *   length, then objects as [uint32 length][string type][uint32 version] and
 *   strings as [uint32 length][bytes]. The "Table" object holds the row count,
 *   a format word and the table type; then the "TableDesc" object holds its name,
 *   version, comment and the table keywords as a "TableRecord" (a "RecordDesc"
 *   of [name, int32 data type, comment] per field, an int32 record type, then
 *   the values in field order).
 * - `table.f0` (little-endian, the incremental storage manager): a header object
 *   "IncrementalStMan" (version 5: a big-endian flag byte, bucket size, bucket count, …) in the first 512
 *   bytes, the buckets, then an "ISMIndex" object giving each bucket's first
 *   row. Each bucket starts with a uint32 offset of its index; the index lists,
 *   per column, [uint32 n][n uint32 rows relative to the bucket][n uint32 data
 *   offsets counted from byte 4 of the bucket]. Values are 8 bytes each: the
 *   double for `MJD`, an int64 byte offset into `table.f0i` for the array column.
 * - `table.f0i` (little-endian): at each such offset, int32 [1, ndim = 1, length]
 *   followed by `length` float64 values.
 */
import { readFileSync } from 'node:fs';
import { join } from 'node:path';

const AIPSIO_MAGIC = 0xbebebebe;
const CASACORE_TYPE_DOUBLE = 8; // casacore DataType enum: TpBool=0 … TpInt=5, TpUInt=6, TpFloat=7, TpDouble=8 …, TpString=11
const CASACORE_TYPE_INT = 5;
const CASACORE_TYPE_STRING = 11;
const ISM_HEADER_BYTES = 512;

export interface CasacoreTableHeader {
  rowCount: number;
  tableName: string;
  /** Scalar table keywords (numbers and strings); e.g. MJD0, dMJD, EMRAT, AU, CLIGHT, GMS. */
  keywords: Record<string, number | string>;
}

/** Sequential reader of AipsIO values with a fixed byte order. */
class AipsIoCursor {
  offset: number;
  constructor(
    private readonly bytes: Buffer,
    private readonly littleEndian: boolean,
    offset = 0,
    private readonly label = 'file',
  ) {
    this.offset = offset;
  }
  uint32(): number {
    this.need(4);
    const v = this.littleEndian ? this.bytes.readUInt32LE(this.offset) : this.bytes.readUInt32BE(this.offset);
    this.offset += 4;
    return v;
  }
  uint8(): number {
    this.need(1);
    return this.bytes[this.offset++];
  }
  int32(): number {
    this.need(4);
    const v = this.littleEndian ? this.bytes.readInt32LE(this.offset) : this.bytes.readInt32BE(this.offset);
    this.offset += 4;
    return v;
  }
  float64(): number {
    this.need(8);
    const v = this.littleEndian ? this.bytes.readDoubleLE(this.offset) : this.bytes.readDoubleBE(this.offset);
    this.offset += 8;
    return v;
  }
  string(): string {
    const length = this.uint32();
    this.need(length);
    const s = this.bytes.toString('latin1', this.offset, this.offset + length);
    this.offset += length;
    return s;
  }
  /** [uint32 length][string type][uint32 version]; checks the type and returns the version. */
  objectStart(expectedType: string): number {
    const at = this.offset;
    this.uint32();
    const type = this.string();
    if (type !== expectedType) this.fail(`expected AipsIO object "${expectedType}", found "${type}"`, at);
    return this.uint32();
  }
  fail(message: string, at = this.offset): never {
    throw new Error(`casacore table ${this.label}: ${message} at byte ${at}`);
  }
  private need(n: number): void {
    if (this.offset + n > this.bytes.length) this.fail(`unexpected end of file (need ${n} bytes)`);
  }
}

/**
 * Reads the row count and the scalar table keywords from `table.dat`.
 * Throws Error naming the byte offset when the file does not have the expected layout.
 */
export function readCasacoreTableHeader(tableDat: Buffer): CasacoreTableHeader {
  const io = new AipsIoCursor(tableDat, false, 0, 'table.dat');
  if (io.uint32() !== AIPSIO_MAGIC) io.fail('missing AipsIO magic word', 0);
  io.uint32(); // total object length
  if (io.string() !== 'Table') io.fail('expected a "Table" object', 8);
  io.uint32(); // Table version
  const rowCount = io.uint32();
  io.uint32(); // format word (byte order of the data files)
  io.string(); // table type, e.g. "PlainTable"
  io.objectStart('TableDesc');
  const tableName = io.string();
  io.string(); // description version
  io.string(); // comment
  return { rowCount, tableName, keywords: readScalarTableRecord(io) };
}

/** A "TableRecord" whose fields are all scalar doubles, ints or strings. */
function readScalarTableRecord(io: AipsIoCursor): Record<string, number | string> {
  io.objectStart('TableRecord');
  io.objectStart('RecordDesc');
  const fieldCount = io.uint32();
  const fields: Array<{ name: string; type: number }> = [];
  for (let i = 0; i < fieldCount; i++) {
    const name = io.string();
    const at = io.offset;
    const type = io.int32();
    if (type !== CASACORE_TYPE_DOUBLE && type !== CASACORE_TYPE_INT && type !== CASACORE_TYPE_STRING) {
      io.fail(`keyword ${name} has unsupported data type ${type}`, at);
    }
    io.string(); // comment
    fields.push({ name, type });
  }
  io.int32(); // record type
  const keywords: Record<string, number | string> = {};
  for (const { name, type } of fields) {
    keywords[name] = type === CASACORE_TYPE_STRING ? io.string() : type === CASACORE_TYPE_INT ? io.int32() : io.float64();
  }
  return keywords;
}

export interface IncrementalColumns {
  /** Per column (in storage order), per row: the raw 8-byte little-endian cell. */
  cells: Array<Array<Buffer>>;
  rowCount: number;
}

/**
 * Reads every bucket of an incremental-storage-manager file (`table.f0`) whose
 * columns hold one value per row (as in the DE405 table).
 */
export function readIncrementalColumns(f0: Buffer, rowCount: number, columnCount: number): IncrementalColumns {
  const io = new AipsIoCursor(f0, true, 0, 'table.f0');
  if (io.uint32() !== AIPSIO_MAGIC) io.fail('missing AipsIO magic word', 0);
  const version = io.objectStart('IncrementalStMan');
  if (version >= 5 && io.uint8() !== 0) io.fail('data are big-endian; only little-endian files are supported');
  const bucketBytes = io.uint32();
  const bucketCount = io.uint32();
  const bucketFirstRows = readIsmIndex(f0, ISM_HEADER_BYTES + bucketCount * bucketBytes, bucketCount);
  const cells: Buffer[][] = Array.from({ length: columnCount }, () => new Array<Buffer>(rowCount));
  for (let b = 0; b < bucketCount; b++) {
    const base = ISM_HEADER_BYTES + b * bucketBytes;
    const bucket = new AipsIoCursor(f0, true, base, 'table.f0');
    bucket.offset = base + bucket.uint32();
    for (let c = 0; c < columnCount; c++) {
      const n = bucket.uint32();
      const rows = Array.from({ length: n }, () => bucket.uint32());
      const offsets = Array.from({ length: n }, () => bucket.uint32());
      rows.forEach((relativeRow, k) => {
        const row = bucketFirstRows[b] + relativeRow;
        if (row >= rowCount) bucket.fail(`row ${row} beyond the row count ${rowCount}`);
        const start = base + 4 + offsets[k];
        cells[c][row] = f0.subarray(start, start + 8);
      });
    }
  }
  cells.forEach((column, c) => {
    for (let r = 0; r < rowCount; r++) {
      if (column[r] === undefined) io.fail(`column ${c} has no value for row ${r} (values that repeat are not supported)`);
    }
  });
  return { cells, rowCount };
}

/** The "ISMIndex" object at the end of table.f0: the first row of each bucket. */
function readIsmIndex(f0: Buffer, offset: number, bucketCount: number): number[] {
  const io = new AipsIoCursor(f0, true, offset, 'table.f0');
  if (io.uint32() !== AIPSIO_MAGIC) io.fail('missing AipsIO magic word before the ISM index', offset);
  io.objectStart('ISMIndex');
  io.uint32(); // number of used entries
  io.objectStart('Block');
  const firstRowCount = io.uint32();
  const firstRows = Array.from({ length: firstRowCount }, () => io.uint32());
  io.objectStart('Block');
  const bucketNumberCount = io.uint32();
  const bucketNumbers = Array.from({ length: bucketNumberCount }, () => io.uint32());
  if (bucketNumberCount !== bucketCount) io.fail(`ISM index lists ${bucketNumberCount} buckets, header says ${bucketCount}`);
  const result = new Array<number>(bucketCount);
  bucketNumbers.forEach((bucket, i) => {
    result[bucket] = firstRows[i];
  });
  return result;
}

/**
 * The double array stored at `offset` of an indirect-array file (`table.f0i`).
 * Throws Error when the array header is not [1, 1, expectedLength].
 */
export function readIndirectDoubleArray(f0i: Buffer, offset: number, expectedLength: number, into: Float64Array, intoOffset: number): void {
  const io = new AipsIoCursor(f0i, true, offset, 'table.f0i');
  const marker = io.int32();
  const dimensions = io.int32();
  const length = io.int32();
  if (marker !== 1 || dimensions !== 1 || length !== expectedLength) {
    io.fail(`array header [${marker}, ${dimensions}, ${length}] is not [1, 1, ${expectedLength}]`, offset);
  }
  for (let i = 0; i < length; i++) into[intoOffset + i] = io.float64();
}

export interface CasacoreChebyshevTable {
  header: CasacoreTableHeader;
  /** The `MJD` column: start of each row's interval. */
  rowStartMjd: Float64Array;
  /** rowCount × coefficientsPerRow doubles, row-major. */
  coefficients: Float64Array;
  coefficientsPerRow: number;
}

/**
 * Reads a table of the DE405 layout (scalar `MJD` column, array column `x` of
 * `coefficientsPerRow` doubles) from a casacore table directory.
 */
export function readCasacoreChebyshevTable(directory: string, coefficientsPerRow: number): CasacoreChebyshevTable {
  const header = readCasacoreTableHeader(readFileSync(join(directory, 'table.dat')));
  const { cells } = readIncrementalColumns(readFileSync(join(directory, 'table.f0')), header.rowCount, 2);
  const f0i = readFileSync(join(directory, 'table.f0i'));
  const rowStartMjd = new Float64Array(header.rowCount);
  const coefficients = new Float64Array(header.rowCount * coefficientsPerRow);
  for (let r = 0; r < header.rowCount; r++) {
    rowStartMjd[r] = cells[0][r].readDoubleLE(0);
    const arrayOffset = Number(cells[1][r].readBigInt64LE(0));
    readIndirectDoubleArray(f0i, arrayOffset, coefficientsPerRow, coefficients, r * coefficientsPerRow);
  }
  return { header, rowStartMjd, coefficients, coefficientsPerRow };
}

/**
 * Text-level handling of the arrival-time CSV (docs/formats.md §1): bytes →
 * string (strict UTF-8, optional byte-order mark, NUL bytes rejected) and one
 * physical line → fields (RFC 4180 quoting, restricted to one line: Note 1).
 *
 * Notes: 1. A quoted field may hold commas and doubled quotes but not a line
 *           break; the format keeps one record per line so that every error
 *           names the line it is on. An unclosed quote is an error on its line.
 *        2. Unquoted fields lose surrounding spaces and tabs; quoted fields are
 *           kept exactly.
 */

export type DecodedText = { ok: true; text: string } | { ok: false; line: number; message: string };

const NUL = 0;
const LINE_FEED = 0x0a;
const BYTE_ORDER_MARK = 0xfeff;

/** 1 + the number of line feeds before byte `offset`. */
function lineOfByte(bytes: Uint8Array, offset: number): number {
  let line = 1;
  for (let i = 0; i < offset; i += 1) if (bytes[i] === LINE_FEED) line += 1;
  return line;
}

/** Offset of the first byte that breaks UTF-8 (RFC 3629 §4 byte patterns), or −1. */
function firstInvalidUtf8Offset(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    let extra: number;
    let min: number;
    if (b < 0x80) { i += 1; continue; }
    if (b >= 0xc2 && b <= 0xdf) { extra = 1; min = 0x80; }
    else if (b >= 0xe0 && b <= 0xef) { extra = 2; min = 0x800; }
    else if (b >= 0xf0 && b <= 0xf4) { extra = 3; min = 0x10000; }
    else return i;
    if (i + extra >= bytes.length) return i; // truncated sequence
    let codePoint = b & (0x3f >> extra);
    for (let k = 1; k <= extra; k += 1) {
      const c = bytes[i + k];
      if ((c & 0xc0) !== 0x80) return i;
      codePoint = (codePoint << 6) | (c & 0x3f);
    }
    if (codePoint < min || codePoint > 0x10ffff || (codePoint >= 0xd800 && codePoint <= 0xdfff)) return i;
    i += extra + 1;
  }
  return -1;
}

/**
 * The file's text without a byte-order mark, or the reason it is not text.
 *
 * @param input  the file as bytes (UTF-8) or as an already decoded string
 */
export function decodeCsvText(input: string | Uint8Array): DecodedText {
  if (typeof input === 'string') {
    const nulAt = input.indexOf('\0');
    if (nulAt !== -1) return { ok: false, line: input.slice(0, nulAt).split('\n').length, message: nulMessage };
    return { ok: true, text: input.charCodeAt(0) === BYTE_ORDER_MARK ? input.slice(1) : input };
  }
  const nulAt = input.indexOf(NUL);
  if (nulAt !== -1) return { ok: false, line: lineOfByte(input, nulAt), message: nulMessage };
  try {
    // TextDecoder drops a leading byte-order mark by default (ignoreBOM: false).
    return { ok: true, text: new TextDecoder('utf-8', { fatal: true }).decode(input) };
  } catch {
    const offset = Math.max(0, firstInvalidUtf8Offset(input));
    return {
      ok: false,
      line: lineOfByte(input, offset),
      message: `the file is not UTF-8 text (invalid byte 0x${input[offset].toString(16).padStart(2, '0')} at byte ${offset}); save it as UTF-8 CSV`,
    };
  }
}

const nulMessage = 'the file contains NUL bytes: it looks like a binary file, not UTF-8 CSV text';

export type SplitLine = { ok: true; fields: string[] } | { ok: false; message: string };

/**
 * One physical line (without its line end) → fields (module Notes 1–2).
 */
export function splitCsvLine(line: string): SplitLine {
  if (line.indexOf('"') === -1) {
    const fields = line.split(',');
    for (let i = 0; i < fields.length; i += 1) fields[i] = fields[i].trim();
    return { ok: true, fields };
  }
  return splitQuotedCsvLine(line);
}

function splitQuotedCsvLine(line: string): SplitLine {
  const fields: string[] = [];
  let i = 0;
  for (;;) {
    // skip spaces before a possible opening quote
    let start = i;
    while (start < line.length && (line[start] === ' ' || line[start] === '\t')) start += 1;
    if (line[start] === '"') {
      let value = '';
      let j = start + 1;
      let close: number;
      for (;;) {
        close = line.indexOf('"', j);
        if (close === -1) {
          return { ok: false, message: `field ${fields.length + 1}: the quoted field is not closed on this line (line breaks inside fields are not supported)` };
        }
        if (line[close + 1] !== '"') break;
        value += line.slice(j, close + 1); // a doubled quote stands for one quote
        j = close + 2;
      }
      fields.push(value === '' ? line.slice(j, close) : value + line.slice(j, close));
      let after = close + 1;
      while (after < line.length && (line[after] === ' ' || line[after] === '\t')) after += 1;
      if (after === line.length) return { ok: true, fields };
      if (line[after] !== ',') {
        return { ok: false, message: `field ${fields.length}: unexpected text after the closing quote (a quote inside a quoted field is written "")` };
      }
      i = after + 1;
    } else {
      const comma = line.indexOf(',', i);
      const end = comma === -1 ? line.length : comma;
      const field = line.slice(i, end);
      if (field.indexOf('"') !== -1) {
        return { ok: false, message: `field ${fields.length + 1}: a quote inside an unquoted field (quote the whole field and write a quote as "")` };
      }
      fields.push(field.trim());
      if (comma === -1) return { ok: true, fields };
      i = comma + 1;
    }
  }
}

/** A field as it must be written so that splitCsvLine reads it back unchanged. */
export function quoteCsvField(value: string): string {
  if (value.includes('\n') || value.includes('\r')) {
    throw new RangeError(`CSV field "${value}" holds a line break, which the arrival-time format cannot carry`);
  }
  const needsQuotes = /[",]/.test(value) || value !== value.trim();
  return needsQuotes ? `"${value.replace(/"/g, '""')}"` : value;
}

/**
 * Receives a multipart/form-data TOA upload as it streams in: the `file` part
 * is collected in memory chunks up to a hard byte limit (busboy's
 * limits.fileSize stops the stream one byte past it) and hashed with SHA-256
 * on the way; the only other field is `confirmDuplicate`. An oversized file is drained and answered 413 with
 * nothing kept.
 */
import busboy from 'busboy';
import { createHash } from 'node:crypto';
import type { Request } from 'express';
import { AppError, fieldError } from '../../errors';

export interface ReceivedToaUpload {
  fileName: string;
  bytes: Uint8Array;
  checksumSha256: string; // lower-case hex of `bytes`
  confirmDuplicate: boolean;
}

const FIELD_LIMIT_BYTES = 1024;

function tooLarge(maxBytes: number): AppError {
  const mib = maxBytes / (1024 * 1024);
  return new AppError(413, 'payload_too_large', `the file is larger than the upload limit of ${maxBytes} bytes (${Number(mib.toFixed(3))} MiB)`);
}

/**
 * Reads the upload from the request stream.
 *
 * @param req       the request (its body not read yet)
 * @param maxBytes  largest accepted file, bytes
 * @returns         the file's bytes, name, SHA-256 and the confirmDuplicate flag
 *
 * Throws AppError 400 validation_failed (not multipart, no `file` part, a second
 * file, unknown or bad fields, malformed body), 413 payload_too_large.
 */
export function receiveToaUpload(req: Request, maxBytes: number): Promise<ReceivedToaUpload> {
  return new Promise((resolve, reject) => {
    let parser: busboy.Busboy;
    try {
      parser = busboy({ headers: req.headers, limits: { fileSize: maxBytes + 1, files: 1, fields: 4, fieldSize: FIELD_LIMIT_BYTES, parts: 5 } });
    } catch {
      reject(fieldError([], 'expected a multipart/form-data body with a "file" part'));
      return;
    }
    const chunks: Buffer[] = [];
    const hash = createHash('sha256');
    let fileName: string | null = null;
    let receivedBytes = 0;
    let truncated = false; // more than maxBytes arrived (busboy stops at maxBytes + 1)
    let problem: AppError | null = null;
    let confirmDuplicate = false;
    let settled = false;
    const fail = (err: AppError) => {
      problem ??= err;
    };

    parser.on('file', (name, stream, info) => {
      stream.on('error', () => undefined); // a truncated body errors the file stream too; the parser's 'error' answers it
      if (name !== 'file' || fileName !== null) {
        fail(fieldError([name], name === 'file' ? 'only one file per upload' : 'unknown file field (the file part is named "file")'));
        stream.resume();
        return;
      }
      fileName = info.filename || 'upload.csv';
      stream.on('data', (chunk: Buffer) => {
        if (truncated) return;
        receivedBytes += chunk.length;
        if (receivedBytes > maxBytes) {
          truncated = true;
          chunks.length = 0; // nothing of an oversized file is kept
          return;
        }
        chunks.push(chunk);
        hash.update(chunk);
      });
    });
    parser.on('field', (name, value, info) => {
      if (name !== 'confirmDuplicate') fail(fieldError([name], 'unknown field'));
      else if (info.valueTruncated || (value !== 'true' && value !== 'false')) fail(fieldError([name], 'must be "true" or "false"'));
      else confirmDuplicate = value === 'true';
    });
    parser.on('filesLimit', () => fail(fieldError(['file'], 'only one file per upload')));
    parser.on('fieldsLimit', () => fail(fieldError([], 'too many fields')));
    parser.on('partsLimit', () => fail(fieldError([], 'too many parts')));
    parser.on('error', () => {
      if (settled) return;
      settled = true;
      req.unpipe(parser);
      req.resume(); // drain the rest so the client gets the answer
      reject(fieldError([], 'malformed multipart/form-data body'));
    });
    parser.on('close', () => {
      if (settled) return;
      settled = true;
      if (truncated) reject(tooLarge(maxBytes));
      else if (problem) reject(problem);
      else if (fileName === null) reject(fieldError(['file'], 'a file part named "file" is required'));
      else resolve({ fileName, bytes: Buffer.concat(chunks), checksumSha256: hash.digest('hex'), confirmDuplicate });
    });
    req.on('error', () => {
      if (settled) return;
      settled = true;
      reject(new AppError(400, 'upload_aborted', 'the upload was interrupted'));
    });
    req.pipe(parser);
  });
}

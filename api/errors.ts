/**
 * The one error class of the API. Services and middleware throw it; the error
 * handler (api/middleware/error-handler.ts) turns it into
 * `{ error: { code, message, details? } }` with its status.
 */
import type { core } from 'zod';

export interface ErrorDetail {
  path: (string | number)[];
  message: string;
  line?: number | null; // file problems (invalid_toa_file): 1-based line, null for the whole file
  column?: string | null; // file problems: column name, null for the whole line or file
  existingBatchId?: number; // duplicate_upload: the stored batch with the same checksum
}

export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly details?: ErrorDetail[],
  ) {
    super(message);
    this.name = 'AppError';
  }
}

export const notFound = (what: string): AppError => new AppError(404, 'not_found', `${what} not found`);

export const conflict = (message: string): AppError => new AppError(409, 'conflict', message);

/** A 400 for one field, in the same shape zod failures get. */
export function fieldError(path: (string | number)[], message: string): AppError {
  const where = path.length > 0 ? `${path.join('.')}: ` : '';
  return new AppError(400, 'validation_failed', `${where}${message}`, [{ path, message }]);
}

/** A 400 validation_failed listing every problem; the message names the first. */
export function validationError(details: ErrorDetail[]): AppError {
  const first = details[0];
  const where = first && first.path.length > 0 ? `${first.path.join('.')}: ` : '';
  return new AppError(400, 'validation_failed', `${where}${first?.message ?? 'invalid input'}`, details);
}

/** zod issues → error details; an unknown key gets its own path so a form can point at it. */
export function detailsFromIssues(issues: core.$ZodIssue[], prefix: (string | number)[] = []): ErrorDetail[] {
  return issues.flatMap((issue): ErrorDetail[] => {
    const path = [...prefix, ...issue.path.map((p) => (typeof p === 'symbol' ? String(p) : p))];
    if (issue.code === 'unrecognized_keys') {
      return issue.keys.map((key) => ({ path: [...path, key], message: 'unknown field' }));
    }
    return [{ path, message: issue.message }];
  });
}

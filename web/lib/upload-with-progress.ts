import { env } from '../config/env';
import { ApiError, errorFromBody, getCsrfToken, resetCsrfToken } from './api-client';

/**
 * An ApiError from an upload that also keeps the raw `error.details` entries, because upload errors
 * carry fields the generic client drops (`line`, `column` of a bad row, `existingBatchId` of a duplicate).
 */
export class UploadError extends ApiError {
  readonly rawDetails: Record<string, unknown>[];

  constructor(base: ApiError, rawDetails: Record<string, unknown>[]) {
    super(base.status, base.code, base.message, base.details);
    this.name = 'UploadError';
    this.rawDetails = rawDetails;
  }
}

export interface UploadProgress {
  loadedBytes: number;
  /** Null when the browser cannot tell the request's size. */
  totalBytes: number | null;
}

export interface UploadOptions {
  /** Called from `xhr.upload.onprogress` while the request body is being sent. */
  onProgress?: (progress: UploadProgress) => void;
  /** Called once every byte is sent; the server is then validating and storing. */
  onSent?: () => void;
  signal?: AbortSignal;
}

function parseJson(text: string): unknown {
  if (text === '') return undefined;
  try {
    return JSON.parse(text);
  } catch {
    return undefined;
  }
}

function rawDetailsOf(body: unknown): Record<string, unknown>[] {
  const details = (body as { error?: { details?: unknown } } | undefined)?.error?.details;
  return Array.isArray(details) ? details.filter((d): d is Record<string, unknown> => typeof d === 'object' && d !== null) : [];
}

function errorFor(status: number, body: unknown): UploadError {
  if (status === 413 && rawDetailsOf(body).length === 0 && !(body as { error?: unknown } | undefined)?.error) {
    // A proxy in front of the API may answer 413 without our error body.
    return new UploadError(new ApiError(413, 'payload_too_large', 'The file is larger than the server accepts.'), []);
  }
  return new UploadError(errorFromBody(status, body), rawDetailsOf(body));
}

function sendOnce<T>(path: string, form: FormData, token: string, options: UploadOptions): Promise<T> {
  return new Promise<T>((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `${env.apiBaseUrl}${path}`);
    xhr.setRequestHeader('accept', 'application/json');
    xhr.setRequestHeader('x-csrf-token', token);
    xhr.upload.onprogress = (event: ProgressEvent) => {
      options.onProgress?.({ loadedBytes: event.loaded, totalBytes: event.lengthComputable ? event.total : null });
    };
    xhr.upload.onload = () => options.onSent?.();
    xhr.onload = () => {
      const body = parseJson(xhr.responseText);
      if (xhr.status >= 200 && xhr.status < 300) {
        if (typeof body === 'object' && body !== null && 'data' in body) resolve((body as { data: T }).data);
        else reject(new UploadError(new ApiError(xhr.status, 'unexpected_response', 'The server answered without a data field'), []));
      } else {
        reject(errorFor(xhr.status, body));
      }
    };
    xhr.onerror = () =>
      reject(new UploadError(new ApiError(0, 'network_error', 'The server could not be reached. Check your connection and try again.'), []));
    xhr.onabort = () => reject(new UploadError(new ApiError(0, 'aborted', 'The upload was cancelled.'), []));
    if (options.signal) {
      if (options.signal.aborted) {
        xhr.abort();
        return;
      }
      options.signal.addEventListener('abort', () => xhr.abort(), { once: true });
    }
    xhr.send(form);
  });
}

/**
 * POSTs `form` (multipart/form-data) to `/api${path}` with XMLHttpRequest, so the upload's byte
 * progress can be reported (fetch cannot report request-body progress). Carries the session's CSRF
 * token in `x-csrf-token` like `apiRequest`, refreshing it and retrying once on 403 `csrf_invalid`.
 * Resolves with the unwrapped `data`; rejects with an `UploadError`.
 */
export async function uploadWithProgress<T>(path: string, form: FormData, options: UploadOptions = {}): Promise<T> {
  try {
    return await sendOnce<T>(path, form, await getCsrfToken(), options);
  } catch (error) {
    if (!(error instanceof ApiError && error.status === 403 && error.code === 'csrf_invalid')) throw error;
    resetCsrfToken();
    return sendOnce<T>(path, form, await getCsrfToken(), options);
  }
}

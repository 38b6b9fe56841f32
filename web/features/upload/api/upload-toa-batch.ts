import { useQueryClient } from '@tanstack/react-query';
import { useCallback } from 'react';
import { uploadWithProgress, type UploadOptions } from '../../../lib/upload-with-progress';

/** A stored upload as the API returns it (docs/api-workflow.md, `TOABatch`). */
export interface UploadedBatch {
  id: number;
  pulsarId: number;
  fileName: string;
  uploadedBy: { id: number | string; displayName: string };
  checksumSha256: string;
  rowCount: number;
  firstMjd: string | null;
  lastMjd: string | null;
  observatories: string[];
  backends: string[];
  status: string;
  createdAt: string;
}

/** `POST /api/pulsars/:id/toa-batches` as multipart (`file`, optional `confirmDuplicate=true`), with byte progress. */
export function uploadToaBatch(pulsarId: string, file: File, confirmDuplicate: boolean, options: UploadOptions = {}) {
  const form = new FormData();
  // The server reads fields in order; the flag goes before the file so it is known while the file streams.
  if (confirmDuplicate) form.append('confirmDuplicate', 'true');
  form.append('file', file, file.name);
  return uploadWithProgress<UploadedBatch>(`/pulsars/${encodeURIComponent(pulsarId)}/toa-batches`, form, options);
}

// Prefixes of the queries an upload makes stale (pulsar counts and the batch list on the pulsar page).
const STALE_AFTER_UPLOAD: readonly (readonly string[])[] = [['pulsars'], ['toa-batches']];

/** The upload call plus cache invalidation on success (a mutation hook cannot carry progress callbacks per call as neatly). */
export function useUploadToaBatch(pulsarId: string) {
  const queryClient = useQueryClient();
  return useCallback(
    async (file: File, confirmDuplicate: boolean, options: UploadOptions = {}) => {
      const batch = await uploadToaBatch(pulsarId, file, confirmDuplicate, options);
      await Promise.all(STALE_AFTER_UPLOAD.map((queryKey) => queryClient.invalidateQueries({ queryKey })));
      return batch;
    },
    [pulsarId, queryClient],
  );
}

/** The API's limit for one TOA file (docs/api-workflow.md): 50 MB. */
export const MAX_UPLOAD_BYTES = 50 * 1024 * 1024;

export interface UploadPrecheck {
  /** Reasons the file is not sent at all. */
  errors: string[];
  /** Things worth knowing that do not stop the upload. */
  warnings: string[];
}

/** Checks a chosen file before any byte is sent: the size limit blocks, an unusual name only warns. */
export function precheckUpload(file: { name: string; size: number }): UploadPrecheck {
  const errors: string[] = [];
  const warnings: string[] = [];
  if (file.size > MAX_UPLOAD_BYTES) {
    errors.push(`${file.name} is ${formatBytes(file.size)}; the limit is ${formatBytes(MAX_UPLOAD_BYTES)}.`);
  }
  if (file.size === 0) warnings.push(`${file.name} is empty; the server will reject it.`);
  if (!/\.csv$/i.test(file.name)) warnings.push(`${file.name} does not end in .csv; it is sent anyway and checked as a TOA CSV.`);
  return { errors, warnings };
}

/** Bytes as "812 B", "14.2 kB", "50.0 MB" (powers of 1024, like the limit). */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

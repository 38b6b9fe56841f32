import { Fact } from '../../../components/fact';
import { formatCount, formatMjd } from '../../../lib/format';
import type { UploadedBatch } from '../api/upload-toa-batch';

/** Days between two MJD strings, for display only (one decimal; the MJDs themselves are never rounded). */
export function spanDays(firstMjd: string | null, lastMjd: string | null): string {
  if (!firstMjd || !lastMjd) return '—';
  const days = Number(lastMjd) - Number(firstMjd);
  return Number.isFinite(days) ? `${days.toFixed(1)} days` : '—';
}

/** What a stored upload holds. */
export function UploadSummary({ batch }: { batch: UploadedBatch }) {
  return (
    <dl aria-label="Stored batch" className="grid grid-cols-2 gap-4 text-sm sm:grid-cols-3">
      <Fact label="File">{batch.fileName}</Fact>
      <Fact label="Batch">#{batch.id}</Fact>
      <Fact label="TOAs stored">{formatCount(batch.rowCount)}</Fact>
      <Fact label="First TOA (MJD)">{formatMjd(batch.firstMjd, 6)}</Fact>
      <Fact label="Last TOA (MJD)">{formatMjd(batch.lastMjd, 6)}</Fact>
      <Fact label="Span">{spanDays(batch.firstMjd, batch.lastMjd)}</Fact>
      <Fact label="Observatories">{batch.observatories.length ? batch.observatories.join(', ') : '—'}</Fact>
      <Fact label="Backends">{batch.backends.length ? batch.backends.join(', ') : '—'}</Fact>
    </dl>
  );
}

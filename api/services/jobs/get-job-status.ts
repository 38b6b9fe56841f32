/** State, progress, result and failure reason of a queued job, from BullMQ; 404 if unknown. */
import { Job, type Queue } from 'bullmq';
import { JobProgress } from '../../contracts/queues';
import { notFound } from '../../errors';

export interface JobStatus {
  id: string;
  name: string;
  state: string; // waiting | active | completed | failed | delayed | prioritized | waiting-children | unknown
  progress: JobProgress;
  result: unknown;
  failedReason: string | null;
}

/** A job that has not reported progress yet (or reported a bare number) still gets the one progress shape. */
function progressOf(raw: unknown, state: string): JobProgress {
  const parsed = JobProgress.safeParse(raw);
  if (parsed.success) return parsed.data;
  if (typeof raw === 'number' && raw >= 0 && raw <= 100) return { percent: raw, stage: state };
  return { percent: state === 'completed' ? 100 : 0, stage: state };
}

export async function getJobStatus(queue: Queue, id: string): Promise<JobStatus> {
  const job = await Job.fromId(queue, id);
  if (!job) throw notFound('job');
  const state = await job.getState();
  return {
    id: String(job.id),
    name: job.name,
    state,
    progress: progressOf(job.progress, state),
    result: job.returnvalue ?? null,
    failedReason: job.failedReason ?? null,
  };
}

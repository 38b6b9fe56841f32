/**
 * E-mails the followers of a pulsar when one of its fit runs has finished
 * (succeeded, failed or cancelled): what finished, reduced χ² and weighted RMS
 * before (the previous succeeded fit of the pulsar) → after, and a link.
 * Called by the worker after the run's outcome is committed (worker/index.ts
 * listens to the fit-run job's completed/failed events). Never throws: a
 * mail that cannot be sent is logged, the job's outcome stands.
 */
import type { MailDeps } from '../../api/app-deps';
import { fitRunFinishedEmail } from '../../api/mail/notification-emails';
import { findPreviousFit, nullableNumber } from '../../api/services/campaigns/find-previous-fit';

const FINAL = new Set(['succeeded', 'failed', 'cancelled']);

/** Returns the addresses mailed (empty when the run is not final or nobody follows the pulsar). */
export async function notifyFitRunFinished(deps: MailDeps, fitRunId: number): Promise<string[]> {
  try {
    const run = await deps.knex('fit_runs as f').join('pulsars as p', 'p.id', 'f.pulsar_id').where('f.id', fitRunId)
      .first('f.id', 'f.pulsar_id', 'f.revision_id', 'f.status', 'f.error_message', 'f.finished_at', 'f.reduced_chi2', 'f.weighted_rms_us', 'p.name as pulsar_name');
    if (!run || !FINAL.has(run.status)) return [];
    const recipients: string[] = await deps.knex('notification_subscriptions as s').join('users as u', 'u.id', 's.user_id')
      .where({ 's.pulsar_id': run.pulsar_id, 'u.active': true }).orderBy('u.id').pluck('u.email');
    if (recipients.length === 0) return [];
    const before = await findPreviousFit(deps.knex, run.pulsar_id, { finishedBefore: run.finished_at ?? new Date(), excludeFitRunId: run.id });
    const facts = {
      fitRunId: run.id,
      pulsarName: run.pulsar_name,
      revisionId: run.revision_id,
      status: run.status,
      errorMessage: run.error_message,
      before,
      after: run.status === 'succeeded' ? { reducedChi2: nullableNumber(run.reduced_chi2), weightedRmsUs: nullableNumber(run.weighted_rms_us) } : null,
      link: `${deps.publicUrl}/fit-runs/${run.id}`,
    };
    return await sendEach(deps, recipients, (to) => fitRunFinishedEmail(to, facts), `fit run ${fitRunId}`);
  } catch (err) {
    deps.log(`notification for fit run ${fitRunId} not sent`, err);
    return [];
  }
}

/** Sends one message per recipient; a failed send is logged and the others still go out. */
export async function sendEach(
  deps: MailDeps,
  recipients: string[],
  build: (to: string) => Parameters<MailDeps['mailer']['send']>[0],
  what: string,
): Promise<string[]> {
  const sent: string[] = [];
  for (const to of recipients) {
    try {
      await deps.mailer.send(build(to));
      sent.push(to);
    } catch (err) {
      deps.log(`notification for ${what} to ${to} not sent`, err);
    }
  }
  return sent;
}

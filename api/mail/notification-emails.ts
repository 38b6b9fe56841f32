/**
 * Texts of the notification e-mails (plain text + escaped HTML): a fit run or
 * a campaign finished or failed, with the reduced χ² and weighted RMS before →
 * after and a link to the result page.
 */
import type { CampaignSummaryItem, FitFigures } from '../db/campaigns';
import type { OutgoingMail } from './mailer';

function escapeHtml(text: string): string {
  return text.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}

/** A figure with 4 significant digits, or "—" when there is none. */
function figure(value: number | null | undefined): string {
  return value === null || value === undefined || !Number.isFinite(value) ? '—' : Number(value.toPrecision(4)).toString();
}

/** "reduced χ² 1.52 → 1.01, weighted RMS 3.2 µs → 2.1 µs" (an absent side reads "none"). */
export function describeChange(before: FitFigures | null, after: FitFigures | null): string {
  const chi2 = `${before ? figure(before.reducedChi2) : 'none'} → ${after ? figure(after.reducedChi2) : 'none'}`;
  const rms = `${before ? `${figure(before.weightedRmsUs)} µs` : 'none'} → ${after ? `${figure(after.weightedRmsUs)} µs` : 'none'}`;
  return `reduced χ² ${chi2}, weighted RMS ${rms}`;
}

export interface FitRunMailFacts {
  fitRunId: number;
  pulsarName: string;
  revisionId: number;
  status: 'succeeded' | 'failed' | 'cancelled';
  errorMessage: string | null;
  before: (FitFigures & { fitRunId: number }) | null;
  after: FitFigures | null;
  link: string;
}

export function fitRunFinishedEmail(to: string, f: FitRunMailFacts): OutgoingMail {
  const what = `Fit run ${f.fitRunId} of ${f.pulsarName} (revision ${f.revisionId}) ${f.status}`;
  const lines = [`${what}.`, ''];
  if (f.status === 'failed') lines.push(`Error: ${f.errorMessage ?? 'no message'}`, '');
  if (f.status === 'succeeded') {
    lines.push(`Change: ${describeChange(f.before, f.after)}`);
    lines.push(f.before ? `(before = fit run ${f.before.fitRunId}, the previous succeeded fit of ${f.pulsarName})` : '(no earlier succeeded fit of this pulsar)');
    lines.push('');
  }
  lines.push('Details:', f.link, '', 'You receive this because you follow this pulsar in Pulsekeeper.');
  const html =
    `<p>${escapeHtml(what)}.</p>` +
    (f.status === 'failed' ? `<p>Error: ${escapeHtml(f.errorMessage ?? 'no message')}</p>` : '') +
    (f.status === 'succeeded' ? `<p>Change: ${escapeHtml(describeChange(f.before, f.after))}</p>` : '') +
    `<p>Details: <a href="${escapeHtml(f.link)}">${escapeHtml(f.link)}</a></p>` +
    '<p>You receive this because you follow this pulsar in Pulsekeeper.</p>';
  return { to, subject: `${what}`, text: lines.join('\n'), html };
}

export interface CampaignMailFacts {
  campaignId: number;
  name: string;
  status: 'succeeded' | 'failed' | 'cancelled';
  errorMessage: string | null;
  summary: CampaignSummaryItem[];
  link: string;
}

function summaryLine(item: CampaignSummaryItem): string {
  if (item.status === 'skipped') return `${item.pulsarName}: skipped (${item.skippedReason ?? 'no reason given'})`;
  if (item.status !== 'succeeded') return `${item.pulsarName}: ${item.status}`;
  return `${item.pulsarName}: ${describeChange(item.before, item.after)}`;
}

export function campaignFinishedEmail(to: string, f: CampaignMailFacts): OutgoingMail {
  const what = `Campaign "${f.name}" ${f.status}`;
  const lines = [`${what}.`, ''];
  if (f.errorMessage) lines.push(`Error: ${f.errorMessage}`, '');
  lines.push('Per pulsar (before → after):', ...f.summary.map((item) => `- ${summaryLine(item)}`), '');
  lines.push('Details:', f.link, '', 'You receive this because you follow this campaign in Pulsekeeper.');
  const html =
    `<p>${escapeHtml(what)}.</p>` +
    (f.errorMessage ? `<p>Error: ${escapeHtml(f.errorMessage)}</p>` : '') +
    `<p>Per pulsar (before → after):</p><ul>${f.summary.map((item) => `<li>${escapeHtml(summaryLine(item))}</li>`).join('')}</ul>` +
    `<p>Details: <a href="${escapeHtml(f.link)}">${escapeHtml(f.link)}</a></p>` +
    '<p>You receive this because you follow this campaign in Pulsekeeper.</p>';
  return { to, subject: what, text: lines.join('\n'), html };
}

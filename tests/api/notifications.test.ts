/**
 * E-mail subscriptions (routes) and the notifiers: a finished or failed fit
 * run (its state written directly, as the fit job would leave it) and a
 * finished campaign are mailed through nodemailer to the in-process SMTP sink,
 * with the χ²/RMS change and the link; a mailer that fails never throws.
 */
import type { Knex } from 'knex';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MailDeps } from '../../api/app-deps';
import type { CampaignSummaryItem } from '../../api/db/campaigns';
import { createMailer, type Mailer } from '../../api/mail/mailer';
import { startSmtpSink, type SmtpSink } from '../../api/mail/smtp-sink';
import { notifyCampaignFinished } from '../../worker/jobs/notify-campaign-finished';
import { notifyFitRunFinished } from '../../worker/jobs/notify-fit-run-finished';
import { signedInClient, type Client } from './helpers/agents';
import { createPulsarRow, createUser, type CreatedUser } from './helpers/factories';
import { lastMailId, waitForMail } from './helpers/outbox';
import { buildTestApp, type TestApp } from './helpers/test-app';

let t: TestApp;
let sink: SmtpSink;
let mailer: Mailer;
let viewer: CreatedUser;
let viewerClient: Client;
const logged: { message: string; err: unknown }[] = [];
let deps: MailDeps;

beforeAll(async () => {
  t = buildTestApp();
  sink = await startSmtpSink({ knex: t.knex, host: t.config.mail.host, port: t.config.mail.port });
  mailer = createMailer(t.config.mail);
  deps = { knex: t.knex, mailer, publicUrl: t.config.api.publicUrl, log: (message, err) => logged.push({ message, err }) };
  viewer = await createUser(t.knex, 'viewer');
  viewerClient = await signedInClient(t.app, viewer.email, viewer.password);
});
afterAll(async () => {
  mailer.close();
  await sink.close();
  await t.close();
});

function put(client: Client, url: string, body: unknown) {
  return client.agent.put(url).set('x-csrf-token', client.csrf).send(body as object);
}

/** A fit run in the state the fit job leaves it in (finished_at `minutesAgo` before now). */
async function finishedFit(
  knex: Knex,
  pulsarId: number,
  fields: { status: string; reducedChi2?: number; weightedRmsUs?: number; errorMessage?: string; minutesAgo: number },
): Promise<{ id: number; revisionId: number }> {
  const [revisionId] = await knex('model_revisions').insert({ pulsar_id: pulsarId, message: 'test model', model_json: '{}' });
  const finishedAt = new Date(Date.now() - fields.minutesAgo * 60_000);
  const [id] = await knex('fit_runs').insert({
    pulsar_id: pulsarId,
    revision_id: revisionId,
    inputs_hash: 'b'.repeat(64),
    settings: '{}',
    status: fields.status,
    finished_at: finishedAt,
    reduced_chi2: fields.reducedChi2 ?? null,
    weighted_rms_us: fields.weightedRmsUs ?? null,
    error_message: fields.errorMessage ?? null,
  });
  return { id, revisionId };
}

describe('subscription routes', () => {
  it('lets a viewer follow and unfollow a pulsar and a campaign, idempotently', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const [campaignId] = await t.knex('campaigns').insert({ name: 'c', revision_choice: 'latest', pulsar_selection: '"all"' });
    expect((await put(viewerClient, `/api/pulsars/${pulsar.id}/notification`, { subscribed: true })).body.data).toEqual({ subscribed: true });
    await put(viewerClient, `/api/pulsars/${pulsar.id}/notification`, { subscribed: true }).expect(200);
    await put(viewerClient, `/api/campaigns/${campaignId}/notification`, { subscribed: true }).expect(200);
    let mine = await viewerClient.agent.get('/api/notifications').expect(200);
    expect(mine.body.data).toEqual({ pulsarIds: [pulsar.id], campaignIds: [campaignId] });

    await put(viewerClient, `/api/pulsars/${pulsar.id}/notification`, { subscribed: false }).expect(200);
    mine = await viewerClient.agent.get('/api/notifications').expect(200);
    expect(mine.body.data).toEqual({ pulsarIds: [], campaignIds: [campaignId] });
  });

  it('answers 404 for an unknown pulsar or campaign and 400 for a bad body', async () => {
    const pulsar = await put(viewerClient, '/api/pulsars/2147480000/notification', { subscribed: true }).expect(404);
    expect(pulsar.body.error).toMatchObject({ code: 'not_found', message: 'pulsar not found' });
    const campaign = await put(viewerClient, '/api/campaigns/2147480000/notification', { subscribed: true }).expect(404);
    expect(campaign.body.error).toMatchObject({ code: 'not_found', message: 'campaign not found' });
    const bad = await put(viewerClient, '/api/pulsars/1/notification', { subscribed: 'yes' }).expect(400);
    expect(bad.body.error.details).toEqual([{ path: ['subscribed'], message: 'must be true or false' }]);
  });
});

describe('notifyFitRunFinished', () => {
  it('mails each follower of the pulsar what finished, reduced χ² and RMS before → after, and the link', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const other = await createUser(t.knex, 'analyst');
    for (const userId of [viewer.id, other.id]) await t.knex('notification_subscriptions').insert({ user_id: userId, pulsar_id: pulsar.id });
    await finishedFit(t.knex, pulsar.id, { status: 'succeeded', reducedChi2: 9.5, weightedRmsUs: 40, minutesAgo: 60 }); // older: not "before"
    const previous = await finishedFit(t.knex, pulsar.id, { status: 'succeeded', reducedChi2: 4.25, weightedRmsUs: 12.5, minutesAgo: 30 });
    await finishedFit(t.knex, pulsar.id, { status: 'failed', errorMessage: 'no TOAs', minutesAgo: 20 }); // failed: not "before"
    const run = await finishedFit(t.knex, pulsar.id, { status: 'succeeded', reducedChi2: 1.0312, weightedRmsUs: 2.125, minutesAgo: 1 });

    const afterId = await lastMailId(t.knex);
    const sent = await notifyFitRunFinished(deps, run.id);
    expect(sent.sort()).toEqual([viewer.email, other.email].sort());
    const mail = await waitForMail(t.knex, viewer.email, afterId);
    expect(mail.subject).toBe(`Fit run ${run.id} of ${pulsar.name} (revision ${run.revisionId}) succeeded`);
    expect(mail.text_body).toContain('Change: reduced χ² 4.25 → 1.031, weighted RMS 12.5 µs → 2.125 µs');
    expect(mail.text_body).toContain(`(before = fit run ${previous.id}, the previous succeeded fit of ${pulsar.name})`);
    expect(mail.text_body).toContain(`${t.config.api.publicUrl}/fit-runs/${run.id}`);
    expect(mail.html_body).toContain(`<a href="${t.config.api.publicUrl}/fit-runs/${run.id}">`);
    await waitForMail(t.knex, other.email, afterId);
  });

  it("mails a failed run's error message, and says when there is no earlier fit", async () => {
    const pulsar = await createPulsarRow(t.knex);
    await t.knex('notification_subscriptions').insert({ user_id: viewer.id, pulsar_id: pulsar.id });
    const failed = await finishedFit(t.knex, pulsar.id, { status: 'failed', errorMessage: 'design matrix is singular', minutesAgo: 2 });
    const afterId = await lastMailId(t.knex);
    await notifyFitRunFinished(deps, failed.id);
    const mail = await waitForMail(t.knex, viewer.email, afterId);
    expect(mail.subject).toBe(`Fit run ${failed.id} of ${pulsar.name} (revision ${failed.revisionId}) failed`);
    expect(mail.text_body).toContain('Error: design matrix is singular');

    const first = await finishedFit(t.knex, pulsar.id, { status: 'succeeded', reducedChi2: 1.5, weightedRmsUs: 3, minutesAgo: 1 });
    const afterFailed = await lastMailId(t.knex);
    await notifyFitRunFinished(deps, first.id);
    const second = await waitForMail(t.knex, viewer.email, afterFailed);
    expect(second.text_body).toContain('Change: reduced χ² none → 1.5, weighted RMS none → 3 µs');
    expect(second.text_body).toContain('(no earlier succeeded fit of this pulsar)');
  });

  it('sends nothing for a run that is still running, for an unfollowed pulsar, or to a deactivated follower', async () => {
    const pulsar = await createPulsarRow(t.knex);
    const inactive = await createUser(t.knex, 'viewer', { active: false });
    await t.knex('notification_subscriptions').insert({ user_id: inactive.id, pulsar_id: pulsar.id });
    const running = await finishedFit(t.knex, pulsar.id, { status: 'running', minutesAgo: 0 });
    expect(await notifyFitRunFinished(deps, running.id)).toEqual([]);
    const done = await finishedFit(t.knex, pulsar.id, { status: 'succeeded', reducedChi2: 1, weightedRmsUs: 1, minutesAgo: 0 });
    expect(await notifyFitRunFinished(deps, done.id)).toEqual([]);
    const lonely = await createPulsarRow(t.knex);
    const unfollowed = await finishedFit(t.knex, lonely.id, { status: 'succeeded', reducedChi2: 1, weightedRmsUs: 1, minutesAgo: 0 });
    expect(await notifyFitRunFinished(deps, unfollowed.id)).toEqual([]);
  });

  it('logs and returns normally when the mailer fails (the job outcome stands)', async () => {
    const pulsar = await createPulsarRow(t.knex);
    await t.knex('notification_subscriptions').insert({ user_id: viewer.id, pulsar_id: pulsar.id });
    const run = await finishedFit(t.knex, pulsar.id, { status: 'succeeded', reducedChi2: 1, weightedRmsUs: 1, minutesAgo: 0 });
    const broken: Mailer = { send: async () => Promise.reject(new Error('SMTP refused')), close: () => {} };
    const before = logged.length;
    await expect(notifyFitRunFinished({ ...deps, mailer: broken }, run.id)).resolves.toEqual([]);
    expect(logged.slice(before).map((l) => l.message)).toEqual([`notification for fit run ${run.id} to ${viewer.email} not sent`]);
  });
});

describe('notifyCampaignFinished', () => {
  it('mails the followers of a finished campaign the per-pulsar summary and the link', async () => {
    const summary: CampaignSummaryItem[] = [
      { pulsarId: 1, pulsarName: 'J0001', fitRunId: 5, before: { reducedChi2: 3.5, weightedRmsUs: 8 }, after: { reducedChi2: 1.1, weightedRmsUs: 2.5 }, status: 'succeeded', skippedReason: null },
      { pulsarId: 2, pulsarName: 'J0002', fitRunId: null, before: null, after: null, status: 'skipped', skippedReason: 'no TOAs' },
    ];
    const [id] = await t.knex('campaigns').insert({
      name: 'Spring refit', revision_choice: 'latest', pulsar_selection: '"all"', status: 'succeeded', summary_json: JSON.stringify(summary),
    });
    await t.knex('notification_subscriptions').insert({ user_id: viewer.id, campaign_id: id });
    const afterId = await lastMailId(t.knex);
    expect(await notifyCampaignFinished(deps, id)).toEqual([viewer.email]);
    const mail = await waitForMail(t.knex, viewer.email, afterId);
    expect(mail.subject).toBe('Campaign "Spring refit" succeeded');
    expect(mail.text_body).toContain('- J0001: reduced χ² 3.5 → 1.1, weighted RMS 8 µs → 2.5 µs');
    expect(mail.text_body).toContain('- J0002: skipped (no TOAs)');
    expect(mail.text_body).toContain(`${t.config.api.publicUrl}/campaigns/${id}`);
  });

  it('sends nothing while the campaign is still running', async () => {
    const [id] = await t.knex('campaigns').insert({ name: 'busy', revision_choice: 'latest', pulsar_selection: '"all"', status: 'running' });
    await t.knex('notification_subscriptions').insert({ user_id: viewer.id, campaign_id: id });
    expect(await notifyCampaignFinished(deps, id)).toEqual([]);
  });
});

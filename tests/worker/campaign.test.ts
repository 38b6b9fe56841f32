/**
 * The campaign job end to end with the real worker (BullMQ on the real Redis,
 * in this process): a lead starts a campaign through the API over pulsars
 * with and without TOAs and revisions; the worker fans out fit runs, tracks
 * them, writes the before/after summary and e-mails the lead (SMTP sink in
 * this process). Also: released revisions, cancelling, a worker restart and a
 * Redis that stops answering for 3 s in the middle of a campaign.
 */
import { readFileSync } from 'node:fs';
import path from 'node:path';
import { UnrecoverableError, type Job } from 'bullmq';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ObservatoryJson } from '../../api/db/observatories';
import { createMailer } from '../../api/mail/mailer';
import { startSmtpSink, type SmtpSink } from '../../api/mail/smtp-sink';
import { createFitRun } from '../../api/services/fit-runs/create-fit-run';
import { processCampaign } from '../../worker/jobs/campaign';
import { failCampaign } from '../../worker/jobs/campaign-failure';
import { startWorker } from '../../worker/index';
import { signedInClient, type Client } from '../api/helpers/agents';
import { createPulsarRow, createUser, type CreatedUser } from '../api/helpers/factories';
import { lastMailId } from '../api/helpers/outbox';
import { buildTestApp, type TestApp } from '../api/helpers/test-app';
import { createTestObservatory, demoModelJson, offsetStartModel, simulatedCsv, storeCsv } from './fit-run-fixtures';

const TOA_COUNT = 200; // small: each fit takes well under a second
const START_FREQUENCY_HZ = '218.8118472401'; // 2.3e-12 Hz below the fixture model's truth

let t: TestApp;
let sink: SmtpSink;
let worker: ReturnType<typeof startWorker>;
let lead: CreatedUser;
let leadClient: Client;
let observatory: ObservatoryJson;

beforeAll(async () => {
  t = buildTestApp();
  sink = await startSmtpSink({ knex: t.knex, host: t.config.mail.host, port: t.config.mail.port });
  worker = startWorker(t.config);
  lead = await createUser(t.knex, 'lead');
  leadClient = await signedInClient(t.app, lead.email, lead.password);
  observatory = await createTestObservatory(t.knex);
});

afterAll(async () => {
  await worker.close();
  await sink.close();
  await t.close();
});

const post = (url: string, body: object = {}) => leadClient.agent.post(url).set('x-csrf-token', leadClient.csrf).send(body);

/** A pulsar with simulated TOAs (unless `toas` is false) and one revision per model given. */
async function pulsarWith(options: { toas: boolean; models: ('truth' | 'offset')[]; seed?: number }) {
  const pulsar = await createPulsarRow(t.knex);
  const truth = demoModelJson(pulsar.name);
  if (options.toas) await storeCsv(t.knex, pulsar.id, simulatedCsv(truth, observatory, TOA_COUNT, options.seed ?? 7), lead.id);
  const revisionIds: number[] = [];
  for (const kind of options.models) {
    const model = kind === 'truth' ? truth : offsetStartModel(truth, START_FREQUENCY_HZ);
    const res = await post(`/api/pulsars/${pulsar.id}/revisions`, { model, message: `${kind} model` });
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    revisionIds.push(res.body.data.id);
  }
  return { ...pulsar, revisionIds };
}

async function waitForCampaign(id: number, until: (c: { status: string; runs: { fitRunId: number | null }[] }) => boolean, timeoutMs = 90_000) {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const res = await leadClient.agent.get(`/api/campaigns/${id}`).expect(200);
    if (until(res.body.data)) return res.body.data;
    if (Date.now() > deadline) throw new Error(`campaign ${id} still ${res.body.data.status} (${res.body.data.progress.stage})`);
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
}
/** The captured message to `to` with this subject and id above `afterId` (mails of one campaign arrive in any order). */
async function mailWithSubject(to: string, afterId: number, subject: string, timeoutMs = 10_000): Promise<{ text_body: string }> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const row = await t.knex('captured_emails').where({ to_addresses: to, subject }).where('id', '>', afterId).first('text_body');
    if (row) return row;
    if (Date.now() > deadline) throw new Error(`no mail "${subject}" to ${to} within ${timeoutMs} ms`);
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}
const isFinal = (c: { status: string }) => ['succeeded', 'failed', 'cancelled'].includes(c.status);

async function fitFigures(fitRunId: number) {
  const row = await t.knex('fit_runs').where({ id: fitRunId }).first('reduced_chi2', 'weighted_rms_us', 'status', 'campaign_id');
  return { reducedChi2: Number(row.reduced_chi2), weightedRmsUs: Number(row.weighted_rms_us), status: row.status, campaignId: row.campaign_id };
}

describe('a campaign over several pulsars', () => {
  it('fits each pulsar, skips those without TOAs or revisions, writes before → after and e-mails the lead', async () => {
    const refit = await pulsarWith({ toas: true, models: ['offset'] });
    const fresh = await pulsarWith({ toas: true, models: ['truth'], seed: 11 });
    const noToas = await pulsarWith({ toas: false, models: ['truth'] });
    const noRevision = await pulsarWith({ toas: true, models: [] });
    // An earlier fit of `refit`, then a new revision: the campaign fits the new one and compares with the earlier fit.
    const earlier = await post(`/api/pulsars/${refit.id}/fit-runs`, { revisionId: refit.revisionIds[0] });
    expect(earlier.status).toBe(202);
    const earlierId = earlier.body.data.fitRun.id as number;
    for (let i = 0; (await fitFigures(earlierId)).status !== 'succeeded'; i++) {
      expect(i, 'earlier fit did not succeed in time').toBeLessThan(600);
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    const newer = await post(`/api/pulsars/${refit.id}/revisions`, { model: demoModelJson(refit.name), message: 'truth model' });
    expect(newer.status).toBe(201);

    await leadClient.agent.put(`/api/pulsars/${fresh.id}/notification`).set('x-csrf-token', leadClient.csrf).send({ subscribed: true }).expect(200);
    const afterMailId = await lastMailId(t.knex);
    const started = await post('/api/campaigns', {
      name: 'Refit four', pulsarIds: [refit.id, fresh.id, noToas.id, noRevision.id], revisionChoice: 'latest', notifyMe: true,
    });
    expect(started.status, JSON.stringify(started.body)).toBe(202);
    const campaign = await waitForCampaign(started.body.data.id, isFinal);

    expect(campaign.status, campaign.errorMessage).toBe('succeeded');
    expect(campaign.progress).toMatchObject({ done: 4, total: 4, percent: 100, stage: 'succeeded' });
    const run = (id: number) => campaign.runs.find((r: { pulsarId: number }) => r.pulsarId === id);
    expect(run(refit.id)).toMatchObject({ revisionId: newer.body.data.id, status: 'succeeded', skippedReason: null });
    expect(run(fresh.id)).toMatchObject({ revisionId: fresh.revisionIds[0], status: 'succeeded' });
    expect(run(noToas.id)).toMatchObject({ status: 'skipped', skippedReason: 'no TOAs', fitRunId: null });
    expect(run(noRevision.id)).toMatchObject({ status: 'skipped', skippedReason: 'no revision', revisionId: null, fitRunId: null });

    const refitAfter = await fitFigures(run(refit.id).fitRunId);
    expect(refitAfter.campaignId).toBe(campaign.id);
    const earlierFigures = await fitFigures(earlierId);
    const item = (id: number) => campaign.summary.find((s: { pulsarId: number }) => s.pulsarId === id);
    expect(item(refit.id)).toMatchObject({
      status: 'succeeded',
      before: { reducedChi2: earlierFigures.reducedChi2, weightedRmsUs: earlierFigures.weightedRmsUs },
      after: { reducedChi2: refitAfter.reducedChi2, weightedRmsUs: refitAfter.weightedRmsUs },
    });
    expect(item(fresh.id).before).toBeNull();
    expect(item(fresh.id).after).toMatchObject({ reducedChi2: (await fitFigures(run(fresh.id).fitRunId)).reducedChi2 });
    expect(item(noToas.id)).toMatchObject({ status: 'skipped', before: null, after: null });

    const mail = await mailWithSubject(lead.email, afterMailId, 'Campaign "Refit four" succeeded');
    expect(mail.text_body).toContain(`- ${noToas.name}: skipped (no TOAs)`);
    expect(mail.text_body).toMatch(new RegExp(`- ${refit.name}: reduced χ² [0-9.]+ → [0-9.]+, weighted RMS [0-9.]+ µs → [0-9.]+ µs`));
    expect(mail.text_body).toContain(`${t.config.api.publicUrl}/campaigns/${campaign.id}`);
    // The lead also follows `fresh`: its campaign fit was mailed by the worker's finished-listener.
    const fitMail = await mailWithSubject(lead.email, afterMailId, `Fit run ${run(fresh.id).fitRunId} of ${fresh.name} (revision ${fresh.revisionIds[0]}) succeeded`);
    expect(fitMail.text_body).toContain(`${t.config.api.publicUrl}/fit-runs/${run(fresh.id).fitRunId}`);

    // Run again with nothing changed: the identical succeeded results are reused (no new fit runs).
    const [{ n: fitsBefore }] = await t.knex('fit_runs').count({ n: '*' });
    const again = await post('/api/campaigns', { name: 'Refit again', pulsarIds: [refit.id, fresh.id], revisionChoice: 'latest' });
    const second = await waitForCampaign(again.body.data.id, isFinal);
    expect(second.status).toBe('succeeded');
    expect(second.runs.map((r: { fitRunId: number }) => r.fitRunId).sort()).toEqual([run(refit.id).fitRunId, run(fresh.id).fitRunId].sort());
    const [{ n: fitsAfter }] = await t.knex('fit_runs').count({ n: '*' });
    expect(Number(fitsAfter)).toBe(Number(fitsBefore));
  });

  it("fits each pulsar's newest released revision and skips a pulsar without one", async () => {
    const released = await pulsarWith({ toas: true, models: ['offset', 'truth'] });
    const unreleased = await pulsarWith({ toas: true, models: ['truth'] });
    await post(`/api/revisions/${released.revisionIds[0]}/release`, { note: 'first release' }).expect(200);
    const started = await post('/api/campaigns', { name: 'Released only', pulsarIds: [released.id, unreleased.id], revisionChoice: 'released' });
    const campaign = await waitForCampaign(started.body.data.id, isFinal);
    expect(campaign.status).toBe('succeeded');
    const byPulsar = new Map(campaign.runs.map((r: { pulsarId: number }) => [r.pulsarId, r]));
    expect(byPulsar.get(released.id)).toMatchObject({ revisionId: released.revisionIds[0], status: 'succeeded' });
    expect(byPulsar.get(unreleased.id)).toMatchObject({ revisionId: null, status: 'skipped', skippedReason: 'no released revision' });
  });
});

describe('failures', () => {
  it('is failed, with the fit error in its message, when one pulsar cannot be fitted; the others still finish', async () => {
    const good = await pulsarWith({ toas: true, models: ['truth'], seed: 51 });
    const tooFew = await createPulsarRow(t.knex); // 3 TOAs for a model that solves for more parameters than that
    await storeCsv(t.knex, tooFew.id, simulatedCsv(demoModelJson(tooFew.name), observatory, 3, 52), lead.id);
    await post(`/api/pulsars/${tooFew.id}/revisions`, { model: demoModelJson(tooFew.name), message: 'start' }).expect(201);
    const afterMailId = await lastMailId(t.knex);
    const started = await post('/api/campaigns', { name: 'One bad', pulsarIds: [good.id, tooFew.id], revisionChoice: 'latest', notifyMe: true, recompute: true });
    const campaign = await waitForCampaign(started.body.data.id, isFinal);
    expect(campaign.status).toBe('failed');
    const failedFit = await t.knex('fit_runs').where({ campaign_id: campaign.id, pulsar_id: tooFew.id }).first('status', 'error_message');
    expect(failedFit.status).toBe('failed');
    expect(campaign.errorMessage).toBe(`1 of 2 fit runs failed; first: ${tooFew.name}: ${failedFit.error_message}`);
    const statusOf = new Map(campaign.summary.map((s: { pulsarId: number; status: string }) => [s.pulsarId, s.status]));
    expect(statusOf).toEqual(new Map([[good.id, 'succeeded'], [tooFew.id, 'failed']]));
    const mail = await mailWithSubject(lead.email, afterMailId, 'Campaign "One bad" failed');
    expect(mail.text_body).toContain(`- ${tooFew.name}: failed`);
  });

  it('records a campaign whose job failed for good as failed, keeps the summary so far and mails its followers once', async () => {
    const p = await createPulsarRow(t.knex);
    const [id] = await t.knex('campaigns').insert({ name: 'Lost job', created_by: lead.id, revision_choice: 'latest', pulsar_selection: '"all"', status: 'running' });
    await t.knex('campaign_runs').insert({ campaign_id: id, pulsar_id: p.id, status: 'skipped', skipped_reason: 'no TOAs' });
    await t.knex('notification_subscriptions').insert({ user_id: lead.id, campaign_id: id });
    const afterMailId = await lastMailId(t.knex);
    const mail = { knex: t.knex, mailer: createMailer(t.config.mail), publicUrl: t.config.api.publicUrl, log: () => {} };
    try {
      expect(await failCampaign({ knex: t.knex, mail }, id, 'Connection lost: The server closed the connection.')).toBe(true);
      expect(await failCampaign({ knex: t.knex, mail }, id, 'again')).toBe(false); // already final: no second mail
    } finally {
      mail.mailer.close();
    }
    const row = await t.knex('campaigns').where({ id }).first();
    expect(row).toMatchObject({ status: 'failed', error_message: 'Connection lost: The server closed the connection.', progress_done: 1, progress_total: 1 });
    const got = await mailWithSubject(lead.email, afterMailId, 'Campaign "Lost job" failed');
    expect(got.text_body).toContain('Error: Connection lost: The server closed the connection.');
    const [{ n }] = await t.knex('captured_emails').where('id', '>', afterMailId).where({ subject: 'Campaign "Lost job" failed' }).count({ n: '*' });
    expect(Number(n)).toBe(1);
  });
});

describe('robustness', () => {
  it('finishes with every run succeeded although Redis stops answering for 3 s mid-campaign', async () => {
    const pulsars = [await pulsarWith({ toas: true, models: ['offset'], seed: 21 }), await pulsarWith({ toas: true, models: ['offset'], seed: 22 })];
    const started = await post('/api/campaigns', { name: 'Blip', pulsarIds: pulsars.map((p) => p.id), revisionChoice: 'latest', recompute: true });
    const fannedOut = await waitForCampaign(started.body.data.id, (c) => c.runs.length === 2 && c.runs.every((r) => r.fitRunId !== null));
    expect(fannedOut.status).toBe('running'); // the blip falls inside the campaign
    const redisPid = Number(readFileSync(path.join(t.config.dataDir, 'redis', 'redis.pid'), 'utf8').trim()); // where scripts/services/redis.ts keeps it
    process.kill(redisPid, 'SIGSTOP');
    try {
      await new Promise((resolve) => setTimeout(resolve, 3_000));
    } finally {
      process.kill(redisPid, 'SIGCONT');
    }
    const campaign = await waitForCampaign(started.body.data.id, isFinal);
    expect(campaign.status, campaign.errorMessage).toBe('succeeded');
    expect(campaign.runs.map((r: { status: string }) => r.status)).toEqual(['succeeded', 'succeeded']);
    const fits = await t.knex('fit_runs').where({ campaign_id: campaign.id });
    expect(fits.map((f) => f.status)).toEqual(['succeeded', 'succeeded']); // one fit per pulsar, no duplicates
  });

  it('carries on after the worker is restarted mid-campaign', async () => {
    const pulsars = [await pulsarWith({ toas: true, models: ['offset'], seed: 31 }), await pulsarWith({ toas: true, models: ['offset'], seed: 32 })];
    const started = await post('/api/campaigns', { name: 'Restart', pulsarIds: pulsars.map((p) => p.id), revisionChoice: 'latest', recompute: true });
    await waitForCampaign(started.body.data.id, (c) => c.status === 'running');
    await worker.close();
    worker = startWorker(t.config);
    const campaign = await waitForCampaign(started.body.data.id, isFinal);
    expect(campaign.status, campaign.errorMessage).toBe('succeeded');
    const [{ n }] = await t.knex('fit_runs').where({ campaign_id: campaign.id }).count({ n: '*' });
    expect(Number(n)).toBe(2);
  });

  it('stops at the next pass after a cancel, cancels queued fits and keeps a summary', async () => {
    const pulsars = [await pulsarWith({ toas: true, models: ['offset'], seed: 41 }), await pulsarWith({ toas: true, models: ['offset'], seed: 42 })];
    const started = await post('/api/campaigns', { name: 'Cancel me', pulsarIds: pulsars.map((p) => p.id), revisionChoice: 'latest', recompute: true });
    const cancelled = await post(`/api/campaigns/${started.body.data.id}/cancel`);
    expect(cancelled.status, JSON.stringify(t.logged.map((l) => `${l.message}: ${String(l.err)}`))).toBe(200);
    expect(cancelled.body.data.status).toBe('cancelled');
    const campaign = await waitForCampaign(started.body.data.id, (c) => (c as unknown as { summary: unknown }).summary !== null);
    expect(campaign.status).toBe('cancelled');
    const fits = await t.knex('fit_runs').where({ campaign_id: campaign.id }).pluck('status');
    expect(fits.filter((s) => s === 'queued')).toEqual([]);
  });

  it('rejects a bad payload or an unknown campaign as unrecoverable', async () => {
    const deps = { knex: t.knex, queue: t.queue, createFitRun, mail: { knex: t.knex, mailer: { send: async () => {}, close: () => {} }, publicUrl: '', log: () => {} } };
    const job = (data: unknown) => ({ data, updateProgress: async () => {}, moveToDelayed: async () => {} }) as unknown as Job;
    await expect(processCampaign(job({ campaignId: 'x' }), undefined, deps)).rejects.toBeInstanceOf(UnrecoverableError);
    await expect(processCampaign(job({ campaignId: 2147480000 }), undefined, deps)).rejects.toThrow(/does not exist/);
  });
});

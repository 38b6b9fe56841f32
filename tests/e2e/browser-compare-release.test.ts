/**
 * Browser test (2) of the demo scenario (playwright-core + Debian's Chromium, the
 * built client served by the real API, the real worker): as the demo lead, compare
 * two finished fits of one demo pulsar, read both runs with AIC and BIC, save the
 * comparison with a comment, then release one revision with a note and see it
 * marked released on the timeline, the comparison and the fit-run page.
 * Screenshots: test-artifacts/compare-*.png (git-ignored).
 *
 * Precondition (set through the API as the lead, marked as test setup): besides the
 * demo's starting model of FPG-J1839-1127 (spin and DM free), a revision that also
 * frees the position (the demo's off-sky pulsar), and a finished fit of each.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningApi } from '../../api/server';
import { artifactPath } from './helpers/browser';
import { startBrowserScenario, type BrowserScenario, type ScenarioApi } from './helpers/browser-scenario';

const PULSAR = 'FPG-J1839-1127'; // the demo's pulsar with a slightly wrong starting position (api/db/demo-scenario/demo-pulsars.ts)
const FIT_WAIT_MS = 240_000;
const POSITION = ['astrometry.ra_hms', 'astrometry.dec_dms'];

let scenario: BrowserScenario;
let api: RunningApi;
let pulsarId: number;
let signIn: BrowserScenario['signIn'];
let consoleErrors: string[];

beforeAll(async () => {
  scenario = await startBrowserScenario(async (knex) => {
    pulsarId = (await knex('pulsars').where({ name: PULSAR }).first('id')).id;
  });
  ({ api, signIn, consoleErrors } = scenario);
});

afterAll(async () => {
  await scenario?.close();
});

/** Queues a fit of the revision (or takes the identical finished one the API offers) and waits for it to succeed. */
async function finishedFit(client: ScenarioApi, revisionId: number): Promise<number> {
  const queued = await client.post<{ fitRun: { id: number } }>(`/api/pulsars/${pulsarId}/fit-runs`, { revisionId });
  const id = queued.fitRun.id;
  const until = Date.now() + FIT_WAIT_MS;
  for (;;) {
    const run = await client.get<{ status: string; errorMessage: string | null }>(`/api/fit-runs/${id}`);
    if (run.status === 'succeeded') return id;
    if (run.status === 'failed' || run.status === 'cancelled') throw new Error(`fit run ${id} ${run.status}: ${run.errorMessage}`);
    if (Date.now() > until) throw new Error(`fit run ${id} still ${run.status} after ${FIT_WAIT_MS} ms`);
    await new Promise((r) => setTimeout(r, 1000));
  }
}

/** The starting revision and a child that also frees the position (test setup), each with a finished fit. */
async function twoFinishedFits(client: ScenarioApi) {
  const revisions = await client.get<{ id: number }[]>(`/api/pulsars/${pulsarId}/revisions`);
  const start = revisions[revisions.length - 1]; // the demo's starting model (oldest)
  const model = (await client.get<{ model: { solve_for: string[] } }>(`/api/revisions/${start.id}`)).model;
  const withPosition = await client.post<{ id: number }>(`/api/pulsars/${pulsarId}/revisions`, {
    model: { ...model, solve_for: [...model.solve_for, ...POSITION.filter((p) => !model.solve_for.includes(p))] },
    message: 'TEST SETUP (browser test 2): position freed as well',
    parentId: start.id,
  });
  const [startRun, positionRun] = [await finishedFit(client, start.id), await finishedFit(client, withPosition.id)];
  return { startRun, positionRun, positionRevisionId: withPosition.id };
}

/** The browser steps: pick, compare, save, release, and see the release everywhere. */
async function compareSaveAndRelease(page: Page): Promise<void> {
  const { startRun, positionRun, positionRevisionId } = await twoFinishedFits(scenario.apiAs(page.request));

  // Pick the two runs on the pulsar page, the starting fit first (the reference).
  await page.goto(`${api.url}/pulsars/${pulsarId}`);
  await page.getByRole('heading', { name: PULSAR }).waitFor();
  const picker = page.getByRole('list', { name: 'Finished fit runs to compare' });
  await picker.getByRole('checkbox', { name: new RegExp(`^Run #${startRun} `) }).check();
  await picker.getByRole('checkbox', { name: new RegExp(`^Run #${positionRun} `) }).check();
  await page.getByRole('link', { name: 'Compare 2 runs' }).click();

  // Both runs side by side, with AIC and BIC, and the residuals drawn.
  const statistics = page.getByRole('table', { name: 'Fit statistics of the compared runs' });
  await statistics.waitFor({ timeout: 60_000 });
  expect(page.url()).toBe(`${api.url}/pulsars/${pulsarId}/compare?runs=${startRun},${positionRun}`);
  await statistics.getByRole('link', { name: `Run #${startRun}` }).waitFor();
  await statistics.getByRole('link', { name: `Run #${positionRun}` }).waitFor();
  const aicCells = await statistics.getByRole('row').filter({ has: page.getByRole('rowheader', { name: 'AIC' }) }).getByRole('cell').allTextContents();
  const bicCells = await statistics.getByRole('row').filter({ has: page.getByRole('rowheader', { name: 'BIC' }) }).getByRole('cell').allTextContents();
  expect(aicCells).toHaveLength(2);
  expect(bicCells).toHaveLength(2);
  for (const cell of [...aicCells, ...bicCells]) expect(cell).toMatch(/^-?\d+\.\d{2}/);
  // Same TOAs and settings: the lowest of each criterion is named in words.
  expect(aicCells.filter((c) => c.includes('lowest AIC'))).toHaveLength(1);
  expect(bicCells.filter((c) => c.includes('lowest BIC'))).toHaveLength(1);
  expect(await page.getByText('Statistics are not comparable across these runs').count()).toBe(0);
  await page.getByText(/Bevington & Robinson, Data Reduction and Error Analysis for the Physical Sciences, 3rd ed\. \(2003\)/).waitFor();
  await page.getByRole('list', { name: 'F-tests of nested pairs' }).getByText(`Run #${positionRun} adds 2 parameters to run #${startRun}`).waitFor();
  await page.getByRole('table', { name: 'Engine settings of the compared runs' }).getByText('DE405').first().waitFor();
  await page.locator('.js-plotly-plot .legend').first().waitFor({ timeout: 60_000 }); // Plotly drew the stacked residuals
  await page.screenshot({ path: artifactPath('compare-1-comparison.png'), fullPage: true });

  // Save it with a comment and open the saved page.
  const comment = 'Freeing the position removes the annual wave (browser test 2).';
  const form = page.getByRole('form', { name: 'Save comparison' });
  await form.getByLabel('Comment').fill(comment);
  await form.getByRole('button', { name: 'Save comparison' }).click();
  const savedLink = form.getByRole('link', { name: /^Open saved comparison #\d+$/ });
  await savedLink.waitFor({ timeout: 30_000 });
  await savedLink.click();
  await page.getByRole('heading', { name: /^Comparison #\d+$/ }).waitFor();
  await page.getByText(comment).waitFor();
  await page.getByRole('table', { name: 'Fit statistics of the compared runs' }).waitFor();
  await page.screenshot({ path: artifactPath('compare-2-saved.png'), fullPage: true });

  // Release the revision with the position, with a note; the timeline marks it released.
  await page.goto(`${api.url}/pulsars/${pulsarId}`);
  await page.getByRole('list', { name: 'Saved comparisons' }).getByText(comment).waitFor();
  const timeline = page.getByRole('list', { name: 'Model revisions' });
  const entry = timeline.getByRole('listitem').filter({ hasText: `#${positionRevisionId}` }).filter({ hasText: 'position freed as well' });
  await entry.getByRole('button', { name: `Release #${positionRevisionId}…` }).click();
  await entry.getByLabel('Release note').fill('Position fitted; preferred by AIC, BIC and the F-test (browser test 2).');
  await entry.getByRole('button', { name: `Release revision #${positionRevisionId}` }).click();
  await entry.getByText('released', { exact: true }).waitFor({ timeout: 30_000 });
  await entry.getByText(/^Released .* by Leda Fenwright \(group lead\)/).waitFor();
  await entry.getByRole('button', { name: `Withdraw release of #${positionRevisionId}…` }).waitFor();
  await entry.scrollIntoViewIfNeeded();
  await page.screenshot({ path: artifactPath('compare-3-released.png') });

  // Marked released in the comparison table and on the fit-run page too.
  await page.goto(`${api.url}/pulsars/${pulsarId}/compare?runs=${startRun},${positionRun}`);
  const headers = page.getByRole('table', { name: 'Fit statistics of the compared runs' }).getByRole('columnheader');
  await headers.nth(2).getByText('released', { exact: true }).waitFor({ timeout: 60_000 });
  expect(await headers.nth(1).getByText('released', { exact: true }).count()).toBe(0);
  await page.goto(`${api.url}/fit-runs/${positionRun}`);
  await page.getByRole('heading', { name: `Fit run #${positionRun}` }).waitFor();
  await page.getByText('released', { exact: true }).waitFor({ timeout: 30_000 });
  await page.screenshot({ path: artifactPath('compare-4-fit-run-released.png') });
}

describe('comparing two fits and releasing one in the browser', () => {
  it('lets the lead compare two fits with AIC/BIC, save the comparison with a comment and release the better revision', async () => {
    const page = await signIn('lead');
    try {
      await compareSaveAndRelease(page);
    } catch (error) {
      await page.screenshot({ path: artifactPath('compare-failure.png'), fullPage: true });
      throw error;
    }
    await page.close();
    expect(consoleErrors).toEqual([]);
  });
});

/**
 * Browser test of the "find the hidden companions" step of the demo story
 * (playwright-core + Debian's Chromium, the built client served by the real API,
 * the real worker), done entirely in the browser: as the demo analyst, open the
 * demo pulsar whose starting model has no companions, start a companion search
 * from the pulsar page, follow it to the end on the search-run page, read two
 * accepted candidates near 71.4 d and 283.6 d with their ± uncertainties and the
 * threshold line over the periodogram, save the resulting model as a revision
 * with a message, queue a fit of it from there and see it finish.
 * Screenshots: test-artifacts/search-*.png (git-ignored). Needs a built client
 * (`npx vite build`).
 */
import type { Locator } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HIDDEN_COMPANIONS } from '../../api/db/demo-scenario/demo-pulsars';
import type { RunningApi } from '../../api/server';
import { artifactPath } from './helpers/browser';
import { startBrowserScenario, type BrowserScenario } from './helpers/browser-scenario';

const PULSAR = 'FPG-J2208+4121'; // the demo's pulsar with two hidden companions (api/db/demo-scenario/README.md)
const SEARCH_WAIT_MS = 300_000;
const FIT_WAIT_MS = 240_000;

let scenario: BrowserScenario;
let api: RunningApi;
let pulsarId: number;
let startRevisionId: number; // the demo's starting model, without companions
let signIn: BrowserScenario['signIn'];
let consoleErrors: string[];

beforeAll(async () => {
  scenario = await startBrowserScenario(async (knex) => {
    pulsarId = (await knex('pulsars').where({ name: PULSAR }).first('id')).id;
    startRevisionId = (await knex('model_revisions').where({ pulsar_id: pulsarId }).orderBy('id').first('id')).id;
  });
  ({ api, signIn, consoleErrors } = scenario);
});

afterAll(async () => {
  await scenario?.close();
});

/** An accepted candidate's period cell, "71.38… ± 0.0012 days", as numbers. */
async function acceptedPeriods(table: Locator): Promise<{ name: string; periodDays: number; sigmaDays: number; text: string }[]> {
  const rows = table.locator('tbody tr');
  const found: { name: string; periodDays: number; sigmaDays: number; text: string }[] = [];
  for (let i = 0; i < (await rows.count()); i++) {
    const cells = rows.nth(i).locator('td');
    const status = (await cells.nth(1).textContent()) ?? '';
    if (!/accepted/.test(status) || /not a discovery/.test(status)) continue;
    const text = ((await cells.nth(2).textContent()) ?? '').trim();
    const match = /^([0-9.]+)\s*±\s*([0-9.eE+-]+)/.exec(text);
    found.push({
      name: ((await cells.nth(0).locator('span').first().textContent()) ?? '').trim(),
      periodDays: match ? Number(match[1]) : Number.NaN,
      sigmaDays: match ? Number(match[2]) : Number.NaN,
      text,
    });
  }
  return found;
}

describe('the companion search in the browser', () => {
  it('lets the analyst find the two hidden companions, save them as a revision and fit it', async () => {
    const page = await signIn('analyst');

    // The pulsar page: its starting model has no companions; start a search with the defaults.
    await page.goto(`${api.url}/pulsars/${pulsarId}`);
    const section = page.getByRole('region', { name: 'Companion search' });
    const form = section.getByRole('form', { name: 'Start a companion search' });
    await form.waitFor();
    // Other browser tests may have saved revisions of this pulsar into the same test database: pick the start.
    await form.getByLabel('Model revision').selectOption(String(startRevisionId));
    await page.screenshot({ path: artifactPath('search-1-pulsar-page.png'), fullPage: true });
    await form.getByRole('button', { name: 'Start search' }).click();
    const queued = section.getByRole('link', { name: /^search #\d+$/ });
    await queued.waitFor();
    await queued.click();

    // The search-run page follows the run to the end.
    await page.getByRole('heading', { name: /^Companion search #\d+$/ }).waitFor();
    const candidates = page.getByRole('table', { name: 'Companion candidates' });
    await candidates.waitFor({ timeout: SEARCH_WAIT_MS });
    expect(await page.getByText('The search failed').count()).toBe(0);

    // Two accepted candidates near the hidden periods, each with its ± uncertainty.
    const accepted = await acceptedPeriods(candidates);
    if (accepted.length !== 2) await page.screenshot({ path: artifactPath('search-failure.png'), fullPage: true });
    expect(accepted, JSON.stringify(accepted)).toHaveLength(2);
    for (const hidden of HIDDEN_COMPANIONS) {
      const truePeriodDays = Number(hidden.period_days); // the demo's invented truth (71.38 d, 283.6 d)
      const match = accepted.find((c) => Math.abs(c.periodDays - truePeriodDays) < 0.01 * truePeriodDays);
      expect(match, `a candidate within 1 % of ${truePeriodDays} d among ${JSON.stringify(accepted)}`).toBeDefined();
      expect(match!.sigmaDays).toBeGreaterThan(0);
      expect(match!.sigmaDays).toBeLessThan(0.01 * truePeriodDays);
      console.info(`browser-search: ${match!.name} at ${match!.text} (truth ${truePeriodDays} d, ${(Math.abs(match!.periodDays - truePeriodDays) / match!.sigmaDays).toFixed(1)}σ off)`);
    }

    // The threshold line over the first round's periodogram, with its label.
    const round1 = page.getByRole('figure', { name: 'Periodogram of round 1' });
    await round1.locator('.js-plotly-plot').waitFor({ timeout: 60_000 });
    await round1.locator('.annotation-text', { hasText: /^False-alarm threshold 1\.0e-3$/ }).waitFor();
    expect(await round1.locator('.shapelayer path').count()).toBeGreaterThanOrEqual(1);
    await round1.getByText(/The dashed line is the power [0-9.]+ at which the false-alarm probability/).waitFor();
    const plotHeight = await round1.locator('.js-plotly-plot').evaluate((node) => node.getBoundingClientRect().height);
    expect(plotHeight).toBeGreaterThan(100);
    await page.waitForTimeout(1000); // let Plotly finish drawing before the screenshots
    await page.screenshot({ path: artifactPath('search-2-finished.png'), fullPage: true });
    await round1.screenshot({ path: artifactPath('search-3-round-1-periodogram.png') });

    // Save the resulting model as a revision with a message.
    await page.getByRole('button', { name: 'Save resulting model as a revision' }).click();
    const dialog = page.getByRole('dialog', { name: 'Save as a new revision' });
    await dialog.getByLabel('Message').fill('Two companions found by the companion search (browser test)');
    await dialog.getByRole('button', { name: 'Save revision' }).click();
    const saved = page.getByText(/^Saved as revision #\d+$/);
    await saved.waitFor();
    const revisionId = Number(/#(\d+)/.exec((await saved.textContent()) ?? '')![1]);
    await page.screenshot({ path: artifactPath('search-4-saved.png'), fullPage: true });

    // Queue a fit of it from there and see it finish.
    await page.getByRole('button', { name: `Queue a fit of revision #${revisionId}` }).click();
    const fitLink = page.getByRole('link', { name: /^fit run #\d+$/ });
    await fitLink.waitFor();
    await fitLink.click();
    await page.getByRole('heading', { name: /^Fit run #\d+$/ }).waitFor();
    await page.getByText(`· revision #${revisionId}`).waitFor();
    await page.getByText('Fit statistics').waitFor({ timeout: FIT_WAIT_MS });
    expect(await page.getByText('The fit failed').count()).toBe(0);
    expect(await page.getByText('succeeded', { exact: true }).count()).toBeGreaterThanOrEqual(1);
    await page.waitForTimeout(1000);
    await page.screenshot({ path: artifactPath('search-5-fit-finished.png'), fullPage: true });
    await page.close();
    expect(consoleErrors).toEqual([]);
  }, 900_000);
});

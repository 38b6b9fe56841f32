/**
 * Browser test of the residual explorer on the demo scenario (playwright-core +
 * Debian's Chromium, the built client served by the real API, the real worker):
 * as the demo analyst, open the demo pulsar with hidden companions on a fit that
 * has them, switch a companion off (the RMS rises) and on again (it comes back),
 * box-select two TOAs and exclude them (the count changes), queue a fit with the
 * new exclusions and see it finish. Screenshots: test-artifacts/explorer-*.png
 * (git-ignored).
 *
 * Precondition (set through the API): a revision of FPG-J2208+4121 with its two
 * companions, found by a companion search and saved from it, then a fit of it.
 */
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { HIDDEN_COMPANIONS } from '../../api/db/demo-scenario/demo-pulsars';
import type { RunningApi } from '../../api/server';
import { artifactPath } from './helpers/browser';
import { startBrowserScenario, type BrowserScenario, type ScenarioApi } from './helpers/browser-scenario';

const PULSAR = 'FPG-J2208+4121'; // the demo's pulsar with two hidden companions (api/db/demo-scenario/README.md)
const SEARCH_WAIT_MS = 240_000;
const FIT_WAIT_MS = 240_000;

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

interface Revision { id: number; model?: { companions?: unknown[] } }

async function waitFinal<T extends { status: string }>(read: () => Promise<T>, timeoutMs: number): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const value = await read();
    if (['succeeded', 'failed', 'cancelled'].includes(value.status) || Date.now() > until) return value;
    await new Promise((r) => setTimeout(r, 1000));
  }
}

/**
 * The revision with the two companions, as the demo story makes it: a companion search on the starting
 * model, saved as a revision (or the revision already saved from the same search, when an earlier test
 * in this database ran it: the search is reused by its inputs hash and can be saved once).
 */
async function revisionWithCompanions(client: ScenarioApi): Promise<{ revisionId: number; how: string }> {
  const revisions = await client.get<Revision[]>(`/api/pulsars/${pulsarId}/revisions`);
  const start = revisions[revisions.length - 1]; // the demo's starting model (oldest)
  // At most two companions: other inputs than the browser search test's defaults, so the two tests never share a run.
  const created = await client.post<{ searchRun: { id: number } }>(`/api/pulsars/${pulsarId}/search-runs`, { revisionId: start.id, maxCompanions: 2 });
  const run = await waitFinal(
    async () =>
      client.get<{ status: string; savedRevisionId: number | null; result: { resultingModel?: { companions?: unknown[] } } | null }>(
        `/api/search-runs/${created.searchRun.id}`,
      ),
    SEARCH_WAIT_MS,
  );
  expect(run.status).toBe('succeeded');
  expect(run.result?.resultingModel?.companions ?? []).toHaveLength(HIDDEN_COMPANIONS.length);
  if (run.savedRevisionId !== null) return { revisionId: run.savedRevisionId, how: 'a search saved earlier' };
  const saved = await client.post<Revision>(`/api/search-runs/${created.searchRun.id}/save-revision`, { message: 'Companions found by the search (browser test)' });
  return { revisionId: saved.id, how: 'the search' };
}

/** Waits until the periodogram below the plot is drawn and no longer recomputing (screenshots show the settled page). */
async function settle(page: Page): Promise<void> {
  await page.locator('figure[aria-label="Periodogram plot"] .js-plotly-plot').waitFor({ timeout: 60_000 });
  await page.waitForTimeout(1500);
}

const number = (text: string | null) => Number.parseFloat((text ?? '').replace(/,/g, ''));

/** Screen centres of the residual plot's markers (SVG scatter below the WebGL threshold). */
async function markerCentres(page: Page): Promise<{ x: number; y: number }[]> {
  return page.locator('section[aria-label="Residual plot"] .js-plotly-plot .scatterlayer path.point').evaluateAll((nodes) =>
    nodes.map((node) => {
      const r = node.getBoundingClientRect();
      return { x: r.left + r.width / 2, y: r.top + r.height / 2 };
    }),
  );
}

/** A box (≥ 14 px each way) holding exactly two marker centres, the closest such pair. */
function boxAroundTwo(points: { x: number; y: number }[]): { x0: number; y0: number; x1: number; y1: number } {
  const pairs: [number, number, number][] = [];
  for (let i = 0; i < points.length; i++) {
    for (let j = i + 1; j < Math.min(points.length, i + 40); j++) pairs.push([i, j, Math.hypot(points[i].x - points[j].x, points[i].y - points[j].y)]);
  }
  pairs.sort((a, b) => a[2] - b[2]);
  for (const [i, j] of pairs) {
    const cx = (points[i].x + points[j].x) / 2;
    const cy = (points[i].y + points[j].y) / 2;
    const hw = Math.max(7, Math.abs(points[i].x - points[j].x) / 2 + 3);
    const hh = Math.max(7, Math.abs(points[i].y - points[j].y) / 2 + 3);
    const box = { x0: cx - hw, y0: cy - hh, x1: cx + hw, y1: cy + hh };
    const inside = points.filter((p) => p.x >= box.x0 - 2 && p.x <= box.x1 + 2 && p.y >= box.y0 - 2 && p.y <= box.y1 + 2).length;
    if (inside === 2) return box;
  }
  throw new Error('no two markers can be boxed alone');
}

describe('the residual explorer in the browser', () => {
  it('lets the analyst switch a companion off and on, exclude two box-selected TOAs and refit', async () => {
    const page = await signIn('analyst');
    const client = scenario.apiAs(page.request);
    const { revisionId, how } = await revisionWithCompanions(client);
    const queued = await client.post<{ fitRun: { id: number } }>(`/api/pulsars/${pulsarId}/fit-runs`, { revisionId });
    const fit = await waitFinal(async () => client.get<{ status: string; errorMessage: string | null }>(`/api/fit-runs/${queued.fitRun.id}`), FIT_WAIT_MS);
    expect(fit.status, `fit of the ${how} revision: ${fit.errorMessage ?? ''}`).toBe('succeeded');
    console.info(`browser-explorer: companions from ${how}, fit #${queued.fitRun.id}`);

    // Opened from the pulsar page's link.
    await page.goto(`${api.url}/pulsars/${pulsarId}`);
    await page.getByRole('link', { name: 'Open in explorer' }).click();
    await page.getByRole('heading', { name: `Residual explorer · ${PULSAR}` }).waitFor();
    await page.locator('section[aria-label="Residual plot"] .js-plotly-plot .legend').waitFor({ timeout: 60_000 });
    const summary = page.getByRole('status', { name: 'Summary' });
    await summary.getByText('DE405').waitFor(); // the settings behind the figures
    await settle(page);
    const rmsOn = await page.getByTestId('summary-rms').textContent();
    const excludedBefore = number(await page.getByTestId('summary-excluded').textContent());
    const usedBefore = number(await page.getByTestId('summary-used').textContent());
    await page.screenshot({ path: artifactPath('explorer-0-viewport-1280x800.png') }); // what fits on a 1280×800 screen
    await page.screenshot({ path: artifactPath('explorer-1-fit-with-companions.png'), fullPage: true });

    // A companion off: its delay shows in the residuals and the RMS rises (x ≥ 42 µs against ~1 µs).
    const toggle = page.getByRole('switch', { name: /^Companion .+ in the model$/ }).first();
    await toggle.click();
    await expect.poll(async () => number(await page.getByTestId('summary-rms').textContent())).toBeGreaterThan(5 * number(rmsOn));
    await summary.getByText(/preview of the edited model/).waitFor();
    await settle(page);
    await page.screenshot({ path: artifactPath('explorer-2-companion-off.png'), fullPage: true });
    await toggle.click();
    await expect.poll(async () => page.getByTestId('summary-rms').textContent()).toBe(rmsOn);

    // Box-select two TOAs and exclude them.
    const box = boxAroundTwo(await markerCentres(page));
    await page.mouse.move(box.x0, box.y0);
    await page.mouse.down();
    await page.mouse.move((box.x0 + box.x1) / 2, (box.y0 + box.y1) / 2, { steps: 4 });
    await page.mouse.move(box.x1, box.y1, { steps: 4 });
    await page.mouse.up();
    await expect.poll(async () => page.getByTestId('selection-count').textContent()).toBe('2 TOAs selected');
    await page.getByRole('table', { name: 'Delay components of the selected TOAs' }).waitFor();
    await page.getByLabel('Reason for leaving them out').fill('browser test: two TOAs left out');
    await page.screenshot({ path: artifactPath('explorer-3-two-selected.png'), fullPage: true });
    await page.getByRole('button', { name: 'Exclude with reason' }).click();
    await expect.poll(async () => number(await page.getByTestId('summary-excluded').textContent())).toBe(excludedBefore + 2);
    expect(number(await page.getByTestId('summary-used').textContent())).toBe(usedBefore - 2);
    await summary.getByText(/exclusions changed since the fit/).waitFor();
    await settle(page);
    await page.screenshot({ path: artifactPath('explorer-4-two-excluded.png'), fullPage: true });

    // A real fit with the new exclusions, followed to the end and opened here.
    await page.getByRole('button', { name: 'Queue fit with current exclusions' }).click();
    const show = page.getByRole('link', { name: /^Show fit #\d+ here$/ });
    await show.waitFor({ timeout: FIT_WAIT_MS });
    await show.click();
    await page.locator('section[aria-label="Residual plot"] .js-plotly-plot .legend').waitFor({ timeout: 60_000 });
    await expect.poll(async () => page.url()).not.toContain(`fit=${queued.fitRun.id}`);
    await expect.poll(async () => number(await page.getByTestId('summary-excluded').textContent())).toBe(excludedBefore + 2);
    expect(await summary.getByText(/exclusions changed since the fit/).count()).toBe(0);
    await settle(page);
    await page.screenshot({ path: artifactPath('explorer-5-refit.png'), fullPage: true });
    await page.close();
    expect(consoleErrors).toEqual([]);
  }, 900_000);
});

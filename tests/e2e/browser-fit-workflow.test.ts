/**
 * Browser test of the daily workflow on the demo scenario (playwright-core +
 * Debian's Chromium, the built client served by the real API, the real worker):
 * the demo observer uploads a TOA file, then the demo analyst queues a fit of
 * the same pulsar, watches it finish and reads the result with its residual
 * plot. Screenshots: test-artifacts/workflow-*.png (git-ignored).
 */
import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { RunningApi } from '../../api/server';
import { builtinObservatories } from '../../worker/timing/earth/builtin-observatories';
import { readModelFile } from '../../worker/timing/model/read-model-file';
import { simulateToas } from '../../worker/timing/simulate/simulate-toas';
import { parseMjd } from '../../worker/timing/time/mjd-string';
import { writeToaCsv } from '../../worker/timing/toas/write-toa-csv';
import { artifactPath } from './helpers/browser';
import { startBrowserScenario, type BrowserScenario } from './helpers/browser-scenario';

const PULSAR = 'FPG-J0412+2733'; // the demo's young pulsar

let scenario: BrowserScenario;
let api: RunningApi;
let pulsarId: number;
let uploadFile: string;
let signIn: BrowserScenario['signIn'];
let consoleErrors: string[];

beforeAll(async () => {
  let revision: { model_json: string } = { model_json: '' };
  scenario = await startBrowserScenario(async (knex) => {
    const pulsar = await knex('pulsars').where({ name: PULSAR }).first('id');
    pulsarId = pulsar.id;
    // A new observing block (after the demo's TOAs) simulated from the pulsar's stored starting model.
    revision = await knex('model_revisions').where({ pulsar_id: pulsarId }).orderBy('id').first('model_json');
  });
  ({ api, signIn, consoleErrors } = scenario);
  const sites = new Map(builtinObservatories().map((o) => [o.code, o]));
  const { toas } = simulateToas(
    readModelFile(JSON.parse(revision.model_json)),
    { startMjd: parseMjd('61010'), endMjd: parseMjd('61060'), count: 6, observatory: 'harrow-ridge', uncertaintyUs: 120, frequencyMhz: 1384, seed: 99, backend: 'wideband-1' },
    sites,
  );
  uploadFile = path.join(mkdtempSync(path.join(os.tmpdir(), 'pk-upload-')), 'fpg-j0412+2733_harrow-ridge_2026.csv');
  writeFileSync(uploadFile, writeToaCsv(toas, { fractionDigits: 20 }));
});

afterAll(async () => {
  await scenario?.close();
});

describe('the daily workflow in the browser', () => {
  it('lets the observer upload a TOA file to a demo pulsar', async () => {
    const page = await signIn('observer');
    await page.goto(`${api.url}/pulsars/${pulsarId}/upload`);
    await page.locator('#toa-file-input').setInputFiles(uploadFile);
    await page.getByRole('button', { name: /^Upload / }).click();
    await page.getByText('Stored 6 TOAs from fpg-j0412+2733_harrow-ridge_2026.csv').waitFor({ timeout: 60_000 });
    await page.screenshot({ path: artifactPath('workflow-1-upload.png'), fullPage: true });
    await page.close();
  });

  it('lets the analyst queue a fit, watch it finish and read the result with its plot', async () => {
    const page = await signIn('analyst');
    await page.goto(`${api.url}/pulsars/${pulsarId}`);
    await page.getByRole('heading', { name: PULSAR }).waitFor();
    await page.getByRole('button', { name: 'Queue fit' }).click();
    const runLink = page.locator('a[href^="/fit-runs/"]').first();
    await runLink.waitFor({ timeout: 60_000 });
    const href = await runLink.getAttribute('href');
    await page.goto(`${api.url}${href}`);
    await page.getByText('succeeded', { exact: true }).first().waitFor({ timeout: 120_000 });
    await page.getByText('Reduced χ²').first().waitFor();
    await page.locator('.js-plotly-plot .legend').first().waitFor({ timeout: 60_000 }); // Plotly drew its legend
    await page.getByText('DE405').first().waitFor(); // the settings that produced the result are shown
    await page.screenshot({ path: artifactPath('workflow-2-fit-result.png'), fullPage: true });
    const toaCount = await page.getByText('521', { exact: true }).count(); // 515 demo TOAs + the 6 uploaded
    expect(toaCount).toBeGreaterThan(0);
    await page.close();
    expect(consoleErrors).toEqual([]);
  });
});

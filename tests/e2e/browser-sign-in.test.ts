/**
 * Browser test (playwright-core + Debian's Chromium): the demo analyst signs in
 * to the built client served by the real API and sees the dashboard with the
 * demo pulsars. Screenshot: test-artifacts/sign-in-dashboard.png (git-ignored).
 */
import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { loadConfig } from '../../api/config';
import { createKnex } from '../../api/db/create-knex';
import { seedDemo, type DemoSignIn } from '../../api/db/seed-demo';
import { startApi, type RunningApi } from '../../api/server';
import { artifactPath, launchBrowser } from './helpers/browser';

let api: RunningApi;
let browser: BrowserContext;
let analyst: DemoSignIn;
let demoPulsarNames: string[];

beforeAll(async () => {
  const config = loadConfig();
  const knex = createKnex(config);
  const demo = await seedDemo(knex);
  demoPulsarNames = (await knex('pulsars').select('name')).map((r) => r.name as string);
  await knex.destroy();
  analyst = demo.users.find((u) => u.role === 'analyst')!;
  api = await startApi();
  browser = await launchBrowser();
});

afterAll(async () => {
  await browser?.close();
  await api?.stop();
});

describe('signing in through the browser', () => {
  it('takes the demo analyst from the sign-in page to the dashboard', async () => {
    const page = await browser.newPage();
    const consoleErrors: string[] = [];
    page.on('console', (msg) => {
      if (msg.type() === 'error') consoleErrors.push(msg.text());
    });
    await page.goto(`${api.url}/`);
    await page.waitForURL(/\/sign-in/);
    await page.getByLabel('E-mail').fill(analyst.email);
    await page.getByLabel('Password').fill(analyst.password);
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.getByRole('heading', { name: 'Dashboard' }).waitFor();
    for (const name of demoPulsarNames.slice(0, 2)) {
      await page.getByText(name, { exact: true }).first().waitFor();
    }
    await page.screenshot({ path: artifactPath('sign-in-dashboard.png'), fullPage: true });
    expect(new URL(page.url()).pathname).toBe('/');
    // The one expected console error: the signed-out session check (GET /api/auth/me → 401) before signing in.
    expect(consoleErrors.filter((e) => !/status of 401/.test(e))).toEqual([]);
  });
});

/**
 * Setup shared by the browser tests of the demo scenario: seed the demo, start
 * the real API (serving the built client) and the real worker, launch the
 * browser, and sign demo users in with their console errors collected.
 */
import type { Knex } from 'knex';
import type { APIRequestContext, BrowserContext, Page } from 'playwright-core';
import { loadConfig } from '../../../api/config';
import { createKnex } from '../../../api/db/create-knex';
import { seedDemo, type DemoSignIn } from '../../../api/db/seed-demo';
import { startApi, type RunningApi } from '../../../api/server';
import { startWorker } from '../../../worker/index';
import { launchBrowser } from './browser';

/** The API as a signed-in browser user: `{ data }` unwrapped, a non-2xx answer thrown as "METHOD path → status: message". */
export interface ScenarioApi {
  get<T>(path: string): Promise<T>;
  post<T>(path: string, body: unknown): Promise<T>;
}

export interface BrowserScenario {
  api: RunningApi;
  browser: BrowserContext;
  users: DemoSignIn[];
  /** console errors of every signed-in page, except the expected 401s of the sign-in check */
  consoleErrors: string[];
  /** Opens a page and signs in as the demo user of this role; resolves once the dashboard shows. */
  signIn(role: string): Promise<Page>;
  /** The API with this request context's cookies (e.g. `page.request`), sending the CSRF token on posts. */
  apiAs(request: APIRequestContext): ScenarioApi;
  /** Closes the browser, the worker and the API. */
  close(): Promise<void>;
}

/**
 * Seeds the demo and starts everything a browser test needs.
 *
 * @param prepare  runs on the seeded database before the API starts (e.g. to
 *                 look up a demo pulsar); its connection is closed afterwards
 * @returns the running scenario; call `close()` in afterAll
 */
export async function startBrowserScenario(prepare?: (knex: Knex) => Promise<void>): Promise<BrowserScenario> {
  const config = loadConfig();
  const knex = createKnex(config);
  const users = (await seedDemo(knex)).users;
  try {
    await prepare?.(knex);
  } finally {
    await knex.destroy();
  }
  const api = await startApi();
  const worker = startWorker(config);
  let browser: BrowserContext;
  try {
    browser = await launchBrowser();
  } catch (error) {
    await worker.close();
    await api.stop();
    throw error;
  }
  const consoleErrors: string[] = [];
  return {
    api,
    browser,
    users,
    consoleErrors,
    async signIn(role) {
      const user = users.find((u) => u.role === role)!;
      const page = await browser.newPage();
      page.on('console', (msg) => {
        if (msg.type() === 'error' && !/status of 401/.test(msg.text())) consoleErrors.push(msg.text());
      });
      await page.goto(`${api.url}/sign-in`);
      await page.getByLabel('E-mail').fill(user.email);
      await page.getByLabel('Password').fill(user.password);
      await page.getByRole('button', { name: 'Sign in' }).click();
      await page.getByRole('heading', { name: 'Dashboard' }).waitFor();
      return page;
    },
    apiAs(request) {
      let token: string | null = null;
      const call = async <T>(method: 'get' | 'post', path: string, body?: unknown): Promise<T> => {
        const headers: Record<string, string> = {};
        if (method === 'post') {
          token ??= ((await (await request.get(`${api.url}/api/auth/csrf`)).json()) as { data: { token: string } }).data.token;
          headers['x-csrf-token'] = token;
        }
        const response = method === 'get' ? await request.get(`${api.url}${path}`) : await request.post(`${api.url}${path}`, { data: body, headers });
        const json = (await response.json().catch(() => ({}))) as { data: T; error?: { message: string } };
        if (!response.ok()) throw new Error(`${method.toUpperCase()} ${path} → ${response.status()}: ${json.error?.message ?? ''}`);
        return json.data;
      };
      return { get: <T>(path: string) => call<T>('get', path), post: <T>(path: string, body: unknown) => call<T>('post', path, body) };
    },
    async close() {
      await browser.close();
      await worker.close();
      await api.stop();
    },
  };
}

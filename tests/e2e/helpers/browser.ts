/**
 * Headless Debian Chromium driven by playwright-core (launch flags from
 * STACK.md §8: the network-quietening flags keep Chromium from reaching out on
 * this closed machine). Screenshots go to test-artifacts/ (git-ignored).
 */
import { mkdirSync, mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium, type BrowserContext } from 'playwright-core';

export const ARTIFACTS_DIR = path.resolve(import.meta.dirname, '../../../test-artifacts');

export async function launchBrowser(): Promise<BrowserContext> {
  mkdirSync(ARTIFACTS_DIR, { recursive: true });
  const userDataDir = mkdtempSync(path.join(os.tmpdir(), 'pk-chromium-'));
  return chromium.launchPersistentContext(userDataDir, {
    executablePath: '/usr/bin/chromium',
    headless: true,
    viewport: { width: 1280, height: 800 },
    args: [
      '--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run',
      '--disable-background-networking', '--disable-component-update', '--disable-sync',
    ],
  });
}

export function artifactPath(name: string): string {
  return path.join(ARTIFACTS_DIR, name);
}

// Browser-test harness: Debian's Chromium driven by playwright-core against the real server, started
// in-process on an ephemeral port with a fresh data folder and the demo building.
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe } from 'vitest';
import { chromium, type Browser, type BrowserContext, type Page } from 'playwright-core';
import { startServer } from '../../server/server.ts';

export const CHROMIUM_PATH = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';
export const haveChromium = existsSync(CHROMIUM_PATH);
export const haveBuild = existsSync(path.resolve('dist/index.html'));

if (!haveChromium) {
  const bar = '!'.repeat(78);
  console.warn(
    `\n${bar}\n!! BROWSER TESTS SKIPPED: no Chromium at ${CHROMIUM_PATH}.\n` +
      `!! Install it with:  apt-get update && apt-get install -y chromium\n` +
      `!! (or set CHROMIUM_PATH). CI installs it in .ci/run, so CI always runs them.\n${bar}\n`,
  );
}
if (haveChromium && !haveBuild) throw new Error('Browser tests need the built client: run `npm run build` first (npm test does).');

/** `describe` when a browser is available, `describe.skip` (with the notice above) when not. */
export const describeInBrowser = haveChromium ? describe : describe.skip;

export const DEMO_PASSWORD = 'stanchion-demo';
export const DEMO = {
  lead: 'lead@stanchion.test',
  engineer: 'engineer@stanchion.test',
  viewer: 'viewer@stanchion.test',
  admin: 'admin@stanchion.test',
} as const;

const SCREENSHOT_DIR = path.resolve('test-results');

export interface App {
  url: string;
  close(): Promise<void>;
}

export async function startApp(): Promise<App> {
  const dataDir = mkdtempSync(path.join(tmpdir(), 'stanchion-e2e-'));
  const server = await startServer({ port: 0, dataDir, seed: true, logLevel: 'silent' });
  return {
    url: server.url,
    async close() {
      await server.close();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export async function launchBrowser(): Promise<Browser> {
  // playwright-core gives every launch a fresh, temporary user-data-dir of its own.
  return chromium.launch({
    executablePath: CHROMIUM_PATH,
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export async function newContext(browser: Browser): Promise<BrowserContext> {
  return browser.newContext({ viewport: { width: 1440, height: 900 }, acceptDownloads: true });
}

export async function screenshot(page: Page, name: string): Promise<void> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

export async function signIn(page: Page, baseUrl: string, email: string, password = DEMO_PASSWORD): Promise<void> {
  await page.goto(`${baseUrl}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
}

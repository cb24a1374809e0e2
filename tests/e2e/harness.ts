// Browser-test harness: Debian's Chromium driven by playwright-core against the real server, started
// in-process on an ephemeral port with a fresh data folder and the demo building.
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe } from 'vitest';
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
if (haveChromium && !haveBuild)
  throw new Error('Browser tests need the built client: run `npm run build` first (npm test does).');

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

/** Opens the demo building from the buildings list. */
export async function openDemoBuilding(page: Page): Promise<void> {
  await page.getByText('Demo office block').first().click();
  await page.getByRole('heading', { name: 'Demo office block' }).waitFor();
}

/** Opens a stack of the current building by its grid reference. */
export async function openStack(page: Page, gridRef: string): Promise<void> {
  await page.getByRole('cell', { name: gridRef, exact: true }).first().click();
  await page.waitForURL(/\/stacks\/\d+/);
  await results(page).getByText('governs').first().waitFor();
}

export const results = (page: Page) => page.getByRole('region', { name: 'Results' });
export const properties = (page: Page) => page.getByRole('complementary', { name: 'Properties' });
export const graphNode = (page: Page, id: string) => page.locator(`.vue-flow__node[data-id="${id}"]`);

/** Selects a node on the graph with the keyboard, as a person can. */
export async function selectNode(page: Page, id: string): Promise<void> {
  // A tall stack is larger than the pane: focusing a node pans to it (as Tab does), Enter selects it.
  const node = graphNode(page, id);
  await node.focus();
  await page.keyboard.press('Enter');
  await properties(page).getByText(/./).first().waitFor();
}

/** The results-table row of a lift, by its label (L1, L2, … from the bottom). */
export const liftRow = (page: Page, label: string) =>
  results(page)
    .locator('tbody tr')
    .filter({ has: page.locator('td:first-child', { hasText: new RegExp(`^\\s*${label}(\\s|$)`) }) });

/** Picks a catalogue section in the properties pane's section picker. */
export async function pickSection(page: Page, designation: string): Promise<void> {
  const field = properties(page).locator('[data-field="section"]');
  await field.click();
  await page.keyboard.type(designation, { delay: 10 });
  await page.locator('.q-menu .q-item').filter({ hasText: designation }).first().click();
}

/** A lift's utilisation as the results table shows it. */
export async function liftUtilisation(page: Page, label: string): Promise<number> {
  const headers = (await results(page).locator('thead th').allInnerTexts()).map((h) => h.trim());
  const column = headers.indexOf('Utilisation');
  if (column < 0) throw new Error(`no Utilisation column in ${headers.join(' | ')}`);
  const text = await liftRow(page, label).locator('td').nth(column).innerText();
  return Number(text.trim().split(/\s+/)[0]);
}

/** The label (L1, L2, …) of the lift the results table marks as governing. */
export async function governingLift(page: Page): Promise<string> {
  const row = results(page).locator('tbody tr').filter({ hasText: 'governs' });
  return (await row.locator('td').first().innerText()).replace('governs', '').trim();
}

export interface Session {
  readonly app: App;
  readonly browser: Browser;
  /** A fresh browser context and page, signed in as the given demo account. */
  pageAs(email: string): Promise<Page>;
}

/** Starts the app and a browser before a suite's tests and stops both after them. */
export function useAppAndBrowser(): Session {
  let app: App | undefined;
  let browser: Browser | undefined;
  beforeAll(async () => {
    app = await startApp();
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await app?.close();
  });
  const session: Session = {
    get app() {
      if (!app) throw new Error('the app is not running yet');
      return app;
    },
    get browser() {
      if (!browser) throw new Error('the browser is not running yet');
      return browser;
    },
    async pageAs(email) {
      const page = await (await newContext(session.browser)).newPage();
      await signIn(page, session.app.url, email);
      return page;
    },
  };
  return session;
}

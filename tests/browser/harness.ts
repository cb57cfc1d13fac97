import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { afterAll, beforeAll } from 'vitest';
import { startApp, type RunningApp } from '../support/app-process';

const root = fileURLToPath(new URL('../..', import.meta.url));
export const SCREENSHOT_DIR = path.join(root, 'tests', 'output', 'screenshots');
import { DEMO_PASSWORD } from '../support/app-process';

export { DEMO_PASSWORD };

/** Debian's Chromium, or CHROMIUM_PATH. */
export function findChromium(): string | undefined {
  const candidates = [process.env.CHROMIUM_PATH, '/usr/bin/chromium', '/usr/bin/chromium-browser'].filter(Boolean) as string[];
  return candidates.find((p) => existsSync(p));
}

/**
 * Browser tests need Chromium. Under CI=true its absence is a failure naming the package; elsewhere the
 * tests are skipped with a loud notice.
 */
export function chromiumOrSkip(): { available: boolean } {
  const found = findChromium();
  if (found) return { available: true };
  const message = 'No Chromium found at CHROMIUM_PATH or /usr/bin/chromium: install the Debian package with `apt-get install -y chromium`.';
  if (process.env.CI === 'true') throw new Error(message);
  console.warn(`\n!!!!!!!!\n!!! BROWSER TESTS SKIPPED. ${message}\n!!!!!!!!\n`);
  return { available: false };
}

export { startApp, type RunningApp } from '../support/app-process';

/** A browser opened by openBrowser: its context and how to close it (and remove its profile). */
export interface OpenBrowser {
  context: BrowserContext;
  close: () => Promise<void>;
}

/** A fresh headless Chromium profile, as the workplace's notes require (no --user-data-dir in args). */
export async function openBrowser(): Promise<OpenBrowser> {
  const profile = mkdtempSync(path.join(tmpdir(), 'epsigma-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: findChromium(),
    viewport: { width: 1360, height: 900 },
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
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/**
 * Starts the app (with `extraEnv`) and a fresh Chromium before the tests of the enclosing describe, and closes
 * both after them. The returned `app` and `browser` read through to the running ones, so tests keep writing
 * `app.url` and `browser.context`; using them before the beforeAll hook has run throws.
 */
export function useAppAndBrowser(extraEnv: Record<string, string> = {}): { app: RunningApp; browser: OpenBrowser } {
  let running: RunningApp | undefined;
  let opened: OpenBrowser | undefined;
  beforeAll(async () => {
    running = await startApp(extraEnv);
    opened = await openBrowser();
  });
  afterAll(async () => {
    await opened?.close();
    await running?.stop();
  });
  const started = <T>(value: T | undefined, what: string): T => {
    if (value === undefined) throw new Error(`the ${what} is not started yet: use it inside a test or a later hook`);
    return value;
  };
  const app: RunningApp = {
    get url() {
      return started(running, 'app').url;
    },
    get dir() {
      return started(running, 'app').dir;
    },
    stop: () => started(running, 'app').stop(),
    kill: () => started(running, 'app').kill(),
    output: () => started(running, 'app').output(),
  };
  const browser: OpenBrowser = {
    get context() {
      return started(opened, 'browser').context;
    },
    close: () => started(opened, 'browser').close(),
  };
  return { app, browser };
}

/** Signs in from a clean slate (the browser profile is shared by the pages of one test file). */
export async function signIn(page: Page, url: string, email: string, password = DEMO_PASSWORD) {
  // Leave the old page first: a request it still has in flight could set the session cookie again after the clear.
  await page.goto('about:blank');
  await page.context().clearCookies();
  await page.goto(`${url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

export async function screenshot(page: Page, name: string) {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: path.join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

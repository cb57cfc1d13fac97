import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

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

/** A fresh headless Chromium profile, as the workplace's notes require (no --user-data-dir in args). */
export async function openBrowser(): Promise<{ context: BrowserContext; close: () => Promise<void> }> {
  const profile = mkdtempSync(path.join(tmpdir(), 'epsigma-chromium-'));
  const context = await chromium.launchPersistentContext(profile, {
    executablePath: findChromium(),
    viewport: { width: 1360, height: 900 },
    args: ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync'],
  });
  return {
    context,
    close: async () => {
      await context.close();
      rmSync(profile, { recursive: true, force: true });
    },
  };
}

/** Signs in from a clean slate (the browser profile is shared by the pages of one test file). */
export async function signIn(page: Page, url: string, email: string, password = DEMO_PASSWORD) {
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

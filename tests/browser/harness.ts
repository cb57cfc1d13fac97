import { spawn, type ChildProcess } from 'node:child_process';
import { existsSync, mkdirSync, mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { chromium, type BrowserContext, type Page } from 'playwright-core';

const root = fileURLToPath(new URL('../..', import.meta.url));
export const SCREENSHOT_DIR = path.join(root, 'tests', 'output', 'screenshots');
export const DEMO_PASSWORD = 'browser-test-password';

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

export interface RunningApp {
  url: string;
  dir: string;
  stop: () => Promise<void>;
  output: () => string;
}

/** Starts the real server entry point on a random port with a fresh database; the client must be built. */
export async function startApp(extraEnv: Record<string, string> = {}): Promise<RunningApp> {
  if (!existsSync(path.join(root, 'dist', 'client', 'index.html'))) throw new Error('The client is not built: run `vite build` first (npm test does).');
  const dir = mkdtempSync(path.join(tmpdir(), 'epsigma-browser-'));
  let output = '';
  const child: ChildProcess = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: root,
    env: { ...process.env, NODE_ENV: 'production', PORT: '0', HOST: '127.0.0.1', DATABASE_PATH: path.join(dir, 'app.sqlite'), DEMO_PASSWORD, LOG_REQUESTS: '0', WORKERS: '1', ...extraEnv },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start:\n${output}`)), 60_000);
    const onData = (d: Buffer) => {
      output += d.toString();
      const m = output.match(/LISTENING (http:\/\/\S+)/);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (d: Buffer) => (output += d.toString()));
    child.on('exit', (code) => reject(new Error(`server exited with ${code}:\n${output}`)));
  });
  return {
    url,
    dir,
    output: () => output,
    stop: async () => {
      if (child.exitCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
        if (child.exitCode === null) child.kill('SIGKILL');
      }
      rmSync(dir, { recursive: true, force: true });
    },
  };
}

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

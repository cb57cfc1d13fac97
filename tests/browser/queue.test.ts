/**
 * The Simulations screen with the Redis driver: the web process runs no jobs (WORKERS=0), one worker process does.
 * A modeller meets the per-run limits on the form, starts a small run and sees where it ran; the admin sees the
 * queue and the live worker process.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startRedis, startWorkerProcess, type TestRedis, type WorkerProcess } from '../support/redis-server';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

describe.skipIf(!available)('Simulations screen with worker processes', () => {
  const extraEnv: Record<string, string> = { WORKERS: '0', QUEUE_LOCK_MS: '4000' };
  let redis: TestRedis | undefined;
  let worker: WorkerProcess | undefined;
  // Redis and the worker first: the app's environment needs the Redis address.
  beforeAll(async () => {
    redis = await startRedis();
    extraEnv.REDIS_URL = redis.url;
    worker = await startWorkerProcess(redis.url, { WORKERS: '1', QUEUE_LOCK_MS: '4000' });
  }, 90_000);
  afterAll(async () => {
    await worker?.stop();
    await redis?.stop();
  });
  const { app, browser } = useAppAndBrowser(extraEnv);

  it('a modeller meets the limits, starts a run and sees the worker that ran it', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.goto(`${app.url}/simulations`);
    await page.getByLabel('Atoms').fill('4000');
    await page.getByLabel('MD steps').fill('100000');
    await page.getByText('Atoms × steps may be at most 250,000,000 per run').waitFor();
    expect(await page.getByRole('button', { name: 'Run NPT simulation' }).isDisabled()).toBe(true);
    await screenshot(page, 'simulations-limit');
    await page.getByLabel('Atoms').fill('108');
    await page.getByLabel('MD steps').fill('3000');
    await page.getByRole('button', { name: 'Run NPT simulation' }).click();
    // The notice follows the run (queued → running → finished); on a quiet machine the first state may already be gone.
    await page
      .getByRole('status')
      .getByText(/is queued|is running|has finished/)
      .waitFor();
    await page.getByText(`ran on ${worker!.name}`).waitFor({ timeout: 60_000 });
    await screenshot(page, 'simulations-ran-on');
    await page.close();
  }, 120_000);

  it('the admin sees the queue: the Redis driver and the live worker process', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'admin@demo.epsigma.test');
    await page.waitForURL((u) => !u.pathname.startsWith('/sign-in'));
    await page.goto(`${app.url}/simulations`);
    const panel = page.locator('section', { hasText: 'Job queue' });
    await panel.getByText('Redis (BullMQ): jobs run on worker processes.').waitFor();
    await page.getByRole('list', { name: 'Worker processes' }).getByText(worker!.name).waitFor();
    expect(await page.getByRole('button', { name: 'Run NPT simulation' }).count()).toBe(0);
    await screenshot(page, 'simulations-queue-admin');
    await page.close();
  }, 60_000);
});

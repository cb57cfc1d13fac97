import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BrowserContext } from 'playwright-core';
import { chromiumOrSkip, openBrowser, screenshot, signIn, startApp, type RunningApp } from './harness';

const { available } = chromiumOrSkip();

describe.skipIf(!available)('fits in Chromium', () => {
  let app: RunningApp;
  let browser: { context: BrowserContext; close: () => Promise<void> };
  beforeAll(async () => {
    app = await startApp();
    browser = await openBrowser();
  });
  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  it('a modeller runs a fit of the demo B2 and viscosity sets from the form and sees the result with its plots', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Substances' }).click();
    await page.getByRole('link', { name: 'Quillgas QG-1' }).click();
    await page.getByRole('link', { name: 'Fits', exact: true }).click();
    await page.getByRole('link', { name: 'New fit' }).click();
    // Both gas-phase sets are ticked by default; the density set needs the simulation stage.
    expect(await page.getByLabel('Use QG-1 B2, Burnett runs 2026').isChecked()).toBe(true);
    expect(await page.getByLabel('Use QG-1 viscosity, oscillating disc').isChecked()).toBe(true);
    await page.getByRole('button', { name: 'Run fit' }).click();
    await page.waitForURL(/\/fits\/\d+$/);
    await page.getByText('Succeeded', { exact: true }).waitFor({ timeout: 90_000 });
    const eps = await page.getByTestId('epsilon-value').textContent();
    const sigma = await page.getByTestId('sigma-value').textContent();
    // The demo tables were generated from invented parameters near 131.5 K and 3.52 Å (fixtures/demo/scenario.ts).
    expect(Number(eps!.split(' ')[0])).toBeGreaterThan(120);
    expect(Number(eps!.split(' ')[0])).toBeLessThan(145);
    expect(Number(sigma!.split(' ')[0])).toBeGreaterThan(3.4);
    expect(Number(sigma!.split(' ')[0])).toBeLessThan(3.65);
    expect(await page.locator('canvas').count()).toBeGreaterThanOrEqual(5);
    await screenshot(page, 'fit-result');

    // Units switch: ε in kJ/mol is ε/k_B × R/1000.
    await page.getByText('kJ/mol', { exact: true }).click();
    const epsKj = Number((await page.getByTestId('epsilon-value').textContent())!.split(' ')[0]);
    expect(epsKj).toBeCloseTo(Number(eps!.split(' ')[0]) * 0.0083144626, 2);

    // What-if: moving σ away from the fit raises χ².
    const chi2Before = await page.getByTestId('what-if-chi2').textContent();
    await page.getByLabel('What-if σ value (Å)').fill('3.7');
    await page.getByLabel('What-if σ value (Å)').press('Tab');
    await expect.poll(async () => page.getByTestId('what-if-chi2').textContent()).not.toBe(chi2Before);
    await page.close();
  });
});

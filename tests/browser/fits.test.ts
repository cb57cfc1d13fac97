import { describe, expect, it } from 'vitest';
import { expectDensityEvidence, expectDensityEvidenceAtReviewAndCard, expectDensityWhatIf } from './density-evidence';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

describe.skipIf(!available)('fits in Chromium', () => {
  const { app, browser } = useAppAndBrowser({ WORKERS: '2' });

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

  it('a joint B2 + density fit runs its simulations, shows them, and a second identical fit reuses every run', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const runJointFit = async () => {
      await page.goto(`${app.url}/substances`);
      await page.getByRole('link', { name: 'Quillgas QG-1' }).click();
      await page.getByRole('link', { name: 'Fits', exact: true }).click();
      await page.getByRole('link', { name: 'New fit' }).click();
      // B2 and densities only: untick every other set the form ticks by default.
      await page.getByLabel('Use QG-1 B2, Burnett runs 2026').waitFor();
      for (const box of await page.getByRole('checkbox', { name: /^Use / }).all())
        if ((await box.isEnabled()) && (await box.isChecked())) await box.uncheck();
      await page.getByLabel('Use QG-1 B2, Burnett runs 2026').check();
      await page.getByLabel('Use QG-1 liquid and supercritical densities').check();
      // Small, quick runs: this checks the flow; the physics has its own tests.
      await page.getByLabel('Atoms').fill('200');
      await page.getByLabel('MD steps per run').fill('3000');
      await page.getByRole('button', { name: 'Run fit' }).click();
      await page.waitForURL(/\/fits\/\d+$/);
      await page
        .getByRole('progressbar')
        .or(page.getByText('Succeeded', { exact: true }))
        .first()
        .waitFor();
      await page
        .getByText('Succeeded', { exact: true })
        .or(page.getByText('Failed', { exact: true }))
        .first()
        .waitFor({ timeout: 400_000 });
      expect(await page.getByText('Succeeded', { exact: true }).count(), 'the joint fit succeeds').toBe(1);
    };
    await runJointFit();
    const runsTable = page.getByRole('table', { name: 'Simulations behind the fit' });
    await runsTable.waitFor();
    expect(await runsTable.getByRole('row').count()).toBeGreaterThan(8);
    await screenshot(page, 'fit-density-result');
    const firstSummary = await page.getByText(/runs, \d+ of them reused/).textContent();
    expect(firstSummary).toMatch(/(\d+) runs, 0 of them reused/);
    // Everything behind the fit on its page, and What if? that says what its χ² is (issue 14, items 1, 3, 15).
    const densityFitId = Number(page.url().split('/').pop());
    await expectDensityEvidence(page, 'fit page');
    await expectDensityWhatIf(page);

    await runJointFit();
    const summary = await page.getByText(/runs, \d+ of them reused/).textContent();
    const [, total, reused] = summary!.match(/(\d+) runs, (\d+) of them reused/)!;
    expect(Number(reused)).toBe(Number(total));

    // A run behind the fit: its traces, the detected start of production, the Q6 order parameter and the phase flag.
    await page.getByRole('table', { name: 'Simulations behind the fit' }).getByRole('link').first().click();
    await page.waitForURL(/\/simulations\/\d+$/);
    await page.getByRole('heading', { name: 'Traces' }).waitFor();
    await page.getByRole('img', { name: 'Q6 order parameter against MD step' }).waitFor();
    expect(await page.getByText('fluid', { exact: true }).count()).toBeGreaterThan(0);
    expect(await page.getByText(/Production starts/).count()).toBe(1);
    await screenshot(page, 'simulation-detail');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Simulations' }).click();
    await page.getByRole('heading', { name: 'Runs' }).waitFor();
    await screenshot(page, 'simulations');
    // The same evidence at review and on the catalog card of the approved set.
    await expectDensityEvidenceAtReviewAndCard(page, app.url, densityFitId);
    await page.close();
  }, 900_000);
});

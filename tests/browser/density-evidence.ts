import type { Page } from 'playwright-core';
import { expect } from 'vitest';
import { screenshot, signIn } from './harness';

/**
 * Checks of everything behind a density fit (issue 14, items 1, 3 and 15), shared by the browser test that
 * runs the joint B2 + density fit (fits.test.ts) so no second density fit is paid for.
 */

/** Σ(residual²) drawn in each (model − meas.)/u residual panel of a region of the page, in page order. */
const residualSums = (page: Page, scope: string) =>
  page
    .locator(`${scope} [data-residual-sum-squares][aria-label="Residuals: (model − meas.)/u"]`)
    .evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-residual-sum-squares'))));

/** Everything behind a density fit must be on the page: both density plots, the simulation stage and profile χ². */
export async function expectDensityEvidence(page: Page, where: string) {
  const evidence = page.getByTestId('fit-evidence');
  await evidence.getByRole('heading', { name: 'Fluid density against temperature, per isobar' }).waitFor();
  for (const heading of [
    'Fluid density against pressure, per isotherm',
    'Second virial coefficient',
    'Simulation stage',
    'Per measurement set',
  ]) {
    expect(await evidence.getByRole('heading', { name: heading }).count(), `${where}: ${heading}`).toBe(1);
  }
  expect(await evidence.getByRole('heading', { name: /Profile χ²/ }).count(), `${where}: profile χ²`).toBe(1);
  expect(
    await evidence.getByRole('table', { name: 'Simulations behind the fit' }).getByRole('row').count(),
    `${where}: simulation runs`,
  ).toBeGreaterThan(8);
  expect(await evidence.getByRole('table', { name: 'Stages of the fit' }).count(), `${where}: stage table`).toBe(1);
  expect(await evidence.getByRole('img', { name: 'Residuals: deviation (%)' }).count(), `${where}: deviations in %`).toBe(1);
  expect(
    await evidence.getByRole('img', { name: 'Residuals: (model − meas.)/u' }).count(),
    `${where}: residual axis`,
  ).toBeGreaterThanOrEqual(2);
}

/** On the page of a succeeded joint B2 + density fit: What if? names what its χ² is and redraws every residual panel. */
export async function expectDensityWhatIf(page: Page) {
  const whatIf = page.locator('section').filter({ has: page.getByRole('heading', { name: 'What if?' }) });
  const chi2 = whatIf.getByTestId('what-if-chi2');
  expect(await chi2.textContent()).toMatch(/equation-of-state densities at these values/);
  expect(await whatIf.getByText(/cannot run in the browser/).count()).toBe(1);
  expect(await whatIf.getByRole('heading', { name: 'Fluid density against temperature, per isobar' }).count()).toBe(1);
  const scope = 'section:has(h2:text-is("What if?"))';
  const before = await residualSums(page, scope);
  await whatIf.getByLabel('What-if ε/k_B value (K)').fill('150');
  await whatIf.getByLabel('What-if ε/k_B value (K)').press('Tab');
  await expect.poll(async () => residualSums(page, scope)).not.toEqual(before);
  const after = await residualSums(page, scope);
  // The residual panels are of the what-if values: the (model − meas.)/u panels of every kind add up to the χ²
  // the panel reports (written with 5 significant digits).
  const trialChi2 = Number((await chi2.locator('strong').textContent())!);
  const total = after.reduce((a, b) => a + b, 0);
  expect(Math.abs(total - trialChi2) / trialChi2).toBeLessThan(1e-4);
  await screenshot(page, 'density-fit-what-if');
}

/** Drafts and submits a set from the fit, then shows the same evidence to the reviewer and, once approved, on the card. */
export async function expectDensityEvidenceAtReviewAndCard(page: Page, url: string, fitId: number) {
  const headers = { Origin: url };
  const drafted = await page.request.post(`${url}/api/parameter-sets`, {
    headers,
    data: { fitId, rationale: 'Joint B2 and liquid density fit for simulations with a 2.5 σ cutoff.' },
  });
  expect(drafted.status()).toBe(201);
  const setId = (await drafted.json()).id as number;
  expect((await page.request.post(`${url}/api/parameter-sets/${setId}/submit`, { headers })).status()).toBe(200);
  await signIn(page, url, 'reviewer@demo.epsigma.test');
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
  await page.goto(`${url}/parameter-sets/${setId}`);
  await expectDensityEvidence(page, 'review page');
  await screenshot(page, 'density-set-review');
  await page.getByLabel('Review comment').fill('Densities within their uncertainties at both isotherms; approved for 2.5 σ truncated use.');
  await page.getByRole('button', { name: 'Approve' }).click();
  await page.getByLabel('Reason for retiring').waitFor();
  await signIn(page, url, 'consumer@demo.epsigma.test');
  await page.getByRole('navigation', { name: 'Main' }).waitFor();
  await page.goto(`${url}/catalog/${setId}`);
  await expectDensityEvidence(page, 'catalog card');
  // The card's scheme is the fit's: truncated with tail corrections at 2.5 σ.
  expect(await page.getByText('Truncated with tail corrections, r_c = 2.5 σ').count()).toBeGreaterThan(0);
  await screenshot(page, 'density-set-card');
}

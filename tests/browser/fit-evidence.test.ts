import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

/** The demo substance with B2, viscosity and density tables (fixtures/demo/scenario.ts). */
const SUBSTANCE = 'Quillgas QG-1';

async function json<T>(page: Page, url: string): Promise<T> {
  const response = await page.request.get(url);
  expect(response.status(), url).toBe(200);
  return (await response.json()) as T;
}

async function demoSets(page: Page, url: string) {
  const { substances } = await json<{ substances: Array<{ id: number; name: string }> }>(page, `${url}/api/substances`);
  const substanceId = substances.find((s) => s.name === SUBSTANCE)!.id;
  const { datasets } = await json<{ datasets: Array<{ id: number; property: string }> }>(page, `${url}/api/datasets?substanceId=${substanceId}`);
  const of = (kind: string) => datasets.find((d) => d.property === kind)!.id;
  return { substanceId, b2: of('b2'), density: of('density'), viscosity: of('viscosity') };
}

async function waitForFit(page: Page, url: string, fitId: number, seconds: number) {
  for (let i = 0; i < seconds * 2; i++) {
    const { status } = await json<{ status: string }>(page, `${url}/api/fits/${fitId}`);
    if (status === 'succeeded') return;
    if (status === 'failed' || status === 'cancelled') throw new Error(`fit ${fitId} ${status}`);
    await page.waitForTimeout(500);
  }
  throw new Error(`fit ${fitId} did not finish in ${seconds} s`);
}

/** Σ(residual²) drawn in each residual panel of a region of the page, in page order. */
const residualSums = (page: Page, scope: string) =>
  page.locator(`${scope} [data-residual-sum-squares]`).evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-residual-sum-squares'))));

/** Everything behind a density fit must be on the page: both density plots, the simulation stage and profile χ². */
async function expectDensityEvidence(page: Page, where: string) {
  const evidence = page.getByTestId('fit-evidence');
  await evidence.getByRole('heading', { name: 'Fluid density against temperature, per isobar' }).waitFor();
  for (const heading of ['Fluid density against pressure, per isotherm', 'Second virial coefficient', 'Simulation stage', 'Per measurement set']) {
    expect(await evidence.getByRole('heading', { name: heading }).count(), `${where}: ${heading}`).toBe(1);
  }
  expect(await evidence.getByRole('heading', { name: /Profile χ²/ }).count(), `${where}: profile χ²`).toBe(1);
  expect(await evidence.getByRole('table', { name: 'Simulations behind the fit' }).getByRole('row').count(), `${where}: simulation runs`).toBeGreaterThan(8);
  expect(await evidence.getByRole('table', { name: 'Stages of the fit' }).count(), `${where}: stage table`).toBe(1);
  expect(await evidence.getByRole('img', { name: 'Residuals: deviation (%)' }).count(), `${where}: deviations in %`).toBe(1);
  expect(await evidence.getByRole('img', { name: 'Residuals: (model − meas.)/u' }).count(), `${where}: residual axis`).toBe(2);
}

describe.skipIf(!available)('everything behind a density fit, on the fit page, the review page and the card', () => {
  const { app, browser } = useAppAndBrowser({ WORKERS: '2' });

  it('a joint B2 + density fit shows its density evidence the same way on all three pages; What if? recomputes the residuals and names its χ²', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const headers = { Origin: app.url };
    const sets = await demoSets(page, app.url);
    // Small, quick runs: this checks the screens; the physics has its own tests.
    const started = await page.request.post(`${app.url}/api/fits`, {
      headers,
      data: { substanceId: sets.substanceId, datasets: [{ id: sets.b2 }, { id: sets.density }], options: { density: { atoms: 200, steps: 3000, cutoff: 2.5, scheme: 'truncated-tail' } } },
    });
    expect(started.status()).toBe(202);
    const fitId = (await started.json()).id as number;
    await waitForFit(page, app.url, fitId, 240);

    await page.goto(`${app.url}/fits/${fitId}`);
    await expectDensityEvidence(page, 'fit page');
    await screenshot(page, 'density-fit-evidence');

    // What if? on a density fit: says the densities come from the equation of state and compares like with like.
    const whatIf = page.locator('section').filter({ has: page.getByRole('heading', { name: 'What if?' }) });
    const chi2 = whatIf.getByTestId('what-if-chi2');
    expect(await chi2.textContent()).toMatch(/equation-of-state densities at these values/);
    expect(await whatIf.getByText(/cannot run in the browser/).count()).toBe(1);
    expect(await whatIf.getByRole('heading', { name: 'Fluid density against temperature, per isobar' }).count()).toBe(1);
    const before = await residualSums(page, 'section:has(h2:text-is("What if?"))');
    await whatIf.getByLabel('What-if ε/k_B value (K)').fill('150');
    await whatIf.getByLabel('What-if ε/k_B value (K)').press('Tab');
    await expect.poll(async () => residualSums(page, 'section:has(h2:text-is("What if?"))')).not.toEqual(before);
    const after = await residualSums(page, 'section:has(h2:text-is("What if?"))');
    // The residual panels are of the what-if values: their squares add up to the χ² the panel reports.
    const trialChi2 = Number((await chi2.locator('strong').textContent())!);
    const gasAndEos = after[0] + after[after.length - 1];
    // (The reported χ² is written with 5 significant digits.)
    expect(Math.abs(gasAndEos - trialChi2) / trialChi2).toBeLessThan(1e-4);
    await screenshot(page, 'density-fit-what-if');

    // Drafted, submitted: the reviewer sees the same evidence on the review page.
    const drafted = await page.request.post(`${app.url}/api/parameter-sets`, { headers, data: { fitId, rationale: 'Joint B2 and liquid density fit for simulations with a 2.5 σ cutoff.' } });
    expect(drafted.status()).toBe(201);
    const setId = (await drafted.json()).id as number;
    expect((await page.request.post(`${app.url}/api/parameter-sets/${setId}/submit`, { headers })).status()).toBe(200);
    await signIn(page, app.url, 'reviewer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    await page.goto(`${app.url}/parameter-sets/${setId}`);
    await expectDensityEvidence(page, 'review page');
    await screenshot(page, 'density-set-review');
    await page.getByLabel('Review comment').fill('Densities within their uncertainties at both isotherms; approved for 2.5 σ truncated use.');
    await page.getByRole('button', { name: 'Approve' }).click();
    await page.getByLabel('Reason for retiring').waitFor();

    // The catalog card of the approved set, as a consumer reads it.
    await signIn(page, app.url, 'consumer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    await page.goto(`${app.url}/catalog/${setId}`);
    await expectDensityEvidence(page, 'catalog card');
    await screenshot(page, 'density-set-card');
    await page.close();
  }, 360_000);
});

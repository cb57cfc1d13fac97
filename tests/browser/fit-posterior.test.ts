import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { POSTERIOR_SEED } from '../../shared/fitting/fit-defaults';
import path from 'node:path';
import { chromiumOrSkip, screenshot, SCREENSHOT_DIR, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

/** The demo's B2 table of Quillgas QG-1 (fixtures/demo/scenario.ts). */
const B2 = 'QG-1 B2, Burnett runs 2026';

async function onlyTheB2Set(page: Page) {
  await page.getByLabel(`Use ${B2}`).waitFor();
  for (const box of await page.getByRole('checkbox', { name: /^Use / }).all())
    if ((await box.isEnabled()) && (await box.isChecked())) await box.uncheck();
  await page.getByLabel(`Use ${B2}`).check();
}

async function fitsTheWindow(page: Page) {
  return page.evaluate(() => ({ scrollWidth: document.documentElement.scrollWidth, innerWidth: window.innerWidth }));
}

describe.skipIf(!available)('posterior and model comparison in Chromium', () => {
  const { app, browser } = useAppAndBrowser();

  it('a Mie 16-6 fit with its posterior from the form shows draws, credible region and bands; compared with a 12-6 fit', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1360, height: 900 });
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const { substances } = (await (await page.request.get(`${app.url}/api/substances`)).json()) as {
      substances: Array<{ id: number; name: string }>;
    };
    const substanceId = substances.find((s) => s.name === 'Quillgas QG-1')!.id;

    // The form: Mie λr-6 held, the posterior switched on from the keyboard, fewer steps per walker.
    await page.goto(`${app.url}/substances/${substanceId}/fits/new`);
    await onlyTheB2Set(page);
    await page.getByRole('radio', { name: 'Mie λr-6' }).check();
    const exponent = page.getByLabel('Repulsive exponent λr (held)');
    await exponent.fill('40');
    await page.getByRole('switch', { name: 'Sample the posterior' }).focus();
    await page.keyboard.press('Space');
    expect(await page.getByRole('switch', { name: 'Sample the posterior' }).isChecked()).toBe(true);
    expect(await page.getByLabel('Sampler seed').inputValue()).toBe(String(POSTERIOR_SEED));
    await page.getByLabel('Steps per walker').fill('300');
    // λr = 40 is refused by the request schema in the browser, beside the field, and nothing is sent.
    await page.getByRole('button', { name: 'Run fit' }).click();
    await page.getByText('the repulsive exponent λr is at most 36').waitFor();
    expect(await exponent.getAttribute('aria-invalid')).toBe('true');
    expect(page.url()).toMatch(/\/fits\/new$/);
    await screenshot(page, 'fit-form-mie-refused');
    await exponent.fill('16');
    await expect.poll(() => page.getByText('the repulsive exponent λr is at most 36').count()).toBe(0);
    const [request] = await Promise.all([
      page.waitForRequest((r) => r.method() === 'POST' && r.url().endsWith('/api/fits')),
      page.getByRole('button', { name: 'Run fit' }).click(),
    ]);
    expect(request.postDataJSON().options).toMatchObject({
      model: 'mie',
      repulsiveExponent: 16,
      posterior: { samples: 300, seed: POSTERIOR_SEED },
    });
    await page.waitForURL(/\/fits\/\d+$/);
    const mieFitId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.getByText('Succeeded', { exact: true }).waitFor({ timeout: 90_000 });

    // The ε–σ plot: posterior draws, their 95 % credible region and the linearised region, named in its legend.
    const legend = page.getByRole('list', { name: 'Legend of the ε–σ plot' });
    await legend.waitFor();
    const entries = await legend.getByRole('listitem').allTextContents();
    expect(entries[0]).toMatch(/^posterior draws \(\d+\)$/);
    expect(entries.slice(1)).toEqual(['posterior 95 % credible region', 'linearised 95 % region', 'best fit']);
    expect(await page.getByRole('img', { name: /posterior draws with their 95 % credible region/ }).count()).toBe(1);
    expect(await page.getByRole('table', { name: 'Posterior against linearised intervals' }).getByRole('row').count()).toBe(3);
    // The B2 plot carries the posterior-predictive band.
    await page
      .getByTestId('fit-evidence')
      .getByText(/Shaded: the central 95 % of the model over the posterior draws/)
      .waitFor();
    // What if? compares other parameters with the data: no band there.
    expect(await page.getByText(/Shaded: the central 95 %/).count()).toBe(1);
    await screenshot(page, 'fit-mie-posterior');
    await page
      .getByRole('figure', { name: '95 % regions of ε/k_B and σ' })
      .screenshot({ path: path.join(SCREENSHOT_DIR, 'fit-mie-posterior-regions.png') });
    await page
      .getByTestId('fit-evidence')
      .getByRole('figure', { name: 'b2 data and model' })
      .screenshot({ path: path.join(SCREENSHOT_DIR, 'fit-mie-posterior-b2-band.png') });
    await page.setViewportSize({ width: 390, height: 844 });
    await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))));
    const phone = await fitsTheWindow(page);
    await screenshot(page, 'phone-fit-mie-posterior');
    await page
      .getByRole('figure', { name: '95 % regions of ε/k_B and σ' })
      .screenshot({ path: path.join(SCREENSHOT_DIR, 'phone-fit-mie-posterior-regions.png') });
    expect(phone.scrollWidth, `the fit page is ${phone.scrollWidth} px wide at 390 px`).toBeLessThanOrEqual(phone.innerWidth);
    await page.setViewportSize({ width: 1360, height: 900 });

    // A 12-6 fit of the same data from the form (its defaults), then both side by side.
    await page.goto(`${app.url}/substances/${substanceId}/fits/new`);
    await onlyTheB2Set(page);
    await page.getByRole('button', { name: 'Run fit' }).click();
    await page.waitForURL(/\/fits\/\d+$/);
    const ljFitId = Number(new URL(page.url()).pathname.split('/').pop());
    await page.getByText('Succeeded', { exact: true }).waitFor({ timeout: 90_000 });
    await page.goto(`${app.url}/fits/compare?a=${ljFitId}&b=${mieFitId}`);
    const table = page.getByRole('table', { name: 'Fits side by side' });
    await table.waitFor();
    const cells = async (label: string) =>
      (
        await table
          .getByRole('row')
          .filter({ has: page.getByRole('cell', { name: label, exact: true }) })
          .getByRole('cell')
          .allTextContents()
      ).slice(1);
    expect(await cells('Model')).toEqual(['LJ 12-6', 'Mie 16-6']);
    expect(await cells('λr')).toEqual(['12 (LJ 12-6)', '16 (held)']);
    expect(await cells('Free parameters')).toEqual(['2', '2']);
    const posteriorEpsilon = await cells('ε/k_B, posterior 95 %');
    expect(posteriorEpsilon[0]).toBe('—');
    expect(posteriorEpsilon[1]).toMatch(/^[\d.]+ \([\d.]+–[\d.]+\) K$/);
    expect(
      await page
        .getByRole('note')
        .filter({ hasText: /BIC|equally well/ })
        .textContent(),
    ).toMatch(/prefer Fit #\d+ over Fit #\d+ \(ΔBIC = [\d.]+|about equally well/);
    // Residuals of both fits: one plot for the B2 set and its χ² and RMS per fit.
    await page.getByRole('heading', { name: 'Residuals of both fits' }).waitFor();
    expect(await page.getByRole('img', { name: /b2 residuals of both fits/ }).count()).toBe(1);
    const perSet = page.getByRole('table', { name: 'Residuals per measurement set' });
    const row = perSet.getByRole('row').filter({ hasText: B2 });
    const numbers = (await row.getByRole('cell').allTextContents()).slice(1);
    expect(numbers).toHaveLength(6);
    expect(numbers[0]).toBe(numbers[3]);
    for (const n of numbers) expect(Number(n)).toBeGreaterThan(0);
    await screenshot(page, 'fit-compare-lj-mie');
    await page.setViewportSize({ width: 390, height: 844 });
    await page.evaluate(() => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(done))));
    const phoneCompare = await fitsTheWindow(page);
    await screenshot(page, 'phone-fit-compare-lj-mie');
    expect(phoneCompare.scrollWidth, `the comparison is ${phoneCompare.scrollWidth} px wide at 390 px`).toBeLessThanOrEqual(
      phoneCompare.innerWidth,
    );

    // A joint fit of B2 and viscosity (the form's default sets): each kind's 95 % region alone is drawn and named too.
    await page.setViewportSize({ width: 1360, height: 900 });
    await page.goto(`${app.url}/substances/${substanceId}/fits/new`);
    await page.getByLabel(`Use ${B2}`).waitFor();
    // With the posterior and, as its prior, the substance's approved LJ 12-6 set from the demo.
    await page.getByRole('switch', { name: 'Sample the posterior' }).check();
    await page.getByLabel('Steps per walker').fill('300');
    const prior = page.getByLabel('Gaussian prior from an approved set');
    expect(await prior.getByRole('option').count()).toBeGreaterThan(1);
    const priorSetId = await prior.getByRole('option').nth(1).getAttribute('value');
    await prior.selectOption(priorSetId!);
    const [jointRequest] = await Promise.all([
      page.waitForRequest((r) => r.method() === 'POST' && r.url().endsWith('/api/fits')),
      page.getByRole('button', { name: 'Run fit' }).click(),
    ]);
    expect(jointRequest.postDataJSON().options.posterior).toEqual({
      samples: 300,
      seed: POSTERIOR_SEED,
      prior: { parameterSetId: Number(priorSetId) },
    });
    await page.waitForURL(/\/fits\/\d+$/);
    await page.getByText('Succeeded', { exact: true }).waitFor({ timeout: 90_000 });
    await page.getByText(/times the bivariate Gaussian of/).waitFor();
    const jointLegend = await page.getByRole('list', { name: 'Legend of the ε–σ plot' }).getByRole('listitem').allTextContents();
    expect(jointLegend).toContain('B2 alone, 95 %');
    expect(jointLegend.slice(-2)).toEqual(['linearised 95 % region', 'best fit']);
    expect(await page.getByRole('img', { name: /the 95 % regions of B2( and viscosity)? fitted alone/ }).count()).toBe(1);
    await page
      .getByRole('figure', { name: '95 % regions of ε/k_B and σ' })
      .screenshot({ path: path.join(SCREENSHOT_DIR, 'fit-joint-kind-regions.png') });
    await page.close();
  });
});

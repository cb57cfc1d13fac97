import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

/*
 * The demo start approves real fits of the Quillgas QG-1, Norrane and FB-3 gas-phase tables
 * (server/demo-seed.ts), so the consumer finds them in the catalog.
 * 1 K × R in kJ/mol: R = 8.314462618… J/(mol K), CODATA 2018 (exact product N_A k).
 */
const R_KJ_PER_MOL_K = (6.02214076e23 * 1.380649e-23) / 1000;

describe.skipIf(!available)('catalog in Chromium', () => {
  const { app, browser } = useAppAndBrowser();

  it('the filter bar keeps a name as typed, refuses a range that ends below its start beside "To (K)", then sends a valid one', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'consumer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalog' }).click();
    await page.getByRole('link', { name: 'Norrane' }).waitFor();
    // Typed key by key: the space after "Quillgas" stays in the box while the address gets the trimmed text.
    await page.getByLabel('Substance').pressSequentially('Quillgas QG');
    await page.waitForURL(/q=Quillgas(\+|%20)QG/);
    expect(await page.getByLabel('Substance').inputValue()).toBe('Quillgas QG');
    await page.getByRole('link', { name: 'Norrane' }).waitFor({ state: 'detached' });
    await page.getByLabel('From (K)').fill('400');
    await page.waitForURL(/tMinK=400/);
    await page.getByLabel('To (K)', { exact: true }).fill('100');
    const toError = page.locator('#catalog-tmax-error');
    await toError.waitFor();
    // catalogQuery (shared/schemas/catalog.ts), the schema GET /api/catalog validates with.
    expect(await toError.textContent()).toContain('must not be below');
    expect(page.url()).not.toMatch(/tMaxK=/);
    await page.getByLabel('To (K)', { exact: true }).fill('900');
    await page.waitForURL(/tMinK=400&tMaxK=900/);
    expect(await toError.count()).toBe(0);
    // The navigation's Catalog link clears the address: the boxes follow it.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalog' }).click();
    await page.waitForURL((u) => !u.search.includes('tMinK'));
    await expect.poll(() => page.getByLabel('From (K)').inputValue()).toBe('');
    expect(await page.getByLabel('Substance').inputValue()).toBe('');
    await page.close();
  });

  it('a consumer finds a substance, switches units, downloads two formats and builds a mixture', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'consumer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalog' }).click();
    await page.getByRole('heading', { name: 'Approved parameter sets' }).waitFor();
    await page.getByRole('link', { name: 'Quillgas QG-1' }).waitFor();
    await page.getByLabel('Substance').fill('norr');
    await page.waitForURL(/q=norr/);
    await page.getByRole('link', { name: 'Quillgas QG-1' }).waitFor({ state: 'detached' });
    await screenshot(page, 'catalog-search');
    await page.getByRole('link', { name: 'Norrane' }).click();
    await page.getByRole('heading', { name: 'Norrane v1' }).waitFor();

    // ε/k_B in K first (the default), then kJ/mol: the shown value follows R·ε/k_B.
    const epsilon = page.getByTestId('card-epsilon');
    const inK = Number((await epsilon.textContent())!.split(' ')[0]);
    expect(inK).toBeGreaterThan(80);
    await page.getByText('kJ/mol', { exact: true }).first().click();
    await expect.poll(async () => (await epsilon.textContent()) ?? '').toMatch(/kJ\/mol$/);
    const inKJ = Number((await epsilon.textContent())!.split(' ')[0]);
    // Shown to the standard error's decimals: agreement to a thousandth of the value.
    expect(inKJ / (inK * R_KJ_PER_MOL_K)).toBeCloseTo(1, 2);
    await page.getByText('nm', { exact: true }).first().click();
    await expect.poll(async () => (await page.getByTestId('card-sigma').textContent()) ?? '').toMatch(/nm$/);

    // A different scheme for the consumer's own simulation gives a visible warning, remembered on reload.
    await page.getByLabel('My simulation uses').selectOption('truncated-shifted');
    await page.getByText('Different scheme.').waitFor();
    await page.reload();
    await page.getByText('Different scheme.').waitFor();
    await expect.poll(async () => (await page.getByTestId('card-epsilon').textContent()) ?? '').toMatch(/kJ\/mol$/);
    await page
      .getByText(/not validated property data for pressure, safety or process design/)
      .first()
      .waitFor();
    await screenshot(page, 'catalog-card');

    // Two downloads: the file names and contents come from the server.
    const [json] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: /JSON/ }).click()]);
    expect(json.suggestedFilename()).toMatch(/^epsigma-norrane-ps\d+-v1\.json$/);
    const doc = JSON.parse(readFileSync((await json.path())!, 'utf8'));
    expect(doc.format).toBe('epsigma.parameter-set/1');
    expect(doc.substance.name).toBe('Norrane');
    const [csv] = await Promise.all([page.waitForEvent('download'), page.getByRole('link', { name: /CSV/ }).click()]);
    expect(csv.suggestedFilename()).toMatch(/\.csv$/);
    const header = readFileSync((await csv.path())!, 'utf8').split('\r\n')[0];
    // The CSV link carries the units picked on the card.
    expect(header).toContain('epsilon_kJ_per_mol');
    expect(header).toContain('sigma_nm');

    // A two-component mixture by Lorentz–Berthelot.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Mixtures' }).click();
    await page.getByRole('heading', { name: 'Mixtures' }).waitFor();
    await page.getByRole('checkbox', { name: /Norrane v1/ }).check();
    await page.waitForURL(/sets=\d+/); // the picks live in the address: let the first one land before the second
    await page.getByRole('checkbox', { name: /Quillgas QG-1 v1/ }).check();
    const table = page.getByRole('table', { name: 'Mixture pairs' });
    await table.waitFor();
    expect(await table.getByRole('row').count()).toBe(4); // header + 1-1, 1-2, 2-2
    await table.getByText('Lorentz–Berthelot estimate').waitFor();
    await page.getByText('Combining-rule estimates.').waitFor();
    await page.getByLabel('Combining rule').selectOption('waldman-hagler');
    await table.getByText('Waldman–Hagler estimate').waitFor();
    await screenshot(page, 'catalog-mixture');
    await page.close();
  });

  it('a consumer creates an API token, sees it once, and revokes it', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'consumer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    await page.goto(`${app.url}/account/tokens`);
    await page.getByLabel('Token name').fill('notebook');
    await page.getByRole('button', { name: 'Create token' }).click();
    const secret = (await page.getByTestId('new-token').textContent())!.trim();
    expect(secret).toMatch(/^[A-Za-z0-9_-]{43}$/);
    const res = await fetch(`${app.url}/api/catalog`, { headers: { Authorization: `Bearer ${secret}` } });
    expect(res.status).toBe(200);
    await screenshot(page, 'catalog-token-created');
    await page.getByRole('button', { name: 'Done' }).click();
    await expect.poll(() => page.getByTestId('new-token').count()).toBe(0);
    await page.getByRole('button', { name: 'Revoke notebook' }).click();
    await page.getByText(/^Revoked/).waitFor();
    expect((await fetch(`${app.url}/api/catalog`, { headers: { Authorization: `Bearer ${secret}` } })).status).toBe(401);
    await page.close();
  });
});

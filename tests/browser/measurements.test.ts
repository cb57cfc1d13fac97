import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();
const fixture = (name: string) => fileURLToPath(new URL(`../fixtures/csv/${name}`, import.meta.url));

describe.skipIf(!available)('measurement upload in Chromium', () => {
  const { app, browser } = useAppAndBrowser();

  it('a modeller uploads a °C + bar density table, previews it, stores it and finds canonical values', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Substances' }).click();
    await page.getByLabel('Name').fill('Browserine');
    await page.getByLabel('Molar mass (g/mol)').fill('28.0134');
    await page.getByRole('button', { name: 'Create substance' }).click();
    await page.getByRole('heading', { name: 'Browserine' }).waitFor();

    await page.getByRole('link', { name: 'Upload measurements' }).click();
    await page.getByLabel('CSV file').setInputFiles(fixture('good-density-celsius-bar.csv'));
    await page.getByRole('heading', { name: /Preview: 4 rows in canonical units/ }).waitFor();
    // The preview shows temperatures in K (25 °C → 298.15 K) and pressures in MPa (10 bar → 1 MPa), with a plot.
    const preview = page.getByRole('table', { name: 'Preview rows' });
    const firstPreviewRow = (await preview.getByRole('row').nth(1).getByRole('cell').allTextContents()).map((c) => c.trim());
    expect(firstPreviewRow).toEqual(['3', '298.15', '1', '16', '0.02']);
    expect(await page.locator('canvas').count()).toBeGreaterThan(0);
    await page.getByLabel('Source (citation)').fill('Fenwick Thermophysics Laboratory, invented run 12');
    await screenshot(page, 'upload-preview');

    await page.getByRole('button', { name: 'Store measurement set' }).click();
    await page.waitForURL(/\/measurement-sets\/\d+$/);
    await page.getByText('version 1 of 1').waitFor();
    const rows = page.getByRole('table').filter({ hasText: 'File row' });
    const cells = async (i: number) => (await rows.getByRole('row').nth(i).getByRole('cell').allTextContents()).map((c) => c.trim());
    // "Row" counts data rows from 1 (the number a fit's "leave rows out" uses); "File row" is the line in the file.
    expect(await cells(1)).toEqual(['1', '3', '298.15', '1', '16', '0.02', 'file']);
    expect(await cells(4)).toEqual(['4', '6', '348.15', '5', '70', '0.05', 'file']);
    await screenshot(page, 'measurement-set-detail');
    // An address from before the rename (a bookmark, an older mail) leads to the same page.
    const here = new URL(page.url());
    await page.goto(`${app.url}${here.pathname.replace('/measurement-sets/', '/datasets/')}`); // vocabulary: keep
    await page.waitForURL(here.href);
    await page.getByText('version 1 of 1').waitFor();
    await page.close();
  });

  it('shows the problems of a broken file and offers no store button', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Substances' }).click();
    await page.getByRole('link', { name: 'Browserine' }).click();
    await page.getByRole('link', { name: 'Upload measurements' }).click();
    await page.getByLabel('CSV file').setInputFiles(fixture('nonpositive-temperature.csv'));
    await page.getByRole('heading', { name: /Problems to fix/ }).waitFor();
    expect(await page.getByRole('alert').first().textContent()).toMatch(/Row \d+/);
    expect(await page.getByRole('button', { name: 'Store measurement set' }).count()).toBe(0);
    await screenshot(page, 'upload-problems');
    await page.close();
  });
});

import { describe, expect, it } from 'vitest';
import { REFERENCE_CHECKS } from '../../shared/validation/reference-checks';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

describe.skipIf(!available)('admin page: Validation suite in Chromium', () => {
  const { app, browser } = useAppAndBrowser();

  it('shows the demo admin every reference check passing on this server, by area, and reruns them from the keyboard', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1360, height: 900 });
    await signIn(page, app.url, 'admin@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Validation suite' }).click();
    await page.getByRole('heading', { name: 'Validation suite', level: 1 }).waitFor();

    // The first request runs the suite on the server (a few seconds).
    const summary = page.getByTestId('validation-summary');
    await summary.waitFor({ timeout: 60_000 });
    const total = REFERENCE_CHECKS.length;
    expect(await summary.textContent()).toContain(`${total} of ${total} checks passed`);
    expect(await summary.textContent()).toMatch(/Code version/);
    expect(await page.getByText('Fail', { exact: true }).count()).toBe(0);

    // Every area with checks is listed, each with all its checks passed; the slow ones are marked as test-suite only.
    const areas = [...new Set(REFERENCE_CHECKS.map((c) => c.area))];
    for (const area of areas) {
      const n = REFERENCE_CHECKS.filter((c) => c.area === area).length;
      expect(await page.locator(`details[data-area="${area}"] summary`).textContent()).toContain(`${n} of ${n} passed`);
    }
    await page.getByRole('heading', { name: 'Run in the test suite only (too slow for a page)' }).waitFor();

    // Open an area with the keyboard and read one row: source, reference, ours, tolerance, verdict.
    const b2 = page.locator('details[data-area="B2"]');
    await b2.locator('summary').focus();
    await page.keyboard.press('Enter');
    const row = b2.locator('tr[data-check="b2.hcb-table.t1"]');
    await row.waitFor();
    const text = (await row.textContent()) ?? '';
    expect(text).toContain('Hirschfelder, Curtiss & Bird 1954, Table I-B');
    expect(text).toContain('-2.538');
    expect(text).toContain('± 0.0005');
    expect(text).toContain('Pass');
    await screenshot(page, 'validation-suite');

    // Rerun: the button says what it does while the server runs the checks, then the summary is back, all passing.
    const rerun = page.getByRole('button', { name: 'Run again' });
    await rerun.focus();
    await page.keyboard.press('Enter');
    await page.getByRole('button', { name: 'Running the checks…' }).waitFor();
    await page.getByRole('button', { name: 'Run again' }).waitFor({ timeout: 60_000 });
    expect(await summary.textContent()).toContain(`${total} of ${total} checks passed`);
    await page.close();
  }, 120_000);

  it('tells a modeller the page is for admins', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    expect(await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Validation suite' }).count()).toBe(0);
    await page.goto(`${app.url}/validation-suite`);
    await page.getByText('The validation suite is for admins.').waitFor();
    await page.close();
  });
});

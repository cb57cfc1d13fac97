import type { Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

async function json<T>(page: Page, url: string): Promise<T> {
  const response = await page.request.get(url);
  expect(response.status(), url).toBe(200);
  return (await response.json()) as T;
}

async function qg1(page: Page, url: string) {
  const { substances } = await json<{ substances: Array<{ id: number; name: string }> }>(page, `${url}/api/substances`);
  const substanceId = substances.find((s) => s.name === 'Quillgas QG-1')!.id;
  const { measurementSets } = await json<{ measurementSets: Array<{ id: number; kind: string; name: string }> }>(
    page,
    `${url}/api/measurement-sets?substanceId=${substanceId}`,
  );
  return { substanceId, b2: measurementSets.find((d) => d.kind === 'b2')! };
}

describe.skipIf(!available)('what a fitter expects: hold, leave out, notices, needs-my-action, revision diff', () => {
  const { app, browser } = useAppAndBrowser();

  it('holds σ and leaves two B2 rows out from the form; the result shows both (hollow points outside χ²); the author gets a notice', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const { substanceId, b2 } = await qg1(page, app.url);
    await page.goto(`${app.url}/substances/${substanceId}/fits/new`);
    // Only the B2 set: untick every other set the form offers.
    await page.getByLabel(`Use ${b2.name}`).waitFor();
    for (const box of await page.getByRole('checkbox', { name: /^Use / }).all())
      if ((await box.isEnabled()) && (await box.isChecked())) await box.uncheck();
    await page.getByLabel(`Use ${b2.name}`).check();
    // Tick rows 1 and 2 of the B2 set out, with a reason.
    const b2Row = page.getByRole('row').filter({ has: page.getByLabel(`Use ${b2.name}`) });
    await b2Row.getByRole('button', { name: /choose/ }).click();
    await page.getByLabel(`Leave out row 1 of ${b2.name}`).check();
    await page.getByLabel(`Leave out row 2 of ${b2.name}`).check();
    await page.getByLabel('Why rows 1, 2 are left out (optional)').fill('Gauge drift in the first two runs');
    // Hold σ at 3.52 Å.
    await page.getByRole('switch', { name: 'Hold σ' }).check();
    await page.getByLabel('Hold σ (Å)').fill('3.52');
    await screenshot(page, 'fit-form-hold-and-leave-out');
    await page.getByRole('button', { name: 'Run fit' }).click();
    await page.waitForURL(/\/fits\/\d+$/);
    const fitUrl = page.url();
    await page.getByText('Succeeded', { exact: true }).waitFor({ timeout: 90_000 });

    // Held: exact, no ±, said so.
    expect((await page.getByTestId('sigma-value').textContent())!.trim()).toBe('3.5200 Å');
    expect(await page.getByText('held at this value').count()).toBe(1);
    // Left out: named with the reason; counted apart in the statistics; hollow in the plots and outside χ².
    expect(
      await page.getByText('Left out of QG-1 B2, Burnett runs 2026 v1: rows 1, 2 — “Gauge drift in the first two runs”.').count(),
    ).toBe(1);
    expect(await page.getByText('(+2 left out)').count()).toBe(1);
    await page.getByText('open markers are points left out of the fit').first().waitFor();
    const fit = await json<{ result: { chi2: number; dof: number; residuals: Array<{ excluded: boolean; residual: number }> } }>(
      page,
      `${app.url}/api/fits/${fitUrl.split('/').pop()}`,
    );
    const counted = fit.result.residuals.filter((r) => !r.excluded).length;
    // One parameter fitted (σ held): dof = counted points − 1.
    expect(fit.result.dof).toBe(counted - 1);
    const sums = await page
      .locator('[data-testid="fit-evidence"] [data-residual-sum-squares]')
      .evaluateAll((els) => els.map((e) => Number(e.getAttribute('data-residual-sum-squares'))));
    const apiSum = fit.result.residuals.filter((r) => !r.excluded).reduce((a, r) => a + r.residual ** 2, 0);
    expect(
      Math.abs(apiSum - fit.result.chi2) / fit.result.chi2,
      `Σ counted residuals² ${apiSum} against χ² ${fit.result.chi2}`,
    ).toBeLessThan(1e-9);
    expect(Math.abs(sums[0] - fit.result.chi2) / fit.result.chi2, `the panel's Σ ${sums[0]} against χ² ${fit.result.chi2}`).toBeLessThan(
      1e-9,
    );
    // Profile χ² of ε beside its linearised interval; σ is held.
    expect(await page.getByTestId('profile-interval-epsilonK').textContent()).toMatch(/\d+(\.\d+)? … \d+(\.\d+)? K/);
    expect(await page.getByTestId('profile-interval-sigmaAngstrom').textContent()).toBe('held');
    await screenshot(page, 'fit-held-and-left-out');

    // The notice of one's own finished fit: counted, listed, followed (and then read).
    await page.goto(`${app.url}/`);
    const bell = page.getByRole('button', { name: /^Notices/ });
    await expect.poll(async () => bell.getAttribute('aria-label'), { timeout: 30_000 }).toMatch(/unread/);
    await bell.click();
    const notices = page.getByRole('region', { name: 'Notices' });
    const link = notices.getByRole('link', { name: /Fit #\d+ of Quillgas QG-1/ }).first();
    await link.waitFor();
    await screenshot(page, 'notices-open');
    await link.click();
    await page.waitForURL(fitUrl);
    await expect.poll(async () => bell.getAttribute('aria-label')).toBe('Notices');
    await page.close();
  }, 150_000);

  it('a set sent back waits on the Workbench; the revision keeps its truncated scheme, may change the cutoff, and the reviewer sees the change', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const headers = { Origin: app.url };
    const { substanceId, b2 } = await qg1(page, app.url);
    const started = await page.request.post(`${app.url}/api/fits`, { headers, data: { substanceId, measurementSets: [{ id: b2.id }] } });
    expect(started.status()).toBe(202);
    const fitId = (await started.json()).id as number;
    for (let i = 0; i < 120 && (await json<{ status: string }>(page, `${app.url}/api/fits/${fitId}`)).status !== 'succeeded'; i++)
      await page.waitForTimeout(500);
    const drafted = await page.request.post(`${app.url}/api/parameter-sets`, {
      headers,
      data: {
        fitId,
        scheme: 'truncated-tail',
        cutoffSigma: 2.5,
        rationale: 'B2 fit for simulations truncated at 2.5 σ with tail corrections.',
      },
    });
    expect(drafted.status()).toBe(201);
    const setId = (await drafted.json()).id as number;
    // A draft of mine waits on the Workbench.
    await page.goto(`${app.url}/`);
    const needs = page.getByRole('list', { name: 'Needs my action' });
    await needs.getByRole('link').first().waitFor();
    expect(await needs.textContent()).toMatch(/Draft/);
    expect((await page.request.post(`${app.url}/api/parameter-sets/${setId}/submit`, { headers })).status()).toBe(200);

    // The reviewer finds it under "Needs my action" and sends it back.
    await signIn(page, app.url, 'reviewer@demo.epsigma.test');
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    const reviewerNeeds = page.getByRole('list', { name: 'Needs my action' });
    await reviewerNeeds.getByText('Awaiting your review').first().waitFor();
    await reviewerNeeds.getByRole('link').filter({ hasText: 'Quillgas QG-1' }).first().click();
    await page.getByLabel('Review comment').fill('Say why 2.5 σ and not 3 σ, which the plant simulations use.');
    await page.getByRole('button', { name: 'Request changes' }).click();
    await page.getByText('Nothing for you to do on this set now (Changes requested).').waitFor();

    // The modeller: "Sent back" on the Workbench, then a revision that keeps the scheme and moves the cutoff.
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    await page.getByRole('list', { name: 'Needs my action' }).getByText('Sent back').first().waitFor();
    await screenshot(page, 'workbench-needs-action');
    await page.goto(`${app.url}/parameter-sets/${setId}`);
    const revise = page.getByRole('form', { name: 'Draft a revision' });
    expect(await revise.getByLabel('Cutoff scheme').inputValue()).toBe('truncated-tail');
    expect(await revise.getByLabel('From fit').inputValue()).toBe(String(fitId));
    await revise.getByLabel('Cutoff r_c (σ)').fill('3');
    await revise.getByLabel('Rationale of the revision').fill('The plant simulations truncate at 3 σ with tail corrections.');
    await revise.getByRole('button', { name: 'Draft revision' }).click();
    await page.waitForURL((u) => !u.pathname.endsWith(`/${setId}`));
    await page.getByText('Truncated with tail corrections, r_c = 3 σ').first().waitFor();
    const diff = page.getByRole('table', { name: 'Changes from the previous version' });
    await diff.waitFor();
    expect(await diff.textContent()).toMatch(/2\.5/);
    expect(await diff.textContent()).toMatch(/3/);
    await screenshot(page, 'revision-diff');
    await page.close();
  }, 150_000);

  it('a measurement set without a source citation says it cannot go to review as it is, and is "Not used yet" until a fit uses it', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const { substanceId } = await qg1(page, app.url);
    const csv = Buffer.from(['T (K),B2 (cm3/mol),u(B2) (cm3/mol)', '300,-20.1,0.5', '400,-5.2,0.5', '500,3.3,0.5'].join('\n'));
    const upload = await page.request.post(`${app.url}/api/measurement-sets`, {
      headers: { Origin: app.url },
      multipart: {
        substanceId: String(substanceId),
        kind: 'b2',
        name: 'QG-1 B2, uncited bench check',
        file: { name: 'b2.csv', mimeType: 'text/csv', buffer: csv },
      },
    });
    expect(upload.status()).toBe(201);
    expect(((await upload.json()) as { warnings: string[] }).warnings.length).toBeGreaterThan(0);
    await page.goto(`${app.url}/measurement-sets/${(await upload.json()).id}`);
    await page.getByText(/No source citation/).waitFor();
    // On the substance page the new set is "Not used yet"; the B2 set the demo fits used is "In use".
    await page.goto(`${app.url}/substances/${substanceId}`);
    const table = page.getByRole('table', { name: /Measurement sets of/ });
    await table.waitFor();
    expect(await table.getByRole('row').filter({ hasText: 'QG-1 B2, uncited bench check' }).textContent()).toContain('Not used yet');
    expect(await table.getByRole('row').filter({ hasText: 'QG-1 B2, Burnett runs 2026' }).textContent()).toContain('In use');
    await page.close();
  });
});

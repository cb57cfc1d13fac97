import { describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { b2WithGradient } from '../../shared/physics/virial';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

// Synthetic B2 table from invented parameters (ε/k_B = 140 K, σ = 3.5 Å) with a small deterministic wiggle.
function syntheticB2Csv(shiftCm3PerMol = 0): Buffer {
  const lines = ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)'];
  for (let i = 0; i < 12; i++) {
    const T = 170 + i * 45;
    lines.push(`${T},${(b2WithGradient(T, 140, 3.5).b2Cm3PerMol + 0.25 * Math.sin(1.3 * i) + shiftCm3PerMol).toFixed(4)},0.5`);
  }
  return Buffer.from(lines.join('\n'));
}

let substanceId: number;
let measurementSetId: number;

/** A substance, a B2 upload and a succeeded fit, made through the API with the signed-in page's cookies. */
async function succeededFit(page: Page, url: string): Promise<number> {
  const headers = { Origin: url };
  const substance = await page.request.post(`${url}/api/substances`, { headers, data: { name: 'Reviewite', molarMassGPerMol: 44.01 } });
  expect(substance.status()).toBe(201);
  substanceId = (await substance.json()).id;
  const upload = await page.request.post(`${url}/api/measurement-sets`, {
    headers,
    multipart: {
      substanceId: String(substanceId),
      kind: 'b2',
      name: 'Reviewite B2',
      source: 'Fenwick Thermophysics Laboratory, invented run 31',
      file: { name: 'b2.csv', mimeType: 'text/csv', buffer: syntheticB2Csv() },
    },
  });
  expect(upload.status()).toBe(201);
  measurementSetId = (await upload.json()).id;
  return fitOf(page, url, { id: measurementSetId });
}

async function fitOf(page: Page, url: string, measurementSet: { id: number; version?: number }): Promise<number> {
  const fit = await page.request.post(`${url}/api/fits`, {
    headers: { Origin: url },
    data: { substanceId, measurementSets: [measurementSet] },
  });
  expect(fit.status()).toBe(202);
  const fitId = (await fit.json()).id;
  for (let i = 0; i < 120; i++) {
    const status = (await (await page.request.get(`${url}/api/fits/${fitId}`)).json()).status;
    if (status === 'succeeded') return fitId;
    if (status === 'failed' || status === 'cancelled') throw new Error(`fit ${status}`);
    await page.waitForTimeout(500);
  }
  throw new Error('the fit did not finish');
}

describe.skipIf(!available)('parameter-set review in Chromium', () => {
  const { app, browser } = useAppAndBrowser();

  it('a modeller drafts and submits; a reviewer approves it from the Review desk; the approval mail reaches the mailbox', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const fitId = await succeededFit(page, app.url);

    await page.goto(`${app.url}/fits/${fitId}`);
    await page.getByRole('button', { name: 'Draft a parameter set' }).click();
    const form = page.getByRole('form', { name: 'Draft a parameter set' });
    // The validity range starts at the span of the fitted data (170 K … 665 K).
    expect(await form.getByLabel('Valid from (K)').inputValue()).toBe('170');
    expect(await form.getByLabel('Valid to (K)').inputValue()).toBe('665');
    expect(await form.getByLabel('Cutoff scheme').inputValue()).toBe('full-potential');
    await form.getByLabel('Rationale').fill('B2 over 170–665 K within its uncertainty; for full-potential use.');
    await screenshot(page, 'parameter-set-draft-form');
    await form.getByRole('button', { name: 'Draft parameter set' }).click();
    await page.waitForURL(/\/parameter-sets\/\d+$/);
    await page.getByRole('heading', { name: 'Reviewite v1' }).waitFor();
    const caution = page.getByRole('note');
    await caution.waitFor();
    expect(await caution.textContent()).toContain(
      'Fitted model parameters are not validated property data for pressure, safety or process design; defer to local codes and licensed engineering practice.',
    );
    await page.getByRole('button', { name: 'Submit for review' }).click();
    await page.getByRole('heading', { name: 'Actions' }).waitFor();
    await page.getByText('Nothing for you to do on this set now (In review).').waitFor();
    const setUrl = page.url();
    await screenshot(page, 'parameter-set-in-review');

    await signIn(page, app.url, 'reviewer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Review desk' }).click();
    await page.getByRole('heading', { name: 'Review desk' }).waitFor();
    await page.getByRole('link', { name: 'Reviewite v1' }).click();
    await page.waitForURL(setUrl);
    await page.getByRole('heading', { name: 'Data and model' }).waitFor();
    expect(await page.locator('canvas').count()).toBeGreaterThan(0);
    // No comment, no decision: the form says so and nothing is sent.
    await page.getByRole('button', { name: 'Approve' }).click();
    await page.getByText('A review needs a comment.').waitFor();
    await page.getByLabel('Review comment').fill('Residuals flat, σ well determined; approved for full-potential use.');
    await screenshot(page, 'parameter-set-review');
    await page.getByRole('button', { name: 'Approve' }).click();
    // Approved: the reviewer's only move left is to retire it with a reason.
    await page.getByLabel('Reason for retiring').waitFor();
    expect(await page.getByRole('button', { name: 'Approve' }).count()).toBe(0);
    expect(
      await page
        .locator('header', { has: page.getByRole('heading', { name: 'Reviewite v1' }) })
        .getByText('Approved', { exact: true })
        .count(),
    ).toBe(1);
    await page.getByText('Residuals flat, σ well determined; approved for full-potential use.').first().waitFor();
    await screenshot(page, 'parameter-set-approved');

    await signIn(page, app.url, 'admin@demo.epsigma.test');
    const nav = page.getByRole('navigation', { name: 'Main' });
    await nav.getByRole('link', { name: 'Workbench' }).waitFor();
    if ((await nav.getByRole('link', { name: 'Mailbox' }).count()) > 0) {
      // The outbox is delivered by the sender loop; reload until the message is in.
      const subject = 'Approved: Reviewite v1 (Full potential)';
      for (let i = 0; i < 60 && (await page.getByText(subject).count()) === 0; i++) {
        await page.goto(`${app.url}/mailbox`);
        await page.getByRole('heading', { name: 'Mailbox' }).waitFor();
        await page.waitForTimeout(500);
      }
      await page.getByText(subject).first().waitFor();
      await screenshot(page, 'parameter-set-mailbox');
    }
    await page.close();
  });

  it('the reviewer of v2 sees it against the approved v1 (parameters with the change, deviations, both curves) and sends it back; the modeller revises it as v3', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const headers = { Origin: app.url };
    // A corrected table (every B2 value 1.5 cm³/mol higher) as version 2 of the measurement set, fitted again.
    const v2data = await page.request.post(`${app.url}/api/measurement-sets/${measurementSetId}/versions`, {
      headers,
      multipart: {
        source: 'Fenwick Thermophysics Laboratory, invented run 31, recalibrated',
        file: { name: 'b2-v2.csv', mimeType: 'text/csv', buffer: syntheticB2Csv(1.5) },
      },
    });
    expect(v2data.status()).toBe(201);
    const fitId = await fitOf(page, app.url, { id: measurementSetId, version: 2 });
    const drafted = await page.request.post(`${app.url}/api/parameter-sets`, {
      headers,
      data: { fitId, rationale: 'Recalibrated B2 table.' },
    });
    expect(drafted.status()).toBe(201);
    const setId = (await drafted.json()).id;
    expect((await page.request.post(`${app.url}/api/parameter-sets/${setId}/submit`, { headers })).status()).toBe(200);

    await signIn(page, app.url, 'reviewer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Review desk' }).click();
    await page.getByRole('heading', { name: 'Review desk' }).waitFor();
    await page.getByRole('link', { name: 'Reviewite v2' }).click();
    await page.getByRole('heading', { name: 'Against the approved v1' }).waitFor();
    const table = page.getByRole('table', { name: 'Parameters against the approved version' });
    const header = (await table.getByRole('row').first().getByRole('columnheader').allTextContents()).map((c) => c.trim());
    expect(header.slice(1)).toEqual(['Approved v1', 'This set v2', 'Change']);
    expect(await page.getByRole('table', { name: 'Deviations per measurement set' }).getByRole('row').count()).toBe(2);
    await page.getByRole('heading', { name: 'Data with both models' }).waitFor();
    await screenshot(page, 'parameter-set-compare');

    // Sent back with a comment, then revised by the modeller as the next version.
    await page.getByLabel('Review comment').fill('Say why the recalibration moves ε by 3 %.');
    await page.getByRole('button', { name: 'Request changes' }).click();
    await page.getByText('Nothing for you to do on this set now (Changes requested).').waitFor();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    await page.goto(`${app.url}/parameter-sets/${setId}`);
    const revise = page.getByRole('form', { name: 'Draft a revision' });
    await revise
      .getByLabel('Rationale of the revision')
      .fill('Recalibrated B2 table: the pressure gauge offset moved every B2 by +1.5 cm³/mol, hence the lower ε.');
    await revise.getByRole('button', { name: 'Draft revision' }).click();
    await page.getByRole('heading', { name: 'Reviewite v3' }).waitFor();
    await page.getByRole('link', { name: 'the set sent back' }).waitFor();
    await screenshot(page, 'parameter-set-revision');
    await page.close();
  });
});

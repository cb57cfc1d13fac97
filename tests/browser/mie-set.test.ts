import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { b2WithGradient } from '../../shared/physics/virial';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

// Synthetic B2 of an invented Mie 16-6 gas (ε/k_B = 150 K, σ = 3.7 Å) from the Mie quadrature of virial.ts, with a small
// deterministic wiggle; not real data.
function mieB2Csv(): Buffer {
  const lines = ['T (K),B2 (cm3/mol),u(B2) (cm3/mol)'];
  [100, 120, 145, 175, 210, 260, 330, 420, 550, 720, 950].forEach((T, i) =>
    lines.push(
      `${T},${(b2WithGradient(T, 150, 3.7, undefined, { repulsiveExponent: 16 }).b2Cm3PerMol + 0.2 * Math.sin(1.7 * i)).toFixed(4)},0.4`,
    ),
  );
  return Buffer.from(lines.join('\n'));
}

describe.skipIf(!available)('a Mie λr-6 parameter set in Chromium', () => {
  const { app, browser } = useAppAndBrowser();

  it('goes through review (approved on its page) and export (LAMMPS mie/cut; no GROMACS link)', async () => {
    const page = await browser.context.newPage();
    const headers = { Origin: app.url };
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    const substance = await page.request.post(`${app.url}/api/substances`, {
      headers,
      data: { name: 'Quillgas QG-9', molarMassGPerMol: 58.1 },
    });
    expect(substance.status()).toBe(201);
    const substanceId = (await substance.json()).id;
    const upload = await page.request.post(`${app.url}/api/measurement-sets`, {
      headers,
      multipart: {
        substanceId: String(substanceId),
        kind: 'b2',
        name: 'QG-9 B2',
        source: 'Fenwick Thermophysics Laboratory, invented run 9',
        doi: '10.1000/epsigma.mie.9',
        file: { name: 'b2.csv', mimeType: 'text/csv', buffer: mieB2Csv() },
      },
    });
    expect(upload.status()).toBe(201);
    const measurementSetId = (await upload.json()).id;
    const fit = await page.request.post(`${app.url}/api/fits`, {
      headers,
      data: {
        substanceId,
        measurementSets: [{ id: measurementSetId }],
        options: { model: 'mie', repulsiveExponent: 16, posterior: { samples: 200 } },
      },
    });
    expect(fit.status()).toBe(202);
    const fitId = (await fit.json()).id;
    await expect
      .poll(async () => (await (await page.request.get(`${app.url}/api/fits/${fitId}`)).json()).status, { timeout: 60_000 })
      .toBe('succeeded');
    // The fit page shows the posterior beside the linearised intervals and the next measurements to make.
    await page.goto(`${app.url}/fits/${fitId}`);
    await page.getByRole('heading', { name: 'Posterior (Bayesian)' }).waitFor();
    await page.getByText('Mie 16-6 on QG-9 B2 v1').waitFor();
    expect(await page.getByRole('table', { name: 'Posterior against linearised intervals' }).getByRole('row').count()).toBe(3);
    const next = page.getByRole('list', { name: 'Next measurements, best first' });
    expect(await next.getByRole('listitem').count()).toBeGreaterThan(0);
    expect(await next.getByRole('listitem').first().textContent()).toMatch(
      /^B2 at [\d.]+ K \(expected .* cm3\/mol\) would make the joint 95 % region \d+ % smaller\.$/,
    );
    await screenshot(page, 'mie-fit-insights');

    // The same data fitted with LJ 12-6, compared with the Mie fit: model, AIC and BIC side by side, and a verdict.
    const ljFit = await page.request.post(`${app.url}/api/fits`, {
      headers,
      data: { substanceId, measurementSets: [{ id: measurementSetId }] },
    });
    const ljFitId = (await ljFit.json()).id;
    await expect
      .poll(async () => (await (await page.request.get(`${app.url}/api/fits/${ljFitId}`)).json()).status, { timeout: 60_000 })
      .toBe('succeeded');
    await page.goto(`${app.url}/fits/compare?a=${ljFitId}&b=${fitId}`);
    await page.getByRole('heading', { name: 'Side by side' }).waitFor();
    await page.getByRole('cell', { name: 'Mie 16-6' }).waitFor();
    await page.getByRole('cell', { name: 'BIC' }).waitFor();
    expect(await page.getByRole('note').filter({ hasText: /ΔBIC/ }).textContent()).toMatch(
      /The data (very strongly|strongly|positively) prefer Fit #\d+ over Fit #\d+ \(ΔBIC = [\d.]+|fit these data about equally well/,
    );
    await screenshot(page, 'mie-fit-compare');
    const draft = await page.request.post(`${app.url}/api/parameter-sets`, {
      headers,
      data: { fitId, rationale: 'Mie 16-6 fits the QG-9 B2 table within its uncertainty.' },
    });
    expect(draft.status()).toBe(201);
    const setId = (await draft.json()).id;
    expect((await page.request.post(`${app.url}/api/parameter-sets/${setId}/submit`, { headers })).status()).toBe(200);

    await signIn(page, app.url, 'reviewer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Review desk' }).click();
    await page.getByRole('heading', { name: 'Review desk' }).waitFor();
    await page.getByRole('link', { name: 'Quillgas QG-9 v1' }).click();
    await page.getByTestId('set-potential').waitFor();
    expect(await page.getByTestId('set-potential').textContent()).toBe('Mie 16-6: u = C ε[(σ/r)^16 − (σ/r)^6]');
    await page.getByLabel('Review comment').fill('Mie 16-6 form and residuals checked; approved.');
    await page.getByRole('button', { name: 'Approve' }).click();
    await page.getByLabel('Reason for retiring').waitFor();
    await screenshot(page, 'mie-set-approved');

    await signIn(page, app.url, 'consumer@demo.epsigma.test');
    // Let the sign-in land on its own page first, so its redirect cannot overtake the card's address.
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalog' }).waitFor();
    await page.goto(`${app.url}/catalog/${setId}`);
    await page
      .getByRole('heading', { name: 'Quillgas QG-9 v1' })
      .waitFor()
      .catch(async (err) => {
        await screenshot(page, 'mie-set-card-failed');
        throw err;
      });
    await screenshot(page, 'mie-set-card');
    await page.getByTestId('card-potential').waitFor();
    expect(await page.getByTestId('card-potential').textContent()).toContain('Mie 16-6');
    // C(16) = (16/10)(16/6)^0.6 = 2.8820 (by hand).
    expect(await page.getByTestId('card-model').textContent()).toBe('Mie 16-6, u(r) = Cε[(σ/r)^16 − (σ/r)⁶], C = 2.8820');
    const downloads = page.getByRole('list', { name: 'Downloads' });
    expect(await downloads.getByRole('link', { name: /GROMACS/ }).count()).toBe(0);
    await page.getByText(/GROMACS has no Mie pair function, so it is not offered/).waitFor();
    // Predictions at the consumer's own temperatures, one inside and one outside the validity range (100–950 K).
    const predict = page.getByRole('form', { name: 'Predict at my states' });
    await predict.getByLabel('Temperatures (K, comma-separated)').fill('150, 2000');
    await predict.getByRole('button', { name: 'Predict' }).click();
    const rows = page.getByRole('table', { name: 'Predictions' }).getByRole('row');
    await expect.poll(() => rows.count()).toBe(3);
    expect(await rows.nth(1).textContent()).toContain('within the validity range');
    expect(await rows.nth(2).textContent()).toContain('2000 K lies outside the validity range 100–950 K');
    await screenshot(page, 'mie-set-predictions');
    const [lammps] = await Promise.all([page.waitForEvent('download'), downloads.getByRole('link', { name: /LAMMPS real/ }).click()]);
    const text = readFileSync((await lammps.path())!, 'utf8');
    expect(text).toMatch(/^pair_style mie\/cut /m);
    expect(text).toMatch(/^pair_coeff 1 1 \S+ \S+ 16 6$/m);
    await page.close();
  });
});

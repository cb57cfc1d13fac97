import { describe, expect, it } from 'vitest';
import { chromiumOrSkip, DEMO_PASSWORD, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

// Forms through react-hook-form with the request schemas of shared/schemas: a refused value is said beside its
// field (the Field's `<id>-error` paragraph, tied to the control by aria-describedby), and a valid one goes through.
describe.skipIf(!available)('forms say what is wrong beside the field, then accept a valid value', () => {
  const { app, browser } = useAppAndBrowser();

  it('API tokens: an empty name is refused beside the name; a named token is created', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'consumer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    await page.goto(`${app.url}/account/tokens`);
    await page.getByRole('button', { name: 'Create token' }).click();
    const nameError = page.locator('#token-name-error');
    await nameError.waitFor();
    expect(await nameError.textContent()).toBe('give the token a name');
    expect(await page.getByLabel('Token name').getAttribute('aria-describedby')).toBe('token-name-error');
    await page.getByLabel('Token name').fill('Quillmoor nightly export');
    await page.getByRole('button', { name: 'Create token' }).click();
    await page.getByText('Token “Quillmoor nightly export” created').waitFor();
    expect(await nameError.count()).toBe(0);
    await page.close();
  });

  it('Change password: a short new password is refused beside it; a long one is taken', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'reviewer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    await page.goto(`${app.url}/account`);
    await page.getByLabel('Current password').fill('anything');
    await page.getByLabel('New password').fill('short');
    await page.getByRole('button', { name: 'Change password' }).click();
    const newError = page.locator('#new-password-error');
    await newError.waitFor();
    expect(await newError.textContent()).toBe('must have at least 12 characters');
    expect(await page.locator('#current-password-error').count()).toBe(0);
    // The demo password is the current one; the new one is long enough.
    await page.getByLabel('Current password').fill(DEMO_PASSWORD);
    await page.getByLabel('New password').fill('quillmoor-reviewer-2026');
    await page.getByRole('button', { name: 'Change password' }).click();
    await page.getByRole('status').filter({ hasText: 'Password changed.' }).waitFor();
    expect(await newError.count()).toBe(0);
    await page.close();
  });

  it('Simulations: T* outside the schema range is refused beside T*; a valid state point starts a run', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Simulations' }).click();
    await page.getByLabel('T*').fill('50');
    await page.getByLabel('Atoms').fill('108');
    await page.getByLabel('MD steps').fill('1000');
    await page.getByRole('button', { name: 'Run NPT simulation' }).click();
    const tError = page.locator('#sim-t-error');
    await tError.waitFor();
    expect(await tError.textContent()).toMatch(/10/); // createSimulationBody: reducedTemperature at most 10
    expect(await page.getByTestId('started-simulation').count()).toBe(0);
    await page.getByLabel('T*').fill('1.2');
    await page.getByRole('button', { name: 'Run NPT simulation' }).click();
    await page.getByTestId('started-simulation').waitFor();
    expect(await tError.count()).toBe(0);
    await page.close();
  });
  it('Substances: a molar mass below a hydrogen atom is refused beside it; a decimal comma is read and the substance made', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    await page.goto(`${app.url}/substances`);
    await page.getByLabel('Name').fill('Quillmoor trial gas QT-2');
    await page.getByLabel('Molar mass (g/mol)').fill('0,5');
    await page.getByRole('button', { name: 'Create substance' }).click();
    const massError = page.locator('#substance-molar-mass-error');
    await massError.waitFor();
    // createSubstanceBody (shared/schemas/measurements.ts): nothing is lighter than a hydrogen atom.
    expect(await massError.textContent()).toContain('at least 1 g/mol');
    expect(await page.getByLabel('Molar mass (g/mol)').getAttribute('aria-describedby')).toBe('substance-molar-mass-error');
    await page.getByLabel('Molar mass (g/mol)').fill('44,62');
    await page.getByRole('button', { name: 'Create substance' }).click();
    await page.waitForURL(/\/substances\/\d+$/);
    await page.getByRole('heading', { name: 'Quillmoor trial gas QT-2' }).waitFor();
    await page.close();
  });
});

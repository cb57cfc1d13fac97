import { describe, expect, it } from 'vitest';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

/** What each demo role must (and must not) find in the main navigation. */
const NAVIGATION: Record<string, { email: string; sees: string[]; doesNotSee: string[] }> = {
  admin: { email: 'admin@demo.epsigma.test', sees: ['Workbench', 'People'], doesNotSee: ['Review desk'] },
  modeller: { email: 'modeller@demo.epsigma.test', sees: ['Workbench', 'Substances'], doesNotSee: ['People', 'Review desk'] },
  reviewer: { email: 'reviewer@demo.epsigma.test', sees: ['Workbench', 'Substances', 'Review desk'], doesNotSee: ['People'] },
  consumer: {
    email: 'consumer@demo.epsigma.test',
    sees: ['Workbench', 'Catalog', 'Mixtures'],
    doesNotSee: ['People', 'Substances', 'Review desk'],
  },
};

describe.skipIf(!available)('app shell in Chromium', () => {
  const { app, browser } = useAppAndBrowser();

  it('sends a visitor without a session to the sign-in page', async () => {
    const page = await browser.context.newPage();
    await page.goto(`${app.url}/people`);
    await page.waitForURL(/\/sign-in\?next=%2Fpeople/);
    await expectVisible(page.getByRole('heading', { name: 'Sign in' }));
    await page.close();
  });

  it('shows a clear message for a wrong password', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test', 'definitely-wrong');
    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.textContent()).toContain('E-mail or password is not right.');
    await screenshot(page, 'sign-in-wrong-password');
    await page.close();
  });

  for (const [role, nav] of Object.entries(NAVIGATION)) {
    it(`signs in as ${role} and shows that role's navigation`, async () => {
      const page = await browser.context.newPage();
      await signIn(page, app.url, nav.email);
      const main = page.getByRole('navigation', { name: 'Main' });
      await main.getByRole('link', { name: 'Workbench' }).waitFor();
      const labels = (await main.getByRole('link').allTextContents()).map((s) => s.trim());
      for (const label of nav.sees) expect(labels).toContain(label);
      for (const label of nav.doesNotSee) expect(labels).not.toContain(label);
      await screenshot(page, `shell-${role}`);
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.waitForURL(/\/sign-in/);
      await page.close();
    });
  }

  it('lets the admin add a person from the People page with the keyboard', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'admin@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'People' }).click();
    await page.getByLabel('Name').fill('Tove Ramsay');
    await page.getByLabel('E-mail').fill('tove.ramsay@demo.epsigma.test');
    await page.getByLabel('Initial password').fill('a-long-initial-pass');
    await page.getByLabel('Initial password').press('Enter');
    await page.getByRole('status').filter({ hasText: 'Added tove.ramsay@demo.epsigma.test' }).waitFor();
    await page.getByText('Tove Ramsay').waitFor();
    await screenshot(page, 'people');
    await page.close();
  });

  it('shows the 404 page for an unknown address inside the app', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'consumer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).waitFor();
    await page.goto(`${app.url}/no/such/page`);
    await expectVisible(page.getByRole('heading', { name: 'There is no page here' }));
    await page.close();
  });
});

async function expectVisible(locator: import('playwright-core').Locator) {
  await locator.waitFor({ state: 'visible' });
  expect(await locator.isVisible()).toBe(true);
}

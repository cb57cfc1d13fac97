import type { ConsoleMessage, Page } from 'playwright-core';
import { describe, expect, it } from 'vitest';
import { chromiumOrSkip, screenshot, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

/** The pages a phone user must be able to read without sideways scrolling (issue 14, item 11). */
const PHONE_PAGES = ['Workbench', 'Substances', 'Catalog', 'Simulations', 'People', 'Audit trail', 'Mailbox'];

/** Console errors and warnings of a page, as the browser reports them. */
function watchConsole(page: Page) {
  const messages: string[] = [];
  const keep = (m: ConsoleMessage) => {
    if (m.type() === 'error' || m.type() === 'warning') messages.push(`${m.type()}: ${m.text()}`);
  };
  page.on('console', keep);
  page.on('pageerror', (e) => messages.push(`pageerror: ${e.message}`));
  return messages;
}

/** True when the document is no wider than the window (nothing scrolls sideways). */
const fitsWidth = (page: Page) =>
  page.evaluate(() => ({ scrollWidth: document.scrollingElement!.scrollWidth, innerWidth: window.innerWidth }));

// Dates are written "2 Dec 2026, 05:58": never as 12/2/2026 (common practice, no source).
const UNAMBIGUOUS = /\d{1,2} (Jan|Feb|Mar|Apr|May|Jun|Jul|Aug|Sep|Oct|Nov|Dec) \d{4}, \d{2}:\d{2}/;
const NUMERIC_DATE = /\b\d{1,2}\/\d{1,2}\/\d{2,4}\b/;

describe.skipIf(!available)('screens on a phone and a wide screen', () => {
  const { app, browser } = useAppAndBrowser();

  it('at 390 px every listed page fits the width, the menu folds and opens, sign-out is reachable, and nothing logs an error', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await signIn(page, app.url, 'admin@demo.epsigma.test');
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    // From here on (the sign-in page's own "who is signed in?" question answers 401 by design) nothing may log.
    const messages = watchConsole(page);
    // A full load of a page under the session check (the lazy page shows the loading state, no router warning).
    await page.goto(`${app.url}/`);
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    const menu = page.getByRole('button', { name: 'Menu' });
    expect(await menu.getAttribute('aria-expanded')).toBe('false');
    expect(await page.getByRole('button', { name: 'Sign out' }).count()).toBe(0);
    for (const name of PHONE_PAGES) {
      await menu.click();
      await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name, exact: true }).click();
      await page.getByRole('heading', { level: 1 }).first().waitFor();
      await page.waitForLoadState('networkidle');
      expect(await menu.getAttribute('aria-expanded'), `${name}: the menu closes after a choice`).toBe('false');
      const { scrollWidth, innerWidth } = await fitsWidth(page);
      if (scrollWidth > innerWidth)
        console.log(
          'WIDE',
          name,
          await page.evaluate(() =>
            [...document.querySelectorAll('main *')]
              .filter(
                (e) =>
                  e.getBoundingClientRect().right > window.innerWidth + 1 &&
                  ![...e.children].some((c) => c.getBoundingClientRect().right > window.innerWidth + 1),
              )
              .slice(0, 8)
              .map(
                (e) =>
                  `${e.tagName}.${e.className.toString().slice(0, 60)} ${Math.round(e.getBoundingClientRect().right)} ${(e.textContent ?? '').slice(0, 40)}`,
              ),
          ),
        );
      expect(scrollWidth, `${name} is ${scrollWidth} px wide in a ${innerWidth} px window`).toBeLessThanOrEqual(innerWidth);
      await screenshot(page, `phone-${name.toLowerCase().replace(/ /g, '-')}`);
    }
    // A parameter card, opened from the catalog.
    await menu.click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalog', exact: true }).click();
    await page.locator('a[href^="/catalog/"]').first().click();
    await page.getByRole('heading', { name: 'Data and model' }).waitFor();
    await page.waitForLoadState('networkidle');
    const card = await fitsWidth(page);
    expect(card.scrollWidth, `the card is ${card.scrollWidth} px wide`).toBeLessThanOrEqual(card.innerWidth);
    await screenshot(page, 'phone-catalog-card');
    // Dates on the audit trail read unambiguously.
    await menu.click();
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Audit trail', exact: true }).click();
    await page.getByRole('table').first().waitFor();
    const auditText = (await page.locator('main').textContent()) ?? '';
    expect(auditText).toMatch(UNAMBIGUOUS);
    expect(auditText).not.toMatch(NUMERIC_DATE);
    // Escape closes the menu; Sign out sits in it and leaves cleanly.
    await menu.click();
    expect(await menu.getAttribute('aria-expanded')).toBe('true');
    await page.keyboard.press('Escape');
    expect(await menu.getAttribute('aria-expanded')).toBe('false');
    await menu.click();
    await screenshot(page, 'phone-menu-open');
    await page.getByRole('button', { name: 'Sign out' }).click();
    await page.waitForURL(/\/sign-in$/);
    await page.getByRole('heading', { name: 'Sign in' }).waitFor();
    await page.waitForTimeout(300);
    expect(messages).toEqual([]);
    await page.close();
  });

  it("at 390 px a modeller's pages fit too: a substance, its fits, the fit form, a fit and a parameter set", async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 390, height: 844 });
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    const { substances } = (await (await page.request.get(`${app.url}/api/substances`)).json()) as {
      substances: Array<{ id: number; name: string }>;
    };
    const id = substances.find((x) => x.name === 'Quillgas QG-1')!.id;
    const { fits } = (await (await page.request.get(`${app.url}/api/substances/${id}/fits`)).json()) as {
      fits: Array<{ id: number; status: string }>;
    };
    const { parameterSets } = (await (await page.request.get(`${app.url}/api/substances/${id}/parameter-sets`)).json()) as {
      parameterSets: Array<{ id: number }>;
    };
    const pages: Array<[string, string]> = [
      ['substance', `/substances/${id}`],
      ['fits', `/substances/${id}/fits`],
      ['fit-form', `/substances/${id}/fits/new`],
      ...(fits.length ? [['fit', `/fits/${fits.find((f) => f.status === 'succeeded')!.id}`] as [string, string]] : []),
      ...(parameterSets.length ? [['parameter-set', `/parameter-sets/${parameterSets[0].id}`] as [string, string]] : []),
    ];
    expect(pages.length).toBe(5);
    for (const [name, path] of pages) {
      await page.goto(`${app.url}${path}`);
      await page.getByRole('heading', { level: 1 }).first().waitFor();
      await page.waitForLoadState('networkidle');
      await screenshot(page, `phone-${name}`);
      const { scrollWidth, innerWidth } = await fitsWidth(page);
      if (scrollWidth > innerWidth)
        console.log(
          'WIDE',
          name,
          await page.evaluate(() =>
            [...document.querySelectorAll('main *')]
              .filter(
                (e) =>
                  e.getBoundingClientRect().right > window.innerWidth + 1 &&
                  ![...e.children].some((c) => c.getBoundingClientRect().right > window.innerWidth + 1),
              )
              .slice(0, 8)
              .map(
                (e) =>
                  `${e.tagName}.${e.className.toString().slice(0, 60)} ${Math.round(e.getBoundingClientRect().right)} ${(e.textContent ?? '').slice(0, 40)}`,
              ),
          ),
        );
      expect(scrollWidth, `${name} is ${scrollWidth} px wide in a ${innerWidth} px window`).toBeLessThanOrEqual(innerWidth);
    }
    await page.close();
  });

  it('signing out from every kind of page logs no error, and a missing parameter set says "not found" without "Try again"', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
    await page.goto(`${app.url}/parameter-sets/999`);
    const alert = page.getByRole('alert');
    await alert.waitFor();
    expect(await alert.textContent()).toMatch(/not found/i);
    expect(await page.getByRole('button', { name: 'Try again' }).count()).toBe(0);
    await screenshot(page, 'parameter-set-not-found');
    // Sign out from the workbench (it reads the signed-in user), a polling page and a page of charts.
    for (const path of ['/', '/simulations', '/catalog']) {
      await signIn(page, app.url, 'modeller@demo.epsigma.test');
      await page.getByRole('heading', { name: /Good to see you/ }).waitFor();
      const messages = watchConsole(page);
      await page.goto(`${app.url}${path}`);
      await page.getByRole('heading', { level: 1 }).first().waitFor();
      await page.waitForLoadState('networkidle');
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.waitForURL(/\/sign-in$/);
      await page.getByRole('heading', { name: 'Sign in' }).waitFor();
      await page.waitForTimeout(300);
      page.removeAllListeners('console');
      page.removeAllListeners('pageerror');
      expect(messages, `signing out from ${path}`).toEqual([]);
    }
    await page.close();
  });

  it('the notice of a started simulation follows the run to its end', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Simulations' }).click();
    await page.getByLabel('Atoms').fill('108');
    await page.getByLabel('MD steps').fill('1000');
    await page.getByRole('button', { name: 'Run NPT simulation' }).click();
    const notice = page.getByTestId('started-simulation');
    await notice.waitFor();
    await expect.poll(async () => notice.textContent(), { timeout: 90_000, interval: 500 }).toMatch(/has finished|failed/);
    expect(await notice.textContent()).toMatch(/has finished: ρ\* = /);
    await page.close();
  }, 120_000);

  it('at 1440 px the plots fill their cards and table columns keep apart', async () => {
    const page = await browser.context.newPage();
    await page.setViewportSize({ width: 1440, height: 900 });
    await signIn(page, app.url, 'consumer@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Catalog' }).click();
    await page.locator('a[href^="/catalog/"]').first().click();
    const panel = page.locator('section').filter({ has: page.getByRole('heading', { name: 'Data and model' }) });
    await panel.locator('canvas').first().waitFor();
    const [panelWidth, canvasWidth] = await panel.evaluate((el) => [
      el.getBoundingClientRect().width,
      el.querySelector('canvas')!.getBoundingClientRect().width,
    ]);
    expect(canvasWidth / panelWidth, `plot ${canvasWidth} px in a ${panelWidth} px card`).toBeGreaterThan(0.85);
    await screenshot(page, 'wide-catalog-card');
    await page.close();
  });
});

import path from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import type { Locator } from 'playwright-core';
import { openDatabase } from '../../server/db/database';
import { mailBody, queueMail } from '../../server/features/mail/mail.service';
import { chromiumOrSkip, screenshot, SCREENSHOT_DIR, signIn, useAppAndBrowser } from './harness';

const { available } = chromiumOrSkip();

const SUBJECT = 'Quillgas QG-1 v1 — submitted for review';

async function expectVisible(locator: Locator) {
  await locator.waitFor({ state: 'visible' });
  expect(await locator.isVisible()).toBe(true);
}

describe.skipIf(!available)('admin pages in Chromium: Mailbox and Audit trail', () => {
  const { app, browser } = useAppAndBrowser();
  beforeAll(async () => {
    // Queue a mail in the running app's database; its own sender delivers it over SMTP to its local service.
    const handle = openDatabase(path.join(app.dir, 'app.sqlite'));
    try {
      await queueMail(handle.db, {
        to: ['reviewer@demo.epsigma.test'],
        subject: SUBJECT,
        ...mailBody(['Milo Carraway submitted v1 of Quillgas QG-1 for review: ε/k_B = 152.3 ± 0.8 K, σ = 3.71 ± 0.01 Å.']),
        link: '/substances',
        reason: 'browser-test',
      });
      for (let i = 0; i < 100; i++) {
        const got = await handle.db.selectFrom('mailboxMessage').select('id').where('subject', '=', SUBJECT).executeTakeFirst();
        if (got) break;
        await new Promise((r) => setTimeout(r, 200));
      }
    } finally {
      await handle.close();
    }
  });

  it('lets a modeller follow a substance from its page', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'modeller@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Substances' }).click();
    await page.getByRole('table').getByRole('link').first().click();
    const follow = page.getByRole('button', { name: 'Follow', exact: true, pressed: false });
    await expectVisible(follow);
    await follow.click();
    await expectVisible(page.getByRole('button', { name: 'Following', exact: true, pressed: true }));
    await screenshot(page, 'substance-followed');
    await page.close();
  });

  it('shows the admin the mailbox with the delivered message and its text part', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'admin@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Mailbox' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Mailbox', level: 1 }));
    const list = page.getByRole('list', { name: 'Messages' });
    await expectVisible(list.getByRole('button', { name: new RegExp(SUBJECT) }));
    await list.getByRole('button', { name: new RegExp(SUBJECT) }).click();
    const reader = page.getByRole('article', { name: `Message ${SUBJECT}` });
    await expectVisible(reader.getByText('reviewer@demo.epsigma.test'));
    expect(await reader.locator('pre').textContent()).toContain('ε/k_B = 152.3 ± 0.8 K, σ = 3.71 ± 0.01 Å');
    expect(await reader.locator('pre').textContent()).toContain(`Open in Epsigma: ${app.url}/substances`);
    const outbox = page.getByRole('table', { name: 'Outbox' });
    await expectVisible(outbox.getByText(SUBJECT));
    expect(await outbox.getByRole('row').filter({ hasText: SUBJECT }).textContent()).toContain('sent');
    await screenshot(page, 'mailbox-text');

    await reader.getByRole('button', { name: 'HTML' }).click();
    const frame = reader.locator('iframe');
    await expectVisible(frame);
    expect(await frame.getAttribute('sandbox')).toBe('');
    await expectVisible(page.frameLocator('iframe').getByRole('link', { name: 'Open in Epsigma' }));
    // An element shot: Chromium leaves a frame blank in full-page shots taller than the window.
    await reader.screenshot({ path: path.join(SCREENSHOT_DIR, 'mailbox-html.png') });

    await page.getByLabel('Recipient contains').fill('nobody-here@');
    await expectVisible(page.getByText('No mail to that address'));
    await page.close();
  });

  it('shows the admin the audit trail and filters it by action', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'admin@demo.epsigma.test');
    await page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Audit trail' }).click();
    await expectVisible(page.getByRole('heading', { name: 'Audit trail', level: 1 }));
    const table = page.getByRole('table');
    await expectVisible(table.getByText('substance.followed'));
    await screenshot(page, 'audit-trail');

    await page.getByLabel('Action').selectOption('substance.followed');
    await page.getByRole('button', { name: 'Apply filters' }).click();
    await page.waitForURL(/action=substance\.followed/);
    // The filtered page replaces the full one once its request answers.
    const actionCells = table.locator('tbody tr td:nth-child(4)');
    let actions: string[] = [];
    for (let i = 0; i < 50; i++) {
      actions = (await actionCells.allTextContents()).map((s) => s.trim());
      if (actions.length > 0 && actions.every((a) => a === 'substance.followed')) break;
      await page.waitForTimeout(200);
    }
    await expectVisible(table.getByRole('cell', { name: 'modeller@demo.epsigma.test', exact: true }));
    expect(actions.length).toBeGreaterThan(0);
    expect(new Set(actions)).toEqual(new Set(['substance.followed']));
    await screenshot(page, 'audit-trail-filtered');
    await page.close();
  });

  it('hides Mailbox and Audit trail from other roles', async () => {
    const page = await browser.context.newPage();
    await signIn(page, app.url, 'reviewer@demo.epsigma.test');
    const main = page.getByRole('navigation', { name: 'Main' });
    await main.getByRole('link', { name: 'Workbench' }).waitFor();
    const labels = (await main.getByRole('link').allTextContents()).map((s) => s.trim());
    expect(labels).not.toContain('Mailbox');
    expect(labels).not.toContain('Audit trail');
    for (const address of ['/mailbox', '/audit']) {
      await page.goto(`${app.url}${address}`);
      await expectVisible(page.getByText('Not allowed for your roles'));
    }
    await page.close();
  });
});

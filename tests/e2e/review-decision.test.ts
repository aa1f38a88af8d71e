import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInOnPage } from '../helpers/browser';
import { findFreePort, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  // No SMTP server: Lashline's own local mail catcher takes the notices; with MAIL_CATCHER_PAGE=on a
  // built server lists them at /dev/mail, to the team's owners only.
  server = await startServer({
    demo: true,
    env: { SMTP_HOST: '', MAIL_CATCHER: 'on', MAIL_CATCHER_PAGE: 'on', SMTP_PORT: String(await findFreePort()) },
  });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

describe('a crew chief decides a review in the browser', () => {
  it('reads the evidence, retires the set, and the team gets the decision by mail', async () => {
    const page = await browser.newPage();
    await signInOnPage(page, server.baseUrl, 'chief@lashline.test');

    await page.goto(`${server.baseUrl}/reviews`);
    await page
      .getByTestId('open-review')
      .getByRole('link', { name: /GS-4102/ })
      .click();
    await page.waitForURL(/\/reviews\/[\w-]+$/);
    const evidence = page.getByTestId('evidence');
    expect(await evidence.getByText(/Lashline suggests: ■ Retire/).count()).toBe(1);
    expect(await evidence.getByText(/runs over the life limit of 50/).count()).toBe(1);
    expect(
      await evidence
        .getByRole('row', { name: /Back-face runout \(measured\)/ })
        .getByText('✕ Out of band')
        .count(),
    ).toBe(1);

    // Nothing chosen: the page says so at the field and keeps what was typed.
    await page.getByLabel('Reason').fill('Runout beyond the limit');
    await page.getByRole('button', { name: 'Check the decision' }).click();
    await page.getByText('Choose one of the three decisions.').waitFor();
    expect(await page.getByLabel('Reason').inputValue()).toBe('Runout beyond the limit');
    expect(page.url()).toMatch(/#decide$/);
    // Each choice is a target a gloved finger can hit.
    const tile = await page.locator('label.choice-tile').first().boundingBox();
    expect(tile!.height).toBeGreaterThanOrEqual(44);

    await page.getByLabel('Retire').check();
    await page.getByLabel('Notes').fill('Wave keeps growing; past its life anyway.');
    await page.getByRole('button', { name: 'Check the decision' }).click();
    // The decision in words, once more, before it is recorded.
    const summary = page.getByTestId('decision-summary');
    await summary.waitFor();
    expect(await summary.textContent()).toContain('Check, then record: Retire');
    expect(await summary.textContent()).toContain('Reason: Runout beyond the limit');
    expect(await page.locator('[data-testid="decision"]').count()).toBe(0);
    await summary.getByRole('button', { name: 'Record: Retire' }).click();
    await page.waitForSelector('[data-testid="decision"]');
    expect(await page.getByTestId('decision').textContent()).toContain('Decision: Retire');

    const status = await page.evaluate(async () => {
      const sets = await (await fetch('/api/gear-sets')).json();
      return sets.items.find((s: { serial: string }) => s.serial === 'GS-4102').status;
    });
    expect(status).toBe('retired');

    // The outbox hands the notices to the catcher within a few seconds; the caught-mail page is the owner's.
    await page.close();
    const ownerPage = await browser.newPage();
    await signInOnPage(ownerPage, server.baseUrl, 'owner@lashline.test');
    let notices = 0;
    for (let i = 0; i < 40 && notices < 3; i += 1) {
      await ownerPage.goto(`${server.baseUrl}/dev/mail`);
      notices = await ownerPage
        .getByTestId('caught-mail')
        .filter({ hasText: 'Decision on gear set GS-4102: Retire' })
        .count();
      if (notices < 3) await ownerPage.waitForTimeout(500);
    }
    // Everyone in the team but the chief who decided: owner, technician, viewer.
    expect(notices).toBe(3);
    const first = ownerPage
      .getByTestId('caught-mail')
      .filter({ hasText: 'Decision on gear set GS-4102: Retire' })
      .first();
    expect(await first.textContent()).toContain('Reason: Runout beyond the limit');
    await ownerPage.close();
  });
});

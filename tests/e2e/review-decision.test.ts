import type { Browser } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInOnPage } from '../helpers/browser';
import { findFreePort, startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  // No SMTP server: Lashline's own local mail catcher takes the notices and lists them at /dev/mail.
  server = await startServer({
    demo: true,
    env: { SMTP_HOST: '', MAIL_CATCHER: 'on', SMTP_PORT: String(await findFreePort()) },
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

    await page.getByLabel('Retire').check();
    await page.getByLabel('Reason').fill('Runout beyond the limit');
    await page.getByLabel('Notes').fill('Wave keeps growing; past its life anyway.');
    await page.getByRole('button', { name: 'Record the decision' }).click();
    await page.waitForSelector('[data-testid="decision"]');
    expect(await page.getByTestId('decision').textContent()).toContain('Decision: Retire');

    const status = await page.evaluate(async () => {
      const sets = await (await fetch('/api/gear-sets')).json();
      return sets.items.find((s: { serial: string }) => s.serial === 'GS-4102').status;
    });
    expect(status).toBe('retired');

    // The outbox hands the notices to the catcher within a few seconds.
    let notices = 0;
    for (let i = 0; i < 40 && notices < 3; i += 1) {
      await page.goto(`${server.baseUrl}/dev/mail`);
      notices = await page
        .getByTestId('caught-mail')
        .filter({ hasText: 'Decision on gear set GS-4102: Retire' })
        .count();
      if (notices < 3) await page.waitForTimeout(500);
    }
    // Everyone in the team but the chief who decided: owner, technician, viewer.
    expect(notices).toBe(3);
    const first = page.getByTestId('caught-mail').filter({ hasText: 'Decision on gear set GS-4102: Retire' }).first();
    expect(await first.textContent()).toContain('Reason: Runout beyond the limit');
    await page.close();
  });
});

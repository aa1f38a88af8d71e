import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { uniqueEmail } from '../helpers/api-client';
import { launchBrowser } from '../helpers/browser';
import { startServer, type RunningServer } from '../helpers/server';
import { SmtpFake } from '../helpers/smtp-fake';

/**
 * A person proves their address and later gets back in after forgetting the password, in a real browser,
 * with every link read from the mail a real SMTP server received. The pages work without script: each
 * step is a form that posts back.
 */

let server: RunningServer;
let smtp: SmtpFake;
let browser: Browser;
beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  server = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  browser = await launchBrowser();
}, 60_000);
afterAll(async () => {
  await browser?.close();
  await server?.stop();
  await smtp?.stop();
});

/** The link to `page` in the newest mail to `email` whose subject has `subject`, once `count` have come. */
async function linkFromMail(email: string, subject: string, page: string, count = 1): Promise<string> {
  await smtp.waitFor(
    () => smtp.received.filter((m) => m.to.includes(email) && m.subject.includes(subject)).length >= count,
  );
  const mail = smtp.received.filter((m) => m.to.includes(email) && m.subject.includes(subject)).at(-1)!;
  const link = new RegExp(`https?://\\S+/${page}\\?token=[A-Za-z0-9_-]+`).exec(mail.text)?.[0];
  if (!link) throw new Error(`no ${page} link in: ${mail.text}`);
  return link;
}

async function signIn(page: Page, email: string, password: string): Promise<void> {
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password', { exact: true }).fill(password);
  await page.getByRole('button', { name: 'Sign in' }).click();
}

describe('proving an address and resetting a forgotten password in the browser', () => {
  it('signs up, confirms the address from the mail, forgets the password and sets a new one', async () => {
    const email = uniqueEmail('browser');
    const first = 'a first passphrase to forget';
    const second = 'a second passphrase to keep';
    const laptop = await browser.newPage({ javaScriptEnabled: false });

    // Sign-up ends on "check your mail"; the link can be sent again from there.
    await laptop.goto(`${server.baseUrl}/sign-up`);
    await laptop.getByLabel('Your name').fill('Browser Person');
    await laptop.getByLabel('E-mail').fill(email);
    await laptop.getByLabel('Password').fill(first);
    await laptop.getByRole('button', { name: 'Make the account' }).click();
    await laptop.waitForURL(/\/verify-email\?sent=1/);
    expect(await laptop.getByTestId('check-your-mail').textContent()).toContain(email);
    await linkFromMail(email, 'Confirm your address', 'verify-email');
    await laptop.getByRole('button', { name: 'Send the link again' }).click();
    expect(await laptop.getByRole('status').textContent()).toContain('a new link is on its way');

    // The newest link confirms the address, once.
    const verify = await linkFromMail(email, 'Confirm your address', 'verify-email', 2);
    await laptop.goto(verify);
    await laptop.getByRole('button', { name: 'Confirm my address' }).click();
    expect(await laptop.getByTestId('address-confirmed').textContent()).toContain(`${email} is confirmed`);
    await laptop.goto(verify);
    await laptop.getByRole('button', { name: 'Confirm my address' }).click();
    expect(await laptop.getByRole('alert').textContent()).toContain('already used');

    // Signed in on the laptop.
    await laptop.goto(`${server.baseUrl}/sign-in`);
    await signIn(laptop, email, first);
    await laptop.waitForURL((url) => !url.pathname.startsWith('/sign-in'));

    // On another device the password is forgotten: the sign-in page leads to a mailed link.
    const phone = await browser.newPage({ javaScriptEnabled: false });
    await phone.goto(`${server.baseUrl}/sign-in`);
    await phone.getByRole('link', { name: 'Forgot your password?' }).click();
    await phone.getByLabel('E-mail').fill(email);
    await phone.getByRole('button', { name: 'Mail me a link' }).click();
    expect(await phone.getByTestId('reset-requested').textContent()).toContain('If an account uses this address');

    await phone.goto(await linkFromMail(email, 'Reset your Lashline password', 'reset-password'));
    await phone.getByLabel('New password').fill('short');
    await phone.getByRole('button', { name: 'Set the new password' }).click();
    expect(await phone.getByText(/Use at least 12 characters/).count()).toBe(1);
    await phone.getByLabel('New password').fill(second);
    await phone.getByRole('button', { name: 'Set the new password' }).click();
    await phone.waitForURL(/\/sign-in\?reset=1/);
    expect(await phone.getByRole('status').textContent()).toContain('every earlier session has ended');
    await signIn(phone, email, second);
    await phone.waitForURL((url) => !url.pathname.startsWith('/sign-in'));

    // The laptop's session ended with the reset; the old password no longer opens the account.
    await laptop.goto(`${server.baseUrl}/account`);
    await laptop.waitForURL(/\/sign-in\?next=/);
    await signIn(laptop, email, first);
    await laptop.waitForURL(/error=/);
    await laptop.close();
    await phone.close();
  }, 90_000);
});

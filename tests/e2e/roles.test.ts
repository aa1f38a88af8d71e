import type { Browser, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { launchBrowser, signInOnPage } from '../helpers/browser';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  server = await startServer({ demo: true });
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
});

async function signInAs(email: string): Promise<Page> {
  const page = await browser.newPage();
  await signInOnPage(page, server.baseUrl, email);
  return page;
}

// What each demo role must see on the members page: [role badge, invite form, role controls].
const EXPECTED = [
  { email: 'owner@lashline.test', badge: 'Owner', invite: true, manage: true },
  { email: 'chief@lashline.test', badge: 'Crew chief', invite: true, manage: false },
  { email: 'tech@lashline.test', badge: 'Technician', invite: false, manage: false },
  { email: 'viewer@lashline.test', badge: 'Viewer', invite: false, manage: false },
];

describe('the demo roles in a real browser', () => {
  it('lists the demo accounts on the sign-in page while the demo is on', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.baseUrl}/sign-in`);
    for (const { email } of EXPECTED) expect(await page.getByText(email).count()).toBe(1);
    expect(await page.getByRole('heading', { name: 'Demo accounts' }).count()).toBe(1);
    await page.close();
  });

  for (const role of EXPECTED) {
    it(`shows the ${role.badge.toLowerCase()} exactly what that role may do`, async () => {
      const page = await signInAs(role.email);
      expect(await page.getByTestId('role-badge').textContent()).toBe(role.badge);
      expect(await page.getByRole('heading', { level: 1 }).textContent()).toBe('Cinder Flats Racing');
      expect(await page.getByRole('link', { name: 'Invite the crew' }).count()).toBe(role.invite ? 1 : 0);
      await page.getByRole('link', { name: 'Members' }).click();
      await page.waitForURL(/\/team\/members$/);
      expect(await page.getByTestId('member-row').count()).toBe(4);
      expect(await page.getByRole('heading', { name: 'Invite someone' }).count()).toBe(role.invite ? 1 : 0);
      expect(await page.getByRole('button', { name: 'Set role' }).count()).toBe(role.manage ? 4 : 0);
      expect(await page.getByRole('button', { name: /^Remove / }).count()).toBe(role.manage ? 3 : 0);
      await page.getByRole('button', { name: 'Sign out' }).click();
      await page.waitForURL(/\/sign-in\?signedOut=1/);
      await page.close();
    });
  }

  it('keeps a wrong password generic on the sign-in page', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.baseUrl}/sign-in`);
    await page.getByLabel('E-mail').fill('owner@lashline.test');
    await page.getByLabel('Password').fill('not the password');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/error=/);
    expect(await page.getByRole('alert').textContent()).toContain('do not match an account');
    await page.close();
  });

  it('sends the security headers with a page', async () => {
    const page = await browser.newPage();
    const response = await page.goto(`${server.baseUrl}/sign-in`);
    const headers = response!.headers();
    expect(headers['content-security-policy']).toContain("frame-ancestors 'none'");
    expect(headers['content-security-policy']).toContain("default-src 'self'");
    expect(headers['content-security-policy']).not.toMatch(/https?:\/\//);
    expect(headers['x-content-type-options']).toBe('nosniff');
    expect(headers['referrer-policy']).toBe('same-origin');
    const cookies = await page.context().cookies();
    for (const cookie of cookies) {
      expect(cookie.httpOnly, cookie.name).toBe(true);
      expect(cookie.sameSite, cookie.name).toBe('Lax');
    }
    await page.close();
  });

  it('sends a signed-out visitor from a page to sign-in', async () => {
    const page = await browser.newPage();
    await page.goto(`${server.baseUrl}/team/members`);
    expect(page.url()).toBe(`${server.baseUrl}/sign-in?next=%2Fteam%2Fmembers`);
    await page.close();
  });
});

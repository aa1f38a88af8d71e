import type { Browser, BrowserContext, Page } from 'playwright-core';
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

async function signIn(context: BrowserContext, email: string): Promise<Page> {
  const page = await context.newPage();
  await signInOnPage(page, server.baseUrl, email);
  return page;
}

const LAPTOP = { width: 1280, height: 800 };
const TABLET = { width: 768, height: 1024 };
/** The checklist the technician runs, signed off by the crew chief after. */
let checklistId = '';

describe('procedures and checklists in a real browser', () => {
  it('lets a crew chief write a procedure with a torque group and a tightening order, steps reordered by keyboard', async () => {
    const context = await browser.newContext({ viewport: LAPTOP });
    const page = await signIn(context, 'chief@lashline.test');
    await page.getByRole('link', { name: 'Procedures' }).click();
    await page.getByTestId('new-procedure').click();
    await page.locator('[data-testid="procedure-editor"][data-ready="true"]').waitFor();
    await page.getByTestId('procedure-name').fill('Hub service');
    await page.getByTestId('section-title').fill('Hubs');
    const steps = page.getByTestId('editor-step');
    await steps.nth(0).getByTestId('step-title').fill('Clean the spindle');
    await page.getByTestId('add-step').click();
    const ring = steps.nth(1);
    await ring.getByTestId('step-title').fill('Wheel studs');
    await ring.getByTestId('step-has-fasteners').check();
    await ring.getByTestId('fasteners-count').fill('5');
    await ring.getByTestId('fasteners-torque').fill('95');
    await ring.getByTestId('fasteners-source').fill('hub maker’s sheet');
    await ring.getByTestId('fasteners-passes').fill('50, 100');
    await ring.getByTestId('fasteners-sequence').check();
    await ring.getByTestId('fasteners-compound').selectOption('thread-locker');
    await page.getByTestId('add-step').click();
    await steps.nth(2).getByTestId('step-title').fill('Check the turning effort');

    // The last step moves up one place with the keyboard alone: Space, arrow up, Space.
    await steps.nth(2).getByTestId('step-handle').focus();
    for (const key of ['Space', 'ArrowUp', 'Space']) {
      await page.keyboard.press(key);
      await page.waitForTimeout(250);
    }
    await expect
      .poll(async () => Promise.all([0, 1, 2].map((i) => steps.nth(i).getByTestId('step-title').inputValue())))
      .toEqual(['Clean the spindle', 'Check the turning effort', 'Wheel studs']);

    await page.getByTestId('save-procedure').click();
    await page.waitForURL(/\/procedures\/[0-9a-f-]{36}$/);
    const titles = await page.getByTestId('reading-step').locator('h3').allTextContents();
    expect(titles.map((t) => t.trim())).toEqual([
      '1.1 Clean the spindle',
      '1.2 Check the turning effort',
      '1.3 Wheel studs',
    ]);
    const reading = page.getByTestId('procedure-reading');
    expect(await reading.textContent()).toContain(
      'Thread-locking compounds may cause an allergic skin reaction (H317)',
    );
    expect(await reading.textContent()).toContain('Order: 1, 3, 5, 2, 4, then the final check pass.');
    expect(await reading.textContent()).toContain('Lashline never supplies a torque figure');
    // The diagram is drawn and loads as an image.
    const diagram = reading.locator('img[alt^="Tightening diagram"]');
    await diagram.scrollIntoViewIfNeeded();
    await expect.poll(() => diagram.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth)).toBe(720);
    await context.close();
  });

  it('runs a checklist on a tablet through a lost connection and a reload, storing every change once', async () => {
    const context = await browser.newContext({ viewport: TABLET, hasTouch: true });
    const page = await signIn(context, 'tech@lashline.test');
    await page.goto(`${server.baseUrl}/checklists/new`);
    await page.getByLabel('Procedure').selectOption({ label: 'Ring-and-pinion set-up' });
    await page
      .getByLabel('Assembly')
      .selectOption({ label: 'RE-03 — Spare rear end' })
      .catch(async () => {
        const options = await page.getByLabel('Assembly').locator('option').allTextContents();
        await page.getByLabel('Assembly').selectOption({ label: options.find((o) => o.startsWith('RE-03'))! });
      });
    await page.getByRole('button', { name: 'Start' }).click();
    await page.waitForURL(/\/checklists\/[0-9a-f-]{36}$/);
    checklistId = new URL(page.url()).pathname.split('/').pop()!;
    const runner = page.getByTestId('checklist-runner');
    await expect.poll(() => runner.getAttribute('data-offline-ready'), { timeout: 15_000 }).toBe('true');
    // Targets for a gloved finger: every bolt at least 44 px square.
    const box = await page.getByTestId('bolt-1').first().boundingBox();
    expect(box!.width).toBeGreaterThanOrEqual(44);
    expect(box!.height).toBeGreaterThanOrEqual(44);

    await context.setOffline(true);
    // Ring gear: bolts tapped as the diagram marks them next, torques for each pass.
    const ring = page.getByTestId('run-step-1.1');
    for (let i = 0; i < 10; i++) await ring.locator('[data-next="true"]').tap();
    expect(await ring.locator('[data-tightened="true"]').count()).toBe(10);
    for (const [pass, value] of [
      [1, '200'],
      [2, '460'],
      [3, '660'],
    ] as const) {
      await page.getByTestId('torque-unit').selectOption('lbf-in');
      await page.getByTestId(`torque-1.1-${pass}`).fill(value);
    }
    await page.getByTestId('done-1.1').tap();
    await page.getByTestId('value-2.2').fill('14');
    await page.getByTestId('done-2.2').tap();
    // Carrier caps tapped 1, 2, 3, 4: not the engine's 1, 3, 2, 4 — kept as tapped.
    const caps = page.getByTestId('run-step-2.3');
    for (const bolt of [1, 2, 3, 4]) await caps.getByTestId(`bolt-${bolt}`).tap();
    await page.getByTestId('done-2.3').tap();
    await expect.poll(() => page.getByTestId('sync-status').textContent()).toContain('3 changes kept on this device');

    // A reload with no connection: the page comes from this device, the ticks with it.
    await page.reload();
    await runner.waitFor();
    await expect.poll(() => page.getByTestId('run-step-1.1').getAttribute('data-state')).toBe('done');
    expect(await page.getByTestId('run-step-2.3').getAttribute('data-state')).toBe('done');
    expect(await page.getByTestId('sync-status').textContent()).toContain('3 changes kept on this device');

    await context.setOffline(false);
    await expect
      .poll(() => page.getByTestId('sync-status').textContent(), { timeout: 30_000 })
      .toBe('Everything is saved on the server.');
    const stored = await page.evaluate(
      async (id) =>
        (await (await fetch(`/api/checklists/${id}`)).json()) as { steps: Record<string, any>; sections: any[] },
      checklistId,
    );
    const stepIds = stored.sections.flatMap((s: { steps: { id: string; title: string }[] }) => s.steps);
    const byTitle = (title: string) => stored.steps[stepIds.find((s: { title: string }) => s.title === title)!.id];
    expect(Object.keys(stored.steps)).toHaveLength(3);
    expect(byTitle('Ring gear bolts')).toMatchObject({
      boltsInOrder: [1, 6, 3, 8, 5, 10, 2, 7, 4, 9],
      orderDeviation: false,
      torqueApplied: [
        { pass: 1, value: 200, unit: 'lbf-in' },
        { pass: 2, value: 460, unit: 'lbf-in' },
        { pass: 3, value: 660, unit: 'lbf-in' },
      ],
    });
    expect(byTitle('Carrier bearing caps')).toMatchObject({ boltsInOrder: [1, 2, 3, 4], orderDeviation: true });
    expect(byTitle('Pinion turning torque')).toMatchObject({ value: 14, valueUnit: 'lbf-in' });

    // The rest of the steps, online, then complete.
    for (const number of ['2.1', '2.4', '2.5', '2.6']) await page.getByTestId(`done-${number}`).tap();
    await expect
      .poll(() => page.getByTestId('sync-status').textContent(), { timeout: 20_000 })
      .toBe('Everything is saved on the server.');
    await page.getByTestId('complete').tap();
    await expect.poll(() => page.getByTestId('checklist-status').textContent()).toContain('completed');
    await context.close();
  });

  it('lets a crew chief sign the checklist off, after which the audit trail shows each change once', async () => {
    expect(checklistId).not.toBe('');
    const context = await browser.newContext({ viewport: LAPTOP });
    const page = await signIn(context, 'chief@lashline.test');
    await page.goto(`${server.baseUrl}/checklists/${checklistId}`);
    await page.getByTestId('sign-off-form').getByRole('textbox').fill('Pattern photos checked.');
    await page.getByTestId('sign-off').click();
    await page.getByTestId('signed-off').waitFor();
    expect(await page.getByTestId('signed-off').textContent()).toContain('Pattern photos checked.');
    const trail = await page.evaluate(
      async (id) =>
        (
          (await (await fetch(`/api/audit?recordType=checklist&recordId=${id}&limit=100`)).json()) as {
            items: { action: string }[];
          }
        ).items,
      checklistId,
    );
    expect(trail.filter((e) => e.action === 'step-change')).toHaveLength(7);
    expect(trail.filter((e) => e.action === 'sign-off')).toHaveLength(1);
    await context.close();
  });

  it('lets a new crew member read the procedure: steps, cautions, diagrams and the deviations of its last checklists', async () => {
    const context = await browser.newContext({ viewport: LAPTOP });
    const page = await signIn(context, 'viewer@lashline.test');
    await page.getByRole('link', { name: 'Procedures' }).click();
    await page.getByTestId('procedure-list').getByRole('link', { name: 'Ring-and-pinion set-up' }).click();
    const reading = page.getByTestId('procedure-reading');
    await reading.waitFor();
    const text = (await reading.textContent()) ?? '';
    expect(text).toContain(
      'Thread-locking compounds may cause an allergic skin reaction (H317): wear protective gloves (P280).',
    );
    expect(text).toContain('example figure — use the part maker’s');
    expect(text).toContain('let them cool before opening the housing');
    expect(await reading.locator('img[alt^="Tightening diagram"]').count()).toBe(2);
    const deviations = (await page.getByTestId('deviations').textContent()) ?? '';
    expect(deviations).toContain('Carrier bearing caps: Bolts tightened out of order: 1, 2, 3, 4.');
    expect(deviations).toContain('Second pass done twice');
    // A viewer reads but does not edit or start.
    expect(await page.getByTestId('edit-procedure').count()).toBe(0);
    expect(await page.getByTestId('start-checklist').count()).toBe(0);
    await context.close();
  });
});

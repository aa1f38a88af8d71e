import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { ApiClient } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';

let server: RunningServer;
let chief: ApiClient;
beforeAll(async () => {
  server = await startServer({ demo: true });
  chief = new ApiClient(server.baseUrl);
  await chief.signIn('chief@lashline.test', 'lashline-demo');
});
afterAll(async () => {
  await server?.stop();
});

const serialsOnBoard = (html: string) =>
  [...html.matchAll(/data-testid="board-row"[^>]*data-serial="([^"]+)"/g)]
    .map((m) => m[1])
    .concat([...html.matchAll(/data-serial="([^"]+)"[^>]*data-testid="board-row"/g)].map((m) => m[1]));

describe('finding a set on the board by its serial', () => {
  it('narrows the list to the serials holding what was typed, and says so when none does', async () => {
    const all = serialsOnBoard(await (await chief.request('/')).text());
    expect(all.length).toBeGreaterThan(2);
    const found = serialsOnBoard(await (await chief.request('/?q=4102')).text());
    expect(found).toEqual(['GS-4102']);
    const page = await (await chief.request('/?q=NO-SUCH')).text();
    expect(serialsOnBoard(page)).toEqual([]);
    expect(page).toContain('No gear set in use matches this filter and the serial “NO-SUCH”');
    expect(page).toContain('value="NO-SUCH"');
  });
});

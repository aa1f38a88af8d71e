import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { type ApiClient, TEST_PASSWORD, signedInClient, uniqueEmail } from '../helpers/api-client';
import { startServer, type RunningServer } from '../helpers/server';
import { postSignIn } from '../helpers/sign-in-requests';
import { SmtpFake } from '../helpers/smtp-fake';
import { joinByInvitation } from '../helpers/team';

/**
 * Two built servers on one SQLite file (WAL lets several processes share it) and one SMTP server, as
 * Lashline runs beyond one process: each message delivered once, a role change through one seen at once
 * by the other, and writes through both with no 5xx.
 */

let smtp: SmtpFake;
let first: RunningServer;
let second: RunningServer;
let ownerOnFirst: ApiClient;
let ownerOnSecond: ApiClient;
let car: string;

beforeAll(async () => {
  smtp = await SmtpFake.create();
  await smtp.start();
  first = await startServer({ env: { SMTP_PORT: String(smtp.port) } });
  second = await startServer({ dataDir: first.dataDir, env: { SMTP_PORT: String(smtp.port) } });
  ownerOnFirst = (await signedInClient(first.baseUrl, { team: 'Two Process Team' })).client;
  ownerOnSecond = ownerOnFirst.atServer(second.baseUrl);
  car = (await ownerOnFirst.post('/api/cars', { name: 'Shared car' })).body.id;
}, 120_000);
afterAll(async () => {
  await second?.stop();
  await first?.stop();
  await smtp?.stop();
});

describe('two server processes on one database', () => {
  it('delivers every one of 20 invitations queued through both exactly once, each with its own Message-ID', async () => {
    const emails = Array.from({ length: 20 }, (_, i) => uniqueEmail(`both-${i}`));
    const answers = await Promise.all(
      emails.map((email, i) =>
        (i % 2 ? ownerOnSecond : ownerOnFirst).post('/api/invitations', { email, role: 'viewer' }),
      ),
    );
    expect(answers.map((a) => a.status)).toEqual(emails.map(() => 201));
    for (const email of emails) await smtp.waitFor((m) => m.to.includes(email), 30_000);
    // Both workers poll every 2 s: a second copy from either would have arrived by now.
    await new Promise((r) => setTimeout(r, 5000));
    const copies = emails.map((email) => smtp.received.filter((m) => m.to.includes(email)));
    expect(copies.map((c) => c.length)).toEqual(emails.map(() => 1));
    const ids = copies.map((c) => c[0]!.messageId);
    expect(new Set(ids).size).toBe(20);
    for (const id of ids) expect(id).toMatch(/^<[0-9a-f-]{36}@outbox\.lashline>$/);
  }, 90_000);

  it('refuses a technician demoted through one process on the very next request to the other', async () => {
    const tech = await joinByInvitation(first.baseUrl, smtp, ownerOnFirst, 'technician');
    const techOnSecond = tech.client.atServer(second.baseUrl);
    expect((await techOnSecond.post('/api/runs', { carId: car, at: '2026-05-01T10:00:00Z' })).status).toBe(201);
    // A read through the second process just before, as a technician's screen would make.
    expect((await techOnSecond.get('/api/runs')).status).toBe(200);
    expect((await ownerOnFirst.patch(`/api/members/${tech.userId}`, { role: 'viewer' })).status).toBe(200);
    const refused = await techOnSecond.post('/api/runs', { carId: car, at: '2026-05-01T10:05:00Z' });
    expect(refused.status).toBe(403);
  }, 60_000);

  it('reaches the sign-in limit across both: failures alternating between them are counted together', async () => {
    const { email } = await signedInClient(first.baseUrl);
    const servers = [first, second];
    for (let i = 0; i < 5; i += 1) {
      const { response } = await postSignIn(servers[i % 2]!.baseUrl, { email, password: 'not the password at all' });
      expect(response.status).toBe(302);
    }
    // Five failures per account in 15 minutes: the sixth is refused by either process, right password or not.
    for (const server of servers) {
      const { response, client } = await postSignIn(server.baseUrl, { email, password: TEST_PASSWORD });
      expect(response.status).toBe(429);
      expect(client.hasSessionCookie()).toBe(false);
    }
  }, 60_000);

  it('ends a session signed out through one process on the very next request to the other', async () => {
    const { client } = await signedInClient(first.baseUrl);
    const copyOnSecond = client.atServer(second.baseUrl);
    expect((await copyOnSecond.get('/api/account')).status).toBe(200);
    await client.signOut();
    expect((await copyOnSecond.get('/api/account')).status).toBe(401);
  }, 60_000);

  it('takes writes through both at once with no 5xx and keeps every one', async () => {
    const before = (await ownerOnFirst.get('/api/runs?limit=500')).body.items.length as number;
    const answers = await Promise.all(
      Array.from({ length: 40 }, (_, i) =>
        (i % 2 ? ownerOnSecond : ownerOnFirst).post('/api/runs', {
          carId: car,
          at: `2026-05-02T10:${String(i).padStart(2, '0')}:00Z`,
        }),
      ),
    );
    expect(answers.filter((a) => a.status >= 500)).toEqual([]);
    expect(answers.map((a) => a.status)).toEqual(answers.map(() => 201));
    expect((await ownerOnSecond.get('/api/runs?limit=500')).body.items.length).toBe(before + 40);
  }, 60_000);
});

describe('two server processes on one machine with the local mail catcher', () => {
  it('gives each its own catcher instead of sending one’s mail to the other’s', async () => {
    const env = { SMTP_HOST: '', MAIL_CATCHER: 'on', SMTP_PORT: String(smtp.port + 1) };
    const a = await startServer({ env });
    const b = await startServer({ env });
    try {
      await Promise.all([fetch(`${a.baseUrl}/api/health`), fetch(`${b.baseUrl}/api/health`)]);
      const portOf = (server: RunningServer) =>
        Number(/catching this process's mail on 127\.0\.0\.1:(\d+)/.exec(server.output())?.[1]);
      await expect.poll(() => portOf(a) > 0 && portOf(b) > 0, { timeout: 5000 }).toBe(true);
      expect(portOf(a)).not.toBe(portOf(b));
    } finally {
      await a.stop();
      await b.stop();
    }
  }, 60_000);
});

import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type * as limitsModule from '../../../src/lib/server/attempt-limits';

/**
 * The database limiter against a real SQLite file made by the real migrator: what is counted, what a
 * refusal records (nothing), what forgiving takes back, and how long Retry-After says to wait.
 */

let folder: string;
let limits: typeof limitsModule;
let closeDatabase: () => void;

beforeAll(async () => {
  folder = mkdtempSync(join(tmpdir(), 'lashline-limits-'));
  // Before the imports: the database module reads DATABASE_URL once.
  vi.stubEnv('DATABASE_URL', `file:${join(folder, 'limits.db')}`);
  const client = await import('../../../src/db/client');
  const { applyMigrations } = await import('../../../src/db/migrate');
  await applyMigrations(await client.getDb());
  closeDatabase = client.closeDatabase;
  limits = await import('../../../src/lib/server/attempt-limits');
});
afterAll(() => {
  closeDatabase?.();
  vi.unstubAllEnvs();
  rmSync(folder, { recursive: true, force: true });
});

const MINUTE = 60_000;
const T0 = Date.UTC(2026, 4, 1, 10, 0, 0);

describe('attempt limits on the database', () => {
  it('allows max attempts in the window, then refuses until the oldest leaves it', async () => {
    const count = { kind: 'test-a', key: 'k1', max: 3, windowMs: 15 * MINUTE };
    for (const offset of [0, MINUTE, 2 * MINUTE])
      expect((await limits.limitAttempts([count], T0 + offset)).retryAfterSeconds).toBe(0);
    // The oldest of the three leaves the window at T0 + 15 min: 12 minutes from T0 + 3 min.
    expect((await limits.limitAttempts([count], T0 + 3 * MINUTE)).retryAfterSeconds).toBe(12 * 60);
    expect((await limits.limitAttempts([count], T0 + 15 * MINUTE + 1)).retryAfterSeconds).toBe(0);
  });

  it('records nothing while refusing, so waiting out a refusal is never extended', async () => {
    const count = { kind: 'test-b', key: 'k1', max: 2, windowMs: 10 * MINUTE };
    await limits.limitAttempts([count], T0);
    await limits.limitAttempts([count], T0 + MINUTE);
    for (let i = 2; i < 9; i += 1)
      expect((await limits.limitAttempts([count], T0 + i * MINUTE)).retryAfterSeconds).toBeGreaterThan(0);
    // Only the two allowed attempts counted: the first leaves at T0 + 10 min.
    expect((await limits.limitAttempts([count], T0 + 10 * MINUTE + 1)).retryAfterSeconds).toBe(0);
  });

  it('takes back a forgiven attempt, and forgets a key when cleared', async () => {
    const count = { kind: 'test-c', key: 'k1', max: 2, windowMs: 10 * MINUTE };
    const first = await limits.limitAttempts([count], T0);
    await first.forgive();
    await limits.limitAttempts([count], T0 + 1);
    expect((await limits.limitAttempts([count], T0 + 2)).retryAfterSeconds).toBe(0);
    expect((await limits.limitAttempts([count], T0 + 3)).retryAfterSeconds).toBeGreaterThan(0);
    await limits.clearAttempts('test-c', 'k1');
    expect((await limits.limitAttempts([count], T0 + 4)).retryAfterSeconds).toBe(0);
  });

  it('refuses when any of several limits is reached, and counts only against those that record', async () => {
    const account = { kind: 'test-d-account', key: 'a@example.test', max: 1, windowMs: 10 * MINUTE };
    const address = { kind: 'test-d-address', key: '192.0.2.1', max: 5, windowMs: 10 * MINUTE };
    const peek = { kind: 'test-d-code', key: 'a@example.test', max: 1, windowMs: 10 * MINUTE, record: false };
    expect((await limits.limitAttempts([account, address, peek], T0)).retryAfterSeconds).toBe(0);
    expect((await limits.limitAttempts([account, address, peek], T0 + 1)).retryAfterSeconds).toBeGreaterThan(0);
    // The peeked limit recorded nothing, and the refused attempt did not count against the address.
    expect((await limits.limitAttempts([peek], T0 + 2)).retryAfterSeconds).toBe(0);
    for (let i = 0; i < 4; i += 1)
      expect((await limits.limitAttempts([address], T0 + 3 + i)).retryAfterSeconds).toBe(0);
    expect((await limits.limitAttempts([address], T0 + 10)).retryAfterSeconds).toBeGreaterThan(0);
  });

  it('keys of different kinds never count against each other', async () => {
    const one = { kind: 'test-e-one', key: 'same', max: 1, windowMs: MINUTE };
    const two = { kind: 'test-e-two', key: 'same', max: 1, windowMs: MINUTE };
    await limits.limitAttempts([one], T0);
    expect((await limits.limitAttempts([two], T0)).retryAfterSeconds).toBe(0);
  });

  it('throws a 429 with Retry-After through requireAttemptAllowed', async () => {
    const limit = { max: 1, windowMs: MINUTE };
    await limits.requireAttemptAllowed('test-f', 'k', limit);
    const refusal = await limits.requireAttemptAllowed('test-f', 'k', limit).catch((error: unknown) => error);
    expect(refusal).toMatchObject({ status: 429 });
    expect(Number((refusal as { headers: Record<string, string> }).headers['Retry-After'])).toBeGreaterThan(0);
  });
});

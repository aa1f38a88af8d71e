import { randomBytes } from 'node:crypto';
import { mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { readEnvironment } from '../../environment';

/**
 * The secret that signs and encrypts sessions: AUTH_SECRET when set, otherwise a random one made
 * on first start and kept in the data folder, so restarts keep everyone signed in.
 */
export function resolveAuthSecret(): string {
  const env = readEnvironment();
  if (env.AUTH_SECRET) return env.AUTH_SECRET;
  const folder = resolve(env.DATA_DIR);
  const file = join(folder, 'auth-secret');
  try {
    const stored = readFileSync(file, 'utf8').trim();
    if (stored.length >= 32) return stored;
  } catch {
    // Not made yet: make it below.
  }
  mkdirSync(folder, { recursive: true });
  const secret = randomBytes(48).toString('base64url');
  // 'wx' fails if another process made it first; then read theirs.
  try {
    writeFileSync(file, `${secret}\n`, { flag: 'wx', mode: 0o600 });
    return secret;
  } catch {
    return readFileSync(file, 'utf8').trim();
  }
}

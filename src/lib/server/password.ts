import { hash, verify } from '@node-rs/argon2';

// Algorithm.Argon2id; the package exports it as a const enum, which isolated modules cannot read.
const ARGON2ID = 2;

// OWASP Password Storage Cheat Sheet: argon2id, 19 MiB memory, 2 iterations, 1 degree of parallelism.
const OWASP_ARGON2ID = { algorithm: ARGON2ID, memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

/** Hashes a password with argon2id at OWASP's parameters. */
export function hashPassword(password: string): Promise<string> {
  return hash(password, OWASP_ARGON2ID);
}

/** Checks a password against its stored hash; false for a malformed hash too. */
export async function verifyPassword(storedHash: string, password: string): Promise<boolean> {
  try {
    return await verify(storedHash, password);
  } catch {
    return false;
  }
}

// Verifying against this when the e-mail is unknown makes both failures take the same time.
let decoyHash: Promise<string> | undefined;
/** A hash to verify against when no account matches, so timing does not reveal which e-mails exist. */
export function getDecoyHash(): Promise<string> {
  decoyHash ??= hashPassword('lashline-decoy-password-never-matches');
  return decoyHash;
}

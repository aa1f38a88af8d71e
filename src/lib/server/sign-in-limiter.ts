import { AsyncLocalStorage } from 'node:async_hooks';
import { emailSchema } from '../account-schemas';
import { SECOND_FACTOR_CODE_LIMIT, SIGN_IN_ACCOUNT_LIMIT, SIGN_IN_ADDRESS_LIMIT } from '../rate-limit';
import { clearAttempts, limitAttempt, limitAttempts, type AttemptCount, type AttemptVerdict } from './attempt-limits';

/**
 * Sign-in attempts, limited per account and per client address, and wrong second-factor codes per
 * account, all counted in the database. The middleware reads the e-mail from the body exactly as
 * Auth.js will, counts the attempt before Auth.js runs (or answers 429), and runs Auth.js inside the
 * attempt's async context; the Credentials `authorize` then reports how it went through
 * `currentSignInAttempt()` (Auth.js hands `authorize` a copy of the request, not the context).
 */

export const SIGN_IN_ACCOUNT = 'sign-in-account';
export const SIGN_IN_ADDRESS = 'sign-in-address';
export const SECOND_FACTOR_CODE = 'second-factor-code';

export interface SignInAttempt {
  /** The e-mail the attempt was counted against ('' when the body had none that could be read). */
  email: string;
  clientAddress: string;
  /** Password (and code, when on) right: forgive this attempt and clear the account's failures. */
  succeeded: () => Promise<void>;
  /** The password was right but the second-factor code was not: counted against the code limit. */
  wrongCode: () => Promise<void>;
}

const context = new AsyncLocalStorage<SignInAttempt>();

/**
 * The e-mail of a sign-in body, read as Auth.js reads it (`@auth/core` `getBody`): JSON when the
 * content type says JSON, URL-encoded form otherwise when it says so, where the last of repeated
 * fields wins. Normalised as the sign-in schema does, so the limit counts the account Auth.js checks.
 */
export async function readSignInEmail(request: Request): Promise<string> {
  const type = request.headers.get('content-type') ?? '';
  let raw: unknown;
  try {
    if (type.includes('application/json')) raw = ((await request.clone().json()) as Record<string, unknown>)?.email;
    else if (type.includes('application/x-www-form-urlencoded'))
      raw = Object.fromEntries(new URLSearchParams(await request.clone().text())).email;
  } catch {
    return '';
  }
  const parsed = emailSchema.safeParse(raw);
  // Not an e-mail address: Auth.js's `authorize` refuses it before any account is looked up.
  return parsed.success ? parsed.data : '';
}

/**
 * Counts a sign-in attempt against the account and the address, unless either (or the account's
 * second-factor code limit) is reached: then the seconds to wait, and nothing counted.
 */
export async function beginSignInAttempt(
  email: string,
  clientAddress: string,
): Promise<{ retryAfterSeconds: number; attempt: SignInAttempt | null }> {
  // With no readable e-mail there is no account to count against (and no sign-in can succeed); the address counts.
  const perAccount: AttemptCount[] = email
    ? [
        { kind: SIGN_IN_ACCOUNT, key: email, ...SIGN_IN_ACCOUNT_LIMIT },
        { kind: SECOND_FACTOR_CODE, key: email, ...SECOND_FACTOR_CODE_LIMIT, record: false },
      ]
    : [];
  const verdict: AttemptVerdict = await limitAttempts([
    ...perAccount,
    { kind: SIGN_IN_ADDRESS, key: clientAddress, ...SIGN_IN_ADDRESS_LIMIT },
  ]);
  if (verdict.retryAfterSeconds > 0) return { retryAfterSeconds: verdict.retryAfterSeconds, attempt: null };
  return {
    retryAfterSeconds: 0,
    attempt: {
      email,
      clientAddress,
      succeeded: async () => {
        await verdict.forgive();
        if (!email) return;
        await clearAttempts(SIGN_IN_ACCOUNT, email);
        await clearAttempts(SECOND_FACTOR_CODE, email);
      },
      wrongCode: async () => {
        const { max, windowMs } = SECOND_FACTOR_CODE_LIMIT;
        await limitAttempt(SECOND_FACTOR_CODE, email, max, windowMs);
      },
    },
  };
}

/** Runs Auth.js with the attempt available to `currentSignInAttempt()`. */
export function runSignInAttempt<T>(attempt: SignInAttempt, work: () => T): T {
  return context.run(attempt, work);
}

/** The attempt the middleware counted for this request; undefined when it did not pass the limiter. */
export function currentSignInAttempt(): SignInAttempt | undefined {
  return context.getStore();
}

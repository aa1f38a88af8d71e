import { AsyncLocalStorage } from 'node:async_hooks';
import { ACCOUNT_LIMIT, ADDRESS_LIMIT, FailureWindow } from '../rate-limit';

/**
 * Sign-in attempts, limited per account and per client address. The middleware checks before
 * Auth.js runs and answers 429; the Credentials `authorize` records the outcome, reading the client
 * address from the request's async context (Auth.js hands `authorize` a copy of the request).
 */
const byAccount = new FailureWindow(ACCOUNT_LIMIT);
const byAddress = new FailureWindow(ADDRESS_LIMIT);
const attempt = new AsyncLocalStorage<{ clientAddress: string }>();

/** Seconds until this account or address may try again (0 when neither is blocked). */
export function signInRetryAfterSeconds(email: string, clientAddress: string, now = Date.now()): number {
  const wait = Math.max(byAccount.retryAfterMs(email, now), byAddress.retryAfterMs(clientAddress, now));
  return Math.ceil(wait / 1000);
}

/** Runs the sign-in request with its client address available to `recordSignInOutcome`. */
export function runSignInAttempt<T>(clientAddress: string, work: () => T): T {
  return attempt.run({ clientAddress }, work);
}

/** Counts a failed attempt against the account and the address, or clears the account on success. */
export function recordSignInOutcome(email: string, succeeded: boolean, now = Date.now()): void {
  const clientAddress = attempt.getStore()?.clientAddress ?? 'unknown';
  if (succeeded) {
    byAccount.reset(email);
    return;
  }
  byAccount.recordFailure(email, now);
  byAddress.recordFailure(clientAddress, now);
}

/**
 * A sliding-window counter of failures per key. Pure: the caller passes the time, so tests need no
 * clock. Used per account and per client address for sign-in.
 */
export interface WindowLimit {
  /** Failures allowed inside the window before the key is blocked. */
  maxFailures: number;
  windowMs: number;
}

export class FailureWindow {
  private readonly failures = new Map<string, number[]>();

  constructor(private readonly limit: WindowLimit) {}

  /** Milliseconds until `key` may try again, or 0 when it is not blocked. */
  retryAfterMs(key: string, now: number): number {
    const recent = this.prune(key, now);
    if (recent.length < this.limit.maxFailures) return 0;
    const oldest = recent[recent.length - this.limit.maxFailures] ?? now;
    return Math.max(1, oldest + this.limit.windowMs - now);
  }

  recordFailure(key: string, now: number): void {
    const recent = this.prune(key, now);
    recent.push(now);
    this.failures.set(key, recent);
  }

  reset(key: string): void {
    this.failures.delete(key);
  }

  private prune(key: string, now: number): number[] {
    const recent = (this.failures.get(key) ?? []).filter((at) => at > now - this.limit.windowMs);
    if (recent.length === 0) this.failures.delete(key);
    else this.failures.set(key, recent);
    return recent;
  }
}

// OWASP Authentication Cheat Sheet suggests locking out after a handful of failures; these are ours.
export const ACCOUNT_LIMIT: WindowLimit = { maxFailures: 5, windowMs: 15 * 60_000 };
export const ADDRESS_LIMIT: WindowLimit = { maxFailures: 20, windowMs: 15 * 60_000 };

import { describe, expect, it } from 'vitest';
import { FailureWindow } from '../../src/lib/rate-limit';

describe('the failure window', () => {
  const limit = { maxFailures: 3, windowMs: 60_000 };

  it('blocks after the allowed failures and says how long to wait', () => {
    const window = new FailureWindow(limit);
    for (const at of [0, 1000, 2000]) window.recordFailure('k', at);
    expect(window.retryAfterMs('k', 2500)).toBe(57_500);
  });

  it('does not block before the limit is reached', () => {
    const window = new FailureWindow(limit);
    window.recordFailure('k', 0);
    window.recordFailure('k', 10);
    expect(window.retryAfterMs('k', 20)).toBe(0);
  });

  it('forgets failures older than the window', () => {
    const window = new FailureWindow(limit);
    for (const at of [0, 1000, 2000]) window.recordFailure('k', at);
    expect(window.retryAfterMs('k', 60_001)).toBe(0);
  });

  it('keeps keys apart and clears one on reset', () => {
    const window = new FailureWindow(limit);
    for (const at of [0, 1, 2]) window.recordFailure('a', at);
    expect(window.retryAfterMs('b', 3)).toBe(0);
    window.reset('a');
    expect(window.retryAfterMs('a', 3)).toBe(0);
  });
});

import { describe, expect, it } from 'vitest';
import { retryAfterMs } from '../../src/lib/rate-limit';

describe('the attempt window', () => {
  const limit = { max: 3, windowMs: 60_000 };

  it('refuses once the allowed attempts are used and says how long to wait', () => {
    expect(retryAfterMs([0, 1000, 2000], limit, 2500)).toBe(57_500);
  });

  it('allows an attempt before the limit is reached', () => {
    expect(retryAfterMs([0, 10], limit, 20)).toBe(0);
  });

  it('forgets attempts older than the window', () => {
    expect(retryAfterMs([0, 1000, 2000], limit, 60_500)).toBe(0);
  });

  it('waits for the oldest of the latest allowed attempts, whatever order they come in', () => {
    expect(retryAfterMs([5000, 0, 3000, 4000], limit, 6000)).toBe(57_000);
  });

  it('never answers a wait of 0 ms while refusing', () => {
    expect(retryAfterMs([0, 0, 0], { max: 3, windowMs: 10 }, 9.9999)).toBeGreaterThan(0);
  });
});

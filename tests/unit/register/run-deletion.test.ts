import { describe, expect, it } from 'vitest';
import { mayDeleteRun, OWN_RUN_DELETE_WINDOW_MS } from '../../../src/lib/register/run-deletion';

const now = new Date('2026-05-02T12:00:00Z');
const loggedAgo = (ms: number, by = 'tech-1') => ({ recordedBy: by, createdAt: new Date(now.getTime() - ms) });

describe('who may delete a run', () => {
  it('lets crew chiefs and owners delete any run, however old', () => {
    expect(mayDeleteRun('crew-chief', 'chief-1', loggedAgo(30 * OWN_RUN_DELETE_WINDOW_MS), now)).toBe(true);
    expect(mayDeleteRun('owner', 'owner-1', loggedAgo(1000, 'someone-else'), now)).toBe(true);
  });

  it('lets a technician delete their own run until 24 hours after logging it, and not a moment after', () => {
    expect(mayDeleteRun('technician', 'tech-1', loggedAgo(60_000), now)).toBe(true);
    expect(mayDeleteRun('technician', 'tech-1', loggedAgo(OWN_RUN_DELETE_WINDOW_MS - 1), now)).toBe(true);
    expect(mayDeleteRun('technician', 'tech-1', loggedAgo(OWN_RUN_DELETE_WINDOW_MS), now)).toBe(false);
  });

  it("refuses a technician someone else's run, and a viewer any run", () => {
    expect(mayDeleteRun('technician', 'tech-1', loggedAgo(60_000, 'tech-2'), now)).toBe(false);
    expect(mayDeleteRun('technician', 'tech-1', loggedAgo(60_000, null as unknown as string), now)).toBe(false);
    expect(mayDeleteRun('viewer', 'tech-1', loggedAgo(60_000), now)).toBe(false);
  });
});

import { eq } from 'drizzle-orm';
import { write } from '../src/db/client';
import { reviews } from '../src/db/schema';
import { openReview, addComment, decideReview } from '../src/lib/server/reviews/reviews';
import type { TeamAccess } from '../src/lib/server/guard';
import { DEMO_ACCOUNTS } from '../src/lib/server/demo';
import { DEMO_TEAM_NAME, type SeededPeople } from './people';
import type { SeededRegister } from './register';

/**
 * Demo reviews: GS-4103 was retired early after its spalling was found (a decided review), and
 * GS-4102 — past its life limit with a growing once-per-turn wave — is under review now.
 */
export async function seedReviews(
  people: SeededPeople,
  register: SeededRegister,
  baseUrl = 'http://localhost:4321',
): Promise<void> {
  const accessOf = (role: 'crew-chief' | 'technician'): TeamAccess => {
    const account = DEMO_ACCOUNTS.find((a) => a.role === role)!;
    return {
      user: {
        id: people.userIds[role],
        email: account.email,
        name: account.name,
        lengthUnit: 'in',
        torqueUnit: 'lbf-in',
        currentTeamId: people.teamId,
        secondFactor: false,
      },
      team: { id: people.teamId, name: DEMO_TEAM_NAME, role },
    };
  };
  const chief = accessOf('crew-chief');
  const tech = accessOf('technician');
  const retired = await openReview(tech, register.gearSetIds['GS-4103']!, baseUrl);
  await addComment(tech, retired.id, 'Spalling on three drive-side teeth near the heel. Photos to follow.', baseUrl);
  await decideReview(
    chief,
    retired.id,
    {
      decision: 'retire',
      reason: 'Spalling or pitting on the teeth',
      notes: 'Out at 21 runs; the set was run hot at the Copper Mesa event.',
    },
    baseUrl,
  );
  // The story happened in May: date the review to its teardown.
  await write((tx) =>
    tx
      .update(reviews)
      .set({ createdAt: new Date('2026-05-11T17:00:00Z'), decidedAt: new Date('2026-05-11T18:30:00Z') })
      .where(eq(reviews.id, retired.id)),
  );
  const open = await openReview(tech, register.gearSetIds['GS-4102']!, baseUrl);
  await addComment(
    tech,
    open.id,
    'Past its 50-run limit and the back-face runout keeps climbing. @teodor your call before the next event.',
    baseUrl,
  );
}

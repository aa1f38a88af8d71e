import { randomUUID } from 'node:crypto';
import type { Transaction } from '../src/db/client';
import { memberships, teams, users } from '../src/db/schema';
import { hashPassword } from '../src/lib/server/password';
import { DEMO_ACCOUNTS, DEMO_PASSWORD } from '../src/lib/server/demo';

/** The invented demo team — a privateer pro-stock-style crew of our own — and its four people. */
export const DEMO_TEAM_NAME = 'Cinder Flats Racing';

export interface SeededPeople {
  teamId: string;
  userIds: Record<(typeof DEMO_ACCOUNTS)[number]['role'], string>;
}

export async function seedPeople(tx: Transaction): Promise<SeededPeople> {
  const teamId = randomUUID();
  await tx.insert(teams).values({ id: teamId, name: DEMO_TEAM_NAME });
  const passwordHash = await hashPassword(DEMO_PASSWORD);
  const userIds = {} as SeededPeople['userIds'];
  for (const account of DEMO_ACCOUNTS) {
    const id = randomUUID();
    userIds[account.role] = id;
    await tx.insert(users).values({
      id,
      email: account.email,
      name: account.name,
      passwordHash,
      currentTeamId: teamId,
      // The demo's addresses are invented and counted as proved, so the demo's notices reach the catcher.
      emailVerifiedAt: new Date(),
      lengthUnit: account.role === 'viewer' ? 'mm' : 'in',
      torqueUnit: account.role === 'viewer' ? 'N-m' : 'lbf-in',
    });
    await tx.insert(memberships).values({ teamId, userId: id, role: account.role });
  }
  return { teamId, userIds };
}

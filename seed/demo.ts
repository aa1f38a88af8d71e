import { sql } from 'drizzle-orm';
import { getDb, write } from '../src/db/client';
import { teams } from '../src/db/schema';
import { seedPeople, type SeededPeople } from './people';
import { seedRegister, type SeededRegister } from './register';
import { seedInspections } from './inspections';
import { seedReviews } from './reviews';
import { seedSeason } from './season';
import { seedProcedures } from './procedures';

/**
 * The demo scenario: an invented team, its people, and (as the product grows) its cars, gear sets,
 * runs and inspections. Every name and number here is made up for the demo.
 */
export async function seedDemo(
  options: { season?: boolean } = {},
): Promise<{ seeded: boolean; reason?: string; demo?: { people: SeededPeople; register: SeededRegister } }> {
  const db = await getDb();
  const row = await db.get<{ n: number }>(sql`SELECT count(*) AS n FROM ${teams}`);
  if (Number(row?.n ?? 0) > 0) return { seeded: false, reason: 'the database already holds a team' };
  const { people, register } = await write(async (tx) => {
    const people = await seedPeople(tx);
    return { people, register: await seedRegister(tx, people) };
  });
  // Inspections read the committed run log to know how many runs each set had at its teardown.
  await seedInspections(people, register);
  await seedReviews(people, register);
  await seedProcedures(people, register);
  // A season more of the same team (seed/season.ts), for measuring the screens as data grows.
  if (options.season) await seedSeason(people, register);
  return { seeded: true, demo: { people, register } };
}

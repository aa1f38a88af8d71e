import { closeDatabase, openDatabase } from '../src/db/client';
import { applyMigrations, countAppliedMigrations } from '../src/db/migrate';
import { readEnvironment } from '../src/environment';
import { resolveAuthSecret } from '../src/lib/server/auth-secret';
import { seedDemo } from '../seed/demo';

/**
 * Before `npm start` and `npm run dev`: validates the environment, applies migrations, makes the
 * session secret if none is set, and loads the demo when the database holds no team.
 */
const env = readEnvironment();
const { db } = await openDatabase();
await applyMigrations(db);
resolveAuthSecret();
console.log(`Database ready: ${await countAppliedMigrations(db)} migrations applied.`);
if (env.LASHLINE_DEMO === 'on') {
  const result = await seedDemo();
  console.log(result.seeded ? 'Demo scenario loaded (LASHLINE_DEMO=on).' : `Demo not loaded: ${result.reason}.`);
}
closeDatabase();

import { closeDatabase, openDatabase } from '../src/db/client';
import { applyMigrations } from '../src/db/migrate';
import { seedDemo } from '../seed/demo';

/**
 * `npm run db:seed`: loads the demo scenario into a database that holds no team yet.
 * `npm run db:seed -- --season` adds a season more of data (seed/season.ts), for the benchmarks.
 */
const { db } = await openDatabase();
await applyMigrations(db);
const result = await seedDemo({ season: process.argv.includes('--season') });
console.log(result.seeded ? 'Demo scenario loaded.' : `Demo scenario not loaded: ${result.reason}.`);
closeDatabase();

import { closeDatabase, openDatabase } from '../src/db/client';
import { applyMigrations, countAppliedMigrations } from '../src/db/migrate';

/** `npm run db:migrate`: applies the migrations in drizzle/ to DATABASE_URL. */
const { db, url } = await openDatabase();
await applyMigrations(db);
console.log(`Migrations applied to ${url.replace(/\?.*$/, '')}: ${await countAppliedMigrations(db)} in all.`);
closeDatabase();

import { closeDatabase, openDatabase } from '../src/db/client';
import { applyMigrations } from '../src/db/migrate';
import { seedDemo } from '../seed/demo';

/** `npm run db:seed`: loads the demo scenario into a database that holds no team yet. */
const { db } = await openDatabase();
await applyMigrations(db);
const result = await seedDemo();
console.log(result.seeded ? 'Demo scenario loaded.' : `Demo scenario not loaded: ${result.reason}.`);
closeDatabase();

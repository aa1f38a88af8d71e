import { defineConfig } from 'drizzle-kit';

// Generating migrations needs no database; `npm run db:migrate` applies them through src/db/migrate.ts.
export default defineConfig({
  dialect: 'sqlite',
  schema: './src/db/schema.ts',
  out: './drizzle',
});

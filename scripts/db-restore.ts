import { restoreDatabase } from '../src/lib/server/backup';

/** `npm run db:restore FOLDER [--force]`: brings a backup back into DATABASE_URL and DATA_DIR. */
const args = process.argv.slice(2);
const from = args.find((a) => !a.startsWith('--'));
if (!from) {
  console.error('Name the backup: npm run db:restore data/backups/lashline-… [--force]');
  process.exit(2);
}
try {
  const result = await restoreDatabase(from, args.includes('--force'));
  console.log(
    `Restored ${result.databaseFile} from ${result.folder}: ${Object.values(result.tables).reduce((a, b) => a + b, 0)} rows, ${result.photos} photo files.`,
  );
} catch (error) {
  console.error(`Not restored: ${(error as Error).message}`);
  process.exit(1);
}

import { backupDatabase } from '../src/lib/server/backup';

/** `npm run db:backup [folder]`: a consistent copy of the live database and its photos. */
const result = await backupDatabase(process.argv[2]);
console.log(
  `Backup written to ${result.folder}: ${Object.values(result.tables).reduce((a, b) => a + b, 0)} rows in ${Object.keys(result.tables).length} tables, ${result.photos} photo files.`,
);

import { openDatabase } from '../../db/client';
import { applyMigrations } from '../../db/migrate';
import { readEnvironment } from '../../environment';
import { startMailCatcher } from './mail-catcher';
import { startOutboxWorker } from './outbox';

let ready: Promise<void> | undefined;

/**
 * Everything the server needs before its first answer, once per process: a valid environment,
 * the database migrated, the local mail catcher (when no SMTP server is set) and the outbox worker.
 */
export function ensureStarted(): Promise<void> {
  ready ??= (async () => {
    readEnvironment();
    const { db } = await openDatabase();
    await applyMigrations(db);
    await startMailCatcher();
    startOutboxWorker();
  })();
  ready.catch(() => {
    ready = undefined;
  });
  return ready;
}

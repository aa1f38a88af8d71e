import { offlineShellWorker } from '../../lib/server/offline-shell-worker';

/** The checklist runner's service worker, scoped to /checklists/ by its address. */
export const GET = (): Response =>
  offlineShellWorker({
    name: 'checklist',
    pages: /^\/checklists\/[^/]+$/,
    missing: 'Offline, and this checklist has not been opened on this device before.',
  });

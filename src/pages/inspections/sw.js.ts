import { offlineShellWorker } from '../../lib/server/offline-shell-worker';

/** The inspection sheet's service worker, scoped to /inspections/ by its address. */
export const GET = (): Response =>
  offlineShellWorker({
    name: 'sheet',
    pages: /^\/inspections\/(new|[^/]+\/edit)$/,
    missing: 'Offline, and this sheet has not been opened on this device before.',
  });

/**
 * Lets the sheet open again without a connection: a small service worker (/inspections/sw.js) answers
 * /inspections/new and /inspections/:id/edit from a cache when the network fails, and this puts the
 * page and the files it loaded into that cache. The page is the same for every ?gearSetId and
 * ?draft (the island reads both from the address), so one copy per path serves them all.
 * Needs a secure context (https, or localhost); elsewhere the sheet still keeps its browser copy.
 */
export const SHELL_CACHE = 'lashline-sheet-v1';

/** Registers the worker and caches this page; resolves true when the sheet can open offline. */
export async function prepareOfflineShell(): Promise<boolean> {
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator) || typeof caches === 'undefined')
    return false;
  try {
    await navigator.serviceWorker.register('/inspections/sw.js', { scope: '/inspections/' });
    const cache = await caches.open(SHELL_CACHE);
    const assets = performance
      .getEntriesByType('resource')
      .map((entry) => new URL(entry.name))
      .filter((u) => u.origin === location.origin && u.pathname.startsWith('/_astro/'))
      .map((u) => u.pathname);
    const page = location.pathname;
    await cache.addAll([page, ...new Set(assets)]);
    // Files of an earlier build are never asked for again.
    const keep = new Set([page, ...assets]);
    for (const request of await cache.keys()) {
      const path = new URL(request.url).pathname;
      if (path.startsWith('/_astro/') && !keep.has(path)) await cache.delete(request);
    }
    return true;
  } catch (error) {
    console.warn('Lashline: the sheet cannot be kept for offline use on this device.', error);
    return false;
  }
}

/**
 * Lets a checklist open again without a connection, as the inspection sheet does: a small service
 * worker (/checklists/sw.js, scope /checklists/) answers the checklist's page from a cache when the
 * network fails, and this puts the page and the files it loaded into that cache. Needs a secure
 * context (https, or localhost); elsewhere the checklist still keeps its copy on the device.
 */
export const CHECKLIST_CACHE = 'lashline-checklist-v1';

/** Registers the worker and caches this page; resolves true when the checklist can open offline. */
export async function prepareChecklistShell(): Promise<boolean> {
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator) || typeof caches === 'undefined')
    return false;
  try {
    await navigator.serviceWorker.register('/checklists/sw.js', { scope: '/checklists/' });
    const cache = await caches.open(CHECKLIST_CACHE);
    const assets = performance
      .getEntriesByType('resource')
      .map((entry) => new URL(entry.name))
      .filter((u) => u.origin === location.origin && u.pathname.startsWith('/_astro/'))
      .map((u) => u.pathname);
    await cache.addAll([location.pathname, ...new Set(assets)]);
    return true;
  } catch (error) {
    console.warn('Lashline: the checklist cannot be kept for offline use on this device.', error);
    return false;
  }
}

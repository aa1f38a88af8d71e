// Lashline's offline shell for the checklist runner, served as /checklists/sw.js (so its scope is
// /checklists/) by src/pages/checklists/sw.js.ts; the same rules as the inspection sheet's worker.
// Network first for a checklist's page, the cached copy when the network fails; the build's hashed
// files from the cache. API calls always go to the network, so nothing stale is shown as saved.
const SHELL_CACHE = 'lashline-checklist-v1';
const CHECKLIST_PAGE = /^\/checklists\/[^/]+$/;

self.addEventListener('install', () => self.skipWaiting());

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      for (const name of await caches.keys())
        if (name.startsWith('lashline-checklist-') && name !== SHELL_CACHE) await caches.delete(name);
      await self.clients.claim();
    })(),
  );
});

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;

  if (request.mode === 'navigate' && CHECKLIST_PAGE.test(url.pathname)) {
    event.respondWith(
      (async () => {
        try {
          const response = await fetch(request);
          // Sent to sign-in: whoever was signed in here is not any more, so their copy of the page goes.
          if (response.type === 'opaqueredirect') await caches.delete(SHELL_CACHE);
          if (response.ok && response.type === 'basic' && !response.redirected) {
            const cache = await caches.open(SHELL_CACHE);
            await cache.put(url.pathname, response.clone());
          }
          return response;
        } catch {
          const cached = await caches.match(url.pathname);
          return (
            cached ??
            new Response('Offline, and this checklist has not been opened on this device before.', {
              status: 503,
              headers: { 'Content-Type': 'text/plain; charset=utf-8' },
            })
          );
        }
      })(),
    );
    return;
  }

  if (url.pathname.startsWith('/_astro/')) {
    event.respondWith(
      (async () => {
        const cached = await caches.match(url.pathname);
        if (cached) return cached;
        const response = await fetch(request);
        if (response.ok) {
          const cache = await caches.open(SHELL_CACHE);
          await cache.put(url.pathname, response.clone());
        }
        return response;
      })(),
    );
  }
});

// Lashline's offline shell for a page that must open without a connection (the inspection sheet, the
// checklist runner), served by src/lib/server/offline-shell-worker.ts with its `SHELL` settings written
// before this text, from an address whose folder is the worker's scope. Network first for the shell's
// pages, the cached copy when the network fails; the build's hashed files from the cache. Nothing else is
// touched: API calls always go to the network, so nothing stale is ever saved or shown as saved.
/* global SHELL */

self.addEventListener('install', () => self.skipWaiting());

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      for (const name of await caches.keys())
        if (name.startsWith(SHELL.prefix) && name !== SHELL.cache) await caches.delete(name);
      await self.clients.claim();
    })(),
  );
});

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin) return;

  if (request.mode === 'navigate' && SHELL.pages.test(url.pathname)) {
    event.respondWith(
      (async () => {
        try {
          const response = await fetch(request);
          // Sent to sign-in: whoever was signed in here is not any more, so their copy of the page goes.
          if (response.type === 'opaqueredirect') await caches.delete(SHELL.cache);
          if (response.ok && response.type === 'basic' && !response.redirected) {
            const cache = await caches.open(SHELL.cache);
            await cache.put(url.pathname, response.clone());
          }
          return response;
        } catch {
          const cached = await caches.match(url.pathname);
          return (
            cached ??
            new Response(SHELL.missing, {
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
          const cache = await caches.open(SHELL.cache);
          await cache.put(url.pathname, response.clone());
        }
        return response;
      })(),
    );
  }
});

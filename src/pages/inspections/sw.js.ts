import source from '../../components/inspections/sheet-worker.js?raw';

/**
 * The inspection sheet's service worker. Served from here rather than public/ so that it carries a
 * policy letting it fetch from Lashline itself (the static files get `default-src 'none'`, which
 * would stop the worker's every fetch), and so that its scope is /inspections/ by its own address.
 */
export const GET = (): Response =>
  new Response(source, {
    headers: {
      'Content-Type': 'text/javascript; charset=utf-8',
      'Content-Security-Policy': "default-src 'self'; frame-ancestors 'none'",
      'Cache-Control': 'no-cache',
    },
  });

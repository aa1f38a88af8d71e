import source from '../../components/procedures/checklist-worker.js?raw';

/** The checklist runner's service worker, scoped to /checklists/ by its address (see inspections/sw.js.ts). */
export const GET = (): Response =>
  new Response(source, {
    headers: {
      'Content-Type': 'text/javascript; charset=utf-8',
      'Content-Security-Policy': "default-src 'self'; frame-ancestors 'none'",
      'Cache-Control': 'no-cache',
    },
  });

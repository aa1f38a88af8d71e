import { createServer } from 'node:http';
import { join, resolve } from 'node:path';
import { pathToFileURL } from 'node:url';
import { API_CSP, BASE_SECURITY_HEADERS } from '../src/lib/security-headers';

/**
 * Serves the built app with the security headers on every response, including the ones Astro
 * answers before any middleware runs (its origin check's 403, static files). Pages still carry
 * their own Content-Security-Policy, which replaces the strict default set here.
 *
 *   HOST=localhost PORT=4321 npx tsx scripts/serve.ts     (LASHLINE_DIST picks another build folder)
 */
process.env.ASTRO_NODE_AUTOSTART = 'disabled';
const entry = join(resolve(process.env.LASHLINE_DIST ?? 'dist'), 'server', 'entry.mjs');
const { handler } = (await import(pathToFileURL(entry).href)) as { handler: (req: unknown, res: unknown) => void };

const host = process.env.HOST ?? 'localhost';
const port = Number(process.env.PORT ?? 4321);

const server = createServer((req, res) => {
  for (const [name, value] of Object.entries(BASE_SECURITY_HEADERS)) res.setHeader(name, value);
  res.setHeader('Content-Security-Policy', API_CSP);
  handler(req, res);
});
server.keepAliveTimeout = 65_000;
server.listen(port, host, () => console.log(`Lashline is serving on http://${host}:${port}`));

const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);

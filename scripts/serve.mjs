import { readdirSync } from 'node:fs';
import { createServer } from 'node:http';
import { join, relative, resolve, sep } from 'node:path';
import { pathToFileURL } from 'node:url';
import send from 'send';
import { clientAddressOf, parseTrustProxy } from '../src/lib/client-address.mjs';
import { API_CSP, BASE_SECURITY_HEADERS } from '../src/lib/security-headers.mjs';
import { capRequestBody } from './body-cap.mjs';

/**
 * Serves the built app (the Node adapter in middleware mode) with the security headers on every
 * response, including those Astro answers before any middleware runs (its origin check's 403) and
 * the static files. Pages keep their own Content-Security-Policy, which replaces the strict default.
 * Static files are listed once at start, so an API request never waits on the disk to learn it is
 * not a file. Every request body is capped at its route's row of src/lib/body-limits.mjs while it streams
 * (scripts/body-cap.mjs). Plain JavaScript: nothing compiles on the request path.
 *
 *   HOST=localhost PORT=4321 node scripts/serve.mjs        (LASHLINE_DIST picks another build folder)
 */
const dist = resolve(process.env.LASHLINE_DIST ?? 'dist');
const clientDir = join(dist, 'client');
const { handler } = await import(pathToFileURL(join(dist, 'server', 'entry.mjs')).href);

/** Every file of the built client, as the URL path that serves it. */
function listFiles(dir) {
  return readdirSync(dir, { withFileTypes: true, recursive: true })
    .filter((entry) => entry.isFile())
    .map(
      (entry) =>
        `/${relative(clientDir, join(entry.parentPath ?? entry.path, entry.name))
          .split(sep)
          .join('/')}`,
    );
}
const staticFiles = new Set(listFiles(clientDir));

const host = process.env.HOST ?? 'localhost';
// Astro's Node adapter takes the client address from X-Forwarded-For unchecked; the header it reads is
// rewritten below to the address this server can vouch for (TRUST_PROXY proxies in front, default none).
const trustedProxies = parseTrustProxy(process.env.TRUST_PROXY);
const port = Number(process.env.PORT ?? 4321);

const server = createServer((req, res) => {
  for (const [name, value] of Object.entries(BASE_SECURITY_HEADERS)) res.setHeader(name, value);
  res.setHeader('Content-Security-Policy', API_CSP);
  const path = (req.url ?? '/').split('?')[0];
  if ((req.method === 'GET' || req.method === 'HEAD') && staticFiles.has(path)) {
    // Hashed build assets never change under their name.
    const hashed = path.startsWith('/_astro/');
    send(req, path, { root: clientDir, dotfiles: 'deny', immutable: hashed, maxAge: hashed ? '1y' : 0 }).pipe(res);
    return;
  }
  req.headers['x-forwarded-for'] = clientAddressOf(
    req.headers['x-forwarded-for'],
    req.socket.remoteAddress,
    trustedProxies,
  );
  // Every body is capped here, while it streams, before the app reads it (src/lib/body-limits.mjs).
  if (!capRequestBody(req, res)) return;
  handler(req, res, () => {
    res.statusCode = 404;
    res.setHeader('Content-Type', 'text/plain; charset=utf-8');
    res.end('Not found');
  });
});
server.keepAliveTimeout = 65_000;
server.listen(port, host, () => console.log(`Lashline is serving on http://${host}:${port}`));

const stop = () => server.close(() => process.exit(0));
process.on('SIGTERM', stop);
process.on('SIGINT', stop);

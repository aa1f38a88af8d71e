import { findBodyCap, tooLargeBody } from '../src/lib/body-limits.mjs';

/**
 * Caps a request's body while it streams, at its route's row of src/lib/body-limits.mjs, before the app
 * (Astro, Auth.js, a page's form) reads any of it: a declared length over the cap is answered 413 at once;
 * otherwise the app reads the body through a counting iterator (the Node adapter takes `req.body` when it
 * is one), which answers 413 and closes the connection the moment the count passes the cap. A body the app
 * never reads is counted as Node drains it after the answer, and its connection cut at the cap.
 *
 * Returns false when the request has been answered here.
 * @param {import('node:http').IncomingMessage & { body?: unknown }} req
 * @param {import('node:http').ServerResponse} res
 * @returns {boolean}
 */
export function capRequestBody(req, res) {
  const path = (req.url ?? '/').split('?')[0] ?? '/';
  const cap = findBodyCap(path).bytes;
  const declared = Number(req.headers['content-length'] ?? '0');
  if (declared > cap) {
    refuse(req, res, path);
    return false;
  }
  if (!req.headers['transfer-encoding'] && !(declared > 0)) return true;

  let received = 0;
  let refused = false;
  req.body = (async function* countedBody() {
    // Leaving the loop early (a reader that stops) must not destroy the socket the answer goes out on.
    for await (const chunk of req.iterator({ destroyOnReturn: false })) {
      received += chunk.length;
      if (received > cap) {
        refused = true;
        refuse(req, res, path);
        throw Object.assign(new Error(`request body over its ${cap}-byte cap`), { name: 'BodyTooLargeError' });
      }
      yield chunk;
    }
  })();
  res.once('finish', () => {
    if (refused || req.complete) return;
    req.on('data', (chunk) => {
      received += chunk.length;
      if (received > cap) req.socket.destroy();
    });
  });
  return true;
}

/**
 * Answers 413 with the route's words and `Connection: close` (Node closes the socket once the answer is
 * out, so the rest of the body is never read), then makes the response deaf to the app, which may still be
 * unwinding the body read that failed.
 * @param {import('node:http').IncomingMessage} req
 * @param {import('node:http').ServerResponse} res
 * @param {string} path
 */
function refuse(req, res, path) {
  if (res.headersSent) {
    req.socket.destroy();
    return;
  }
  const body = JSON.stringify(tooLargeBody(path));
  res.writeHead(413, {
    'Content-Type': 'application/json; charset=utf-8',
    'Content-Length': Buffer.byteLength(body),
    'Cache-Control': 'no-store',
    Connection: 'close',
  });
  res.end(body);
  req.pause();
  res.writeHead = () => res;
  res.setHeader = () => res;
  res.write = () => true;
  res.end = () => res;
}

import { findBodyCap, tooLargeBody } from '../src/lib/body-limits.mjs';

/**
 * A body declared over its cap but under this is received and thrown away before the 413, so that a
 * client that cannot read an answer while it is still sending (a browser form, fetch) reads the refusal;
 * a larger one is refused at once and its connection closed.
 */
const MAX_DRAINED_BYTES = 128 * 1024 * 1024;

/**
 * Caps a request's body while it streams, at its route's row of src/lib/body-limits.mjs, before the app
 * (Astro, Auth.js, a page's form) reads any of it: a declared length over the cap is answered 413 without
 * the app (once the body has arrived and been thrown away, up to 128 MB, or at once past that); otherwise the app reads the body through a counting iterator (the Node adapter takes `req.body` when it
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
    if (declared > MAX_DRAINED_BYTES) refuse(req, res, path, true);
    else {
      // Browsers and fetch read no answer before they have sent the body: let it arrive, unread.
      req.on('end', () => refuse(req, res, path, false));
      req.resume();
    }
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
        refuse(req, res, path, true);
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
 * Answers 413 with the route's words, then makes the response deaf to the app, which may still be
 * unwinding the body read that failed. With `close`, the answer says `Connection: close` and the rest of
 * the body is thrown away unread until the client stops (at most 2 s or 16 MB more): closing the socket
 * at once, with the client's bytes still arriving, would reset the connection and could lose the answer
 * before the client reads it.
 * @param {import('node:http').IncomingMessage} req
 * @param {import('node:http').ServerResponse} res
 * @param {string} path
 * @param {boolean} close
 */
function refuse(req, res, path, close) {
  if (res.headersSent) {
    req.socket.destroy();
    return;
  }
  if (close) lingerThenClose(req);
  const body = JSON.stringify(tooLargeBody(path));
  res.writeHead(413, {
    'Content-Type': 'application/json; charset=utf-8',
    'Content-Length': Buffer.byteLength(body),
    'Cache-Control': 'no-store',
    ...(close ? { Connection: 'close' } : {}),
  });
  res.end(body);
  res.writeHead = () => res;
  res.setHeader = () => res;
  res.write = () => true;
  res.end = () => res;
}

const LINGER_MS = 2000;
const LINGER_BYTES = 16 * 1024 * 1024;

/**
 * Node ends a `Connection: close` answer with `socket.destroySoon()`; this socket's version half-closes
 * instead and keeps discarding what still comes, then closes when the client does, or at the bounds.
 * @param {import('node:http').IncomingMessage} req
 */
function lingerThenClose(req) {
  const socket = req.socket;
  let more = 0;
  socket.destroySoon = () => {
    socket.end();
    const timer = setTimeout(() => socket.destroy(), LINGER_MS);
    socket.once('close', () => clearTimeout(timer));
    socket.once('end', () => socket.destroy());
  };
  req.on('data', (chunk) => {
    more += chunk.length;
    if (more > LINGER_BYTES) socket.destroy();
  });
  req.resume();
}

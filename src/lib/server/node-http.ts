import type { IncomingMessage, ServerResponse } from 'node:http';
import { errorToBody, HttpError, JSON_HEADERS, tooLarge } from './http';

/**
 * The few pieces of `http.ts` that the fast lane needs on Node's own request and response objects,
 * without converting them to web Requests and Responses (which costs more than the work itself on
 * the calculation routes).
 */

/**
 * Reads a request body as text, refusing past `maxBytes`: 413 before reading when the declared length
 * is over, and while streaming otherwise — then with `Connection: close`, since the rest stays unread.
 */
export function readNodeBodyText(request: IncomingMessage, maxBytes: number): Promise<string> {
  if (Number(request.headers['content-length'] ?? '0') > maxBytes) return Promise.reject(tooLarge(maxBytes));
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = [];
    let size = 0;
    const onData = (chunk: Buffer) => {
      size += chunk.length;
      if (size <= maxBytes) {
        chunks.push(chunk);
        return;
      }
      request.off('data', onData);
      request.pause();
      reject(tooLarge(maxBytes, { Connection: 'close' }));
    };
    let ended = false;
    request.on('data', onData);
    request.once('end', () => {
      ended = true;
      resolve(Buffer.concat(chunks).toString('utf8'));
    });
    request.once('error', reject);
    // A client that goes away mid-body: no 'end' comes, and nobody will read the answer. ('close' follows
    // every request; the error is made only when it matters, since making one costs a stack trace.)
    request.once('close', () => {
      if (!ended) reject(new HttpError(400, 'The request body was cut off; send it again.'));
    });
  });
}

/** Sends `body` as JSON with the exact status; the security headers were set before (scripts/serve.mjs). */
export function sendJson(
  response: ServerResponse,
  status: number,
  body: unknown,
  headers: Record<string, string> = {},
): void {
  const text = JSON.stringify(body);
  response.writeHead(status, { ...JSON_HEADERS, 'Content-Length': String(Buffer.byteLength(text)), ...headers });
  response.end(text);
}

/** Sends the `{ error: { message, fields? } }` answer for an HttpError. */
export function sendError(response: ServerResponse, error: HttpError, headers: Record<string, string> = {}): void {
  sendJson(response, error.status, errorToBody(error), { ...headers, ...error.headers });
}

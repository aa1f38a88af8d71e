import type { IncomingMessage, ServerResponse } from 'node:http';
import { parse as parseCookieHeader } from 'cookie';
import { CALCULATIONS, readCalculationQuery, type Calculation } from './lib/server/calculations';
import { requireMember } from './lib/server/guard';
import { HttpError, isJsonContentType, logIfDenied, logServerFailure, parseJsonWith } from './lib/server/http';
import { readNodeBodyText, sendError, sendJson } from './lib/server/node-http';
import { loadSession, type SessionLocals } from './lib/server/session';
import { ensureStarted } from './lib/server/startup';

/**
 * The fast lane: the calculation routes (`lib/server/calculations.ts`), answered on Node's own request
 * and response without Astro's pipeline. The inspection sheet asks for them as a technician types, and
 * through Astro each answer cost about 1 ms of CPU against 0.06 ms for the work itself
 * (docs/decisions/007-calculations-beside-astro.md).
 *
 * Built by Astro as a second server entry (astro.config.mjs), so it shares every module instance with
 * the pages — the database connections, the write counter, the session caches. `scripts/serve.mjs` offers
 * it each request first. It answers only what it can answer exactly as the Astro endpoint would, after the
 * same steps in the same order (start-up, session, member check, body limit, JSON, schema); anything
 * unusual — another method or path, a body that is not JSON, an Origin that is not the request's own
 * host, a request through a proxy — it leaves to Astro, whose own checks then answer.
 */

// Marks each answer (browsers show it beside the request's timings), so a person or a test can tell
// which path answered.
const MARK = { 'Server-Timing': 'fast-lane' };

const ROUTES = new Map<string, Calculation>(
  Object.values(CALCULATIONS).map((calculation) => [`${calculation.method} ${calculation.path}`, calculation]),
);

/** Whether Astro should judge this request's Origin instead: present, and not this host's own. */
function needsOriginCheck(request: IncomingMessage): boolean {
  const origin = request.headers.origin;
  if (origin === undefined) return false;
  if (request.headers['x-forwarded-host'] || request.headers['x-forwarded-proto']) return true;
  return origin !== `http://${request.headers.host}`;
}

/**
 * Answers `request` if it is a calculation the fast lane can take, and says whether it did; on false,
 * nothing was read or written, and the request goes on to Astro.
 */
export function answerInFastLane(request: IncomingMessage, response: ServerResponse): boolean {
  const url = request.url ?? '/';
  const queryAt = url.indexOf('?');
  const path = queryAt === -1 ? url : url.slice(0, queryAt);
  const calculation = ROUTES.get(`${request.method} ${path}`);
  if (!calculation || needsOriginCheck(request)) return false;
  if (calculation.method === 'POST' && !isJsonContentType(request.headers['content-type'])) return false;
  void answer(calculation, request, response, queryAt === -1 ? '' : url.slice(queryAt + 1), path);
  return true;
}

async function answer(
  calculation: Calculation,
  request: IncomingMessage,
  response: ServerResponse,
  query: string,
  path: string,
): Promise<void> {
  let locals: SessionLocals = { user: null, team: null };
  try {
    await ensureStarted();
    const cookies = request.headers.cookie ? parseCookieHeader(request.headers.cookie) : {};
    locals = await loadSession((name) => cookies[name]);
    requireMember(locals);
    const input =
      calculation.method === 'POST'
        ? parseJsonWith(calculation.schema, await readNodeBodyText(request, calculation.maxBodyBytes))
        : readCalculationQuery(calculation, new URLSearchParams(query));
    sendJson(response, 200, calculation.answer(input), MARK);
  } catch (error) {
    if (error instanceof HttpError) {
      logIfDenied(error, { method: calculation.method, path }, locals);
      sendError(response, error, MARK);
    } else {
      sendError(response, logServerFailure(calculation.method, path, error), MARK);
    }
  }
}

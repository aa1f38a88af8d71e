import { defineMiddleware, sequence } from 'astro:middleware';
import { bodyLimitFor } from './lib/server/body-limits';
import { errorResponse, HttpError, tooLargeFor } from './lib/server/http';
import { applySecurityHeaders } from './lib/security-headers.mjs';
import { PageExit } from './lib/server/guard';
import { loadSession } from './lib/server/session';
import { ensureStarted } from './lib/server/startup';
import { beginSignInAttempt, readSignInEmail, runSignInAttempt } from './lib/server/sign-in-limiter';
import { tooManyAttempts } from './lib/server/attempt-limits';
import { logSecurityEvent } from './lib/server/security-log';

const REFUSAL_PAGE = '/not-allowed';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** Security headers on every answer, errors included. */
const securityHeaders = defineMiddleware(async (_context, next) => {
  const response = await next();
  try {
    applySecurityHeaders(response.headers);
    return response;
  } catch {
    // Response.redirect() and fetched responses have immutable headers: answer with a copy.
    const copy = new Response(response.body, {
      status: response.status,
      statusText: response.statusText,
      headers: new Headers(response.headers),
    });
    applySecurityHeaders(copy.headers);
    return copy;
  }
});

/** Migrations, the mail catcher and the outbox worker, before the first answer. */
const startup = defineMiddleware(async (_context, next) => {
  await ensureStarted();
  return next();
});

/**
 * JSON endpoints that change state refuse a foreign Origin (Astro's own check covers form posts),
 * and refuse a body declared larger than its route's limit (the table in lib/server/body-limits.ts)
 * before reading it.
 */
const apiGate = defineMiddleware(async ({ request, url }, next) => {
  if (!url.pathname.startsWith('/api/') || SAFE_METHODS.has(request.method)) return next();
  const origin = request.headers.get('origin');
  if (origin && origin !== url.origin) {
    logSecurityEvent('denied-foreign-origin', { path: url.pathname, origin });
    return errorResponse(new HttpError(403, `Requests from ${origin} are not accepted; use Lashline's own pages.`));
  }
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > bodyLimitFor(url.pathname)) return errorResponse(tooLargeFor(url.pathname));
  return next();
});

/** Any Auth.js callback path, however it is spelled (Auth.js takes a trailing slash, and case in the host only). */
function isSignInCallback(pathname: string): boolean {
  let path = pathname;
  try {
    path = decodeURIComponent(pathname);
  } catch {
    // A malformed escape: Auth.js will not route it either; check it as it is.
  }
  return /^\/+api\/+auth\/+callback(\/|$)/i.test(path);
}

/**
 * Sign-in attempts are limited per account and per client address, counted in the database before
 * Auth.js checks the credentials: a refusal is a 429 with Retry-After (thrown inside Auth.js's
 * `authorize`, it would become a redirect). The e-mail is read from the body whatever its type.
 */
const signInLimit = defineMiddleware(async (context, next) => {
  if (context.request.method !== 'POST' || !isSignInCallback(context.url.pathname)) return next();
  const email = await readSignInEmail(context.request);
  const { clientAddress } = context;
  const { retryAfterSeconds, attempt } = await beginSignInAttempt(email, clientAddress);
  if (!attempt) {
    logSecurityEvent('sign-in-limited', { email, clientAddress, retryAfterSeconds });
    return errorResponse(tooManyAttempts(retryAfterSeconds, 'failed sign-ins'));
  }
  return runSignInAttempt(attempt, next);
});

/**
 * A page guard (`requirePageAccess`) ends the response by throwing: a redirect, or the refusal page
 * (status 403) rendered in the place of the page, at the page's own address.
 */
const pageExits = defineMiddleware(async (context, next) => {
  try {
    return await next();
  } catch (error) {
    if (!(error instanceof PageExit)) throw error;
    if ('redirect' in error.exit) return context.redirect(error.exit.redirect);
    context.locals.refusal = error.exit.message;
    return context.rewrite(REFUSAL_PAGE);
  }
});

/** The person and their role in the current team, through `loadSession` (its cache rules are there). */
const session = defineMiddleware(async ({ cookies, locals }, next) => {
  Object.assign(locals, await loadSession((name) => cookies.get(name)?.value));
  return next();
});

export const onRequest = sequence(securityHeaders, startup, apiGate, signInLimit, session, pageExits);

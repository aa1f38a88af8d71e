import type { APIContext } from 'astro';
import type { z } from 'zod';
import { zodIssuesToFields, zodIssuesToMessage } from '../validation';
import { bodyLimitFor, findBodyLimit } from './body-limits';
import { logSecurityEvent } from './security-log';

/** An error that already knows its HTTP status and the message the client should read. */
export class HttpError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly fields?: Record<string, string>,
    readonly headers?: Record<string, string>,
  ) {
    super(message);
  }
}

/** The headers of every JSON answer. */
export const JSON_HEADERS: Readonly<Record<string, string>> = {
  'Content-Type': 'application/json; charset=utf-8',
  'Cache-Control': 'no-store',
};

/** A JSON response with the exact status. */
export function json(body: unknown, status = 200, headers: Record<string, string> = {}): Response {
  return new Response(JSON.stringify(body), { status, headers: { ...JSON_HEADERS, ...headers } });
}

/** The `{ error: { message, fields? } }` body every failing endpoint answers with. */
export function errorToBody(error: HttpError): { error: { message: string; fields?: Record<string, string> } } {
  return { error: { message: error.message, ...(error.fields ? { fields: error.fields } : {}) } };
}

/** The JSON answer for an HttpError, with its status and headers. */
export function errorResponse(error: HttpError): Response {
  return json(errorToBody(error), error.status, error.headers);
}

/**
 * Reads the request body, refusing past `maxBytes` with the error `tooBig` makes: before reading when
 * the declared length is over, and while streaming otherwise. A body cut off part-way leaves the rest
 * unread and the connection unusable (the next request on it hangs, then resets), so that answer tells
 * the client not to reuse it.
 */
export async function readBodyBytes(
  request: Request,
  maxBytes: number,
  tooBig: (headers?: Record<string, string>) => HttpError = (headers) => tooLarge(maxBytes, headers),
): Promise<Buffer> {
  const declared = Number(request.headers.get('content-length') ?? '0');
  if (declared > maxBytes) throw tooBig();
  if (!request.body) return Buffer.alloc(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let size = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    size += value.byteLength;
    if (size > maxBytes) {
      await reader.cancel();
      throw tooBig({ Connection: 'close' });
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}

/** Reads the request body as text, refusing more than `maxBytes` with 413 before reading it all. */
export async function readBodyText(request: Request, maxBytes: number): Promise<string> {
  return (await readBodyBytes(request, maxBytes)).toString('utf8');
}

/** The 413 for a body sent to `pathname` past its cap, in the route's own words where it has them. */
export function tooLargeFor(pathname: string, headers?: Record<string, string>): HttpError {
  const limit = findBodyLimit(pathname);
  return limit.refusal
    ? new HttpError(413, limit.refusal.message, limit.refusal.fields, headers)
    : tooLarge(limit.bytes, headers);
}

/** The 413 for a body past `maxBytes`, with the limit in words. */
export function tooLarge(maxBytes: number, headers?: Record<string, string>): HttpError {
  const size = maxBytes >= 1024 * 1024 ? `${maxBytes / (1024 * 1024)} MB` : `${maxBytes / 1024} KB`;
  return new HttpError(413, `The request body is larger than ${size}; send less.`, undefined, headers);
}

/**
 * Reads a JSON body and validates it with `schema`: 415 for another content type, 400 for
 * malformed JSON, 400 naming each bad field, 413 past `maxBytes`.
 */
export async function readJson<S extends z.ZodType>(
  request: Request,
  schema: S,
  maxBytes = bodyLimitFor(new URL(request.url).pathname),
): Promise<z.infer<S>> {
  if (!isJsonContentType(request.headers.get('content-type'))) {
    throw new HttpError(415, 'Send the body as JSON with Content-Type: application/json.');
  }
  return parseJsonWith(schema, await readBodyText(request, maxBytes));
}

/** Whether a Content-Type header names JSON, the only body type `readJson` accepts. */
export function isJsonContentType(type: string | null | undefined): boolean {
  return (type ?? '').toLowerCase().startsWith('application/json');
}

/** Parses JSON text and validates it with `schema`: 400 for malformed JSON, 400 naming each bad field. */
export function parseJsonWith<S extends z.ZodType>(schema: S, text: string): z.infer<S> {
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch {
    throw new HttpError(400, 'The body is not valid JSON; check for a missing quote, comma or brace.');
  }
  return parseWith(schema, raw);
}

/** Validates `raw` with `schema`, throwing a 400 whose message names the first bad field. */
export function parseWith<S extends z.ZodType>(schema: S, raw: unknown): z.infer<S> {
  const parsed = schema.safeParse(raw);
  if (parsed.success) return parsed.data;
  throw new HttpError(400, zodIssuesToMessage(parsed.error, 'body'), zodIssuesToFields(parsed.error));
}

/** Logs a 401 or 403 answer as a security event (who was refused what); other statuses are not logged. */
export function logIfDenied(
  error: HttpError,
  request: { method: string; path: string },
  locals: Pick<App.Locals, 'user' | 'team'>,
): void {
  if (error.status !== 401 && error.status !== 403) return;
  logSecurityEvent('denied', {
    status: error.status,
    ...request,
    userId: locals.user?.id ?? null,
    role: locals.team?.role ?? null,
  });
}

/** The answer to an unexpected error: logged in full here, a plain 500 for the client. */
export function logServerFailure(method: string, path: string, error: unknown): HttpError {
  console.error(`[lashline] ${method} ${path} failed`, error);
  return new HttpError(500, 'Something went wrong on the server; the change was not saved.');
}

/** Whether reading the body failed because the serving wrapper cut it off at its route's cap. */
export function isBodyCapError(error: unknown): boolean {
  const named = (value: unknown) => value instanceof Error && value.name === 'BodyTooLargeError';
  return named(error) || (error instanceof Error && named(error.cause));
}

/** Wraps an endpoint so that an HttpError becomes its JSON answer and nothing else leaks. */
export function handle(
  work: (context: APIContext) => Response | Promise<Response>,
): (context: APIContext) => Promise<Response> {
  return async (context) => {
    try {
      return await work(context);
    } catch (error) {
      if (error instanceof HttpError) {
        logIfDenied(error, { method: context.request.method, path: context.url.pathname }, context.locals);
        return errorResponse(error);
      }
      // The serving wrapper has already answered 413 and closed the connection (scripts/body-cap.mjs).
      if (isBodyCapError(error)) return errorResponse(tooLargeFor(context.url.pathname));
      return errorResponse(logServerFailure(context.request.method, context.url.pathname, error));
    }
  };
}

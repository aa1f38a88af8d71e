/**
 * The islands' one way to call the JSON API: a timeout for a poor connection, and every failure
 * turned into `{ status, message, fields }` as the endpoints write it (`{ error: { message, fields } }`).
 */
export interface Problem {
  /** 0 when no answer came (offline, timed out). */
  status: number;
  message: string;
  fields: Record<string, string>;
}

export type Answer<T> = { ok: true; status: number; data: T } | { ok: false; problem: Problem };

export interface Page<T> {
  items: T[];
  nextCursor: string | null;
}

const TIMEOUT_MS = 20_000;

function lostMessage(method: string): string {
  const offline = typeof navigator !== 'undefined' && navigator.onLine === false;
  const cause = offline ? 'This device is offline' : 'No answer from the server';
  return method === 'GET'
    ? `${cause}; the figures on screen are the last ones received. Try again when the signal is back.`
    : `${cause}, so Lashline cannot tell whether this was saved. Check the list before sending it again.`;
}

function bodyToProblem(status: number, body: unknown): Problem {
  const error = (body as { error?: { message?: unknown; fields?: unknown } } | null)?.error;
  const message =
    typeof error?.message === 'string' ? error.message : `The server answered ${status}; nothing was changed.`;
  const fields = error?.fields && typeof error.fields === 'object' ? (error.fields as Record<string, string>) : {};
  return { status, message, fields };
}

/** Calls the API with JSON; never throws. */
export async function callApi<T>(
  path: string,
  options: { method?: string; body?: unknown; timeoutMs?: number; headers?: Record<string, string> } = {},
): Promise<Answer<T>> {
  const method = options.method ?? 'GET';
  const controller = new AbortController();
  const timer = setTimeout(() => controller.abort(), options.timeoutMs ?? TIMEOUT_MS);
  try {
    const response = await fetch(path, {
      method,
      credentials: 'same-origin',
      headers: {
        Accept: 'application/json',
        ...(options.body === undefined ? {} : { 'Content-Type': 'application/json' }),
        ...options.headers,
      },
      body: options.body === undefined ? undefined : JSON.stringify(options.body),
      signal: controller.signal,
    });
    const text = await response.text();
    let body: unknown = undefined;
    try {
      body = text ? JSON.parse(text) : undefined;
    } catch {
      body = undefined;
    }
    if (response.ok) return { ok: true, status: response.status, data: body as T };
    return { ok: false, problem: bodyToProblem(response.status, body) };
  } catch {
    return { ok: false, problem: { status: 0, message: lostMessage(method), fields: {} } };
  } finally {
    clearTimeout(timer);
  }
}

/** GET for TanStack Query, which wants a throw on failure. */
export async function getJson<T>(path: string): Promise<T> {
  const answer = await callApi<T>(path);
  if (!answer.ok) throw new Error(answer.problem.message);
  return answer.data;
}

/**
 * The message for one field: the short text in `fields`, unless the endpoint's message names that
 * field with more to say (a 409's "serial: the team already has …" beside `{ serial: 'already used' }`).
 * @example fieldMessage({ status: 409, message: 'serial: the team already has a gear-set with serial GS-1.', fields: { serial: 'already used' } }, 'serial') // 'The team already has a gear-set with serial GS-1.'
 */
export function fieldMessage(problem: Problem | null, field: string): string | undefined {
  if (!problem) return undefined;
  const short = problem.fields[field];
  const prefix = `${field}: `;
  if (short === undefined || !problem.message.startsWith(prefix)) return short;
  const rest = problem.message.slice(prefix.length).replace(/ \(\d+ more fields? to fix\)$/, '');
  if (rest.includes(short)) return short;
  return rest.charAt(0).toUpperCase() + rest.slice(1);
}

/**
 * The endpoint's message without the field name it starts with, for a sentence on screen.
 * @example messageWithoutField({ status: 404, message: 'carId: no such car in this team.', fields: { carId: 'unknown car' } }) // 'No such car in this team.'
 */
export function messageWithoutField(problem: Problem): string {
  const named = Object.keys(problem.fields).find((field) => problem.message.startsWith(`${field}: `));
  if (!named) return problem.message;
  const rest = problem.message.slice(named.length + 2);
  return rest.charAt(0).toUpperCase() + rest.slice(1);
}

/**
 * The sentence above a form: a count for a refused form (each message sits beside its field), else
 * the endpoint's message.
 * @example problemToSummary({ status: 400, message: 'elapsedSeconds: …', fields: { elapsedSeconds: '…', speedMph: '…' } }) // '2 fields need fixing; see the messages beside them.'
 */
export function problemToSummary(problem: Problem): string {
  const count = Object.keys(problem.fields).length;
  if (problem.status === 400 && count > 0)
    return count === 1
      ? 'One field needs fixing; see the message beside it.'
      : `${count} fields need fixing; see the messages beside them.`;
  return messageWithoutField(problem);
}

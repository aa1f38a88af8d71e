import { HttpError } from './http';

/** The Idempotency-Key header: 1–200 visible characters; null when absent and not required. */
export function readIdempotencyKey(request: Request, required: boolean): string | null {
  const key = request.headers.get('idempotency-key');
  if (key === null) {
    if (required)
      throw new HttpError(
        400,
        'Idempotency-Key: send a unique key (e.g. a UUID) with the submission, the same one on every retry.',
        { 'Idempotency-Key': 'missing' },
      );
    return null;
  }
  if (!/^[\x21-\x7e]{1,200}$/.test(key))
    throw new HttpError(400, 'Idempotency-Key: 1 to 200 visible characters.', { 'Idempotency-Key': 'not valid' });
  return key;
}

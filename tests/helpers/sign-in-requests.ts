import { ApiClient } from './api-client';

/**
 * Sign-in requests shaped as an attacker may send them: the body as a form or as JSON (Auth.js takes
 * both), with extra fields, and with any headers (X-Forwarded-For). Each call is a fresh client, as
 * a guessing script would be; the answer is the callback's raw response.
 */
export interface SignInRequest {
  email: string | string[];
  password: string;
  code?: string;
  as?: 'form' | 'json';
  headers?: Record<string, string>;
  path?: string;
}

/** Fetches the CSRF token now and returns the sign-in to send later (so a burst can leave at one moment). */
export async function prepareSignIn(
  baseUrl: string,
  request: SignInRequest,
): Promise<() => Promise<{ response: Response; client: ApiClient }>> {
  const client = new ApiClient(baseUrl);
  const csrf = await client.get<{ csrfToken: string }>('/api/auth/csrf');
  const fields: [string, string][] = [
    ...(Array.isArray(request.email) ? request.email : [request.email]).map((email): [string, string] => [
      'email',
      email,
    ]),
    ['password', request.password],
    ['csrfToken', csrf.body.csrfToken],
    ['callbackUrl', '/'],
    ...(request.code === undefined ? [] : [['code', request.code] as [string, string]]),
  ];
  const json = request.as === 'json';
  return async () => {
    const response = await client.request(request.path ?? '/api/auth/callback/credentials', {
      method: 'POST',
      headers: {
        'content-type': json ? 'application/json' : 'application/x-www-form-urlencoded',
        ...request.headers,
      },
      body: json ? JSON.stringify(Object.fromEntries(fields)) : new URLSearchParams(fields),
    });
    return { response, client };
  };
}

/** Sends one sign-in request now. */
export async function postSignIn(
  baseUrl: string,
  request: SignInRequest,
): Promise<{ response: Response; client: ApiClient }> {
  return (await prepareSignIn(baseUrl, request))();
}

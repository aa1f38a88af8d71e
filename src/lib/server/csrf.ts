import { Auth } from '@auth/core';
import type { AstroCookies } from 'astro';
import { parseString } from 'set-cookie-parser';
import authConfig from 'auth:config';

/**
 * A CSRF token for the sign-in and sign-out forms, made by Auth.js itself on the server, so those
 * forms work without JavaScript on a poor connection. The cookie Auth.js sets is passed on.
 */
export async function issueCsrfToken(request: Request, cookies: AstroCookies): Promise<string> {
  const url = new URL(`${authConfig.prefix ?? '/api/auth'}/csrf`, request.url);
  const response = await Auth(new Request(url, { headers: request.headers }), authConfig);
  for (const header of response.headers.getSetCookie()) {
    const { name, value, ...options } = parseString(header);
    cookies.set(name, value, options as Parameters<AstroCookies['set']>[2]);
  }
  const body = (await response.json()) as { csrfToken: string };
  return body.csrfToken;
}

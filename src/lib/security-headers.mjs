// Plain JavaScript so that the serving wrapper (scripts/serve.mjs) reads it without a TypeScript
// loader on every request's path; the TypeScript code imports it with the types below.

/**
 * Security headers for every response. Pages get their Content-Security-Policy from Astro (with
 * hashes of its own inline scripts); everything else gets the strict one below.
 */
export const CSP_DIRECTIVES = [
  "default-src 'self'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
];

export const API_CSP = "default-src 'none'; frame-ancestors 'none'";

/** @type {Readonly<Record<string, string>>} */
export const BASE_SECURITY_HEADERS = {
  'X-Content-Type-Options': 'nosniff',
  // Not no-referrer: under it browsers send "Origin: null" with form posts, which the origin check refuses.
  'Referrer-Policy': 'same-origin',
  'X-Frame-Options': 'DENY',
  'Cross-Origin-Opener-Policy': 'same-origin',
  'Cross-Origin-Resource-Policy': 'same-origin',
  'Permissions-Policy': 'camera=(self), geolocation=(), microphone=()',
};

/**
 * Adds the security headers to `headers` in place; a CSP already set by Astro is kept.
 * @param {Headers} headers
 * @returns {void}
 */
export function applySecurityHeaders(headers) {
  for (const [name, value] of Object.entries(BASE_SECURITY_HEADERS)) headers.set(name, value);
  const csp = headers.get('content-security-policy');
  if (!csp) headers.set('Content-Security-Policy', API_CSP);
  else if (!csp.includes('frame-ancestors')) headers.set('Content-Security-Policy', `${csp}; frame-ancestors 'none'`);
}

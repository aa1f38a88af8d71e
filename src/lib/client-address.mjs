// Plain JavaScript so that the serving wrapper (scripts/serve.mjs) reads it without a TypeScript loader.
import { isIP } from 'node:net';

/** The most proxies Lashline will believe stand in front of it. */
export const MAX_TRUSTED_PROXIES = 10;

/**
 * Reads TRUST_PROXY: how many proxies stand in front of the server (unset or 0: none, the socket's
 * address is the client's). Throws with the variable's name on anything else.
 * @param {string | undefined} value
 * @returns {number}
 */
export function parseTrustProxy(value) {
  if (value === undefined || value.trim() === '') return 0;
  const trimmed = value.trim();
  if (!/^\d+$/.test(trimmed) || Number(trimmed) > MAX_TRUSTED_PROXIES) {
    throw new Error(
      `Lashline cannot start: TRUST_PROXY must be a whole number of proxies from 0 to ${MAX_TRUSTED_PROXIES}, not "${value}".`,
    );
  }
  return Number(trimmed);
}

/**
 * The client's address. Each proxy appends the address it received the request from to
 * X-Forwarded-For, so with `trustedProxies` proxies in front the client is that many entries left of
 * the socket's address; everything further left was written by the client and is ignored. With no
 * trusted proxy, or a chain shorter than promised (a request that went around the proxies), the
 * socket's address is the answer.
 * @example clientAddressOf('6.6.6.6, 203.0.113.7', '10.0.0.2', 1) // '203.0.113.7'
 * @example clientAddressOf('6.6.6.6', '203.0.113.7', 0) // '203.0.113.7'
 * @param {string | string[] | undefined} forwardedFor
 * @param {string | undefined} socketAddress
 * @param {number} trustedProxies
 * @returns {string}
 */
export function clientAddressOf(forwardedFor, socketAddress, trustedProxies) {
  const socket = socketAddress ?? 'unknown';
  if (trustedProxies <= 0) return socket;
  const header = Array.isArray(forwardedFor) ? forwardedFor.join(',') : (forwardedFor ?? '');
  const chain = [
    ...header
      .split(',')
      .map((hop) => hop.trim())
      .filter(Boolean),
    socket,
  ];
  const index = chain.length - 1 - trustedProxies;
  const candidate = index >= 0 ? chain[index] : undefined;
  return candidate && isIP(candidate) ? candidate : socket;
}

import { describe, expect, it } from 'vitest';
import { clientAddressOf, parseTrustProxy } from '../../src/lib/client-address.mjs';

describe('the client address', () => {
  it('is the socket’s address when no proxy is trusted, whatever X-Forwarded-For says', () => {
    expect(clientAddressOf('6.6.6.6', '203.0.113.7', 0)).toBe('203.0.113.7');
    expect(clientAddressOf(['6.6.6.6', '7.7.7.7'], '203.0.113.7', 0)).toBe('203.0.113.7');
  });

  it('is the address the nearest trusted proxy saw, not what the client wrote further left', () => {
    expect(clientAddressOf('6.6.6.6, 203.0.113.7', '10.0.0.2', 1)).toBe('203.0.113.7');
    expect(clientAddressOf('6.6.6.6, 203.0.113.7, 10.0.0.9', '10.0.0.2', 2)).toBe('203.0.113.7');
  });

  it('falls back to the socket when the chain is shorter than the proxies promised, or not an address', () => {
    expect(clientAddressOf(undefined, '203.0.113.7', 1)).toBe('203.0.113.7');
    expect(clientAddressOf('6.6.6.6', '10.0.0.2', 2)).toBe('10.0.0.2');
    expect(clientAddressOf('not-an-address', '10.0.0.2', 1)).toBe('10.0.0.2');
  });
});

describe('TRUST_PROXY', () => {
  it('is none when unset, a count when a whole number, and stops the server otherwise', () => {
    expect(parseTrustProxy(undefined)).toBe(0);
    expect(parseTrustProxy('')).toBe(0);
    expect(parseTrustProxy('2')).toBe(2);
    expect(() => parseTrustProxy('true')).toThrow(/TRUST_PROXY/);
    expect(() => parseTrustProxy('-1')).toThrow(/TRUST_PROXY/);
    expect(() => parseTrustProxy('11')).toThrow(/TRUST_PROXY/);
  });
});

import { describe, expect, test } from 'vitest';
import { resolveClientAddress } from '../../../src/lib/platform/rate-limit/forwarded-address';

describe('the client address behind trusted proxies', () => {
  test('trusting no proxy, the socket address counts and X-Forwarded-For is ignored', () => {
    expect(resolveClientAddress('198.51.100.9', '203.0.113.1', 0)).toBe('198.51.100.9');
    expect(resolveClientAddress('198.51.100.9', null, 0)).toBe('198.51.100.9');
  });

  test('behind one proxy, the address it appended counts, not what the caller wrote before it', () => {
    // The caller sent `X-Forwarded-For: 1.1.1.1`; our proxy at 10.0.0.2 appended the caller's real address.
    expect(resolveClientAddress('10.0.0.2', '1.1.1.1, 203.0.113.50', 1)).toBe('203.0.113.50');
    expect(resolveClientAddress('10.0.0.2', '203.0.113.50', 1)).toBe('203.0.113.50');
  });

  test('behind two proxies, the second entry from the right of the whole chain counts', () => {
    expect(resolveClientAddress('10.0.0.3', 'forged, 203.0.113.50, 10.0.0.2', 2)).toBe('203.0.113.50');
  });

  test('a chain shorter than the configured hops falls back to its first entry, and no header to the socket', () => {
    expect(resolveClientAddress('10.0.0.3', '203.0.113.50', 3)).toBe('203.0.113.50');
    expect(resolveClientAddress('10.0.0.3', null, 2)).toBe('10.0.0.3');
    expect(resolveClientAddress('10.0.0.3', ' , ', 1)).toBe('10.0.0.3');
  });
});

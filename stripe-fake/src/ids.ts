import { randomBytes } from 'node:crypto';

const ALPHABET = 'ABCDEFGHIJKLMNOPQRSTUVWXYZabcdefghijklmnopqrstuvwxyz0123456789';

/** An object id with the API's prefix for its kind (`cs_test_`, `pi_`, …) and a random tail. */
export function newId(prefix: string, length = 24): string {
  const bytes = randomBytes(length);
  let tail = '';
  for (const byte of bytes) tail += ALPHABET[byte % ALPHABET.length];
  return `${prefix}${tail}`;
}

export function unixNow(): number {
  return Math.floor(Date.now() / 1000);
}

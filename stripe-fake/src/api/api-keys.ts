import { ApiError } from './api-error.ts';

function masked(key: string): string {
  return key.length <= 12 ? `${key.slice(0, 3)}****` : `${key.slice(0, 8)}****${key.slice(-4)}`;
}

/** Reads the secret key from Bearer (as the SDK sends it) or Basic auth (as `curl -u key:` does). */
export function apiKeyFrom(authorization: string | undefined): string {
  let key: string | undefined;
  if (authorization?.startsWith('Bearer ')) {
    key = authorization.slice('Bearer '.length).trim();
  } else if (authorization?.startsWith('Basic ')) {
    key = Buffer.from(authorization.slice('Basic '.length), 'base64').toString('utf8').split(':')[0];
  }
  if (!key) {
    throw new ApiError(
      401,
      "You did not provide an API key. Send it in the Authorization header as 'Authorization: Bearer sk_test_…'; the local payment stand-in accepts any key starting with sk_test_.",
    );
  }
  if (!/^sk_test_\w+$/.test(key)) {
    throw new ApiError(
      401,
      `Invalid API Key provided: ${masked(key)}. The local payment stand-in accepts any test secret key starting with sk_test_.`,
    );
  }
  return key;
}

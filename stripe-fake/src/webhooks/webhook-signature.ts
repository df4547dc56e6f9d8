import { createHmac } from 'node:crypto';

/**
 * The signature header a webhook carries: `t=<unix seconds>,v1=<hex HMAC-SHA256 of "<t>.<body>">`,
 * keyed with the whole endpoint secret (prefix included), so the SDK's `constructEvent` accepts it.
 */
export function signatureHeader(body: string, secret: string, timestamp: number): string {
  const signature = createHmac('sha256', secret).update(`${timestamp}.${body}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${signature}`;
}

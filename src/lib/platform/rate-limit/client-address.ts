import type { APIContext } from 'astro';
import { config } from '../config';
import { PEER_HEADER, resolveClientAddress } from './forwarded-address';

/**
 * Who is asking, for the rate limits. Astro's own `clientAddress` is the first
 * X-Forwarded-For value, which the caller chooses; this believes forwarded
 * addresses only from the configured proxies (TRUSTED_PROXY_HOPS). Without
 * the launcher's peer header (`astro dev`) the socket address is Astro's.
 */
export function clientAddressOf(context: Pick<APIContext, 'request' | 'clientAddress'>): string {
  const headers = context.request.headers;
  const peer = headers.get(PEER_HEADER) ?? context.clientAddress;
  return resolveClientAddress(peer, headers.get('x-forwarded-for'), config.trustedProxyHops);
}

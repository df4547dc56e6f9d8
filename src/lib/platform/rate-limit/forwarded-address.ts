/**
 * The header `npm start` (scripts/start.mjs) sets on every request to the
 * socket's peer address, replacing whatever the caller sent under that name.
 */
export const PEER_HEADER = 'x-railwright-peer';

/**
 * The client's address as our own proxies saw it. Each trusted proxy appends
 * the address it received the request from, so with `hops` proxies the client
 * is `hops` entries from the right of [...X-Forwarded-For, peer]; entries
 * further left were written by the caller and are never believed.
 */
export function resolveClientAddress(peer: string, forwardedFor: string | null, hops: number): string {
  if (hops <= 0 || !forwardedFor) return peer;
  const chain = [
    ...forwardedFor
      .split(',')
      .map((entry) => entry.trim())
      .filter(Boolean),
    peer,
  ];
  return chain[Math.max(0, chain.length - 1 - hops)] ?? peer;
}

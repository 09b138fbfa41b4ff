import { config } from '@/lib/config';

/**
 * The address of the TCP peer, for throttling. Next 16 gives route handlers no socket, and
 * `next start` keeps a client-sent X-Forwarded-For as it is (node_modules/next/dist/server/
 * base-server.js fills it from the socket only when absent), so neither can be trusted as is.
 * instrumentation.ts therefore tags every request with its socket address in PEER_HEADER,
 * overwriting any value a client sent under that name.
 */
export const PEER_HEADER = 'x-kerfline-peer';

type HeaderSource = Headers | Record<string, unknown> | undefined;

function read(headers: HeaderSource, name: string): string | undefined {
  if (!headers) return undefined;
  if (headers instanceof Headers) return headers.get(name) ?? undefined;
  const v = headers[name];
  return typeof v === 'string' ? v : Array.isArray(v) && typeof v[0] === 'string' ? v[0] : undefined;
}

/**
 * The client's address: the socket peer, or with N trusted proxies the address the N-th proxy saw
 * (counted from the right of X-Forwarded-For, since each proxy appends what it saw and only the
 * right-most entries come from proxies we run). Source: RFC 7239 §5.2 on the order of entries;
 * the right-to-left count is common practice (e.g. Express's "trust proxy" hop count).
 */
export function clientAddress(headers: HeaderSource, hops = config().TRUST_PROXY_HOPS): string {
  const peer = read(headers, PEER_HEADER)?.trim() || 'unknown';
  if (hops === 0) return peer;
  const chain = (read(headers, 'x-forwarded-for') ?? '')
    .split(',')
    .map((s) => s.trim())
    .filter(Boolean);
  const path = [...chain, peer];
  return path[Math.max(0, path.length - 1 - hops)] ?? peer;
}

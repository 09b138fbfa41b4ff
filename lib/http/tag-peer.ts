import http from 'node:http';
import { PEER_HEADER } from './peer';

const TAGGED = Symbol.for('kerfline.peer-tagged');

/**
 * Wraps http.Server's emit so every 'request' carries its socket address in PEER_HEADER before
 * Next sees it. Called once from instrumentation.ts, which runs inside the `next start` process.
 */
export function tagRequestsWithPeer(): void {
  const proto = http.Server.prototype as http.Server & { [TAGGED]?: boolean };
  if (proto[TAGGED]) return;
  proto[TAGGED] = true;
  const emit = proto.emit as (this: http.Server, event: string | symbol, ...args: unknown[]) => boolean;
  proto.emit = function (this: http.Server, event: string | symbol, ...args: unknown[]): boolean {
    if (event === 'request') {
      const req = args[0] as http.IncomingMessage | undefined;
      // Always overwritten: a value sent by the client under this name must never count.
      if (req?.headers) req.headers[PEER_HEADER] = req.socket?.remoteAddress ?? 'unknown';
    }
    return emit.call(this, event, ...args);
  } as typeof proto.emit;
}

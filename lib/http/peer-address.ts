// Next does not hand route handlers (or next-auth's authorize) the socket's address, and fills
// X-Forwarded-For from the socket only when the client sent none. So, once per server process, every
// incoming request gets the socket's address in PEER_HEADER, overwriting whatever a client put there.
import http from 'node:http';
import { PEER_HEADER } from './client-address';

const MARK = Symbol.for('scribeline.peerAddress');

export function stampPeerAddresses(): void {
  const proto = http.Server.prototype as unknown as Record<symbol, unknown> & { emit: (...args: unknown[]) => boolean };
  if (proto[MARK]) return;
  proto[MARK] = true;
  const emit = proto.emit;
  proto.emit = function (this: unknown, event: unknown, ...args: unknown[]) {
    if (event === 'request') {
      const req = args[0] as http.IncomingMessage;
      req.headers[PEER_HEADER] = req.socket?.remoteAddress ?? '';
    }
    return emit.call(this, event, ...args);
  };
}

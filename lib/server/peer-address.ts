import http from 'node:http';
import { randomBytes } from 'node:crypto';

// Next gives pages and route handlers no access to the socket, and the X-Forwarded-For it passes on is
// whatever the client sent. So the server's own 'request' event writes the socket's address into a
// header of ours, overwriting anything the client put there, together with a secret made at start-up:
// a header that does not carry the secret (a forged one, or one on a request that arrived before this
// was installed) is not believed.
export const PEER_HEADER = 'x-tidewarden-peer';

const KEY = Symbol.for('tidewarden.peer-address');
type Holder = { [KEY]?: { secret: string } };

/** Installs the stamp once per process (instrumentation.ts calls it when the server starts). */
export function installPeerAddressStamp() {
  const holder = globalThis as Holder;
  if (holder[KEY]) return;
  const secret = randomBytes(24).toString('base64url');
  holder[KEY] = { secret };
  const emit = http.Server.prototype.emit;
  http.Server.prototype.emit = function (this: http.Server, event: string | symbol, ...args: unknown[]) {
    if (event === 'request') {
      const req = args[0] as http.IncomingMessage;
      req.headers[PEER_HEADER] = `${secret} ${req.socket?.remoteAddress ?? ''}`;
    }
    return (emit as (this: http.Server, event: string | symbol, ...rest: unknown[]) => boolean).call(this, event, ...args);
  } as typeof emit;
}

/** The address of the socket the request came in on, or null when the server did not stamp it. */
export function peerAddress(headerValue: string | null | undefined): string | null {
  const secret = (globalThis as Holder)[KEY]?.secret;
  if (!secret || !headerValue) return null;
  const [given, address] = headerValue.split(' ');
  if (given !== secret || !address) return null;
  return address;
}

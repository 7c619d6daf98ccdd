import { headers } from 'next/headers';
import { getEnv, type Env } from './env';
import { PEER_HEADER, peerAddress } from './peer-address';

// The dev inbox shows every e-mail the app sent, reset links included: whoever can read it can take any
// account. So it exists only when all of these hold, and answers 404 as if absent otherwise:
//  - mail goes to the local SMTP fake: an SMTP host on loopback and the fake's inbox API on loopback;
//  - not production;
//  - the request came in on a loopback socket (the socket's own address, never a header);
//  - the request names a loopback host, so a page on another site cannot reach it by pointing its own
//    domain at 127.0.0.1 (DNS rebinding);
//  - no forwarding header names another machine: a reverse proxy on this machine connects from loopback
//    but says whom it forwards for. Such headers can only take the inbox away, never grant it.

const LOOPBACK_NAMES = new Set(['localhost', '127.0.0.1', '::1', '[::1]']);

export function isLoopbackAddress(address: string | null | undefined): boolean {
  if (!address) return false;
  const a = address.trim().toLowerCase();
  if (a === '::1') return true;
  const v4 = a.startsWith('::ffff:') ? a.slice(7) : a;
  return /^127\.\d{1,3}\.\d{1,3}\.\d{1,3}$/.test(v4);
}

function isLoopbackHostName(host: string): boolean {
  const name = host.toLowerCase();
  return LOOPBACK_NAMES.has(name) || isLoopbackAddress(name);
}

/** The Host header's name without its port. */
function hostName(hostHeader: string | null | undefined): string | null {
  if (!hostHeader) return null;
  try {
    return new URL(`http://${hostHeader}`).hostname;
  } catch {
    return null;
  }
}

/** Mail goes to the SMTP fake on this machine, not to a real server. */
export function mailGoesToLocalFake(env: Pick<Env, 'TIDEWARDEN_ENV' | 'SMTP_HOST' | 'FAKE_MAIL_API'>): boolean {
  if (env.TIDEWARDEN_ENV === 'production' || !env.FAKE_MAIL_API) return false;
  if (!isLoopbackHostName(env.SMTP_HOST)) return false;
  try {
    return isLoopbackHostName(new URL(env.FAKE_MAIL_API).hostname);
  } catch {
    return false;
  }
}

export interface InboxRequest {
  /** The socket's address (lib/server/peer-address.ts). */
  peer: string | null;
  host: string | null;
  forwardedFor?: string | null;
  realIp?: string | null;
  forwarded?: string | null;
}

function forwardedForSomeoneElse(request: InboxRequest): boolean {
  const claimed = [
    ...(request.forwardedFor ?? '').split(','),
    request.realIp ?? '',
    ...[...(request.forwarded ?? '').matchAll(/for=("?)\[?([^\]";,]+)/gi)].map((m) => m[2] ?? ''),
  ]
    .map((a) => a.trim())
    .filter(Boolean);
  return claimed.some((address) => !isLoopbackAddress(address));
}

export function devInboxAvailable(env: Pick<Env, 'TIDEWARDEN_ENV' | 'SMTP_HOST' | 'FAKE_MAIL_API'>, request: InboxRequest): boolean {
  if (!mailGoesToLocalFake(env)) return false;
  if (!isLoopbackAddress(request.peer)) return false;
  if (forwardedForSomeoneElse(request)) return false;
  const name = hostName(request.host);
  return name !== null && isLoopbackHostName(name);
}

/** For the inbox page and its attachment route: may this request see the inbox? */
export async function mayUseDevInbox(): Promise<boolean> {
  const env = getEnv();
  if (!mailGoesToLocalFake(env)) return false;
  const h = await headers();
  return devInboxAvailable(env, {
    peer: peerAddress(h.get(PEER_HEADER)),
    host: h.get('host'),
    forwardedFor: h.get('x-forwarded-for'),
    realIp: h.get('x-real-ip'),
    forwarded: h.get('forwarded'),
  });
}

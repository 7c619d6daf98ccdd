import { cache } from 'react';
import { cookies, headers } from 'next/headers';
import { redirect } from 'next/navigation';
import type { User as LuciaUser, Session } from 'lucia';
import { getLucia } from './lucia';
import { getEnv } from '../env';
import type { CurrentUser } from '../org-context';
import { PEER_HEADER, peerAddress } from '../peer-address';

/** The signed-in user for this request (cached per request), refreshing the cookie when Lucia extends it. */
export const getCurrentSession = cache(async (): Promise<{ user: LuciaUser; session: Session } | { user: null; session: null }> => {
  const lucia = getLucia();
  const jar = await cookies();
  const sessionId = jar.get(lucia.sessionCookieName)?.value ?? null;
  if (!sessionId) return { user: null, session: null };
  const result = await lucia.validateSession(sessionId);
  try {
    if (result.session?.fresh) {
      const cookie = lucia.createSessionCookie(result.session.id);
      jar.set(cookie.name, cookie.value, cookie.attributes);
    }
    if (!result.session) {
      const cookie = lucia.createBlankSessionCookie();
      jar.set(cookie.name, cookie.value, cookie.attributes);
    }
  } catch {
    // Server components cannot set cookies; the next action or route handler will.
  }
  return result;
});

export function toCurrentUser(user: LuciaUser): CurrentUser {
  return { id: user.id, email: user.email, name: user.name, emailVerified: user.emailVerified, memberships: user.memberships };
}

export async function getCurrentUser(): Promise<CurrentUser | null> {
  const { user } = await getCurrentSession();
  return user ? toCurrentUser(user) : null;
}

/** For pages: the user, or a redirect to sign-in that comes back here afterwards. */
export async function requireUser(returnTo?: string): Promise<CurrentUser> {
  const user = await getCurrentUser();
  if (!user) redirect(returnTo ? `/sign-in?next=${encodeURIComponent(returnTo)}` : '/sign-in');
  return user;
}

/**
 * Opens a new session for the user and ends the one this browser had, whoever it belonged to: a sign-in
 * never keeps (or adopts) a session id the browser already held.
 */
export async function startSession(userId: string) {
  const lucia = getLucia();
  const jar = await cookies();
  const previous = jar.get(lucia.sessionCookieName)?.value;
  if (previous) await lucia.invalidateSession(previous);
  const session = await lucia.createSession(userId, {});
  const cookie = lucia.createSessionCookie(session.id);
  jar.set(cookie.name, cookie.value, cookie.attributes);
}

export async function endSession() {
  const lucia = getLucia();
  const { session } = await getCurrentSession();
  if (session) await lucia.invalidateSession(session.id);
  const cookie = lucia.createBlankSessionCookie();
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
}

/**
 * The client's address from an X-Forwarded-For chain, trusting `trustedHops` proxies in front of the app.
 * clientAddress() puts the socket's peer address at the end of the chain (lib/server/peer-address.ts), so the
 * last entry is the peer and every entry before it may be anything the client wrote. With no trusted proxy the
 * peer is the client; with n trusted proxies the client is the entry the outermost one appended, n places
 * before the end. A chain shorter than that means a proxy is missing: the first entry is the best guess.
 */
export function addressFromForwardedFor(chain: string | null | undefined, trustedHops: number): string | null {
  const hops = (chain ?? '').split(',').map((s) => s.trim()).filter(Boolean);
  if (hops.length === 0) return null;
  return hops[Math.max(0, hops.length - 1 - Math.max(0, trustedHops))]!;
}

/**
 * The client's address, for rate limits and audit (see addressFromForwardedFor and TRUSTED_PROXY_HOPS).
 * `next start` passes a client-written X-Forwarded-For on unchanged, so the chain is completed with the
 * socket's own address, which the server stamps on every request (instrumentation.ts). Without that stamp
 * (tests that call actions directly) the header is read as it is.
 */
export async function clientAddress(): Promise<string> {
  const h = await headers();
  const forwarded = h.get('x-forwarded-for');
  const peer = peerAddress(h.get(PEER_HEADER));
  const chain = peer ? [forwarded, peer].filter(Boolean).join(', ') : forwarded;
  return addressFromForwardedFor(chain, getEnv().TRUSTED_PROXY_HOPS) ?? 'unknown';
}

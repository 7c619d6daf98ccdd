import { cache } from 'react';
import { cookies, headers } from 'next/headers';
import { redirect } from 'next/navigation';
import type { User as LuciaUser, Session } from 'lucia';
import { getLucia } from './lucia';
import type { CurrentUser } from '../org-context';

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
  return { id: user.id, email: user.email, name: user.name, emailVerified: user.emailVerified };
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

export async function startSession(userId: string) {
  const lucia = getLucia();
  const session = await lucia.createSession(userId, {});
  const cookie = lucia.createSessionCookie(session.id);
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
}

export async function endSession() {
  const lucia = getLucia();
  const { session } = await getCurrentSession();
  if (session) await lucia.invalidateSession(session.id);
  const cookie = lucia.createBlankSessionCookie();
  (await cookies()).set(cookie.name, cookie.value, cookie.attributes);
}

/** The client's address as seen by the Next server (the last hop it appended), for rate limits and audit. */
export async function clientAddress(): Promise<string> {
  const h = await headers();
  const forwarded = h.get('x-forwarded-for');
  const last = forwarded?.split(',').map((s) => s.trim()).filter(Boolean).pop();
  return last || h.get('x-real-ip') || 'unknown';
}

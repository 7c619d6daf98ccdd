import { Lucia, TimeSpan } from 'lucia';
import { getOrm } from '../db';
import { getEnv } from '../env';
import { MikroOrmLuciaAdapter } from './lucia-adapter';
import type { MembershipRow } from '../org-context';

let instance: Lucia | undefined;

export function getLucia() {
  instance ??= new Lucia(new MikroOrmLuciaAdapter(getOrm), {
    sessionExpiresIn: new TimeSpan(14, 'd'),
    sessionCookie: {
      name: 'tw_session',
      expires: true,
      // Secure whenever the app is served over https; HttpOnly and SameSite=Lax are Lucia's defaults.
      attributes: { secure: getEnv().APP_URL.startsWith('https://'), sameSite: 'lax' },
    },
    getUserAttributes: (attributes) => ({
      email: attributes.email,
      name: attributes.name,
      emailVerified: attributes.emailVerified,
      memberships: attributes.memberships,
    }),
  });
  return instance;
}

declare module 'lucia' {
  interface Register {
    Lucia: Lucia<Record<never, never>, { email: string; name: string; emailVerified: boolean; memberships: readonly MembershipRow[] }>;
    DatabaseUserAttributes: { email: string; name: string; emailVerified: boolean; memberships: readonly MembershipRow[] };
  }
}

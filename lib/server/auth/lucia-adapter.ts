import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import type { MikroORM } from '@mikro-orm/postgresql';
import { SessionSchema, UserSchema } from '@/entities';
import type { MembershipRow } from '../org-context';
import { executePrepared } from '../sql';

// Lucia's storage over MikroORM; each call works in its own EntityManager fork.
export class MikroOrmLuciaAdapter implements Adapter {
  constructor(private readonly getOrm: () => Promise<MikroORM>) {}

  private async em() {
    return (await this.getOrm()).em.fork();
  }

  // Every signed-in request asks this once: one plain statement, no entities to build (no query builder either).
  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const em = await this.em();
    // With the user come their memberships (each with its organisation, as getOrgContextOrThrow reads them): a page
    // then resolves its organisation without a statement of its own.
    // A prepared statement (executePrepared): read on every signed-in request, planned once per connection.
    const [row] = await executePrepared<{ id: string; expires_at: Date | string; user_id: string; email: string; name: string; verified: boolean; memberships: MembershipRow[] | null }>(
      em,
      'tw_session_user',
      `select s.id, s.expires_at, u.id as user_id, u.email, u.name, u.email_verified_at is not null as verified,
              (select json_agg(json_build_object('slug', o.slug, 'membership', row_to_json(m), 'organisation', row_to_json(o)))
                 from membership m join organisation o on o.id = m.organisation_id where m.user_id = u.id) as memberships
         from auth_session s join app_user u on u.id = s.user_id where s.id = ?`,
      [sessionId],
    );
    if (!row) return [null, null];
    return [
      { id: row.id, userId: row.user_id, expiresAt: new Date(row.expires_at), attributes: {} },
      { id: row.user_id, attributes: { email: row.email, name: row.name, emailVerified: Boolean(row.verified), memberships: row.memberships ?? [] } },
    ];
  }

  async getUserSessions(userId: string): Promise<DatabaseSession[]> {
    const em = await this.em();
    const sessions = await em.find(SessionSchema, { user: userId });
    return sessions.map((s) => ({ id: s.id, userId, expiresAt: s.expiresAt, attributes: {} }));
  }

  async setSession(session: DatabaseSession): Promise<void> {
    const em = await this.em();
    em.create(SessionSchema, { id: session.id, user: em.getReference(UserSchema, session.userId), expiresAt: session.expiresAt });
    await em.flush();
  }

  async updateSessionExpiration(sessionId: string, expiresAt: Date): Promise<void> {
    const em = await this.em();
    await em.nativeUpdate(SessionSchema, { id: sessionId }, { expiresAt });
  }

  async deleteSession(sessionId: string): Promise<void> {
    const em = await this.em();
    await em.nativeDelete(SessionSchema, { id: sessionId });
  }

  async deleteUserSessions(userId: string): Promise<void> {
    const em = await this.em();
    await em.nativeDelete(SessionSchema, { user: userId });
  }

  async deleteExpiredSessions(): Promise<void> {
    const em = await this.em();
    await em.nativeDelete(SessionSchema, { expiresAt: { $lte: new Date() } });
  }
}

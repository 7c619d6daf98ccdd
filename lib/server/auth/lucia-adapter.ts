import type { Adapter, DatabaseSession, DatabaseUser } from 'lucia';
import type { MikroORM } from '@mikro-orm/postgresql';
import { SessionSchema, UserSchema } from '@/entities';

// Lucia's storage over MikroORM; each call works in its own EntityManager fork.
export class MikroOrmLuciaAdapter implements Adapter {
  constructor(private readonly getOrm: () => Promise<MikroORM>) {}

  private async em() {
    return (await this.getOrm()).em.fork();
  }

  async getSessionAndUser(sessionId: string): Promise<[DatabaseSession | null, DatabaseUser | null]> {
    const em = await this.em();
    const session = await em.findOne(SessionSchema, { id: sessionId }, { populate: ['user'] });
    if (!session) return [null, null];
    const user = session.user;
    return [
      { id: session.id, userId: user.id, expiresAt: session.expiresAt, attributes: {} },
      { id: user.id, attributes: { email: user.email, name: user.name, emailVerified: user.emailVerifiedAt !== null && user.emailVerifiedAt !== undefined } },
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

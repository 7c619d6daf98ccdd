import type { EntityManager } from '@mikro-orm/postgresql';
import { UserTokenSchema, type UserTokenKind } from '@/entities';
import { AppError } from '../../errors';
import { hashToken } from '../../tokens';

/** Finds a single-use token and marks it used; refuses unknown, used and expired tokens alike. */
export async function consumeUserToken(em: EntityManager, kind: UserTokenKind, token: string) {
  const row = await em.findOne(UserTokenSchema, { tokenHash: hashToken(token), kind }, { populate: ['user'] });
  const what = kind === 'verify-email' ? 'confirmation' : 'password reset';
  if (!row || row.usedAt) throw new AppError('invalid', `This ${what} link is not valid or was already used. Ask for a new one.`);
  if (row.expiresAt.getTime() <= Date.now()) throw new AppError('invalid', `This ${what} link has expired. Ask for a new one.`);
  row.usedAt = new Date();
  return row;
}

import type { EntityManager } from '@mikro-orm/postgresql';
import { UserSchema, UserTokenSchema, type UserTokenKind } from '@/entities';
import { AppError } from '../../errors';
import { hashToken } from '../../tokens';

/**
 * Uses a single-use token with ONE conditional update, so of any number of simultaneous uses exactly one
 * gets the row (the others wait for its row lock, then find it used). Unknown, used and expired tokens are
 * refused; nothing else about the token is revealed.
 */
export async function consumeUserToken(em: EntityManager, kind: UserTokenKind, token: string) {
  const tokenHash = hashToken(token);
  const rows: { id: string; user_id: string }[] = await em.execute(
    `update "user_token" set "used_at" = now()
      where "token_hash" = ? and "kind" = ? and "used_at" is null and "expires_at" > now()
      returning "id", "user_id"`,
    [tokenHash, kind],
  );
  const what = kind === 'verify-email' ? 'confirmation' : 'password reset';
  const used = rows[0];
  if (!used) {
    const row = await em.findOne(UserTokenSchema, { tokenHash, kind });
    if (row && !row.usedAt && row.expiresAt.getTime() <= Date.now()) throw new AppError('invalid', `This ${what} link has expired. Ask for a new one.`);
    throw new AppError('invalid', `This ${what} link is not valid or was already used. Ask for a new one.`);
  }
  const user = await em.findOneOrFail(UserSchema, { id: used.user_id });
  return { id: used.id, user };
}

/** After a password reset: every other reset link of the user stops working too. */
export async function retireUserTokens(em: EntityManager, userId: string, kind: UserTokenKind) {
  await em.execute(`update "user_token" set "used_at" = now() where "user_id" = ? and "kind" = ? and "used_at" is null`, [userId, kind]);
}

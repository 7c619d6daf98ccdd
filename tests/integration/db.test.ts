import { afterAll, describe, expect, it } from 'vitest';
import { OrganisationSchema, UserSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { makeUser, uniqueEmail } from '../fixtures/factories';

afterAll(async () => (await getOrm()).close(true));

describe('MikroORM on the real PostgreSQL', () => {
  it('writes an organisation and reads it back in a fresh EntityManager', async () => {
    const em = await getEm();
    const org = em.create(OrganisationSchema, { slug: 'db-round-trip', name: 'Round Trip Marine' });
    await em.flush();
    const again = await (await getEm()).findOneOrFail(OrganisationSchema, { id: org.id });
    expect(again.name).toBe('Round Trip Marine');
    expect(again.renewalMarginMonths).toBe(6); // column default from the migration
    expect(again.createdAt).toBeInstanceOf(Date);
  });

  it('enforces the unique e-mail index, so a sign-up race cannot create two accounts', async () => {
    const email = uniqueEmail();
    await makeUser(await getEm(), { email });
    await expect(makeUser(await getEm(), { email })).rejects.toThrow(/unique|duplicate/i);
    expect(await (await getEm()).count(UserSchema, { email })).toBe(1);
  });

  it('a lost race on a unique value becomes a 409 with a plain message, not a 500', async () => {
    const { toErrorBody } = await import('@/lib/server/errors');
    const email = uniqueEmail();
    await makeUser(await getEm(), { email });
    const error = await makeUser(await getEm(), { email }).catch((e) => e);
    const { status, body } = toErrorBody(error);
    expect(status).toBe(409);
    expect(body.error.code).toBe('conflict');
    expect(body.error.message).not.toMatch(/duplicate key|app_user/);
  });

  it('never serialises the password hash', async () => {
    const user = await makeUser(await getEm());
    const json = JSON.stringify((await getEm()).getReference(UserSchema, user.id)) + JSON.stringify(user);
    expect(json).not.toContain('argon2');
  });
});

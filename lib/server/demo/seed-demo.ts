import type { EntityManager } from '@mikro-orm/postgresql';
import { MembershipSchema, OrganisationSchema, UserSchema, type Role } from '@/entities';
import { hashPassword } from '../auth/password';
import { audit } from '../audit';
import demo from '@/scripts/demo-sign-ins.json' with { type: 'json' };

/**
 * The invented demo scenario. Runs once: when the demo organisation exists it does nothing,
 * so a second start keeps user data and duplicates nothing.
 */
export async function seedDemo(em: EntityManager): Promise<{ created: boolean }> {
  if (await em.count(OrganisationSchema, { slug: demo.organisation.slug })) return { created: false };
  await em.transactional(async (tx) => {
    const organisation = tx.create(OrganisationSchema, { slug: demo.organisation.slug, name: demo.organisation.name, fittingRatePerKg: 14 });
    const passwordHash = await hashPassword(demo.password);
    for (const person of demo.users) {
      const user = (await tx.findOne(UserSchema, { email: person.email })) ?? tx.create(UserSchema, { email: person.email, name: person.name, passwordHash, emailVerifiedAt: new Date() });
      tx.create(MembershipSchema, { organisation, user, role: person.role as Role });
    }
    audit(tx, { organisationId: organisation.id, action: 'organisation.seeded', details: { scenario: 'demo' } });
  });
  return { created: true };
}

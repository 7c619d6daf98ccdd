import type { EntityManager } from '@mikro-orm/postgresql';
import { addDays } from 'date-fns';
import { TRIAL_DAYS } from '@/lib/billing/plans';
import { MembershipSchema, OrganisationSchema, UserSchema } from '@/entities';
import { createOrganisationSchema } from '@/lib/schemas/accounts';
import { AppError } from '../../errors';
import { auditEvent } from '../../audit';
import type { CurrentUser } from '../../org-context';

// Letters that Unicode decomposition leaves whole, common in harbour and company names.
const LETTERS: Record<string, string> = { ø: 'o', æ: 'ae', å: 'a', ß: 'ss', œ: 'oe', ł: 'l', đ: 'd', þ: 'th' };

export function slugify(name: string) {
  const base = name
    .toLowerCase()
    .replace(/[øæåßœłđþ]/g, (c) => LETTERS[c])
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 48);
  return base.length >= 2 ? base : `org-${base}`;
}

/** Creates an organisation with the user as its first owner. */
export async function createOrganisation({ em, user, input, ip }: { em: EntityManager; user: CurrentUser; input: unknown; ip?: string | null }) {
  const { name } = createOrganisationSchema.parse(input);
  if (!user.emailVerified) throw new AppError('forbidden', 'Confirm your e-mail address before creating an organisation.');
  const base = slugify(name);
  let slug = base;
  for (let n = 2; await em.count(OrganisationSchema, { slug }); n++) slug = `${base}-${n}`;
  // Every new organisation starts with the free trial; the plan is chosen on the Billing page.
  const organisation = em.create(OrganisationSchema, { slug, name, subscriptionStatus: 'trialing', trialEndsAt: addDays(new Date(), TRIAL_DAYS) });
  em.create(MembershipSchema, { organisation, user: em.getReference(UserSchema, user.id), role: 'owner' });
  auditEvent(em, { organisationId: organisation.id, actor: user, action: 'organisation.created', targetType: 'organisation', targetId: organisation.id, details: { name }, ipAddress: ip });
  return organisation;
}

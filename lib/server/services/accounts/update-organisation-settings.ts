import { z } from 'zod';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';

export const organisationSettingsSchema = z.object({
  name: z.string().trim().min(2, 'Use at least 2 characters.').max(120, 'Use at most 120 characters.'),
  renewalMarginMonths: z.coerce.number({ error: 'Enter a whole number of months.' }).int('Enter a whole number of months.').min(0, 'The margin cannot be negative.').max(36, 'Use at most 36 months.'),
  fittingRatePerKg: z.preprocess((v) => (v === '' || v === undefined ? null : v), z.coerce.number({ error: 'Enter a number.' }).min(0, 'The rate cannot be negative.').max(100_000).nullable()),
  currency: z.string().trim().regex(/^[A-Z]{3}$/, 'Use a three-letter currency code such as EUR.'),
});

/** The owner's settings: name, the renewal margin the scheduler keeps, and the fitting rate used to cost options. */
export async function updateOrganisationSettings(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'team:manage');
  const data = organisationSettingsSchema.parse(input);
  const org = ctx.organisation;
  const marginChanged = data.renewalMarginMonths !== org.renewalMarginMonths;
  const before = { name: org.name, renewalMarginMonths: org.renewalMarginMonths, fittingRatePerKg: org.fittingRatePerKg ?? null, currency: org.currency };
  ctx.em.assign(org, data);
  audit(ctx, { action: 'organisation.settings-changed', targetType: 'organisation', targetId: org.id, details: { from: before, to: data } });
  // A different margin moves every deadline: the proposals follow.
  if (marginChanged) ctx.effects.organisationChanged();
  return org;
}

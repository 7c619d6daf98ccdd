import { organisationSettingsSchema } from '@/lib/schemas/accounts';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';

/**
 * The owner's settings: name, the renewal margin and the renewal threshold the scheduler works from,
 * and the fitting rate used to cost options.
 */
export async function updateOrganisationSettings(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'team:manage');
  const data = organisationSettingsSchema.parse(input);
  const org = ctx.organisation;
  const scheduleChanged = data.renewalMarginMonths !== org.renewalMarginMonths || data.renewalThresholdPercent !== org.renewalThresholdPercent;
  const before = { name: org.name, renewalMarginMonths: org.renewalMarginMonths, renewalThresholdPercent: org.renewalThresholdPercent, fittingRatePerKg: org.fittingRatePerKg ?? null, currency: org.currency };
  ctx.em.assign(org, data);
  audit(ctx, { action: 'organisation.settings-changed', targetType: 'organisation', targetId: org.id, details: { from: before, to: data } });
  // A different margin moves every deadline, a different threshold every renew-by date: the proposals follow.
  if (scheduleChanged) ctx.effects.organisationChanged();
  return org;
}

import { AssetSchema } from '@/entities';
import { assetLimitOf, PLANS, TRIAL_PLAN } from '@/lib/billing/plans';
import { AppError } from '../../errors';
import type { OrgContext } from '../../org-context';
import { lockRow } from '../../sql';

/**
 * The plan's limit on active assets, checked when an asset is created or restored. The organisation's row
 * is locked until the commit, so creates at the same moment count one after another and the last free
 * slot is taken once; the caller inserts in the same transaction.
 */
export async function assertAssetLimit(ctx: OrgContext): Promise<void> {
  const org = ctx.organisation;
  await lockRow(ctx.em, 'organisation', org.id);
  const limit = assetLimitOf({ plan: org.plan ?? null, subscriptionStatus: org.subscriptionStatus, trialEndsAt: org.trialEndsAt ?? null, stripeSubscriptionId: org.stripeSubscriptionId ?? null, pastDueSince: org.pastDueSince ?? null });
  if (limit === null) return;
  const active = await ctx.em.count(AssetSchema, { organisation: org, archivedAt: null });
  if (active >= limit) {
    const planName = PLANS[org.plan ?? TRIAL_PLAN].name;
    throw new AppError('conflict', `Your ${planName} plan${org.plan ? '' : ' (trial)'} covers ${limit} active vessels and structures and ${active} are in use. Archive one, or move to a larger plan on the Billing page.`);
  }
}

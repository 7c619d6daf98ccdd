import { RenewalSchema } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';
import { classifyRemaining } from '@/lib/surveys/criteria';
import { computePlans } from './compute-plans';
import { inSequence, pgArray } from '../../sql';
import { storeOutlooks } from './stored-outlooks';

/**
 * Brings the scheduler's proposals up to date for some assets: a group gets a 'proposed' renewal at
 * the docking the forecast picks, a stale proposal is withdrawn, and anything a planner has
 * confirmed, ordered, fitted or cancelled is never touched. Also records each asset's outlook, and stores
 * the plan summary the fleet overview reads (stored-outlooks.ts), as of `today`.
 * Runs inside the caller's unit of work (see unit-of-work.ts): services record ctx.effects.assetChanged
 * and the unit of work calls this before commit.
 */
export async function recomputeRenewals(ctx: OrgContext, assetIds?: string[], today = new Date()) {
  // Derived data that any member's permitted change may refresh (an inspector's survey moves proposals).
  requirePermission(ctx, 'org:read');
  // One recompute of an asset at a time, in asset-id order: a second change to the same asset waits here and then
  // computes from what the first committed, so neither stores a summary (or proposals) without the other's change.
  await ctx.em.execute(
    `select id from asset where organisation_id = ? and archived_at is null ${assetIds ? 'and id = any(?::uuid[])' : ''} order by id for no key update`,
    assetIds ? [ctx.organisation.id, pgArray(assetIds)] : [ctx.organisation.id],
  );
  const plans = await computePlans(ctx, { assetIds, today });
  const groupIds = plans.flatMap((p) => p.groups.map((g) => g.group.id));
  const [proposed, cancelled] = groupIds.length
    ? await inSequence(() => ctx.em.find(RenewalSchema, { group: { $in: groupIds }, status: 'proposed' }), () => ctx.em.find(RenewalSchema, { group: { $in: groupIds }, status: 'cancelled' }, { fields: ['group', 'docking'] }))
    : [[], []];
  // A planner who cancelled a proposal at a docking has decided: it is not proposed there again.
  const rejected = new Set(cancelled.map((r) => `${r.group.id}:${r.docking.id}`));
  const proposedByGroup = new Map<string, typeof proposed>();
  for (const r of proposed) proposedByGroup.set(r.group.id, [...(proposedByGroup.get(r.group.id) ?? []), r]);
  let created = 0;
  let withdrawn = 0;
  for (const plan of plans) {
    for (const g of plan.groups) {
      const existing = proposedByGroup.get(g.group.id) ?? [];
      const p = g.proposal;
      if (p?.status === 'proposed' && p.dockingId && !g.booked && !rejected.has(`${g.group.id}:${p.dockingId}`)) {
        const keep = existing.find((r) => r.docking.id === p.dockingId);
        for (const r of existing) if (r !== keep) (ctx.em.remove(r), withdrawn++);
        const latest = g.surveys.at(-1);
        const reason = latest && classifyRemaining(latest.remainingFraction, g.group.model.utilisationFactor) !== 'sound' ? 'survey-finding' : 'forecast-depletion';
        if (keep) {
          keep.rationale = p.reason;
          keep.reason = reason;
        } else {
          ctx.em.create(RenewalSchema, { organisation: ctx.organisation, docking: p.dockingId, group: g.group, status: 'proposed', reason, quantity: g.group.quantity, rationale: p.reason, notes: null, confirmedByEmail: null, confirmedAt: null, fittedOn: null, newGroupId: null });
          created++;
        }
      } else {
        for (const r of existing) (ctx.em.remove(r), withdrawn++);
      }
    }
    if (plan.asset.outlook !== plan.outlook) {
      plan.asset.outlook = plan.outlook;
      plan.asset.outlookChangedAt = today;
    }
  }
  await storeOutlooks(ctx, plans, today);
  return { plans, created, withdrawn };
}

import { RenewalSchema } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';
import { getDockingOrThrow } from './dockings';

/** The renewals booked at a docking, as plain rows for the renewals table and the anode list. */
export async function listDockingRenewals(ctx: OrgContext, dockingId: string) {
  requirePermission(ctx, 'org:read');
  const docking = await getDockingOrThrow(ctx, dockingId);
  const renewals = await ctx.em.find(RenewalSchema, { docking }, { populate: ['group', 'group.zone'], orderBy: { createdAt: 'asc' } });
  const rows = renewals
    .map((r) => ({
      id: r.id,
      status: r.status,
      reason: r.reason,
      quantity: r.quantity,
      notes: r.notes ?? null,
      rationale: r.rationale ?? null,
      confirmedBy: r.confirmedByEmail ?? null,
      fittedOn: r.fittedOn ?? null,
      groupId: r.group.id,
      groupLabel: r.group.label,
      zone: r.group.zone?.name ?? null,
      designation: r.group.model.designation,
      alloy: r.group.model.alloy,
      mounting: r.group.model.mounting,
      netMassKg: r.group.model.netMassKg,
      grossMassKg: r.group.model.grossMassKg,
      positions: r.group.positions ?? null,
      installedOn: r.group.installedOn,
    }))
    .sort((a, b) => (a.zone ?? '').localeCompare(b.zone ?? '') || a.groupLabel.localeCompare(b.groupLabel));
  return { docking, rows };
}
export type DockingRenewalRow = Awaited<ReturnType<typeof listDockingRenewals>>['rows'][number];

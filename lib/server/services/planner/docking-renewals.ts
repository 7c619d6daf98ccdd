import { RenewalSchema } from '@/entities';
import type { AnodeGroupModelSnapshot, RenewalReason, RenewalStatus } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';
import { notFound } from '../../errors';
import { uuidOrNotFound } from '../../ids';
import { getDockingOrThrow } from './dockings';

const byZoneThenLabel = (a: { zone: string | null; groupLabel: string }, b: { zone: string | null; groupLabel: string }) =>
  (a.zone ?? '').localeCompare(b.zone ?? '') || a.groupLabel.localeCompare(b.groupLabel);

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
    .sort(byZoneThenLabel);
  return { docking, rows };
}
export type DockingRenewalRow = Awaited<ReturnType<typeof listDockingRenewals>>['rows'][number];

type RenewalRowSql = {
  docking_id: string;
  id: string | null;
  status: RenewalStatus;
  reason: RenewalReason;
  quantity: number;
  notes: string | null;
  rationale: string | null;
  confirmed_by_email: string | null;
  fitted_on: string | null;
  group_id: string;
  label: string;
  zone_name: string | null;
  model: AnodeGroupModelSnapshot;
  positions: string | null;
  installed_on: string;
};

/**
 * The rows of listDockingRenewals without the docking and the entities: what the renewals JSON API answers.
 * One plain statement (the docking, checked to be the organisation's, with its renewals, groups and zones)
 * instead of two ORM queries that hydrate the docking, its asset, the renewals, groups and zones only to copy a
 * few fields out (the API is benchmarked: the ORM's hydration was most of its cost).
 */
export async function listDockingRenewalRows(ctx: OrgContext, dockingId: string): Promise<DockingRenewalRow[]> {
  requirePermission(ctx, 'org:read');
  uuidOrNotFound(dockingId, 'Docking');
  const found = await ctx.em.execute<RenewalRowSql[]>(
    `select d.id as docking_id, r.id, r.status, r.reason, r.quantity, r.notes, r.rationale, r.confirmed_by_email,
            to_char(r.fitted_on, 'YYYY-MM-DD') as fitted_on, g.id as group_id, g.label, z.name as zone_name, g.model, g.positions,
            to_char(g.installed_on, 'YYYY-MM-DD') as installed_on
       from docking d
       left join renewal r on r.docking_id = d.id
       left join anode_group g on g.id = r.group_id
       left join zone z on z.id = g.zone_id
      where d.id = ? and d.organisation_id = ?
      order by r.created_at asc`,
    [dockingId, ctx.organisation.id],
  );
  if (!found.length) throw notFound('Docking');
  return found
    .filter((r) => r.id !== null)
    .map((r) => ({
      id: r.id!,
      status: r.status,
      reason: r.reason,
      quantity: r.quantity,
      notes: r.notes ?? null,
      rationale: r.rationale ?? null,
      confirmedBy: r.confirmed_by_email ?? null,
      fittedOn: r.fitted_on ?? null,
      groupId: r.group_id,
      groupLabel: r.label,
      zone: r.zone_name ?? null,
      designation: r.model.designation,
      alloy: r.model.alloy,
      mounting: r.model.mounting,
      netMassKg: r.model.netMassKg,
      grossMassKg: r.model.grossMassKg,
      positions: r.positions ?? null,
      installedOn: r.installed_on,
    }))
    .sort(byZoneThenLabel);
}

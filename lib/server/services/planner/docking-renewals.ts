import type { AnodeGroupModelSnapshot, RenewalReason, RenewalStatus } from '@/entities';
import { requirePermission, type OrgContext } from '../../org-context';
import { notFound } from '../../errors';
import { uuidOrNotFound } from '../../ids';
import { getDockingOrThrow } from './dockings';

const byZoneThenLabel = (a: { zone: string | null; groupLabel: string }, b: { zone: string | null; groupLabel: string }) =>
  (a.zone ?? '').localeCompare(b.zone ?? '') || a.groupLabel.localeCompare(b.groupLabel);

/** A renewal booked at a docking, as the renewals table, the API and the anode list read it. */
export interface DockingRenewalRow {
  id: string;
  status: RenewalStatus;
  reason: RenewalReason;
  quantity: number;
  notes: string | null;
  rationale: string | null;
  confirmedBy: string | null;
  /** YYYY-MM-DD. */
  fittedOn: string | null;
  groupId: string;
  groupLabel: string;
  zone: string | null;
  designation: string;
  alloy: AnodeGroupModelSnapshot['alloy'];
  mounting: AnodeGroupModelSnapshot['mounting'];
  netMassKg: number;
  grossMassKg: number;
  positions: string | null;
  /** YYYY-MM-DD. */
  installedOn: string;
}

/** The docking (with its asset) and its renewals as plain rows: the docking page and the anode list. */
export async function listDockingRenewals(ctx: OrgContext, dockingId: string) {
  const docking = await getDockingOrThrow(ctx, dockingId);
  const rows = await listDockingRenewalRows(ctx, dockingId);
  return { docking, rows };
}

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
 * The renewals booked at a docking as plain rows, in one plain statement (the docking, checked to be the
 * organisation's, with its renewals, groups and zones) rather than hydrating them through the ORM only to copy a few
 * fields out (the renewals API is benchmarked: hydration was most of its cost). Sorted by zone, then group.
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

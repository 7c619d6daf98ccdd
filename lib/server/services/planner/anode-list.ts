import { format } from 'date-fns';
import { buildAnodeList, anodeListCsv, type AnodeListInput } from '@/lib/anode-list';
import { renderAnodeListPdf } from '@/lib/anode-list/render-anode-list-pdf';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { toDateOnly } from '@/lib/dates/date-only';
import { listDockingRenewals } from './docking-renewals';
import { loadGroupForecasts } from '../forecast/group-forecasts';

/**
 * The dry-dock anode list of a docking: every renewal not cancelled, with the asset's particulars and
 * each group's renew-by date (the same date the planner and the asset page show).
 */
export async function anodeListFor(ctx: OrgContext, dockingId: string) {
  requirePermission(ctx, 'org:print');
  const { docking, rows } = await listDockingRenewals(ctx, dockingId);
  const a = docking.asset;
  // Fitted groups are closed and have no forecast: their lines carry no renew-by date.
  const forecasts = rows.length ? await loadGroupForecasts(ctx, { assetIds: [a.id] }) : [];
  const renewBy = new Map(forecasts.map((f) => [f.group.id, f.forecast?.renewBy ? toDateOnly(f.forecast.renewBy) : null]));
  const particulars: [string, string][] =
    a.kind === 'vessel'
      ? [
          ['Type', a.vesselType ?? '—'],
          ['IMO number', a.imoNumber ?? '—'],
          ['Length between perpendiculars × beam × draught', a.lengthBppM ? `${a.lengthBppM} × ${a.beamM ?? '?'} × ${a.draughtM ?? '?'} m` : '—'],
          ['Hull', a.hullMaterial ?? '—'],
        ]
      : [
          ['Structure', a.structureType ?? '—'],
          ['Location', a.location ?? '—'],
          ['Piles', a.pileCount ? `${a.pileCount} × Ø ${a.pileDiameterM ?? '?'} m` : '—'],
        ];
  const live = rows.filter((r) => r.status !== 'cancelled');
  const confirmedBy = live.find((r) => r.confirmedBy)?.confirmedBy ?? null;
  const input: AnodeListInput = {
    organisation: { name: ctx.organisation.name },
    asset: { name: a.name, kind: a.kind, particulars },
    docking: { kind: docking.kind, plannedStart: docking.plannedStart, plannedEnd: docking.plannedEnd ?? null, actualStart: docking.actualStart ?? null, yard: docking.yard ?? null, reference: docking.reference ?? null },
    renewals: live.map((r) => ({
      zone: r.zone,
      groupLabel: r.groupLabel,
      designation: r.designation,
      alloy: r.alloy,
      mounting: r.mounting,
      quantity: r.quantity,
      netMassKg: r.netMassKg,
      grossMassKg: r.grossMassKg,
      positions: r.positions,
      reason: r.reason.replace(/-/g, ' '),
      status: r.status,
      renewBy: r.status === 'fitted' ? null : (renewBy.get(r.groupId) ?? null),
    })),
    revision: { number: 1, preparedBy: confirmedBy ?? ctx.user.name, preparedAt: new Date() },
    printedAt: new Date(),
    printedBy: ctx.user.name,
  };
  const list = buildAnodeList(input);
  const filename = `anode-list-${a.name.replace(/[^A-Za-z0-9]+/g, '-')}-${docking.plannedStart}`;
  return { list, filename };
}

export async function anodeListPdf(ctx: OrgContext, dockingId: string) {
  const { list, filename } = await anodeListFor(ctx, dockingId);
  const pdf = await renderAnodeListPdf(list);
  audit(ctx, { action: 'docking.anode-list-printed', targetType: 'docking', targetId: dockingId, details: { printedAt: format(new Date(), 'yyyy-MM-dd HH:mm') } });
  return { pdf, filename: `${filename}.pdf`, list };
}

export async function anodeListCsvFor(ctx: OrgContext, dockingId: string) {
  const { list, filename } = await anodeListFor(ctx, dockingId);
  return { csv: anodeListCsv(list), filename: `${filename}.csv` };
}

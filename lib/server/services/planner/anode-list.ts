import { format } from 'date-fns';
import { AnodeGroupSchema, AnodeModelSchema } from '@/entities';
import { buildAnodeList, anodeListCsv, type AnodeListDimensions, type AnodeListInput } from '@/lib/anode-list';
import { BUILTIN_ANODE_MODELS } from '@/lib/cp';
import { HULL_MATERIAL_LABELS, inSentence, RENEWAL_REASON_LABELS, ROLE_LABELS, STRUCTURE_TYPE_LABELS } from '@/lib/labels';
import { renderAnodeListPdf } from '@/lib/anode-list/render-anode-list-pdf';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { toDateOnly } from '@/lib/dates/date-only';
import { listDockingRenewals } from './docking-renewals';
import { loadGroupForecasts } from '../forecast/group-forecasts';
import { isUuid } from '../../ids';
import { buildAssetDrawing } from '@/lib/drawings/asset-drawing';
import { formatPosition } from '@/lib/drawings/parse-position';
import { positionOf } from '@/lib/drawings/position-of';
import { parseDateOnly } from '@/lib/dates/date-only';

/**
 * The catalogue dimensions of the models on the list, by catalogue key (a group keeps a snapshot of
 * its model without them): built-in models from lib/cp, the organisation's own in one query.
 */
async function dimensionsByKey(ctx: OrgContext, keys: string[]): Promise<Map<string, AnodeListDimensions>> {
  const out = new Map<string, AnodeListDimensions>();
  const orgIds: string[] = [];
  for (const key of new Set(keys)) {
    if (key.startsWith('builtin:')) {
      const model = BUILTIN_ANODE_MODELS.find((m) => m.id === key.slice('builtin:'.length));
      if (model) out.set(key, model.dimensions);
    } else if (key.startsWith('org:') && isUuid(key.slice(4))) orgIds.push(key.slice(4));
  }
  if (orgIds.length) {
    for (const row of await ctx.em.find(AnodeModelSchema, { id: { $in: orgIds }, organisation: ctx.organisation })) out.set(`org:${row.id}`, row.dimensions);
  }
  return out;
}

/**
 * The anode list of a docking or campaign: every renewal not cancelled, with the asset's particulars,
 * each model's dimensions and each group's renew-by date (the same date the planner and the asset
 * page show). The member who prints it is the one named, with their role, as having prepared it.
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
          ['Hull', a.hullMaterial ? (HULL_MATERIAL_LABELS[a.hullMaterial] ?? '—') : '—'],
        ]
      : [
          ['Structure', a.structureType ? (STRUCTURE_TYPE_LABELS[a.structureType] ?? '—') : '—'],
          ['Location', a.location ?? '—'],
          ['Piles', a.pileCount ? `${a.pileCount} × Ø ${a.pileDiameterM ?? '?'} m` : '—'],
        ];
  const live = rows.filter((r) => r.status !== 'cancelled');
  // The groups' snapshots carry the catalogue key.
  const groups = live.length ? await ctx.em.find(AnodeGroupSchema, { id: { $in: live.map((r) => r.groupId) }, organisation: ctx.organisation }) : [];
  const modelKey = new Map(groups.map((g) => [g.id, g.model.key]));
  // The yard works from the engineer's own words; the structured reading (what the drawing shows) follows as "Read as: …".
  const positionOfGroup = new Map(groups.map((g) => [g.id, positionOf(g, a.kind)]));
  const positionWords = new Map(groups.map((g) => [g.id, formatPosition(positionOfGroup.get(g.id)!)]));
  const dimensions = await dimensionsByKey(ctx, groups.map((g) => g.model.key));
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
      dimensions: dimensions.get(modelKey.get(r.groupId) ?? '') ?? null,
      positions: r.positions,
      positionReadAs: r.positions ? (positionWords.get(r.groupId) ?? null) : null,
      reason: inSentence(RENEWAL_REASON_LABELS[r.reason] ?? 'Other'),
      status: r.status,
      renewBy: r.status === 'fitted' ? null : (renewBy.get(r.groupId) ?? null),
    })),
    revision: { number: 1, preparedBy: ctx.user.name, preparedByRole: ROLE_LABELS[ctx.role], preparedAt: new Date() },
    printedAt: new Date(),
    printedBy: ctx.user.name,
  };
  const list = buildAnodeList(input);
  // The drawing for the yard or the divers: each line's group at its position, filled to what the forecast leaves at the docking.
  const atDocking = parseDateOnly(docking.actualStart ?? docking.plannedStart);
  const forecastOf = new Map(forecasts.map((f) => [f.group.id, f.forecast]));
  const drawn = buildAssetDrawing(
    a,
    live.map((r) => {
      // A fitted renewal is a new anode: full. A line without a forecast is drawn as "not known", never as used up.
      const forecast = r.status === 'fitted' ? null : forecastOf.get(r.groupId);
      const remainingFraction = r.status === 'fitted' ? 1 : forecast ? Math.max(0, Math.min(1, forecast.remainingFractionAt(atDocking))) : null;
      return { id: r.groupId, label: r.groupLabel, quantity: r.quantity, position: positionOfGroup.get(r.groupId) ?? positionOf({ positions: r.positions }, a.kind), remainingFraction };
    }),
    [],
  );
  const drawing = live.length ? drawn.drawing : null;
  const filename = `anode-list-${a.name.replace(/[^A-Za-z0-9]+/g, '-')}-${docking.plannedStart}`;
  return { list, filename, drawing };
}

export async function anodeListPdf(ctx: OrgContext, dockingId: string) {
  const { list, filename, drawing } = await anodeListFor(ctx, dockingId);
  const pdf = await renderAnodeListPdf(list, drawing);
  audit(ctx, { action: 'docking.anode-list-printed', targetType: 'docking', targetId: dockingId, details: { printedAt: format(new Date(), 'yyyy-MM-dd HH:mm') } });
  return { pdf, filename: `${filename}.pdf`, list };
}

export async function anodeListCsvFor(ctx: OrgContext, dockingId: string) {
  const { list, filename } = await anodeListFor(ctx, dockingId);
  return { csv: anodeListCsv(list), filename: `${filename}.csv` };
}

import { AnodeGroupSchema, RenewalSchema, ZoneSchema, type Design } from '@/entities';
import { formatDateOnly } from '@/lib/dates/date-only';
import { fitDesignSchema, fitPositionsFrom } from '@/lib/schemas/fit-design';
import { proposePositions, type ProposedPosition } from '@/lib/drawings/propose-positions';
import { storedPosition } from '@/lib/drawings/position-of';
import type { DesignRecord, StoredResults } from '@/lib/schemas/design-record';
import { AppError } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import type { CatalogueModel } from '../catalogue/anode-models';
import { getDockingOrThrow } from '../planner/dockings';
import { modelSnapshot, shareOfDesignCurrent } from '../register/anode-groups';
import { getDesignOrThrow } from './get-design';
import { readDesignRecord } from './read-design-record';

/*
 * "Fit this design": an APPROVED revision's anodes, zone by zone (the distribution's count of the
 * revision's model in each zone), reach the register in one of two ways:
 * - installed: one installed group per zone with anodes, fitted on the day the user enters, linked to
 *   the design (so its share of the design current drives the forecast); a zone the asset does not
 *   have yet is created from the revision's surface;
 * - renewal: at a planned docking or campaign of the asset, a confirmed renewal of the zone's fitted
 *   group of the same model, for the design's quantity (a renewal refits the group's own model, so a
 *   zone without such a group is refused with the advice to fit the design as installed instead).
 * A draft or checked revision is refused. Fitting as installed a revision already fitted on the asset
 * (its groups still in place) is refused unless the user confirms a second fit, and booking a group
 * already booked for renewal is refused as addRenewal does: a double click, or the same form sent
 * twice, never doubles the anodes.
 */

export interface FitDesignResult {
  mode: 'installed' | 'renewal';
  /** Zones, quantities and models written. */
  lines: { zone: string; quantity: number; designation: string }[];
  message: string;
}

interface ZoneCount {
  surface: DesignRecord['inputs']['surfaces'][number];
  count: number;
}

function zoneCounts(design: Design, record: DesignRecord, results: StoredResults): ZoneCount[] {
  const counts = record.inputs.surfaces
    .map((surface) => ({ surface, count: results.distribution.surfaces.find((s) => s.name === surface.name)?.count ?? 0 }))
    .filter((z) => z.count > 0);
  if (!counts.length) throw new AppError('conflict', `Revision ${design.revision} gives no zone any anodes, so there is nothing to fit.`);
  return counts;
}

/** A label free on the asset: the zone's name, else with the revision, else numbered. */
function freeLabel(taken: Set<string>, zoneName: string, revision: number): string {
  const base = zoneName.slice(0, 60);
  const candidates = [base, `${zoneName.slice(0, 46)} (design rev ${revision})`];
  for (let n = 2; candidates.length < 50; n++) candidates.push(`${zoneName.slice(0, 40)} (design rev ${revision}, ${n})`);
  const label = candidates.find((c) => !taken.has(c))!;
  taken.add(label);
  return label;
}

/**
 * Where the revision's anodes go, proposed zone by zone (lib/drawings/propose-positions.ts) for the fit form, which
 * lets the engineer edit each before "fit this design". Empty unless the revision is approved with results.
 */
export async function proposeDesignPositions(ctx: OrgContext, designId: string): Promise<ProposedPosition[]> {
  requirePermission(ctx, 'org:read');
  const design = await getDesignOrThrow(ctx, designId);
  if (design.status !== 'approved') return [];
  const record = readDesignRecord(design);
  if (!record.results) return [];
  const counts = record.inputs.surfaces.map((surface) => ({ name: surface.name, kind: surface.kind, count: record.results!.distribution.surfaces.find((s) => s.name === surface.name)?.count ?? 0 }));
  return proposePositions(design.asset, counts);
}

export async function fitDesign(ctx: OrgContext, designId: string, input: unknown): Promise<FitDesignResult> {
  const data = fitDesignSchema.parse(input);
  // Read before anything is written, so a bad position refuses the fit whole.
  const edited = fitPositionsFrom(input);
  requirePermission(ctx, data.mode === 'installed' ? 'asset:write' : 'renewal:write');
  const design = await getDesignOrThrow(ctx, designId);
  if (design.status !== 'approved') {
    throw new AppError('conflict', `Revision ${design.revision} is ${design.status === 'draft' ? 'a draft' : 'checked but not approved'}: only an approved revision can be fitted. Have it approved first.`);
  }
  const record = readDesignRecord(design);
  if (!record.results || !record.anodeModel) throw new AppError('conflict', `Revision ${design.revision} has no stored results to fit.`);
  const results = record.results;
  const asset = design.asset;
  const counts = zoneCounts(design, record, results);
  // The model as the revision was computed with it (the catalogue may have changed since).
  const model = modelSnapshot({ ...record.anodeModel, archived: false } as unknown as CatalogueModel);

  const fitted = data.mode === 'installed' ? await ctx.em.find(AnodeGroupSchema, { asset, design, removedOn: null }) : [];
  if (fitted.length && !data.confirmSecondFit) {
    const since = fitted.map((g) => g.installedOn).sort()[0];
    throw new AppError('conflict', `Revision ${design.revision} is already fitted on ${asset.name} (${fitted.length} group${fitted.length === 1 ? '' : 's'} since ${formatDateOnly(since)}). Tick "Fit it again" only if a second set of these anodes is really being fitted.`, {
      confirmSecondFit: ['Already fitted: tick this only to fit a second set.'],
    });
  }

  const zones = await ctx.em.find(ZoneSchema, { asset, archivedAt: null });
  const zoneNamed = (name: string) => zones.find((z) => z.name === name) ?? null;

  if (data.mode === 'renewal') {
    const docking = await getDockingOrThrow(ctx, data.dockingId);
    if (docking.asset.id !== asset.id) throw new AppError('invalid', 'That docking is not for this asset.', { dockingId: [`Choose a docking or campaign of ${asset.name}.`] });
    if (docking.status !== 'planned') throw new AppError('conflict', 'Renewals are booked on planned dockings.', { dockingId: ['Choose a planned docking or campaign.'] });
    const live = await ctx.em.find(AnodeGroupSchema, { asset, removedOn: null }, { populate: ['zone'], orderBy: { label: 'asc' } });
    const targets = counts.map(({ surface, count }) => ({ surface, count, group: live.find((g) => g.zone?.name === surface.name && g.model.key === model.key) ?? null }));
    const missing = targets.filter((t) => !t.group).map((t) => t.surface.name);
    if (missing.length) {
      throw new AppError('conflict', `${missing.join(', ')} ${missing.length === 1 ? 'has' : 'have'} no fitted group of ${model.designation} to renew. Fit the design as installed on the day the anodes go on instead.`, {
        mode: ['Renewals refit a group of the same model; fit this design as installed.'],
      });
    }
    const groups = targets.map((t) => t.group!);
    const open = await ctx.em.find(RenewalSchema, { group: { $in: groups }, status: { $in: ['confirmed', 'ordered'] } }, { populate: ['group'] });
    if (open.length) throw new AppError('conflict', `${open.map((r) => `"${r.group.label}"`).join(', ')} ${open.length === 1 ? 'is' : 'are'} already booked for renewal; nothing was booked.`);
    await ctx.em.nativeDelete(RenewalSchema, { group: { $in: groups }, status: 'proposed' });
    for (const t of targets) {
      const r = ctx.em.create(RenewalSchema, {
        organisation: ctx.organisation,
        docking,
        group: t.group!,
        status: 'confirmed',
        reason: 'other',
        quantity: t.count,
        notes: `To design revision ${design.revision}: ${t.count} × ${model.designation}.`,
        rationale: null,
        confirmedByEmail: ctx.user.email,
        confirmedAt: new Date(),
        fittedOn: null,
        newGroupId: null,
      });
      audit(ctx, { action: 'renewal.booked', targetType: 'renewal', targetId: r.id, details: { asset: asset.name, group: t.group!.label, reason: 'other', design: design.id, revision: design.revision, quantity: t.count } });
    }
    audit(ctx, { action: 'design.fitted', targetType: 'design', targetId: design.id, details: { revision: design.revision, asset: asset.name, mode: 'renewal', docking: docking.id, zones: targets.map((t) => `${t.surface.name}: ${t.count}`).join('; ') } });
    ctx.effects.assetChanged(asset.id);
    const total = targets.reduce((s, t) => s + t.count, 0);
    return {
      mode: 'renewal',
      lines: targets.map((t) => ({ zone: t.surface.name, quantity: t.count, designation: model.designation })),
      message: `${total} × ${model.designation} booked as renewals in ${targets.length} zone${targets.length === 1 ? '' : 's'} at the ${docking.kind === 'campaign' ? 'campaign' : 'docking'} from ${formatDateOnly(docking.plannedStart)}.`,
    };
  }

  const taken = new Set((await ctx.em.find(AnodeGroupSchema, { asset, removedOn: null })).map((g) => g.label));
  // Each zone's position: as the engineer left it on the form, else the proposal.
  const proposed = proposePositions(asset, counts.map((c) => ({ name: c.surface.name, kind: c.surface.kind, count: c.count })));
  const positionText = (zoneName: string): string | null => {
    const kept = edited.find((e) => e.zone === zoneName);
    return kept ? kept.text : proposed.find((p) => p.zone === zoneName)?.text || null;
  };
  // Every zone's position is read before anything is written: one that cannot be stored refuses the fit whole, with
  // the message on that zone's position field.
  const positionsToStore = new Map(
    counts.map(({ surface }) => {
      const at = edited.findIndex((e) => e.zone === surface.name);
      return [surface.name, storedPosition(positionText(surface.name), asset.kind, at >= 0 ? `position-${at}` : 'positions')] as const;
    }),
  );
  for (const { surface, count } of counts) {
    let zone = zoneNamed(surface.name);
    if (!zone) {
      zone = ctx.em.create(ZoneSchema, {
        asset,
        name: surface.name,
        kind: surface.kind,
        areaM2: surface.areaM2,
        areaSource: surface.areaSource,
        coatingCategory: surface.coatingCategory,
        coatingAgeYears: surface.coatingAgeYears,
        waterType: record.inputs.water,
        climate: record.inputs.climate,
        depthBand: surface.depthBand,
        temperatureC: surface.temperatureC ?? null,
        drainsCurrent: surface.drainsCurrent ?? null,
        // The desk keeps mA/m², the zone A/m² (zoneToDeskSurface converts the other way).
        currentDensityOverride: surface.currentDensityOverride
          ? { initial: surface.currentDensityOverride.initial / 1000, mean: surface.currentDensityOverride.mean / 1000, final: surface.currentDensityOverride.final / 1000 }
          : null,
        sortOrder: zones.length,
        archivedAt: null,
      });
      zones.push(zone);
      audit(ctx, { action: 'zone.created', targetType: 'zone', targetId: zone.id, details: { asset: asset.name, name: zone.name, fromDesign: design.id } });
    }
    const group = ctx.em.create(AnodeGroupSchema, {
      organisation: ctx.organisation,
      asset,
      zone,
      label: freeLabel(taken, surface.name, design.revision),
      model,
      quantity: count,
      positions: positionText(surface.name),
      ...positionsToStore.get(surface.name)!,
      installedOn: data.fittedOn,
      design,
      meanCurrentA: shareOfDesignCurrent(results, surface.name, count),
      removedOn: null,
      removalReason: null,
      replacesGroupId: null,
      notes: `Fitted to design revision ${design.revision}.`,
    });
    audit(ctx, { action: 'anode-group.fitted', targetType: 'anode-group', targetId: group.id, details: { asset: asset.name, label: group.label, quantity: count, model: model.designation, design: design.id } });
  }
  audit(ctx, { action: 'design.fitted', targetType: 'design', targetId: design.id, details: { revision: design.revision, asset: asset.name, mode: 'installed', fittedOn: data.fittedOn, zones: counts.map((c) => `${c.surface.name}: ${c.count}`).join('; '), secondFit: fitted.length > 0 } });
  ctx.effects.assetChanged(asset.id);
  const total = counts.reduce((s, c) => s + c.count, 0);
  return {
    mode: 'installed',
    lines: counts.map((c) => ({ zone: c.surface.name, quantity: c.count, designation: model.designation })),
    message: `${total} × ${model.designation} recorded as fitted on ${formatDateOnly(data.fittedOn)} in ${counts.length} zone${counts.length === 1 ? '' : 's'} of ${asset.name}.`,
  };
}

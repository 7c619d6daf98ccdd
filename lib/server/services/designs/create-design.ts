import { z } from 'zod';
import { text } from '@/lib/schemas/text';
import { AssetSchema, DesignSchema, UserSchema, ZoneSchema, type Asset } from '@/entities';
import { climateFromTemperature, resistivityFor } from '@/lib/cp';
import { defaultStructureZones, defaultVesselZones } from '@/lib/design/default-zones';
import type { DeskInputs, DeskSurface } from '@/lib/schemas/design';
import { notFound } from '../../errors';
import { audit } from '../../audit';
import { requirePermission, type OrgContext } from '../../org-context';
import { APP_VERSION } from '../../app-version';
import { computeRecord } from './store-results';

const createDesignSchema = z.object({
  assetId: z.uuid('Choose an asset.'),
  title: text().trim().max(160).optional(),
});

/** Starting inputs for an asset: its zones when it has any, else estimates from its particulars. */
/**
 * A new design's inputs follow the asset's own practice: a vessel is sized by ship-hull practice over
 * its docking interval, a structure by harbour practice over its design life. The resistivity comes
 * from the water and the protective potential from the criterion for the metal, both shown as
 * estimated until the engineer enters a value.
 */
export function defaultInputs(asset: Asset, zones: DeskSurface[]): DeskInputs {
  const vessel = asset.kind === 'vessel';
  const climate = 'temperate' as const;
  const water = (asset.waterType ?? 'seawater') as DeskInputs['water'];
  const aluminiumHull = vessel && asset.hullMaterial === 'aluminium';
  return {
    designLifeYears: vessel ? 2.5 : (asset.designLifeYears ?? 20),
    climate,
    water,
    temperatureC: null,
    chloridePpm: null,
    // Placeholders until resolved: from the water (PSS-78) and from the criterion.
    resistivityOhmM: water === 'seawater' ? resistivityFor(climate) : 20,
    protectivePotentialV: aluminiumHull ? -0.9 : -0.8,
    protectedMetal: aluminiumHull ? 'aluminium' : 'steel',
    hullMaterial: vessel ? (asset.hullMaterial ?? 'steel') : null,
    anaerobic: false,
    nextDockingYears: vessel ? 2.5 : null,
    allowMagnesiumOnAluminium: false,
    demandMethod: vessel ? 'ship-hull' : 'harbour',
    hullCoatingCondition: 'good',
    serviceSpeedKnots: null,
    salinityPsu: null,
    // Fresh water has no estimate: the design asks for a measured resistivity rather than invent one.
    resistivitySource: 'water',
    potentialSource: 'criterion',
    // Zinc and aluminium passivate in fresh water: magnesium there (never on an aluminium hull).
    anodeModelKey: vessel ? (aluminiumHull ? 'builtin:TW-ZB-2510' : water === 'fresh' ? 'builtin:TW-MB-3015' : 'builtin:TW-AW-4020') : water === 'fresh' ? 'builtin:TW-MS-1005' : 'builtin:TW-AS-2018',
    surfaces: zones.length ? zones : vessel ? defaultVesselZones(asset) : defaultStructureZones(asset),
  };
}

export function zoneToDeskSurface(z: { name: string; kind: string; areaM2: number; areaSource: string; depthBand: string; coatingCategory: string; coatingAgeYears: number; currentDensityOverride?: { initial: number; mean: number; final: number } | null; drainsCurrent?: string | null }): DeskSurface {
  return {
    name: z.name,
    kind: z.kind as DeskSurface['kind'],
    areaM2: z.areaM2,
    areaSource: z.areaSource,
    depthBand: z.depthBand as DeskSurface['depthBand'],
    coatingCategory: z.coatingCategory as DeskSurface['coatingCategory'],
    coatingAgeYears: z.coatingAgeYears,
    // Zones store A/m2; the desk works in mA/m2.
    currentDensityOverride: z.currentDensityOverride ? { initial: z.currentDensityOverride.initial * 1000, mean: z.currentDensityOverride.mean * 1000, final: z.currentDensityOverride.final * 1000 } : null,
    drainsCurrent: (z.drainsCurrent as DeskSurface['drainsCurrent']) ?? null,
    temperatureC: null,
  };
}

export async function nextRevision(ctx: OrgContext, assetId: string) {
  const latest = await ctx.em.findOne(DesignSchema, { asset: assetId }, { orderBy: { revision: 'desc' }, fields: ['revision'] });
  return (latest?.revision ?? 0) + 1;
}

export async function createDesign(ctx: OrgContext, input: unknown) {
  requirePermission(ctx, 'design:write');
  const { assetId, title } = createDesignSchema.parse(input);
  const asset = await ctx.em.findOne(AssetSchema, { id: assetId, organisation: ctx.organisation, archivedAt: null });
  if (!asset) throw notFound('Asset');
  const zones = await ctx.em.find(ZoneSchema, { asset, archivedAt: null }, { orderBy: { sortOrder: 'asc', createdAt: 'asc' } });
  const inputs = defaultInputs(asset, zones.map(zoneToDeskSurface));
  if (inputs.temperatureC !== null) inputs.climate = climateFromTemperature(inputs.temperatureC);
  const revision = await nextRevision(ctx, asset.id);
  const { record } = await computeRecord(ctx, asset, inputs, `New revision ${revision} of ${asset.name}`);
  const design = ctx.em.create(DesignSchema, {
    organisation: ctx.organisation,
    asset,
    revision,
    title: title || `${asset.name}: anode design`,
    status: 'draft',
    ...record,
    appVersion: APP_VERSION,
    preparedBy: ctx.em.getReference(UserSchema, ctx.user.id),
    basedOnRevision: null,
    checkedBy: null,
    approvedBy: null,
    checkedAt: null,
    approvedAt: null,
  });
  audit(ctx, { action: 'design.created', targetType: 'design', targetId: design.id, details: { asset: asset.name, revision } });
  return design;
}

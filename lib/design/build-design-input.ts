import {
  anodeFromModel,
  coatingConstantsFor,
  currentDensityFor,
  CpInputError,
  HARBOUR_PRACTICE_DENSITY,
  HIGH_FLOW_CONDITION,
  HIGH_SPEED_FACTOR,
  HIGH_SPEED_KNOTS,
  HULL_COATING_CONDITION_MA_PER_M2,
  HULL_CURRENT_DENSITY,
  HULL_DEMAND_ALLOWANCE,
  METALLIC_COATING_CONSTANTS,
  MOVING_BARE_STEEL_A_PER_M2,
  protectionCriterionV,
  seawaterResistivityOhmM,
  type AnodeModel,
  type Coating,
  type CurrentDensity,
  type DesignInput,
  type DesignJob,
} from '@/lib/cp';
import type { DeskInputs, DeskSurface } from '@/lib/schemas/design';
import { AREA_SOURCE_WORDS, METAL_WORDS } from '@/lib/labels/design';

export interface DeskNotice {
  code: string;
  message: string;
}

/** The method the zones are sized by, in words, with where its values come from. */
export const DEMAND_METHOD_SOURCES: Record<DeskInputs['demandMethod'], string> = {
  'ship-hull': 'ship-hull practice (ISO 20313 approach; densities by coating condition: common practice, from memory; propeller and shaft: Japanese ship-equipment guide, published)',
  harbour: 'harbour practice (ISO 13174 approach; project sheets, common practice, within MIL-HDBK-1004/10 Table 1, published)',
  'offshore-table': 'offshore-structure table: DNV-RP-B401 (2010) bare-steel current densities by climate and depth with coating breakdown factors (from memory)',
};

/** Representative water temperature of each band, C, where no temperature is given (mid-band, common practice). */
export const BAND_TEMPERATURE_C: Record<DeskInputs['climate'], number> = { tropical: 25, 'sub-tropical': 16, temperate: 9, arctic: 4 };

/** Full-strength seawater, PSU, where no salinity is given (common practice). */
export const SEAWATER_SALINITY_PSU = 35;

const isMudZone = (surface: DeskSurface) => surface.depthBand === 'sediment' || surface.kind === 'pile-mud' || surface.kind === 'sheet-pile-mud';

/** The zone's current density and the coating that applies to it under the design's method. */
export function zoneDemand(surface: DeskSurface, inputs: Pick<DeskInputs, 'demandMethod' | 'climate' | 'water' | 'hullCoatingCondition' | 'serviceSpeedKnots'>): { currentDensity: CurrentDensity; coating: Coating } {
  // The engineer's own value always wins; it is a bare-metal density, and the coating applies to it.
  if (surface.currentDensityOverride) {
    const o = surface.currentDensityOverride;
    return { currentDensity: { initial: o.initial / 1000, mean: o.mean / 1000, final: o.final / 1000 }, coating: zoneCoating(surface) };
  }
  if (inputs.demandMethod === 'ship-hull') return hullZoneDemand(surface, inputs);
  if (inputs.demandMethod === 'harbour') return harbourZoneDemand(surface, inputs);
  return { currentDensity: currentDensityFor({ climate: inputs.climate, depthBand: surface.depthBand }), coating: zoneCoating(surface) };
}

/**
 * Ship-hull practice: a coated zone takes the density of its paint condition for the coated area
 * (fc = 1), plus about 10 % (common practice), the next worse condition where the flow is highest
 * (rudder, sea chests, thruster tunnels) and +25 % above 20 knots (from memory); a bare copper-alloy
 * propeller 500 mA/m2 and a stainless shaft 120 mA/m2 (published guide); other bare steel 250/150 mA/m2.
 */
function hullZoneDemand(surface: DeskSurface, inputs: Pick<DeskInputs, 'hullCoatingCondition' | 'serviceSpeedKnots'>): { currentDensity: CurrentDensity; coating: Coating } {
  const bareLike = surface.coatingCategory === 'bare' || surface.coatingCategory === 'noble-plating';
  if (bareLike && (surface.kind === 'propeller-shaft' || surface.drainsCurrent)) {
    const range = surface.drainsCurrent === 'stainless' ? HULL_CURRENT_DENSITY['stainless-shaft'] : HULL_CURRENT_DENSITY['copper-alloy-propeller'];
    const d = range.maxAPerM2;
    return { currentDensity: { initial: d, mean: d, final: d }, coating: 'bare' };
  }
  if (bareLike) return { currentDensity: { ...MOVING_BARE_STEEL_A_PER_M2 }, coating: 'bare' };
  const highFlow = surface.kind === 'rudder' || surface.kind === 'sea-chest' || surface.kind === 'thruster-tunnel';
  const condition = highFlow ? HIGH_FLOW_CONDITION[inputs.hullCoatingCondition] : inputs.hullCoatingCondition;
  const speed = inputs.serviceSpeedKnots !== null && inputs.serviceSpeedKnots > HIGH_SPEED_KNOTS ? HIGH_SPEED_FACTOR : 1;
  const d = (HULL_COATING_CONDITION_MA_PER_M2[condition] / 1000) * (1 + HULL_DEMAND_ALLOWANCE) * speed;
  return { currentDensity: { initial: d, mean: d, final: d }, coating: 'bare' };
}

/** What the desk shows beside a zone: the density it is sized with (A/m2) and where it comes from, in words. */
export function zoneDensitySource(surface: DeskSurface, inputs: Pick<DeskInputs, 'demandMethod' | 'climate' | 'water' | 'hullCoatingCondition' | 'serviceSpeedKnots'>): { currentDensity: CurrentDensity; source: string; coatingApplies: boolean } {
  const { currentDensity, coating } = zoneDemand(surface, inputs);
  if (surface.currentDensityOverride) return { currentDensity, source: 'your value', coatingApplies: coating !== 'bare' };
  if (inputs.demandMethod === 'ship-hull') {
    const bareLike = surface.coatingCategory === 'bare' || surface.coatingCategory === 'noble-plating';
    if (bareLike && (surface.kind === 'propeller-shaft' || surface.drainsCurrent)) return { currentDensity, source: `bare ${surface.drainsCurrent === 'stainless' ? 'stainless shaft' : 'copper-alloy propeller'}, ship-equipment guide`, coatingApplies: false };
    if (bareLike) return { currentDensity, source: 'bare steel moving in seawater (from memory)', coatingApplies: false };
    const highFlow = surface.kind === 'rudder' || surface.kind === 'sea-chest' || surface.kind === 'thruster-tunnel';
    const fast = inputs.serviceSpeedKnots !== null && inputs.serviceSpeedKnots > HIGH_SPEED_KNOTS;
    return { currentDensity, source: `coated hull, ${inputs.hullCoatingCondition} paint${highFlow ? ' (next worse: high flow)' : ''} + 10 %${fast ? ', +25 % for speed' : ''}, for the coated area`, coatingApplies: false };
  }
  if (inputs.demandMethod === 'harbour') return { currentDensity, source: `harbour practice, ${isMudZone(surface) ? 'mud' : 'immersed'} bare steel`, coatingApplies: coating !== 'bare' };
  return { currentDensity, source: `DNV-RP-B401 table, ${inputs.climate}, depth ${surface.depthBand}`, coatingApplies: coating !== 'bare' };
}

/** Harbour practice: immersed and mud densities for piles and sheet piling; coatings break down as usual. */
function harbourZoneDemand(surface: DeskSurface, inputs: Pick<DeskInputs, 'water'>): { currentDensity: CurrentDensity; coating: Coating } {
  const table = isMudZone(surface) ? HARBOUR_PRACTICE_DENSITY.mud : inputs.water === 'fresh' ? HARBOUR_PRACTICE_DENSITY['water-fresh'] : HARBOUR_PRACTICE_DENSITY['water-seawater'];
  return { currentDensity: { ...table }, coating: zoneCoating(surface) };
}

/**
 * Coating breakdown constants for a zone. A coating already `age` years old at the start of the
 * design life continues the same line: fc(t) = a + b(age + t) = (a + b*age) + b*t (DNV-RP-B401 (2010) 10.4).
 * A noble plating (tin, nickel, chromium) is a barrier only and counts as bare metal.
 */
export function zoneCoating(surface: DeskSurface): Coating {
  const category = surface.coatingCategory;
  if (category === 'bare' || category === 'noble-plating') return 'bare';
  const { a, b } = category === 'tsa' || category === 'tsz' || category === 'hdg' ? METALLIC_COATING_CONSTANTS[category] : coatingConstantsFor({ category, depthBand: surface.depthBand === 'sediment' ? '0-30' : surface.depthBand });
  return { a: Math.min(1, a + b * surface.coatingAgeYears), b };
}

/** The resistivity and protective potential the design uses, with where each comes from. */
export interface ResolvedEnvironment {
  resistivityOhmM: number;
  resistivitySource: string;
  protectivePotentialV: number;
  potentialSource: string;
}

/**
 * Fills what the engineer left to the tool: the resistivity from the water (PSS-78 at the water's
 * temperature and salinity) and the protective potential from the criterion that governs (anaerobic
 * steel -0.90 V). Brackish and fresh water need a salinity or a measured resistivity.
 */
export function resolveEnvironment(inputs: DeskInputs): ResolvedEnvironment {
  let resistivityOhmM = inputs.resistivityOhmM;
  let resistivitySource = 'measured (entered)';
  if (inputs.resistivitySource === 'water') {
    if (inputs.water === 'fresh') throw new CpInputError('resistivityOhmM', 'Fresh water is 10 to well over 100 Ω·m: enter a measured resistivity.');
    const salinity = inputs.salinityPsu ?? (inputs.water === 'seawater' ? SEAWATER_SALINITY_PSU : null);
    if (salinity === null) throw new CpInputError('salinityPsu', 'Brackish water needs its salinity (PSU) or a measured resistivity.');
    const surfaceGiven = inputs.temperatureC !== null;
    const surfaceTemperature = inputs.temperatureC ?? BAND_TEMPERATURE_C[inputs.climate];
    const at = (temperatureC: number) => Math.round(seawaterResistivityOhmM({ temperatureC, salinityPsu: salinity }) * 1000) / 1000;
    // Where the anodes sit at different depths the water differs (colder, more resistive at depth):
    // each zone that takes anodes gets its own value, and the highest sizes the anodes, since it gives
    // the lowest output per anode (conservative).
    const byZone = inputs.surfaces.filter((s) => !isMudZone(s)).map((s) => ({ name: s.name, temperatureC: s.temperatureC ?? surfaceTemperature }));
    const governing = byZone.reduce((worst, z) => (at(z.temperatureC) > at(worst.temperatureC) ? z : worst), byZone[0] ?? { name: '', temperatureC: surfaceTemperature });
    resistivityOhmM = at(governing.temperatureC);
    const salinityWords = `${salinity} PSU${inputs.salinityPsu === null ? ' (full-strength seawater assumed)' : ''}`;
    resistivitySource =
      new Set(byZone.map((z) => z.temperatureC)).size > 1
        ? `estimated from the water: PSS-78 at ${salinityWords}, by zone ${byZone.map((z) => `${z.name} ${at(z.temperatureC)} Ω·m at ${z.temperatureC} °C`).join(', ')}; the highest (${governing.name}) sizes the anodes`
        : `estimated from the water: PSS-78 at ${governing.temperatureC} °C${surfaceGiven || inputs.surfaces.some((s) => s.temperatureC !== null) ? '' : ' (mid-band)'} and ${salinityWords}`;
  }
  let protectivePotentialV = inputs.protectivePotentialV;
  let potentialSource = 'entered';
  if (inputs.potentialSource === 'criterion') {
    protectivePotentialV = protectionCriterionV({ protectedMetal: inputs.protectedMetal, environment: { water: inputs.water, anaerobic: inputs.anaerobic } });
    potentialSource = inputs.anaerobic && (inputs.protectedMetal === 'steel' || inputs.protectedMetal === 'high-strength-steel') ? 'criterion for anaerobic steel (sulphate-reducing bacteria)' : `criterion for ${METAL_WORDS[inputs.protectedMetal] ?? 'the metal'}`;
  }
  return { resistivityOhmM, resistivitySource, protectivePotentialV, potentialSource };
}

export function buildDesignJob(inputs: DeskInputs): DesignJob {
  const env = resolveEnvironment(inputs);
  return {
    designLifeYears: inputs.designLifeYears,
    protectivePotentialV: env.protectivePotentialV,
    resistivityOhmM: env.resistivityOhmM,
    protectedMetal: inputs.protectedMetal,
    hullMaterial: inputs.hullMaterial ?? undefined,
    nextDockingYears: inputs.nextDockingYears ?? undefined,
    allowMagnesiumOnAluminium: inputs.allowMagnesiumOnAluminium,
    environment: {
      water: inputs.water,
      temperatureC: inputs.temperatureC ?? undefined,
      chloridePpm: inputs.chloridePpm ?? undefined,
      anaerobic: inputs.anaerobic,
    },
    surfaces: inputs.surfaces.map((s) => ({
      name: s.name,
      areaM2: s.areaM2,
      ...zoneDemand(s, inputs),
      drainsCurrent: s.drainsCurrent ?? undefined,
      // Anodes are never placed in the mud: the demand there is met by the anodes in the water.
      ...(isMudZone(s) ? { anodesAllowed: false } : {}),
      // The checks need to know paint is there even where the density already covers it (fc = 1).
      ...(s.coatingCategory !== 'bare' && s.coatingCategory !== 'noble-plating' ? { painted: true } : {}),
    })),
  };
}

export function buildDesignInput(inputs: DeskInputs, model: AnodeModel): DesignInput {
  return { ...buildDesignJob(inputs), anode: anodeFromModel(model, inputs.water) };
}

/** Notes about the inputs that lib/cp cannot see: the method and where values come from, and choices out of scope. */
export function deskNotices(inputs: DeskInputs): DeskNotice[] {
  const notices: DeskNotice[] = [];
  const vessel = inputs.hullMaterial !== null;
  notices.push({ code: 'demand-method', message: `Current demand by ${DEMAND_METHOD_SOURCES[inputs.demandMethod]}.` });
  if (inputs.demandMethod === 'offshore-table' && vessel) {
    notices.push({ code: 'offshore-table-on-hull', message: 'This hull is sized with the offshore-structure table, made for fixed offshore structures: at a usual docking interval it gives far less current than ship-hull practice. Use ship-hull practice unless you have a reason.' });
  }
  if (inputs.demandMethod === 'offshore-table' && !vessel) {
    notices.push({ code: 'offshore-table-on-harbour', message: 'This structure is sized with the offshore-structure table, which gives about three times the mass of harbour practice for bare piles. Use harbour practice unless the site calls for the offshore values.' });
  }
  const tableZones = inputs.surfaces.filter((s) => !s.currentDensityOverride);
  if (inputs.demandMethod === 'offshore-table' && inputs.water !== 'seawater' && tableZones.length) {
    notices.push({
      code: 'table-density-outside-seawater',
      message: `The DNV-RP-B401 current densities are for seawater; ${tableZones.map((s) => s.name).join(', ')} use them in ${inputs.water} water. Enter a measured or handbook value (MIL-HDBK-1004/10 gives 22-65 mA/m² for bare steel in fresh water).`,
    });
  }
  if (vessel && !inputs.surfaces.some((s) => s.kind === 'propeller-shaft')) {
    notices.push({ code: 'no-propeller-zone', message: 'No propeller and shaft zone: a bare bronze propeller drains 450-500 mA/m² from the hull anodes. Add the zone, or say why there is none.' });
  }
  if (vessel && !inputs.surfaces.some((s) => s.kind === 'rudder')) {
    notices.push({ code: 'no-rudder-zone', message: 'No rudder zone: the rudder and the stern around the propeller see the highest flow and usually carry 15-20 % of the hull anodes.' });
  }
  if (!vessel && inputs.demandMethod !== 'ship-hull') {
    notices.push({ code: 'splash-zone-not-protected', message: 'The splash and tidal zones are not protected by anodes (only the immersed and buried steel is, the tidal zone partly): coat, wrap or sheath them, and allow for accelerated low-water corrosion.' });
  }
  if (!vessel) {
    notices.push({ code: 'pile-continuity', message: 'Anodes on some piles protect the others only through electrical continuity: bond every pile (and the fenders and ladders) and check the bonds at each survey.' });
  }
  const mud = inputs.surfaces.filter(isMudZone);
  if (mud.length) {
    notices.push({ code: 'mud-served-from-water', message: `No anodes go in the mud: the demand of ${mud.map((s) => s.name).join(', ')} is met by the anodes in the water.` });
  }
  const estimated = inputs.surfaces.filter((s) => s.areaSource !== 'entered');
  if (estimated.length) {
    notices.push({ code: 'areas-estimated', message: `Estimated areas (replace them with drawing values): ${estimated.map((s) => `${s.name} (${AREA_SOURCE_WORDS[s.areaSource] ?? s.areaSource})`).join('; ')}.` });
  }
  const noble = inputs.surfaces.filter((s) => s.coatingCategory === 'noble-plating');
  if (noble.length) {
    notices.push({ code: 'noble-plating-barrier-only', message: `${noble.map((s) => s.name).join(', ')}: tin, nickel or chromium plating is a barrier only. Where it is scratched, the small exposed steel becomes the anode of a large cathode and pits fast; the zone is sized as bare metal.` });
  }
  const sacrificial = inputs.surfaces.filter((s) => s.coatingCategory === 'tsa' || s.coatingCategory === 'tsz' || s.coatingCategory === 'hdg');
  if (sacrificial.length) {
    notices.push({ code: 'sacrificial-metal-coating', message: `${sacrificial.map((s) => s.name).join(', ')}: a sprayed aluminium or zinc layer or galvanising protects scratches itself and is slowly consumed; its breakdown constants are Tidewarden assumptions (common practice) for you to confirm.` });
  }
  return notices;
}

/** Notices that say how the design was sized (method, sources, estimates) rather than warn. */
export const INFORMATION_NOTICE_CODES: ReadonlySet<string> = new Set(['demand-method', 'resistivity-source', 'potential-source', 'mud-served-from-water', 'areas-estimated']);


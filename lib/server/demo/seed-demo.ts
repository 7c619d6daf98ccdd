import type { EntityManager } from '@mikro-orm/postgresql';
import { AssetSchema, MembershipSchema, OrganisationSchema, UserSchema, ZoneSchema, type Organisation, type Role, type User } from '@/entities';
import { hashPassword } from '../auth/password';
import { audit } from '../audit';
import type { OrgContext } from '../org-context';
import { createDesign } from '../services/designs/create-design';
import { approveDesign } from '../services/designs/sign-design';
import demo from '@/scripts/demo-sign-ins.json' with { type: 'json' };

type ZoneSeed = {
  name: string;
  kind: string;
  areaM2: number;
  areaSource?: string;
  coatingCategory: 'I' | 'II' | 'III' | 'bare';
  coatingAgeYears?: number;
  depthBand?: string;
  drainsCurrent?: 'copper-alloy' | 'stainless';
  currentDensityOverride?: { initial: number; mean: number; final: number };
};

// Every name below is invented for the demonstration: no real company, vessel, port or person.
const VESSELS = [
  {
    name: 'Brindlemoor',
    vesselType: 'Ro-pax ferry',
    imoNumber: null,
    lengthBppM: 96,
    beamM: 18.6,
    draughtM: 4.6,
    blockCoefficient: 0.62,
    hullMaterial: 'steel' as const,
    hasImpressedCurrent: true,
    tradingWaters: 'Gullhaven Sound, temperate coastal',
    zones: [
      { name: 'Hull bottom', kind: 'hull-bottom', areaM2: 1107, areaSource: 'denny-mumford', coatingCategory: 'II', coatingAgeYears: 0 },
      { name: 'Boot-top and sides', kind: 'boot-top-sides', areaM2: 1050, areaSource: 'denny-mumford', coatingCategory: 'II', coatingAgeYears: 0 },
      { name: 'Rudders (2)', kind: 'rudder', areaM2: 32, coatingCategory: 'II' },
      { name: 'Propellers and shafts', kind: 'propeller-shaft', areaM2: 18, coatingCategory: 'bare', drainsCurrent: 'copper-alloy', currentDensityOverride: { initial: 0.5, mean: 0.5, final: 0.5 } },
      { name: 'Sea chests', kind: 'sea-chest', areaM2: 6, coatingCategory: 'II' },
      { name: 'Bow thruster tunnel', kind: 'thruster-tunnel', areaM2: 9, coatingCategory: 'I' },
    ] as ZoneSeed[],
  },
  {
    name: 'Kittiwake Sound',
    vesselType: 'Double-ended passenger ferry',
    imoNumber: null,
    lengthBppM: 68,
    beamM: 14,
    draughtM: 3.6,
    blockCoefficient: 0.58,
    hullMaterial: 'steel' as const,
    hasImpressedCurrent: false,
    tradingWaters: 'Gullhaven Sound',
    zones: [] as ZoneSeed[],
  },
  {
    name: 'Tern Ledger',
    vesselType: 'Multicat workboat',
    imoNumber: null,
    lengthBppM: 26,
    beamM: 10,
    draughtM: 2.4,
    blockCoefficient: 0.7,
    hullMaterial: 'steel' as const,
    hasImpressedCurrent: false,
    tradingWaters: 'Harbour and approaches',
    zones: [] as ZoneSeed[],
  },
  {
    name: 'Wavecrest Minnow',
    vesselType: 'Crew transfer boat',
    imoNumber: null,
    lengthBppM: 22,
    beamM: 7.5,
    draughtM: 1.5,
    blockCoefficient: 0.45,
    hullMaterial: 'aluminium' as const,
    hasImpressedCurrent: false,
    tradingWaters: 'Offshore wind field, temperate',
    zones: [] as ZoneSeed[],
  },
];

const STRUCTURES = [
  {
    name: 'Gullhaven Ferry Jetty',
    structureType: 'jetty',
    location: 'Port of Gullhaven, berth 2',
    waterType: 'seawater' as const,
    designLifeYears: 20,
    pileCount: 48,
    pileDiameterM: 0.61,
    zones: [
      { name: 'Piles, immersed (48 × Ø 0.61 m × 9.5 m)', kind: 'pile-immersed', areaM2: 874, coatingCategory: 'bare' },
      { name: 'Piles, mud zone (48 × Ø 0.61 m × 12 m)', kind: 'pile-mud', areaM2: 1104, coatingCategory: 'bare', depthBand: 'sediment' },
    ] as ZoneSeed[],
  },
  { name: 'Dolphin North', structureType: 'dolphin', location: 'Port of Gullhaven, berth 2', waterType: 'seawater' as const, designLifeYears: 20, pileCount: 6, pileDiameterM: 0.762, zones: [] as ZoneSeed[] },
  { name: 'Dolphin South', structureType: 'dolphin', location: 'Port of Gullhaven, berth 2', waterType: 'seawater' as const, designLifeYears: 20, pileCount: 6, pileDiameterM: 0.762, zones: [] as ZoneSeed[] },
];

/**
 * The invented demo scenario. Runs once: when the demo organisation exists it does nothing,
 * so a second start keeps user data and duplicates nothing.
 */
export async function seedDemo(em: EntityManager): Promise<{ created: boolean }> {
  if (await em.count(OrganisationSchema, { slug: demo.organisation.slug })) return { created: false };
  await em.transactional(async (tx) => {
    const organisation = tx.create(OrganisationSchema, { slug: demo.organisation.slug, name: demo.organisation.name, fittingRatePerKg: 14 });
    const passwordHash = await hashPassword(demo.password);
    const people: Record<string, User> = {};
    for (const person of demo.users) {
      const user = (await tx.findOne(UserSchema, { email: person.email })) ?? tx.create(UserSchema, { email: person.email, name: person.name, passwordHash, emailVerifiedAt: new Date() });
      tx.create(MembershipSchema, { organisation, user, role: person.role as Role });
      people[person.email] = user;
    }
    audit(tx, { organisationId: organisation.id, action: 'organisation.seeded', details: { scenario: 'demo' } });
    await tx.flush();

    const ctxFor = async (email: string): Promise<OrgContext> => {
      const user = people[email];
      const membership = await tx.findOneOrFail(MembershipSchema, { organisation, user });
      return { em: tx, organisation: organisation as Organisation, membership, role: membership.role, user: { id: user.id, email: user.email, name: user.name, emailVerified: true }, ip: null };
    };
    const engineer = await ctxFor('engineer@gullhaven.example');
    const checker = await ctxFor('checker@gullhaven.example');

    const assets: Record<string, string> = {};
    for (const v of VESSELS) {
      const { zones, ...particulars } = v;
      const asset = tx.create(AssetSchema, { ...blank, ...particulars, kind: 'vessel', organisation });
      addZones(tx, asset, zones);
      assets[v.name] = asset.id;
    }
    for (const s of STRUCTURES) {
      const { zones, ...particulars } = s;
      const asset = tx.create(AssetSchema, { ...blank, ...particulars, kind: 'structure', organisation });
      addZones(tx, asset, zones);
      assets[s.name] = asset.id;
    }
    await tx.flush();

    // Brindlemoor: approved design (prepared by one engineer, approved by another).
    const ferry = await createDesign(engineer, { assetId: assets.Brindlemoor, title: 'Brindlemoor hull anodes to the 2028 docking' });
    await approveDesign(checker, ferry.id);
    // The jetty: a draft for a 20-year life with pile-mounted Al-Zn-In anodes.
    await createDesign(engineer, { assetId: assets['Gullhaven Ferry Jetty'], title: 'Ferry jetty piles, 20-year design' });
    // Kittiwake Sound: a draft from the particulars (Denny-Mumford estimate).
    await createDesign(engineer, { assetId: assets['Kittiwake Sound'] });
  });
  return { created: true };
}

const blank = {
  imoNumber: null,
  vesselType: null,
  lengthBppM: null,
  beamM: null,
  draughtM: null,
  blockCoefficient: null,
  hullMaterial: null,
  hasImpressedCurrent: false,
  tradingWaters: null,
  structureType: null,
  location: null,
  waterType: null,
  designLifeYears: null,
  pileCount: null,
  pileDiameterM: null,
  notes: null,
  archivedAt: null,
};

function addZones(em: EntityManager, asset: { id: string }, zones: ZoneSeed[]) {
  zones.forEach((z, i) =>
    em.create(ZoneSchema, {
      asset: asset as never,
      name: z.name,
      kind: z.kind as never,
      areaM2: z.areaM2,
      areaSource: z.areaSource ?? 'entered',
      coatingCategory: z.coatingCategory,
      coatingAgeYears: z.coatingAgeYears ?? 0,
      waterType: z.depthBand === 'sediment' ? 'sediment' : 'seawater',
      climate: 'temperate',
      depthBand: z.depthBand ?? '0-30',
      temperatureC: null,
      drainsCurrent: z.drainsCurrent ?? null,
      currentDensityOverride: z.currentDensityOverride ?? null,
      sortOrder: i,
      archivedAt: null,
    }),
  );
}

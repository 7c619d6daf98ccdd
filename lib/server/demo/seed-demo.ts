import type { EntityManager } from '@mikro-orm/postgresql';
import { AssetSchema, DockingSchema, MembershipSchema, OrganisationSchema, UserSchema, ZoneSchema, type Organisation, type Role, type User } from '@/entities';
import { hashPassword } from '../auth/password';
import { auditEvent } from '../audit';
import type { OrgContext } from '../org-context';
import { createDesign } from '../services/designs/create-design';
import { approveDesign } from '../services/designs/sign-design';
import { createAnodeGroup } from '../services/register/anode-groups';
import { blankParticulars } from '../services/assets/create-asset';
import { createSurvey } from '../services/surveys/create-survey';
import { runUnitOfWork } from '../unit-of-work';
import demo from '@/scripts/demo-sign-ins.json' with { type: 'json' };
import { addDays } from 'date-fns';
import { toDateOnly } from '@/lib/dates/date-only';
import { estimatedFrameSpacingM } from '@/lib/drawings/hull-drawing';
import { PLANS, TRIAL_DAYS } from '@/lib/billing/plans';
import { getEnv } from '../env';
import { getStripe } from '../billing/stripe';
import { applySubscription } from '../services/billing/sync-subscription';

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
    // Not on the particulars we were given: estimated from the length (0.002 L + 0.48 m) and marked so.
    frameSpacingM: estimatedFrameSpacingM(96),
    frameSpacingSource: 'estimate' as const,
    hullMaterial: 'steel' as const,
    hasImpressedCurrent: true,
    tradingWaters: 'Gullhaven Firth, temperate coastal',
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
    name: 'Kittiwake Crossing',
    vesselType: 'Double-ended passenger ferry',
    imoNumber: null,
    lengthBppM: 68,
    beamM: 14,
    draughtM: 3.6,
    blockCoefficient: 0.58,
    hullMaterial: 'steel' as const,
    hasImpressedCurrent: false,
    tradingWaters: 'Gullhaven Firth',
    zones: [] as ZoneSeed[],
  },
  {
    name: 'Tern Ledger',
    vesselType: 'Multi-purpose workboat',
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
    // The grid as the positions name it (bents 1-12, rows A-D); not given with the particulars, so marked estimated.
    pileRows: 4,
    pileBents: 12,
    pileGridSource: 'estimate' as const,
    zones: [
      { name: 'Piles, immersed (48 × Ø 0.61 m × 9.5 m)', kind: 'pile-immersed', areaM2: 874, coatingCategory: 'bare' },
      { name: 'Piles, mud zone (48 × Ø 0.61 m × 12 m)', kind: 'pile-mud', areaM2: 1104, coatingCategory: 'bare', depthBand: 'sediment' },
    ] as ZoneSeed[],
  },
  { name: 'Dolphin North', structureType: 'dolphin', location: 'Port of Gullhaven, berth 2', waterType: 'seawater' as const, designLifeYears: 20, pileCount: 6, pileDiameterM: 0.762, pileRows: 2, pileBents: 3, pileGridSource: 'estimate' as const, zones: [] as ZoneSeed[] },
  { name: 'Dolphin South', structureType: 'dolphin', location: 'Port of Gullhaven, berth 2', waterType: 'seawater' as const, designLifeYears: 20, pileCount: 6, pileDiameterM: 0.762, pileRows: 2, pileBents: 3, pileGridSource: 'estimate' as const, zones: [] as ZoneSeed[] },
];

/**
 * The invented demo scenario. Runs once: when the demo organisation exists it does nothing,
 * so a second start keeps user data and duplicates nothing.
 */
export async function seedDemo(em: EntityManager): Promise<{ created: boolean }> {
  if (await em.count(OrganisationSchema, { slug: demo.organisation.slug })) return { created: false };
  await runUnitOfWork(async (tx, effects) => {
    const organisation = tx.create(OrganisationSchema, { slug: demo.organisation.slug, name: demo.organisation.name, fittingRatePerKg: 14, subscriptionStatus: 'trialing', trialEndsAt: addDays(new Date(), TRIAL_DAYS) });
    const passwordHash = await hashPassword(demo.password);
    const people: Record<string, User> = {};
    for (const person of demo.users) {
      const user = (await tx.findOne(UserSchema, { email: person.email })) ?? tx.create(UserSchema, { email: person.email, name: person.name, passwordHash, emailVerifiedAt: new Date() });
      tx.create(MembershipSchema, { organisation, user, role: person.role as Role });
      people[person.email] = user;
    }
    auditEvent(tx, { organisationId: organisation.id, action: 'organisation.seeded', details: { scenario: 'demo' } });
    await tx.flush();

    const ctxFor = async (email: string): Promise<OrgContext> => {
      const user = people[email];
      const membership = await tx.findOneOrFail(MembershipSchema, { organisation, user });
      return { em: tx, organisation: organisation as Organisation, membership, role: membership.role, user: { id: user.id, email: user.email, name: user.name, emailVerified: true }, ip: null, effects };
    };
    const engineer = await ctxFor('engineer@gullhaven.example');
    // Every asset's proposals and outlook are computed once, before the seed commits.
    effects.ctx = engineer;
    effects.organisationChanged();
    const checker = await ctxFor('checker@gullhaven.example');

    const assets: Record<string, string> = {};
    for (const v of VESSELS) {
      const { zones, ...particulars } = v;
      const asset = tx.create(AssetSchema, { ...blankParticulars(), ...particulars, kind: 'vessel', organisation });
      addZones(tx, asset, zones);
      assets[v.name] = asset.id;
    }
    for (const s of STRUCTURES) {
      const { zones, ...particulars } = s;
      const asset = tx.create(AssetSchema, { ...blankParticulars(), ...particulars, kind: 'structure', organisation });
      addZones(tx, asset, zones);
      assets[s.name] = asset.id;
    }
    await tx.flush();

    // Brindlemoor: approved design (prepared by one engineer, approved by another).
    const ferry = await createDesign(engineer, { assetId: assets.Brindlemoor, title: 'Brindlemoor hull anodes to the 2028 docking' });
    await approveDesign(checker, ferry.id);
    // The jetty: a draft for a 20-year life with pile-mounted Al-Zn-In anodes.
    await createDesign(engineer, { assetId: assets['Gullhaven Ferry Jetty'], title: 'Ferry jetty piles, 20-year design' });
    // Kittiwake Crossing: a draft from the particulars (Denny-Mumford estimate).
    await createDesign(engineer, { assetId: assets['Kittiwake Crossing'] });

    await seedRegister(tx, engineer, await ctxFor('inspector@gullhaven.example'), assets, ferry.id);
    await seedSubscription(organisation as Organisation);
  }, { em });
  return { created: true };
}

/** The demo organisation pays for the Fleet plan, through the payment service (the local fake in development). */
async function seedSubscription(organisation: Organisation) {
  if (!getEnv().STRIPE_API_HOST) return; // no payment service configured: the demo stays on its trial
  try {
    const stripe = getStripe();
    const customer = await stripe.customers.create({ name: organisation.name, email: 'owner@gullhaven.example', metadata: { organisationId: organisation.id } });
    const price = (await stripe.prices.list({ lookup_keys: [PLANS.fleet.lookupKey] })).data[0];
    const sub = await stripe.subscriptions.create({ customer: customer.id, items: [{ price: price.id, quantity: 1 }], metadata: { organisationId: organisation.id, plan: 'fleet' } });
    organisation.stripeCustomerId = customer.id;
    applySubscription(organisation, sub);
  } catch (error) {
    console.warn(`[tidewarden] The demo subscription was not set up (${error instanceof Error ? error.message : error}); the demo organisation stays on its trial.`);
  }
}

/** Installed anodes and two years of surveys on the invented fleet and jetty. */
async function seedRegister(em: EntityManager, engineer: OrgContext, inspector: OrgContext, assets: Record<string, string>, ferryDesignId: string) {
  const zoneId = async (asset: string, name: string) => (await em.findOneOrFail(ZoneSchema, { asset: assets[asset], name })).id;
  const fit = (asset: string, g: Record<string, unknown>) => createAnodeGroup(engineer, assets[asset], g);
  const inDays = (n: number) => toDateOnly(new Date(Date.now() + n * 86_400_000));
  // Brindlemoor, fitted at the March 2025 docking from the approved design.
  const ferryZones: [string, string, number, string][] = [
    ['Hull bottom', 'Bottom P/S', 22, 'Fr 20-130 P/S, bilge strakes, 0.4 m above keel, 6 m pitch'],
    ['Boot-top and sides', 'Sides P/S', 20, 'Fr 18-132 P/S, boot-top and sides, 3.2 m above keel'],
    ['Rudders (2)', 'Rudders', 1, 'Rudders P and S, both faces'],
    ['Propellers and shafts', 'Stern frame', 12, 'Stern frame and shaft brackets P/S, clear of propeller tips'],
    ['Sea chests', 'Sea chests', 1, 'Sea chest P aft, gratings'],
  ];
  for (const [zone, label, quantity, positions] of ferryZones) {
    await fit('Brindlemoor', { zoneId: await zoneId('Brindlemoor', zone), label, anodeModelKey: 'builtin:TW-AW-4020', quantity, positions, installedOn: '2025-03-14', designId: ferryDesignId });
  }
  // Kittiwake Crossing is overdue: 40 x TW-ZW-3015 (8.4 kg net, zinc 780 Ah/kg) at 9.5 A use about 106.7 kg a year, so 25 % of the
  // 336 kg is left about 862 days after fitting. Fitted 910 days before the seeding day, the hull group's renew-by date was
  // about seven weeks ago and its margin ran out long before; its next docking (in 75 days) carries the renewal.
  await fit('Kittiwake Crossing', { label: 'Hull P/S', anodeModelKey: 'builtin:TW-ZW-3015', quantity: 40, positions: 'Fr 6-60 P and S', installedOn: inDays(-910), meanCurrentA: 9.5 });
  await fit('Tern Ledger', { label: 'Hull and nozzles', anodeModelKey: 'builtin:TW-ZB-2510', quantity: 16, positions: 'Bilge keels and nozzle rims', installedOn: '2025-06-20', meanCurrentA: 2.1 });
  await fit('Wavecrest Minnow', { label: 'Hulls P/S', anodeModelKey: 'builtin:TW-ZB-2510', quantity: 8, positions: 'Transoms and keels, both hulls', installedOn: '2025-04-11', meanCurrentA: 0.9 });
  const jettyImmersed = await zoneId('Gullhaven Ferry Jetty', 'Piles, immersed (48 × Ø 0.61 m × 9.5 m)');
  await fit('Gullhaven Ferry Jetty', { zoneId: jettyImmersed, label: 'Bents 1-6', anodeModelKey: 'builtin:TW-AS-2018', quantity: 24, positions: 'B1-A to B6-D, one per pile at -4 m CD', installedOn: '2016-05-10', meanCurrentA: 46 });
  await fit('Gullhaven Ferry Jetty', { zoneId: jettyImmersed, label: 'Bents 7-12', anodeModelKey: 'builtin:TW-AS-2018', quantity: 24, positions: 'B7-A to B12-D, one per pile at -4 m CD', installedOn: '2016-05-10', meanCurrentA: 52 });
  await fit('Dolphin North', { label: 'Dolphin N bracelets', anodeModelKey: 'builtin:TW-AK-0610', quantity: 6, positions: 'Bents 1-3, one bracelet per pile at -3 m CD', installedOn: '2019-08-01', meanCurrentA: 4.2 });
  await fit('Dolphin South', { label: 'Dolphin S bracelets', anodeModelKey: 'builtin:TW-AK-0610', quantity: 6, positions: 'Bents 1-3, one bracelet per pile at -3 m CD', installedOn: '2019-08-01', meanCurrentA: 4.4 });
  await em.flush();

  const survey = (asset: string, surveyedOn: string, method: string, surveyor: string, readings: Record<string, unknown>[]) =>
    createSurvey(inspector, { assetId: assets[asset], surveyedOn, method, surveyor, defaultElectrode: 'ag-agcl-seawater', readings });
  const pile = (location: string, potentialV: number, remainingFraction: number | null = null, group: string | null = null) => ({ location, potentialV, electrode: 'ag-agcl-seawater', anodeGroupLabel: group, remainingFraction, comment: null });
  await survey('Gullhaven Ferry Jetty', '2024-11-18', 'diver', 'Gullhaven Harbour Divers', [
    pile('B1-A', -0.99, 0.52, 'Bents 1-6'), pile('B3-C', -0.97), pile('B6-D', -0.96, 0.5, 'Bents 1-6'),
    pile('B7-A', -0.95, 0.47, 'Bents 7-12'), pile('B9-B', -0.93), pile('B12-D', -0.9, 0.44, 'Bents 7-12'),
  ]);
  await survey('Gullhaven Ferry Jetty', '2025-11-20', 'diver', 'Gullhaven Harbour Divers', [
    pile('B1-A, -4 m CD', -0.98, 0.45, 'Bents 1-6'), pile('B3-C, -2 m CD', -0.95), pile('B6-D, -4 m CD', -0.94, 0.43, 'Bents 1-6'),
    pile('B7-A, -4 m CD', -0.9, 0.37, 'Bents 7-12'), pile('B9-B, -6 m CD', -0.84), pile('B11-C, -2 m CD', -0.78, null), pile('B12-D, -4 m CD', -0.81, 0.33, 'Bents 7-12'),
  ]);
  await survey('Dolphin North', '2025-11-21', 'diver', 'Gullhaven Harbour Divers', [pile('DN-1', -1.01, 0.7, 'Dolphin N bracelets'), pile('DN-4', -1.0)]);
  await survey('Brindlemoor', '2025-09-03', 'drop-cell', 'Ship staff', [pile('Fr 40 P', -0.97), pile('Fr 40 S', -0.98), pile('Fr 110 P', -0.95)]);
  await survey('Brindlemoor', '2026-06-12', 'diver', 'Gullhaven Harbour Divers', [
    pile('Fr 40 P', -0.96, 0.84, 'Bottom P/S'), pile('Fr 110 S', -0.94, 0.82, 'Sides P/S'), pile('Rudder P', -0.93, 0.72, 'Rudders'), pile('Stern frame', -0.91, 0.7, 'Stern frame'),
  ]);
  await survey('Wavecrest Minnow', '2026-03-30', 'drop-cell', 'Ship staff', [pile('Transom P', -1.02), pile('Transom S', -1.03)]);

  // Dockings and campaigns: the last ones done, the next ones planned (dates relative to the seeding day).
  const plan = async (asset: string, kind: string, plannedStart: string, yard: string, status: 'planned' | 'done' = 'planned') => {
    const docking = em.create(DockingSchema, { organisation: engineer.organisation, asset: assets[asset], kind: kind as never, status, plannedStart, plannedEnd: null, actualStart: status === 'done' ? plannedStart : null, actualEnd: null, yard, reference: null, notes: null });
    return docking;
  };
  await plan('Brindlemoor', 'renewal-survey', '2025-03-10', 'Gullhaven Graving Dock', 'done');
  await plan('Brindlemoor', 'intermediate', inDays(640), 'Gullhaven Graving Dock');
  await plan('Kittiwake Crossing', 'intermediate', inDays(75), 'North Basin Ship Repair');
  // Tern Ledger's hull group is renewed by about November 2027 (25 % of its mass left): its docking falls
  // at least the 6-month margin before that, so the renewal is proposed there.
  await plan('Tern Ledger', 'intermediate', inDays(120), 'North Basin Ship Repair');
  await plan('Wavecrest Minnow', 'unplanned', inDays(29), 'Gullhaven Graving Dock');
  await plan('Gullhaven Ferry Jetty', 'campaign', inDays(150), 'Gullhaven Harbour Divers');
  await plan('Dolphin North', 'campaign', inDays(150), 'Gullhaven Harbour Divers');
}


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

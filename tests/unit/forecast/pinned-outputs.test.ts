import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import {
  forecastGroup,
  proposeRenewals,
  proposeRenewalsForFleet,
  type DockingInput,
  type GroupForecast,
  type GroupForecastInput,
  type RenewalGroupInput,
  type RenewalOptions,
} from '@/lib/forecast';
import { benchFleet, seededRandom } from '@/tests/fixtures/bench-data';
import { forecastFigures } from '@/tests/fixtures/forecast-fields';

// Pins the exact outputs of forecastGroup and the renewal scheduler (every forecast field, its
// methods sampled, every proposal and every sentence) over seeded fleets and seeded edge cases, as
// SHA-256 digests of a canonical text. The digests were produced by the code as it was before the
// forecast was made faster; any change to a date, a number (to the last bit), a word or an error
// message changes them. A deliberate change of the engineering or the words must update them here,
// with the reason in the commit.

const DAY_MS = 86_400_000;
const YEAR_MS = 8760 * 3_600_000;

/** A canonical text of any value: sorted keys, undefined kept, dates as epoch ms, numbers exact (-0 too). */
function canonical(value: unknown): string {
  if (value === undefined) return 'u';
  if (value === null) return 'n';
  if (value instanceof Date) return `D${value.getTime()}`;
  if (typeof value === 'number') return Object.is(value, -0) ? '-0' : String(value);
  if (typeof value === 'string') return JSON.stringify(value);
  if (typeof value === 'boolean') return value ? 't' : 'f';
  if (typeof value === 'function') return 'fn';
  if (Array.isArray(value)) return `[${value.map(canonical).join(',')}]`;
  if (typeof value === 'object') {
    const keys = Object.keys(value as object).sort();
    return `{${keys.map((k) => `${k}:${canonical((value as Record<string, unknown>)[k])}`).join(',')}}`;
  }
  return `?${String(value)}`;
}

/** Every field and method of a GroupForecast as an own property, by name (forecastFigures and the three methods). */
function forecastFields(f: GroupForecast): Record<string, unknown> {
  return { ...forecastFigures(f), remainingFractionAt: f.remainingFractionAt, remainingMassKgAt: f.remainingMassKgAt, remainingSeries: f.remainingSeries };
}

const digest = (parts: string[]) => createHash('sha256').update(parts.join('\n')).digest('hex');

/** The outcome of a call: its value, or the error's name, field and message. */
function outcome(fn: () => unknown): string {
  try {
    return canonical(fn());
  } catch (e) {
    const err = e as { name?: string; field?: string; message?: string };
    return `!${err.name}|${err.field}|${err.message}`;
  }
}

/** A forecast with its methods sampled at dates around its life. */
function forecastText(input: GroupForecastInput, probes: Date[]): string {
  return outcome(() => {
    const f = forecastGroup(input);
    const at = probes.map((d) => [f.remainingFractionAt(d), f.remainingMassKgAt(d)]);
    const from = probes[0];
    const to = probes[probes.length - 1];
    const series = [1, 5, 13].map((step) => outcome(() => f.remainingSeries(from, to, step)));
    return { ...forecastFields(f), at, series };
  });
}

// ---------- 1. the bench's own workload, as scripts/bench.ts runs it ----------

function fleetText(seed: number, vessels: number, today: Date, opts: Partial<RenewalOptions> = {}): string {
  const fleet = benchFleet({ vessels, today, seed });
  const parts: string[] = [];
  const assets = fleet.map((v) => ({
    assetId: v.assetId,
    dockings: v.dockings,
    groups: v.groups.map((g) => {
      const f = forecastGroup(g.forecast);
      parts.push(canonical({ ...forecastFields(f), at: [f.remainingFractionAt(today), f.remainingFractionAt(new Date(today.getTime() + YEAR_MS))] }));
      return { id: g.id, renewBy: f.renewBy, renewByEarly: f.renewByEarly, confirmedRenewal: g.confirmedRenewal };
    }),
  }));
  parts.push(canonical(proposeRenewalsForFleet(assets, { today, ...opts })));
  return digest(parts);
}

// ---------- 2. seeded edge cases ----------

const pick = <T,>(rand: () => number, items: readonly T[]): T => items[Math.floor(rand() * items.length)];

/** Month ends, leap days and times of day that are not midnight: where calendar arithmetic goes wrong. */
function awkwardDate(rand: () => number): Date {
  const year = 2020 + Math.floor(rand() * 12);
  const [month, day] = pick(rand, [[0, 31], [1, 28], [1, 29], [2, 31], [3, 30], [7, 31], [11, 31], [5, 15], [9, 1]] as const);
  const ms = pick(rand, [0, 0, 1, 43_200_000, DAY_MS - 1, Math.floor(rand() * DAY_MS)]);
  return new Date(Date.UTC(year, month, Math.min(day, new Date(Date.UTC(year, month + 1, 0)).getUTCDate())) + ms);
}

function edgeGroup(rand: () => number, today: Date): GroupForecastInput {
  const installedOn = rand() < 0.3 ? awkwardDate(rand) : new Date(today.getTime() - rand() * 6 * YEAR_MS + Math.floor(rand() * DAY_MS));
  const input: GroupForecastInput = {
    installedOn,
    quantity: 1 + Math.floor(rand() * 30),
    netMassPerAnodeKg: pick(rand, [4.4, 7.7, 9.8, 8.4, 0.5, 120]),
    utilisationFactor: pick(rand, [0.8, 0.85, 0.9, 1, 0.5, 0.75]),
    capacityAhPerKg: pick(rand, [2000, 780, 1100, 2500]),
    currentA: pick(rand, [0, 0.05, 0.2, 0.6, 1.5, 4, rand() * 2]),
  };
  const profile = rand();
  if (profile < 0.35) {
    const startA = pick(rand, [0, 0.1, 0.4, 1.2, rand()]);
    const endA = pick(rand, [0, startA, startA * 2.5, startA / 3, rand() * 2]);
    input.demandProfile = { startA, endA, overYears: pick(rand, [1, 2.5, 5, 10, 25]) };
    if (rand() < 0.5) delete input.currentA;
  }
  const threshold = rand();
  if (threshold < 0.5) input.renewalThresholdRemaining = pick(rand, [0, 0.1, 0.25, 0.3, 0.5, 1]);
  const count = Math.floor(rand() * 6);
  if (count > 0 || rand() < 0.3) {
    const surveys: { date: Date; remainingFraction: number }[] = [];
    const span = Math.max(0, today.getTime() - installedOn.getTime()) + YEAR_MS;
    for (let s = 0; s < count; s++) {
      const t = installedOn.getTime() + Math.floor(rand() * span);
      const remainingFraction = pick(rand, [1, 1, 0, 0.02, 0.25, 0.2, rand(), rand(), 1 - rand() * 0.1]);
      surveys.push({ date: new Date(t), remainingFraction });
      if (rand() < 0.2) surveys.push({ date: new Date(t), remainingFraction: Math.max(0, remainingFraction - 0.1) });
      if (rand() < 0.1) surveys.push({ date: new Date(installedOn.getTime() + Math.floor(rand() * 0.4 * YEAR_MS)), remainingFraction: 0.97 });
    }
    input.surveys = surveys;
  }
  return input;
}

function edgeDockings(rand: () => number, today: Date, assetId: string): DockingInput[] {
  const n = Math.floor(rand() * 13);
  return Array.from({ length: n }, (_, k) => {
    const date =
      rand() < 0.25 ? awkwardDate(rand) : rand() < 0.1 ? new Date(today.getTime() - Math.floor(rand() * DAY_MS * 0.9)) : new Date(today.getTime() + (rand() * 10 - 2) * YEAR_MS);
    const status = pick(rand, [undefined, 'planned', 'planned', 'planned', 'done', 'cancelled'] as const);
    return status === undefined ? { id: `${assetId}-d${k}`, date } : { id: `${assetId}-d${k}`, date, status };
  });
}

/** What the edge cases reached, so that they are known to cover every rule. */
const seen = new Set<string>();

function edgeCaseText(seed: number): string {
  const rand = seededRandom(seed);
  const parts: string[] = [];
  for (let round = 0; round < 6; round++) {
    const today = rand() < 0.3 ? awkwardDate(rand) : new Date(Date.UTC(2027, 0, 15) + Math.floor(rand() * 3 * YEAR_MS));
    const opts: RenewalOptions = { today };
    if (rand() < 0.5) opts.marginMonths = pick(rand, [0, 1, 6, 12, 25, 120]);
    if (rand() < 0.4) opts.typicalIntervalMonths = pick(rand, [1, 12, 30, 36, 120]);
    const assets = Array.from({ length: 6 }, (_, a) => {
      const assetId = `s${seed}-r${round}-a${a}`;
      const dockings = edgeDockings(rand, today, assetId);
      const oldCaller = rand() < 0.25;
      const groups: RenewalGroupInput[] = Array.from({ length: 1 + Math.floor(rand() * 12) }, (_, g) => {
        const input = edgeGroup(rand, today);
        const probes = [
          new Date(input.installedOn.getTime() - DAY_MS),
          input.installedOn,
          ...(input.surveys ?? []).map((s) => new Date(s.date.getTime() + 1)),
          today,
          new Date(today.getTime() + rand() * 8 * YEAR_MS),
        ];
        parts.push(forecastText(input, probes));
        let f: ReturnType<typeof forecastGroup>;
        try {
          f = forecastGroup(input);
        } catch {
          seen.add('forecast refused');
          return { id: `${assetId}-g${g}`, renewBy: null };
        }
        seen.add(f.basis);
        if (f.spent) seen.add('spent');
        if (f.endOfLife === null) seen.add(f.renewBy === null ? 'never depletes' : 'renewBy without endOfLife');
        if (f.endOfLife !== null && f.late === null) seen.add('no late end');
        if (f.profileScale === undefined) seen.add('no design current');
        const confirmed = rand();
        const confirmedRenewal =
          confirmed < 0.08 && dockings.length > 0 ? { dockingId: pick(rand, dockings).id } : confirmed < 0.1 ? { dockingId: 'nowhere' } : confirmed < 0.15 ? null : undefined;
        const group: RenewalGroupInput = oldCaller
          ? { id: `${assetId}-g${g}`, endOfLife: f.endOfLife, early: rand() < 0.8 ? f.early : undefined }
          : { id: `${assetId}-g${g}`, renewBy: f.renewBy, renewByEarly: rand() < 0.85 ? f.renewByEarly : undefined };
        if (confirmedRenewal !== undefined) group.confirmedRenewal = confirmedRenewal;
        return group;
      });
      const assetKind = pick(rand, [undefined, 'vessel', 'structure'] as const);
      return { assetId, groups, dockings, ...(assetKind ? { assetKind } : {}) };
    });
    parts.push(outcome(() => proposeRenewalsForFleet(assets, opts)));
    for (const a of proposeRenewalsForFleet(assets, opts)) {
      for (const p of a.proposals) {
        seen.add(p.status);
        for (const flag of ['overdue', 'atRisk', 'withinMargin', 'earlierDocking', 'warning', 'nextReviewBy'] as const) if (p[flag]) seen.add(`${p.status} ${flag}`);
      }
    }
    for (const a of assets) parts.push(outcome(() => proposeRenewals({ ...opts, groups: a.groups, dockings: a.dockings, assetKind: a.assetKind })));
  }
  return digest(parts);
}

// ---------- 3. refusals: the same field and the same sentence ----------

function refusalsText(): string {
  const today = new Date('2027-01-15T00:00:00Z');
  const good: GroupForecastInput = { installedOn: new Date('2025-03-01T00:00:00Z'), quantity: 4, netMassPerAnodeKg: 7.7, utilisationFactor: 0.8, capacityAhPerKg: 2000, currentA: 0.3 };
  const forecasts: unknown[] = [
    null,
    {},
    { ...good, installedOn: new Date(NaN) },
    { ...good, quantity: 1.5 },
    { ...good, netMassPerAnodeKg: 0 },
    { ...good, utilisationFactor: 1.2 },
    { ...good, capacityAhPerKg: -1 },
    { ...good, currentA: -0.1 },
    { ...good, currentA: undefined },
    { ...good, demandProfile: { startA: 1, endA: -1, overYears: 2 } },
    { ...good, demandProfile: { startA: 1, endA: 1, overYears: 0 } },
    { ...good, demandProfile: 'linear' },
    { ...good, renewalThresholdRemaining: 1.5 },
    { ...good, surveys: 'none' },
    { ...good, surveys: [{ date: new Date('2024-01-01T00:00:00Z'), remainingFraction: 0.5 }] },
    { ...good, surveys: [{ date: new Date('2026-01-01T00:00:00Z'), remainingFraction: 2 }] },
    { ...good, surveys: [null] },
    { ...good, currentA: 1e308, quantity: 1e10 },
  ];
  const parts = forecasts.map((input) => outcome(() => forecastGroup(input as GroupForecastInput)));
  const f = forecastGroup(good);
  parts.push(outcome(() => f.remainingFractionAt('2026' as unknown as Date)));
  parts.push(outcome(() => f.remainingSeries(today, new Date('2026-01-01T00:00:00Z'), 1)));
  parts.push(outcome(() => f.remainingSeries(today, today, 0)));
  parts.push(outcome(() => f.remainingSeries(new Date('1600-01-01T00:00:00Z'), today, 1)));
  const groups = [{ id: 'g', renewBy: f.renewBy }];
  const fleets: [unknown, unknown][] = [
    [[{ assetId: 'a', groups, dockings: [] }], null],
    [[{ assetId: 'a', groups, dockings: [] }], { today: 'today' }],
    [[{ assetId: 'a', groups, dockings: [] }], { today, marginMonths: -1 }],
    [[{ assetId: 'a', groups, dockings: [] }], { today, typicalIntervalMonths: 0 }],
    [[{ assetId: '', groups, dockings: [] }], { today }],
    [[{ assetId: 'a', groups: 'all', dockings: [] }], { today }],
    [[{ assetId: 'a', groups, dockings: [{ id: 'd', date: today, status: 'booked' }] }], { today }],
    [[{ assetId: 'a', groups, dockings: [{ id: 'd', date: today }, { id: 'd', date: today }] }], { today }],
    [[{ assetId: 'a', groups, dockings: [{ id: 'd', date: 'soon' }] }], { today }],
    [[{ assetId: 'a', groups: [{ id: 'g', renewBy: 'soon' }], dockings: [] }], { today }],
    [[{ assetId: 'a', groups: [{ id: 'g', renewBy: today, renewByEarly: 'soon' }], dockings: [] }], { today }],
    [[{ assetId: 'a', groups: [{ id: 'g' }], dockings: [] }], { today }],
    [[{ assetId: 'a', groups: [{ id: 'g', renewBy: today, confirmedRenewal: { dockingId: 3 } }], dockings: [] }], { today }],
    ['fleet', { today }],
  ];
  for (const [assets, opts] of fleets) parts.push(outcome(() => proposeRenewalsForFleet(assets as never, opts as never)));
  return digest(parts);
}

describe('forecast and renewal outputs are pinned (bit for bit)', () => {
  const TODAY = new Date('2027-01-15T00:00:00Z');

  it('the bench fleet, as the bench runs it, and with other options', () => {
    expect({
      seed500: fleetText(500, 60, TODAY),
      seed250: fleetText(250, 40, TODAY),
      seed7: fleetText(7, 25, new Date('2026-08-31T13:45:00Z'), { marginMonths: 12, typicalIntervalMonths: 36 }),
      seed42: fleetText(42, 25, new Date('2028-02-29T00:00:00Z'), { marginMonths: 0 }),
    }).toEqual(PINNED.fleets);
  });

  it('seeded edge cases: profiles, odd surveys, awkward dates, every rule of the scheduler', () => {
    expect({ 1: edgeCaseText(1), 2: edgeCaseText(2), 3: edgeCaseText(3), 4: edgeCaseText(4) }).toEqual(PINNED.edges);
    // Every status and flag of the scheduler and every kind of forecast was reached.
    expect([...seen].sort()).toEqual([
      'design-rate',
      'kept',
      'kept warning',
      'never depletes',
      'no design current',
      'no late end',
      'no-docking',
      'no-docking earlierDocking',
      'no-docking overdue',
      'proposed',
      'proposed atRisk',
      'proposed earlierDocking',
      'proposed overdue',
      'proposed withinMargin',
      'renewBy without endOfLife',
      'sound',
      'sound nextReviewBy',
      'spent',
      'survey-corrected',
    ]);
  });

  it('refusals: the same fields and sentences', () => {
    expect(refusalsText()).toBe(PINNED.refusals);
  });
});

const PINNED = {
  fleets: {
    seed500: '39c94ef6553fc47e1bcb2af20fb212005fa86d11185b81ba709379a7a9b105af',
    seed250: '04768faa642f118bfe841054d86db52345f93b8f12ddaab97de81b4eb4b65b9f',
    seed7: '6689bb182ad87f15053b60abce32f749ea3d61aa05a0665a6fa66d5d00c226ef',
    seed42: '6b77edf237fb583646fc2ec4d12be87803b325fb506647e50ff3063f50c8cc55',
  },
  edges: {
    1: 'f51f8ccadeed49c44bfc8e0bbcf4f849d81167930a49cec16c6e84b05c9b057f',
    2: 'df0db508ba2718361a57343869d80068440b299a420d564b071145968421ffbe',
    3: 'dcebe76d18d8d8ee0c48a32c74079bb9c672741111de3b8bdc4a873f20177e60',
    4: 'cf851d39e4af4f65ffbc9a4f08c0ce6daf727821d074a972b662b15f7f181966',
  },
  refusals: 'c505556e4da5e9e96a4aec95a8616a5c4bebe94c4ba433a9df752e83f927526f',
};

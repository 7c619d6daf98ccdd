// The benchmarks behind `npm run bench` (scripts/bench.mjs starts PostgreSQL, migrates a fresh
// bench database and runs this file with DATABASE_URL set). Prints one table and ends with
// "bench: N within target, M over target". Exit code 0 even when a benchmark is over its target
// (a measurement, not a test); 1 when a benchmark crashes.
//
// Every time is the median (and p95) of N runs after warm-up runs, in this one process. Machines
// differ, so each median is also given as a RATIO to a BASELINE: a fixed reference workload (a
// JSON round trip of a 1 MB object) timed in the same process and the same run, before and after
// the benchmarks. ratio = benchmark median / baseline median; compare ratios across machines.
import { randomUUID } from 'node:crypto';
import os from 'node:os';
import { MikroORM } from '@mikro-orm/postgresql';
import { ormConfig } from '../mikro-orm.config';
import { getEnv } from '../lib/server/env';
import { AssetSchema } from '../entities';
import { designAnodeSystem } from '../lib/cp';
import { forecastGroup, proposeRenewalsForFleet, type FleetAssetProposals } from '../lib/forecast';
import { buildAnodeList } from '../lib/anode-list';
import { renderAnodeListPdf } from '../lib/anode-list/render-anode-list-pdf';
import { listAnodeGroups } from '../lib/server/services/register/list-anode-groups';
import { computeDesk } from '../lib/server/services/designs/compute-design';
import { defaultInputs } from '../lib/server/services/designs/create-design';
import type { ListQuery } from '../lib/schemas/register';
import type { OrgContext } from '../lib/server/org-context';
import { ctxFor, makeOrgWithRoles } from '../tests/fixtures/factories';
import { BENCH_FERRY, benchAnodeListInput, benchFleet, benchHullDesign, seededRandom, type BenchVessel } from '../tests/fixtures/bench-data';

// ---------- timing ----------
interface Timing {
  runs: number;
  medianMs: number;
  p95Ms: number;
  samples: number[];
}

function summarise(samples: number[]): Timing {
  const sorted = [...samples].sort((a, b) => a - b);
  const at = (q: number) => sorted[Math.min(sorted.length - 1, Math.max(0, Math.ceil(q * sorted.length) - 1))];
  const mid = sorted.length / 2;
  const median = sorted.length % 2 ? sorted[Math.floor(mid)] : (sorted[mid - 1] + sorted[mid]) / 2;
  return { runs: samples.length, medianMs: median, p95Ms: at(0.95), samples };
}

const collectGarbage = () => (globalThis as { gc?: () => void }).gc?.();

async function time(fn: () => unknown, { warmup, runs }: { warmup: number; runs: number }): Promise<Timing> {
  for (let i = 0; i < warmup; i++) await fn();
  collectGarbage();
  const samples: number[] = [];
  for (let i = 0; i < runs; i++) {
    const t0 = performance.now();
    await fn();
    samples.push(performance.now() - t0);
  }
  return summarise(samples);
}

// ---------- baseline ----------
/** About 1 MB of JSON: 4,000 invented register rows. */
function baselineObject() {
  const rand = seededRandom(1);
  return Array.from({ length: 4000 }, (_, i) => ({
    id: `00000000-0000-4000-8000-${String(i).padStart(12, '0')}`,
    asset: `Vessel ${i % 200}`,
    label: `Group ${i}`,
    model: { designation: 'TW-AW-4020', alloy: 'al-zn-in', mounting: 'flush-weld', netMassKg: 7.7, grossMassKg: 8.7 },
    quantity: 1 + Math.floor(rand() * 24),
    remaining: Math.round(rand() * 1000) / 1000,
    positions: `Fr ${Math.floor(rand() * 150)}-${Math.floor(rand() * 150)} P/S, ${(rand() * 4).toFixed(1)} m above keel`,
    readings: [rand(), rand(), rand()].map((x) => Math.round(x * 1000) / 1000),
  }));
}
const BASELINE = baselineObject();
const BASELINE_BYTES = JSON.stringify(BASELINE).length;
const baselineWork = () => JSON.parse(JSON.stringify(BASELINE));

// ---------- results ----------
interface Row {
  label: string;
  timing: Timing | null;
  targetMs: number | null;
  /** A target on the ratio to the baseline as well, with where it comes from. */
  ratioTarget?: { below: number; source: string };
  /** Shown instead of pass/fail for rows without a target of their own. */
  verdict?: string;
  notes: string[];
  error?: unknown;
}

const rows: Row[] = [];

async function bench(label: string, targetMs: number | null, run: () => Promise<{ timing: Timing; notes?: string[]; verdict?: string; ratioTarget?: Row['ratioTarget'] }>) {
  process.stdout.write(`  ${label}...\n`);
  collectGarbage();
  try {
    const { timing, notes = [], verdict, ratioTarget } = await run();
    rows.push({ label, timing, targetMs, notes, verdict, ratioTarget });
  } catch (error) {
    rows.push({ label, timing: null, targetMs, notes: [], error });
  }
}

// TIDEWARDEN_BENCH_ONLY=pdf (or a comma list of design, forecast, pdf, database) runs only those benchmarks.
const ONLY = new Set((process.env.TIDEWARDEN_BENCH_ONLY ?? '').split(',').map((x) => x.trim()).filter(Boolean));
const selected = (name: 'design' | 'forecast' | 'pdf' | 'database') => ONLY.size === 0 || ONLY.has(name);

const fmtMs = (ms: number) => (ms >= 100 ? ms.toFixed(0) : ms >= 10 ? ms.toFixed(1) : ms >= 1 ? ms.toFixed(2) : ms.toFixed(3)) + ' ms';
const fmtRatio = (r: number) => (r >= 100 ? r.toFixed(0) : r >= 10 ? r.toFixed(1) : r >= 1 ? r.toFixed(2) : r.toPrecision(2));
const int = (n: number) => n.toLocaleString('en-GB');

// ---------- 1. lib/cp ----------
async function benchDesign() {
  const input = benchHullDesign();
  const result = designAnodeSystem(input);
  const timing = await time(() => designAnodeSystem(input), { warmup: 300, runs: 2001 });
  return { timing, notes: [`${input.surfaces.length} surfaces, ${result.anodeCount} anodes (governing: ${result.governingCriterion})`] };
}

// ---------- 2. lib/forecast ----------
const TODAY = new Date('2027-01-15T00:00:00Z');

function forecastAndSchedule(fleet: BenchVessel[]): FleetAssetProposals[] {
  return proposeRenewalsForFleet(
    fleet.map((v) => ({
      assetId: v.assetId,
      dockings: v.dockings,
      groups: v.groups.map((g) => {
        const f = forecastGroup(g.forecast);
        return { id: g.id, renewBy: f.renewBy, renewByEarly: f.renewByEarly, confirmedRenewal: g.confirmedRenewal };
      }),
    })),
    { today: TODAY },
  );
}

async function benchFleetPair() {
  const big = benchFleet({ vessels: 500, today: TODAY, seed: 500 });
  const small = benchFleet({ vessels: 250, today: TODAY, seed: 250 });
  const result = forecastAndSchedule(big);
  const byStatus = new Map<string, number>();
  for (const a of result) for (const p of a.proposals) byStatus.set(p.status, (byStatus.get(p.status) ?? 0) + 1);
  // Interleaved so that load from other processes falls on both sizes alike.
  for (let i = 0; i < 3; i++) {
    forecastAndSchedule(big);
    forecastAndSchedule(small);
  }
  collectGarbage();
  const bigSamples: number[] = [];
  const smallSamples: number[] = [];
  for (let i = 0; i < 15; i++) {
    let t0 = performance.now();
    forecastAndSchedule(big);
    bigSamples.push(performance.now() - t0);
    t0 = performance.now();
    forecastAndSchedule(small);
    smallSamples.push(performance.now() - t0);
  }
  const groups = big.reduce((n, v) => n + v.groups.length, 0);
  const dockings = big.reduce((n, v) => n + v.dockings.length, 0);
  const statuses = [...byStatus].sort().map(([s, n]) => `${int(n)} ${s}`).join(', ');
  return {
    big: summarise(bigSamples),
    small: summarise(smallSamples),
    notes: [`${int(big.length)} vessels, ${int(groups)} groups (60 % surveyed), ${int(dockings)} dockings; proposals: ${statuses}`],
  };
}

// ---------- 3. the dry-dock anode list PDF ----------
async function benchPdf() {
  const input = benchAnodeListInput(300);
  let bytes = 0;
  const timing = await time(
    async () => {
      bytes = (await renderAnodeListPdf(buildAnodeList(input))).length;
    },
    { warmup: 2, runs: 9 },
  );
  return {
    timing,
    notes: [`300 lines in 8 zones, 5 models; buildAnodeList + renderAnodeListPdf; ${int(Math.round(bytes / 1024))} KiB`],
    // 85: the ratio of this benchmark recorded when issue 13 was filed (about 2.0 s on the 2-core machine); the issue
    // asks for under a third of it.
    ratioTarget: { below: 85 / 3, source: 'a third of 85, the ratio recorded when issue 13 was filed' },
  };
}

// ---------- 4 and 5: the database ----------
let statements = 0;
let counting = false;

async function insertRows(orm: MikroORM, table: string, columns: string[], values: unknown[][], casts: Record<string, string> = {}) {
  // PostgreSQL takes at most 65,535 parameters per statement.
  const perStatement = Math.floor(60_000 / columns.length);
  const conn = orm.em.getConnection();
  for (let i = 0; i < values.length; i += perStatement) {
    const chunk = values.slice(i, i + perStatement);
    const tuple = `(${columns.map((c) => `?${casts[c] ?? ''}`).join(', ')})`;
    await conn.execute(`insert into "${table}" (${columns.map((c) => `"${c}"`).join(', ')}) values ${chunk.map(() => tuple).join(', ')}`, chunk.flat(), 'run');
  }
}

const ASSET_FIRST = ['Brisa', 'Kestrel', 'Morwen', 'Tidecrest', 'Harrow', 'Saltbeck', 'Fennick', 'Orla', 'Stormwell', 'Lune'];
const ASSET_SECOND = ['Meridian', 'Spray', 'Runner', 'Star', 'Light', 'Venture', 'Bay', 'Sound', 'Wake', 'Crest'];
const ZONES = [
  ['Hull bottom', 'hull-bottom'],
  ['Boot-top and sides', 'boot-top-sides'],
  ['Rudder', 'rudder'],
  ['Sea chests', 'sea-chest'],
] as const;
const MODELS = [
  { key: 'builtin:TW-AW-4020', designation: 'TW-AW-4020', alloy: 'al-zn-in', mounting: 'flush-weld', netMassKg: 7.7, grossMassKg: 8.7, capacityAhPerKg: 2000, utilisationFactor: 0.8, potentialV: -1.05 },
  { key: 'builtin:TW-AW-6512', designation: 'TW-AW-6512', alloy: 'al-zn-in', mounting: 'flush-weld', netMassKg: 9.8, grossMassKg: 11, capacityAhPerKg: 2000, utilisationFactor: 0.85, potentialV: -1.05 },
  { key: 'builtin:TW-ZB-2510', designation: 'TW-ZB-2510', alloy: 'zinc', mounting: 'flush-bolt', netMassKg: 4.7, grossMassKg: 5, capacityAhPerKg: 780, utilisationFactor: 0.8, potentialV: -1.03 },
];

/** 200 vessels with 4 zones each, 8,000 installed groups, one diver survey per vessel reading 3 groups in 4. */
async function seedRegister(orm: MikroORM, organisationId: string, inspectorId: string) {
  const rand = seededRandom(8000);
  const now = new Date();
  const assets = Array.from({ length: 200 }, (_, i) => ({ id: randomUUID(), name: `${ASSET_FIRST[i % 10]} ${ASSET_SECOND[Math.floor(i / 10) % 10]} ${Math.floor(i / 100) + 1}` }));
  await insertRows(
    orm,
    'asset',
    ['id', 'organisation_id', 'kind', 'name', 'hull_material', 'has_impressed_current', 'created_at', 'updated_at'],
    assets.map((a) => [a.id, organisationId, 'vessel', a.name, 'steel', false, now, now]),
  );
  const zones = assets.flatMap((a) => ZONES.map(([name, kind], k) => ({ id: randomUUID(), assetId: a.id, name, kind, sortOrder: k })));
  await insertRows(
    orm,
    'zone',
    ['id', 'asset_id', 'name', 'kind', 'area_m2', 'coating_category', 'water_type', 'climate', 'depth_band', 'sort_order', 'created_at'],
    zones.map((z) => [z.id, z.assetId, z.name, z.kind, Math.round(50 + rand() * 900), 'II', 'seawater', 'temperate', '0-30', z.sortOrder, now]),
  );
  const groups = assets.flatMap((a, ai) =>
    Array.from({ length: 40 }, (_, g) => {
      const zone = zones[ai * 4 + (g % 4)];
      const model = MODELS[g % 3];
      const quantity = 2 + Math.floor(rand() * 22);
      const installedOn = new Date(now.getTime() - (0.2 + rand() * 4) * 365.25 * 86_400_000).toISOString().slice(0, 10);
      return { id: randomUUID(), assetId: a.id, zoneId: zone.id, label: `${zone.name.split(' ')[0]} ${g % 2 ? 'S' : 'P'}${Math.floor(g / 2) + 1}`, model, quantity, installedOn };
    }),
  );
  await insertRows(
    orm,
    'anode_group',
    ['id', 'organisation_id', 'asset_id', 'zone_id', 'label', 'model', 'quantity', 'positions', 'installed_on', 'mean_current_a', 'created_at', 'updated_at'],
    groups.map((g) => [g.id, organisationId, g.assetId, g.zoneId, g.label, JSON.stringify(g.model), g.quantity, `Fr ${Math.floor(rand() * 140)} ${g.label.endsWith('1') ? 'P/S' : 'P'}`, g.installedOn, Math.round(rand() * 500) / 1000, now, now]),
    { model: '::jsonb' },
  );
  const surveys = assets.map((a) => ({ id: randomUUID(), assetId: a.id }));
  const surveyedOn = new Date(now.getTime() - 200 * 86_400_000).toISOString().slice(0, 10);
  await insertRows(
    orm,
    'survey',
    ['id', 'organisation_id', 'asset_id', 'surveyed_on', 'method', 'surveyor', 'created_by_id', 'created_at'],
    surveys.map((s) => [s.id, organisationId, s.assetId, surveyedOn, 'diver', 'Bench Diving Services', inspectorId, now]),
  );
  const readings = groups.flatMap((g, i) => (i % 4 === 3 ? [] : [[randomUUID(), surveys[Math.floor(i / 40)].id, (i % 40) + 1, g.label, g.id, Math.round((0.3 + rand() * 0.65) * 100) / 100]]));
  await insertRows(orm, 'survey_reading', ['id', 'survey_id', 'line', 'location', 'anode_group_id', 'remaining_fraction'], readings);
  // A live database has statistics; without them the planner guesses. Analyse as autovacuum would.
  await orm.em.getConnection().execute('analyze', [], 'run');
  return { assets: assets.length, zones: zones.length, groups: groups.length, readings: readings.length };
}

async function benchDatabase(url: string) {
  const orm = await MikroORM.init(
    ormConfig(url, {
      debug: ['query'],
      logger: (message: string) => {
        if (counting && message.includes('[query]')) statements++;
      },
    }),
  );
  try {
    const setupEm = orm.em.fork();
    const { organisation, users } = await makeOrgWithRoles(setupEm, 'Kestrel Firth Ferries (bench)');
    const seedStarted = performance.now();
    const seeded = await seedRegister(orm, organisation.id, users.inspector.id);
    const seedMs = performance.now() - seedStarted;
    const ferry = setupEm.create(AssetSchema, { organisation, kind: 'vessel', ...BENCH_FERRY });
    await setupEm.flush();

    /** A request's context: a fresh EntityManager fork, as withOrg gives each request. */
    const viewerCtx = await ctxFor(setupEm, organisation, users.viewer);
    const engineerCtx = await ctxFor(setupEm, organisation, users.engineer);
    const fresh = (ctx: OrgContext): OrgContext => ({ ...ctx, em: orm.em.fork() });
    const countStatements = async (fn: () => Promise<unknown>) => {
      statements = 0;
      counting = true;
      try {
        await fn();
      } finally {
        counting = false;
      }
      return statements;
    };

    const query = { page: 1, pageSize: 50, dir: 'asc', archived: '0' } as ListQuery;
    await bench('register, first page of 8,000 groups', 200, async () => {
      const first = await listAnodeGroups(fresh(viewerCtx), query);
      if (first.total !== seeded.groups || first.rows.length !== 50) throw new Error(`listAnodeGroups returned ${first.rows.length} rows of ${first.total}, expected 50 of ${seeded.groups}`);
      const sql = await countStatements(() => listAnodeGroups(fresh(viewerCtx), query));
      const timing = await time(() => listAnodeGroups(fresh(viewerCtx), query), { warmup: 5, runs: 41 });
      return {
        timing,
        notes: [
          `${seeded.assets} vessels, ${int(seeded.zones)} zones, ${int(seeded.groups)} groups, ${int(seeded.readings)} survey readings (seeded in ${fmtMs(seedMs)}); SQL statements per call: ${sql}`,
        ],
      };
    });

    const inputs = defaultInputs(ferry, []);
    await bench('design desk recompute, 96 m ferry (server side)', 150, async () => {
      const desk = await computeDesk(fresh(engineerCtx), inputs);
      if (!desk.result) throw new Error(`computeDesk gave no result: ${desk.error?.message}`);
      const sql = await countStatements(() => computeDesk(fresh(engineerCtx), inputs));
      const timing = await time(() => computeDesk(fresh(engineerCtx), inputs), { warmup: 10, runs: 61 });
      return {
        timing,
        notes: [
          `${inputs.surfaces.length} zones from the particulars (Denny-Mumford), ${desk.result.anodeCount} x ${desk.model.designation}, ${desk.options.length} catalogue options compared; SQL statements per call: ${sql}. This is the server's share of the desk's round trip (no HTTP, JSON or browser time).`,
        ],
      };
    });
  } finally {
    await orm.close(true);
  }
}

// ---------- main ----------
async function main() {
  const url = getEnv().DATABASE_URL;
  const started = performance.now();
  const cpu = os.cpus()[0]?.model?.trim() ?? 'unknown CPU';
  process.stdout.write(`Tidewarden benchmarks: Node ${process.version}, ${os.platform()} ${os.arch()}, ${os.cpus().length} x ${cpu}, load average ${os.loadavg()[0].toFixed(2)}\n`);
  process.stdout.write(`Baseline workload: JSON.parse(JSON.stringify(x)) of a ${(BASELINE_BYTES / 1e6).toFixed(2)} MB object, timed before and after the benchmarks.\n`);
  const before = await time(baselineWork, { warmup: 10, runs: 40 });

  if (selected('design')) await bench('designAnodeSystem, 50-surface hull', 1, benchDesign);

  let fleetSmall: Timing | null = null;
  if (selected('forecast')) await bench('forecast + renewals, 500 vessels x 30 groups x 10 dockings', 200, async () => {
    const { big, small, notes } = await benchFleetPair();
    fleetSmall = small;
    // 10.3: the ratio of this benchmark recorded when issue 15 was filed (242 ms on the 2-core machine); the issue
    // asks for under half of it.
    return { timing: big, notes, ratioTarget: { below: 10.3 / 2, source: 'half of 10.3, the ratio recorded when issue 15 was filed' } };
  });
  const bigRow = rows[rows.length - 1];
  if (fleetSmall && bigRow?.timing) {
    const scale = bigRow.timing.medianMs / (fleetSmall as Timing).medianMs;
    rows.push({
      label: '  same at half size (250 vessels)',
      timing: fleetSmall,
      targetMs: null,
      verdict: `x${scale.toFixed(2)}`,
      notes: [`500 / 250 vessels = x${scale.toFixed(2)} (about 2 means linear cost; ${scale > 1.5 && scale < 2.6 ? 'linear' : 'NOT linear'})`],
    });
  }

  if (selected('pdf')) await bench('dry-dock anode list PDF, 300 lines', 2000, benchPdf);
  if (selected('database')) try {
    await benchDatabase(url);
  } catch (error) {
    // The set-up (ORM, seeding) failed before either database benchmark could run.
    rows.push({ label: 'register, first page of 8,000 groups', timing: null, targetMs: 200, notes: [], error });
    rows.push({ label: 'design desk recompute, 96 m ferry (server side)', timing: null, targetMs: 150, notes: [], error });
  }

  const after = await time(baselineWork, { warmup: 3, runs: 40 });
  const baseline = summarise([...before.samples, ...after.samples]);

  // ---------- the table ----------
  const header = ['#', 'benchmark', 'runs', 'median', 'p95', 'target', 'result', 'ratio'];
  const table: string[][] = [];
  let n = 0;
  let within = 0;
  let over = 0;
  let crashed = 0;
  for (const r of rows) {
    const numbered = r.targetMs !== null;
    if (numbered) n++;
    let result: string;
    if (r.error) {
      result = 'CRASHED';
      crashed++;
    } else if (r.targetMs === null) {
      result = r.verdict ?? '';
    } else if (r.timing!.medianMs < r.targetMs) {
      result = 'within';
      within++;
    } else {
      result = 'OVER';
      over++;
    }
    table.push([
      numbered ? String(n) : '',
      r.label,
      r.timing ? String(r.timing.runs) : '-',
      r.timing ? fmtMs(r.timing.medianMs) : '-',
      r.timing ? fmtMs(r.timing.p95Ms) : '-',
      r.targetMs === null ? '-' : `< ${r.targetMs >= 1000 ? `${r.targetMs / 1000} s` : `${r.targetMs} ms`}`,
      result,
      r.timing ? fmtRatio(r.timing.medianMs / baseline.medianMs) : '-',
    ]);
  }
  const widths = header.map((h, i) => Math.max(h.length, ...table.map((row) => row[i].length)));
  const right = new Set([2, 3, 4, 5, 7]);
  const line = (cells: string[]) => cells.map((c, i) => (right.has(i) ? c.padStart(widths[i]) : c.padEnd(widths[i]))).join(' | ');
  const out: string[] = [''];
  out.push(
    `Baseline median ${fmtMs(baseline.medianMs)} (p95 ${fmtMs(baseline.p95Ms)}, ${baseline.runs} runs; before ${fmtMs(before.medianMs)}, after ${fmtMs(after.medianMs)}). ratio = benchmark median / baseline median.`,
  );
  out.push('');
  out.push(line(header));
  out.push(widths.map((w) => '-'.repeat(w)).join('-|-'));
  for (const row of table) out.push(line(row));
  out.push('');
  n = 0;
  for (const r of rows) {
    const tag = r.targetMs !== null ? `${++n}.` : '  ';
    if (r.error) out.push(`${tag} ${r.label}: CRASHED: ${r.error instanceof Error ? (r.error.stack ?? r.error.message) : String(r.error)}`);
    for (const note of r.notes) out.push(`${tag} ${note}`);
    if (r.ratioTarget && r.timing) {
      const ratio = r.timing.medianMs / baseline.medianMs;
      out.push(`${tag} ratio ${fmtRatio(ratio)} against a target ratio < ${r.ratioTarget.below.toFixed(1)} (${r.ratioTarget.source}): ${ratio < r.ratioTarget.below ? 'target met' : 'target NOT met'}`);
    }
  }
  out.push(`Whole run ${((performance.now() - started) / 1000).toFixed(1)} s in one process (NODE_ENV=${process.env.NODE_ENV ?? 'unset'}).`);
  out.push('');
  out.push(`bench: ${within} within target, ${over} over target${crashed ? `, ${crashed} crashed` : ''}`);
  process.stdout.write(out.join('\n') + '\n');
  process.exitCode = crashed ? 1 : 0;
}

main().catch((error) => {
  console.error(`bench failed: ${error instanceof Error ? (error.stack ?? error.message) : String(error)}`);
  process.exit(1);
});

// The HTTP stage of `npm run bench` (called by scripts/bench.mjs once the production app is up on its own
// ports, against a fresh database seeded with the demo scenario). Two measurements:
//  1. throughput: autocannon, 20 connections, TIDEWARDEN_BENCH_HTTP_SECONDS (default 10) per endpoint, signed
//     in as the demo owner, after one unrecorded warm-up round (TIDEWARDEN_BENCH_HTTP_WARMUP_SECONDS per endpoint, default 8). /api/health is measured
//     first and last; the mean of the two is the reference, and each row's requests/s is given as a ratio to
//     it (machines differ; ratios compare). Targets: every JSON list API and the calculations POST >= 0.35 of
//     health, the fleet and asset pages >= 0.25.
//  2. first-load JavaScript of every page route: the distinct <script src> chunks its HTML references (what a
//     browser loads before the page runs), raw and gzip; target <= 1.5 x the smallest route.
// Every response's status is checked before and after each run: a redirect (to sign-in), a 4xx/5xx or an
// error during the run makes the row FAILED instead of a fast number.
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import autocannon from 'autocannon';
import { root, runTsForOutput, say } from './lib/bootstrap.mjs';
import { runProblems, scriptSources, throughputVerdict, wrongAnswer } from './lib/bench-judge.mjs';

const CONNECTIONS = 20;
const LIST_TARGET = 0.35;
const PAGE_TARGET = 0.25;
const FIRST_LOAD_TARGET = 1.5;
// Long enough for the heaviest page's code to be optimised by V8: with 3 s the fleet page was measured at about two
// thirds of its steady rate (74 against 132 requests/s in two back-to-back runs on this machine).
const WARMUP_SECONDS = Number(process.env.TIDEWARDEN_BENCH_HTTP_WARMUP_SECONDS ?? 8);

/** GET routes under app/api/orgs/[org] that answer a file or one record, not a list (so no list target). */
const NOT_LISTS = {
  'anode-groups/export': 'the register as a CSV file (a download, not a list API)',
  'assets/[assetId]/figures/[figure]': "one of the asset page's figures, an SVG image (the browser keeps it while its version stands)",
  'designs/[designId]': 'one design revision',
  'designs/[designId]/note': 'a PDF',
  'dockings/[dockingId]/anode-list': 'the anode list as a PDF or CSV file',
  'surveys/[surveyId]/attachments/[attachmentId]': 'one stored file',
  'surveys/template': 'a CSV template',
};

/** Pages that exist only with the local SMTP fake, never in a deployment. */
const DEV_ONLY_PAGES = ['/dev/inbox'];

export function httpSeconds() {
  const raw = process.env.TIDEWARDEN_BENCH_HTTP_SECONDS;
  if (raw === undefined || raw === '') return 10;
  const seconds = Number(raw);
  if (!Number.isFinite(seconds) || seconds < 1) throw new Error(`TIDEWARDEN_BENCH_HTTP_SECONDS must be a number of seconds, at least 1 (it is "${raw}").`);
  return seconds;
}

// ---------- the route files ----------
function walk(dir, file) {
  const found = [];
  for (const entry of fs.readdirSync(dir, { withFileTypes: true })) {
    const full = path.join(dir, entry.name);
    if (entry.isDirectory()) found.push(...walk(full, file));
    else if (entry.name === file) found.push(full);
  }
  return found;
}

/** app/(auth)/sign-in/page.tsx -> /sign-in: the URL pattern of a route file (route groups dropped). */
function routeOf(file, appDir) {
  const segments = path.relative(appDir, path.dirname(file)).split(path.sep).filter((s) => s && !/^\(.*\)$/.test(s));
  return `/${segments.join('/')}`;
}

/** The GET route handlers under app/api/orgs/[org], as paths below it ('assets', 'dockings/[dockingId]/renewals'). */
function orgGetRoutes() {
  const base = path.join(root, 'app', 'api', 'orgs', '[org]');
  return walk(base, 'route.ts')
    .filter((file) => /export\s+(const|async\s+function)\s+GET\b/.test(fs.readFileSync(file, 'utf8')))
    .map((file) => path.relative(base, path.dirname(file)).split(path.sep).join('/'))
    .sort();
}

const fillParams = (pattern, params) =>
  pattern.replace(/\[([^\]]+)\]/g, (whole, name) => {
    if (!(name in params)) throw new Error(`no demo value for the route parameter ${whole} in ${pattern}`);
    return params[name];
  });

// ---------- requests ----------
/** One request as the bench's runs make it; the status and what came back. */
async function probe(appUrl, endpoint) {
  const response = await fetch(appUrl + endpoint.path, { method: endpoint.method, headers: endpoint.headers, body: endpoint.body, redirect: 'manual' });
  const text = await response.text();
  return { status: response.status, type: response.headers.get('content-type') ?? '', text, location: response.headers.get('location') };
}

async function measure(appUrl, endpoint, seconds) {
  const row = { label: endpoint.label, path: endpoint.path, kind: endpoint.kind, target: endpoint.target, problems: [] };
  try {
    const before = await probe(appUrl, endpoint);
    const wrongBefore = wrongAnswer(endpoint, before);
    if (wrongBefore) {
      row.problems.push(`before the run: ${wrongBefore}`);
      return row;
    }
    // Warm-up outside the timed run: the first requests load modules and fill caches.
    for (let i = 0; i < 5; i++) await probe(appUrl, endpoint);
    const result = await autocannon({
      url: appUrl + endpoint.path,
      method: endpoint.method,
      headers: endpoint.headers,
      body: endpoint.body,
      connections: CONNECTIONS,
      duration: seconds,
      timeout: 30,
    });
    row.requestsPerSecond = result.requests.average;
    row.total = result.requests.total;
    row.p50 = result.latency.p50;
    row.p99 = result.latency.p99;
    row.non2xx = result.non2xx;
    row.problems.push(...runProblems(result, seconds));
    const after = await probe(appUrl, endpoint);
    const wrongAfter = wrongAnswer(endpoint, after);
    if (wrongAfter) row.problems.push(`after the run: ${wrongAfter}`);
  } catch (error) {
    row.problems.push(`crashed: ${error?.message ?? error}`);
  }
  return row;
}

// ---------- first-load JavaScript ----------
async function firstLoad(appUrl, pages, cookie) {
  const chunkCache = new Map(); // src -> { raw, gzip } or { error }
  const chunk = async (src) => {
    if (!chunkCache.has(src)) {
      chunkCache.set(
        src,
        (async () => {
          const response = await fetch(new URL(src, appUrl));
          if (!response.ok) return { error: `${src}: status ${response.status}` };
          const bytes = Buffer.from(await response.arrayBuffer());
          // zlib's default level, which Next's own compression uses.
          return { raw: bytes.length, gzip: zlib.gzipSync(bytes).length };
        })(),
      );
    }
    return chunkCache.get(src);
  };
  const rows = [];
  for (const page of pages) {
    const row = { route: page.route, url: page.url, problems: [] };
    rows.push(row);
    if (page.error) {
      row.problems.push(page.error);
      continue;
    }
    try {
      const response = await fetch(appUrl + page.url, { headers: page.signedIn ? { cookie } : {}, redirect: 'manual' });
      const html = await response.text();
      if (response.status !== 200) {
        row.problems.push(`status ${response.status}${response.headers.get('location') ? ` to ${response.headers.get('location')}` : ''}`);
        continue;
      }
      const { sources, noModule } = scriptSources(html);
      row.noModule = noModule;
      if (sources.length === 0) row.problems.push('the HTML references no script');
      row.chunks = sources.length;
      row.raw = 0;
      row.gzip = 0;
      for (const src of sources) {
        const size = await chunk(src);
        if (size.error) row.problems.push(size.error);
        else {
          row.raw += size.raw;
          row.gzip += size.gzip;
        }
      }
    } catch (error) {
      row.problems.push(`crashed: ${error?.message ?? error}`);
    }
  }
  return rows;
}

/** Next 16 (Turbopack) no longer prints sizes, but writes each route's uncompressed first-load JS here: a cross-check. */
function buildStats(distDir) {
  try {
    const rows = JSON.parse(fs.readFileSync(path.join(root, distDir, 'diagnostics', 'route-bundle-stats.json'), 'utf8'));
    return new Map(rows.map((r) => [r.route, r.firstLoadUncompressedJsBytes]));
  } catch {
    return new Map();
  }
}

// ---------- printing ----------
const fixed = (n, digits) => (n === undefined || n === null || Number.isNaN(n) ? '-' : n.toFixed(digits));
const kib = (bytes) => fixed(bytes / 1024, 1);

function table(header, rows, rightAligned) {
  const widths = header.map((h, i) => Math.max(h.length, ...rows.map((row) => row[i].length)));
  const line = (cells) => cells.map((c, i) => (rightAligned.has(i) ? c.padStart(widths[i]) : c.padEnd(widths[i]))).join(' | ');
  return [line(header), widths.map((w) => '-'.repeat(w)).join('-|-'), ...rows.map(line)];
}

// ---------- the stage ----------
/**
 * @param {{ appUrl: string, env: Record<string,string>, distDir: string }} options
 * @returns {Promise<{ met: number, notMet: number, failed: number }>}
 */
export async function runHttpBench({ appUrl, env, distDir }) {
  const seconds = httpSeconds();
  const out = (line = '') => process.stdout.write(`${line}\n`);
  const session = JSON.parse(
    runTsForOutput('scripts/bench-session.ts', [], env, 'The bench could not open a session for the demo owner; see the message above.').trim().split('\n').pop(),
  );
  const { cookie, slug, ids, calculationBody } = session;
  say(`Signed in as ${session.owner} (a session row of its own; no sign-in form, so no sign-in rate limit).`);
  const params = { org: slug, ...ids, token: 'bench-unknown-token' };

  const get = (label, urlPath, kind, target, expectType, check) => ({ label, path: urlPath, kind, target, method: 'GET', headers: { cookie }, expectType, check });
  const json = (text) => {
    try {
      JSON.parse(text);
      return null;
    } catch {
      return 'the body is not JSON';
    }
  };
  const health = () => get('/api/health', '/api/health', 'reference', null, 'application/json', (text) => (JSON.parse(text).status === 'ok' ? null : `health says ${text}`));

  // Every GET route under app/api/orgs/[org] that answers a list, found from the files.
  const notMeasured = [];
  const lists = [];
  for (const route of orgGetRoutes()) {
    if (NOT_LISTS[route]) {
      notMeasured.push(`${route}: ${NOT_LISTS[route]}`);
      continue;
    }
    let urlPath;
    try {
      urlPath = `/api/orgs/${slug}/${fillParams(route, params)}`;
    } catch (error) {
      lists.push({ ...get(route, `/api/orgs/${slug}/${route}`, 'list API', LIST_TARGET, 'application/json', json), error: error.message });
      continue;
    }
    lists.push(get(`GET ${route}`, urlPath, 'list API', LIST_TARGET, 'application/json', json));
  }

  const calculations = {
    label: 'POST calculations',
    path: `/api/orgs/${slug}/calculations`,
    kind: 'calculation',
    target: LIST_TARGET,
    method: 'POST',
    // What request-guard.ts asks of an unsafe request: our own origin and a JSON body.
    headers: { cookie, origin: new URL(appUrl).origin, 'content-type': 'application/json' },
    body: JSON.stringify(calculationBody),
    expectType: 'application/json',
    check: (text) => (typeof JSON.parse(text)?.result?.anodeCount === 'number' ? null : 'the answer has no result.anodeCount'),
  };
  const html = (text) => (text.includes('<html') ? null : 'the body is not an HTML page');
  const fleetPage = get('fleet page', `/o/${slug}`, 'page', PAGE_TARGET, 'text/html', html);
  const assetPage = get('asset page', `/o/${slug}/assets/${ids.assetId}`, 'page', PAGE_TARGET, 'text/html', html);

  const endpoints = [health(), ...lists, calculations, fleetPage, assetPage, { ...health(), label: '/api/health (again)' }];
  // A freshly started server is slow until its code paths are compiled and its pools are filled: one unrecorded
  // round over every endpoint first, so that the rows measured early (the first health among them) are not
  // measured cold and the later ones warm.
  const warmup = Math.min(WARMUP_SECONDS, seconds);
  say(`Warming the server up: ${warmup} s per endpoint, not recorded...`);
  for (const endpoint of endpoints) {
    if (endpoint.error) continue;
    await autocannon({ url: appUrl + endpoint.path, method: endpoint.method, headers: endpoint.headers, body: endpoint.body, connections: CONNECTIONS, duration: warmup, timeout: 30 });
  }
  say(`Measuring ${endpoints.length} endpoints with autocannon, ${CONNECTIONS} connections, ${seconds} s each (about ${Math.ceil((endpoints.length * (seconds + 2)) / 60)} min)...`);
  const rows = [];
  for (const endpoint of endpoints) {
    process.stdout.write(`  ${endpoint.label} (${endpoint.method} ${endpoint.path})...\n`);
    rows.push(endpoint.error ? { label: endpoint.label, path: endpoint.path, kind: endpoint.kind, target: endpoint.target, problems: [endpoint.error] } : await measure(appUrl, endpoint, seconds));
  }
  const [healthFirst, healthLast] = [rows[0], rows[rows.length - 1]];
  const healthOk = !healthFirst.problems.length && !healthLast.problems.length;
  const reference = healthOk ? (healthFirst.requestsPerSecond + healthLast.requestsPerSecond) / 2 : null;

  // Pages: every page.tsx under app/, with demo values for its parameters.
  const appDir = path.join(root, 'app');
  const skipped = [];
  const pages = [];
  for (const file of walk(appDir, 'page.tsx')) {
    const route = routeOf(file, appDir);
    if (DEV_ONLY_PAGES.includes(route)) {
      skipped.push(`${route} (development only: the SMTP fake's inbox)`);
      continue;
    }
    // Signed out for the public pages (sign-in would send a signed-in user on), signed in for the rest.
    const signedIn = route === '/orgs' || route.startsWith('/o/');
    try {
      pages.push({ route, url: fillParams(route, params), signedIn });
    } catch (error) {
      pages.push({ route, url: route, signedIn, error: error.message });
    }
  }
  pages.sort((a, b) => a.route.localeCompare(b.route));
  say(`Fetching the HTML of ${pages.length} page routes and the scripts each references...`);
  const loads = await firstLoad(appUrl, pages, cookie);
  const fromBuild = buildStats(distDir);

  // ---------- the tables ----------
  let met = 0;
  let notMet = 0;
  let failed = 0;
  out('');
  out(`HTTP: autocannon, ${CONNECTIONS} connections, ${seconds} s per endpoint, signed in as the demo owner, against ${appUrl} (next start, production build in ${distDir}).`);
  out(
    `/api/health: ${fixed(healthFirst.requestsPerSecond, 1)} requests/s first, ${fixed(healthLast.requestsPerSecond, 1)} last; reference (their mean) ${reference === null ? 'none: health FAILED' : `${fixed(reference, 1)} requests/s`}. Load average ${os.loadavg().map((l) => l.toFixed(2)).join(' ')} on ${os.cpus().length} cores.`,
  );
  if (reference !== null) {
    const drift = Math.abs(healthFirst.requestsPerSecond - healthLast.requestsPerSecond) / reference;
    if (drift > 0.25) out(`Note: the two health runs differ by ${Math.round(drift * 100)} % of their mean: the machine's load changed during the run, so the ratios are uncertain by about that much.`);
  }
  out('');
  const throughput = rows.map((r) => {
    const ran = r.requestsPerSecond !== undefined && r.total > 0;
    const { result, ratio } = throughputVerdict(r, reference);
    if (result === 'met') met++;
    else if (result === 'NOT met') notMet++;
    else if (result !== 'reference') failed++;
    const non2xx = r.non2xx === undefined ? '-' : String(r.non2xx);
    return [r.label, ran ? fixed(r.requestsPerSecond, 1) : '-', ran ? String(r.p50) : '-', ran ? String(r.p99) : '-', non2xx, ratio === null ? '-' : fixed(ratio, 2), r.target === null ? '-' : `>= ${r.target}`, result];
  });
  for (const line of table(['endpoint', 'requests/s', 'p50 ms', 'p99 ms', 'non-2xx', 'ratio to health', 'target', 'result'], throughput, new Set([1, 2, 3, 4, 5]))) out(line);
  out('');
  for (const r of rows) out(`  ${r.label}: ${r.path}${r.total !== undefined ? `, ${r.total} requests` : ''}${r.problems.length ? `; FAILED: ${r.problems.join('; ')}` : ''}`);
  if (notMeasured.length) out(`  GET routes under app/api/orgs/[org] not measured (not lists): ${notMeasured.join('; ')}.`);
  out(`  The calculations POST sends the 50-surface hull of the in-process designAnodeSystem benchmark (${calculations.body.length} bytes).`);

  out('');
  const sized = loads.filter((l) => !l.problems.length);
  const smallest = sized.length ? sized.reduce((a, b) => (b.gzip < a.gzip ? b : a)) : null;
  const noModule = Math.max(0, ...loads.map((l) => l.noModule ?? 0));
  out(
    `First-load JavaScript per page route: the distinct <script src> chunks of its HTML (signed in for /orgs and /o/..., signed out for the public pages), raw and gzip (zlib's default level, as Next compresses); target <= ${FIRST_LOAD_TARGET} x the smallest route${smallest ? ` (${smallest.route}, ${kib(smallest.gzip)} KiB gzip)` : ''}.`,
  );
  out(
    `Not counted: inline scripts (the page's RSC data) and ${noModule ? `the noModule polyfill script (${noModule} per page; modern browsers skip it)` : 'no noModule script (none found)'}. "build KiB raw" is next build's own uncompressed figure from ${distDir}/diagnostics/route-bundle-stats.json (next build no longer prints sizes): a cross-check, it should equal "KiB raw".`,
  );
  out('');
  const jsRows = loads.map((l) => {
    const ok = !l.problems.length;
    const ratio = ok && smallest ? l.gzip / smallest.gzip : null;
    let result;
    if (!ok) {
      result = 'FAILED';
      failed++;
    } else if (ratio <= FIRST_LOAD_TARGET) {
      result = 'met';
      met++;
    } else {
      result = 'NOT met';
      notMet++;
    }
    const build = fromBuild.get(l.route);
    if (ok && build !== undefined && Math.abs(build - l.raw) > 0.01 * build) l.mismatch = `the HTML's scripts (${kib(l.raw)} KiB) differ from next build's figure (${kib(build)} KiB)`;
    return [l.route, ok ? String(l.chunks) : '-', ok ? kib(l.raw) : '-', build === undefined ? '-' : kib(build), ok ? kib(l.gzip) : '-', ratio === null ? '-' : fixed(ratio, 2), `<= ${FIRST_LOAD_TARGET}`, result];
  });
  for (const line of table(['page route', 'scripts', 'KiB raw', 'build KiB raw', 'KiB gzip', 'ratio to smallest', 'target', 'result'], jsRows, new Set([1, 2, 3, 4, 5]))) out(line);
  out('');
  for (const l of loads) if (l.problems.length) out(`  ${l.route} (${l.url}): FAILED: ${l.problems.join('; ')}`);
  for (const l of loads) if (l.mismatch) out(`  ${l.route}: note: ${l.mismatch}`);
  out(`  Demo values: organisation ${slug}, asset ${ids.assetId}, design ${ids.designId}, docking ${ids.dockingId}, survey ${ids.surveyId}; [token] routes get an unknown token (their "cannot be used" answer; the page's scripts are the same).`);
  out(`  Skipped: ${skipped.length ? skipped.join('; ') : 'none'}.`);
  out('');
  out(`bench http: ${met} targets met, ${notMet} not met${failed ? `, ${failed} FAILED` : ''}`);
  return { met, notMet, failed };
}

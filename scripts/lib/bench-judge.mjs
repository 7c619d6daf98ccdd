// How the HTTP stage of `npm run bench` (scripts/bench-http.mjs) judges what came back: plain functions over
// responses and autocannon's results, so they are tested without a server (tests/unit/platform/bench-judge.test.ts).

/**
 * Null when a response is what the endpoint should answer; otherwise why not. A redirect (to sign-in), any
 * status outside 2xx, another content type or a body the endpoint's own check refuses all count as wrong.
 */
export function wrongAnswer(endpoint, answer) {
  if (answer.status < 200 || answer.status > 299) return `status ${answer.status}${answer.location ? ` to ${answer.location}` : ''}`;
  if (!answer.type.startsWith(endpoint.expectType)) return `content type ${answer.type || 'none'}, expected ${endpoint.expectType}`;
  if (endpoint.check) return endpoint.check(answer.text);
  return null;
}

/** What went wrong during an autocannon run: non-2xx answers (3xx included), errors, timeouts, no answer at all. */
export function runProblems(result, seconds) {
  const problems = [];
  if (result.non2xx) {
    const codes = Object.entries(result.statusCodeStats ?? {})
      .filter(([code]) => !code.startsWith('2'))
      .map(([code, { count }]) => `${count} x ${code}`);
    problems.push(`${result.non2xx} non-2xx responses during the run${codes.length ? ` (${codes.join(', ')})` : ''}`);
  }
  if (result.errors || result.timeouts) problems.push(`${result.errors} errors, ${result.timeouts} timeouts during the run`);
  if (!result.requests.total) problems.push(`no response came back within the ${seconds} s run (lengthen TIDEWARDEN_BENCH_HTTP_SECONDS)`);
  else if (!result['2xx']) problems.push('no 2xx response during the run');
  return problems;
}

/**
 * A throughput row's result: FAILED whenever anything went wrong (however fast it was) or there is no
 * reference to compare with; otherwise met when requests/s are at least `target` times the reference.
 */
export function throughputVerdict({ problems, target, requestsPerSecond }, reference) {
  if (problems.length) return { result: 'FAILED', ratio: null };
  const ratio = reference ? requestsPerSecond / reference : null;
  if (target === null) return { result: 'reference', ratio };
  if (ratio === null) return { result: 'FAILED (no reference)', ratio };
  return { result: ratio >= target ? 'met' : 'NOT met', ratio };
}

/** The scripts a browser loads for the page: every <script src>, less the noModule polyfills a modern browser skips. */
export function scriptSources(html) {
  const sources = new Set();
  let noModule = 0;
  for (const [tag] of html.matchAll(/<script\b[^>]*>/gi)) {
    const src = /\ssrc=(?:"([^"]+)"|'([^']+)')/i.exec(tag);
    if (!src) continue;
    if (/\snomodule\b/i.test(tag)) noModule++;
    else sources.add((src[1] ?? src[2]).replace(/&amp;/g, '&'));
  }
  return { sources: [...sources], noModule };
}

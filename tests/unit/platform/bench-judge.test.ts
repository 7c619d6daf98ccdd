import { describe, expect, it } from 'vitest';
import { runProblems, scriptSources, throughputVerdict, wrongAnswer } from '../../../scripts/lib/bench-judge.mjs';

const json = { expectType: 'application/json' };
const answer = (status: number, type = 'application/json', text = '{}', location: string | null = null) => ({ status, type, text, location });
const run = (over: Partial<Parameters<typeof runProblems>[0]> = {}) => ({ non2xx: 0, errors: 0, timeouts: 0, '2xx': 100, requests: { total: 100 }, ...over });

describe('the HTTP bench judges responses, not just speed', () => {
  it('takes a 2xx answer of the expected type and refuses a redirect to sign-in, an error status or another type', () => {
    expect(wrongAnswer(json, answer(200, 'application/json; charset=utf-8'))).toBeNull();
    expect(wrongAnswer(json, answer(307, '', '', '/sign-in?next=%2Fo%2Fgullhaven'))).toBe('status 307 to /sign-in?next=%2Fo%2Fgullhaven');
    expect(wrongAnswer(json, answer(503))).toBe('status 503');
    expect(wrongAnswer({ expectType: 'text/html' }, answer(200))).toBe('content type application/json, expected text/html');
  });

  it("applies the endpoint's own check to the body", () => {
    const health = { expectType: 'application/json', check: (text: string) => (JSON.parse(text).status === 'ok' ? null : 'degraded') };
    expect(wrongAnswer(health, answer(200, 'application/json', '{"status":"ok"}'))).toBeNull();
    expect(wrongAnswer(health, answer(200, 'application/json', '{"status":"degraded"}'))).toBe('degraded');
  });

  it('names every non-2xx answer, error and timeout of a run, and a run in which nothing came back', () => {
    expect(runProblems(run(), 10)).toEqual([]);
    expect(runProblems(run({ non2xx: 40, '2xx': 0, statusCodeStats: { '302': { count: 40 } } }), 10)).toEqual(['40 non-2xx responses during the run (40 x 302)', 'no 2xx response during the run']);
    expect(runProblems(run({ errors: 2, timeouts: 1 }), 10)).toEqual(['2 errors, 1 timeouts during the run']);
    expect(runProblems(run({ '2xx': 0, requests: { total: 0 } }), 2)).toEqual(['no response came back within the 2 s run (lengthen TIDEWARDEN_BENCH_HTTP_SECONDS)']);
  });

  it('says FAILED for a fast row with a problem, and compares the others with the reference', () => {
    expect(throughputVerdict({ problems: ['status 302 to /sign-in'], target: 0.35, requestsPerSecond: 5000 }, 100)).toEqual({ result: 'FAILED', ratio: null });
    expect(throughputVerdict({ problems: [], target: 0.35, requestsPerSecond: 35 }, 100)).toEqual({ result: 'met', ratio: 0.35 });
    expect(throughputVerdict({ problems: [], target: 0.35, requestsPerSecond: 34.9 }, 100).result).toBe('NOT met');
    expect(throughputVerdict({ problems: [], target: 0.25, requestsPerSecond: 30 }, null)).toEqual({ result: 'FAILED (no reference)', ratio: null });
    expect(throughputVerdict({ problems: [], target: null, requestsPerSecond: 120 }, 100)).toEqual({ result: 'reference', ratio: 1.2 });
  });
});

describe("the first-load JavaScript is the page's script tags", () => {
  it('counts each distinct src once and leaves out inline scripts and the noModule polyfill', () => {
    const html = [
      '<script src="/_next/static/chunks/polyfill.js" noModule=""></script>',
      '<script src="/_next/static/chunks/a.js" async=""></script>',
      '<link rel="preload" as="script" href="/_next/static/chunks/b.js"/>',
      '<script nonce="x">self.__next_f.push([1,"..."])</script>',
      '<script src="/_next/static/chunks/b.js?v=1&amp;x=2" async=""></script>',
      '<script src="/_next/static/chunks/a.js" async=""></script>',
    ].join('');
    expect(scriptSources(html)).toEqual({ sources: ['/_next/static/chunks/a.js', '/_next/static/chunks/b.js?v=1&x=2'], noModule: 1 });
  });
});

import http from 'node:http';
import { expect, test } from '@playwright/test';
import { actionHeaders, captureSignInAction, ownOrigin } from './helpers';

// Server actions are POSTs to a page. Whatever shape their body takes, a hostile or broken one must be
// answered with a 4xx, never a 500.

const oneAndAHalfMegabytes = 1.5 * 1024 * 1024;

/** Posts with a chunked body (no Content-Length), as a client that hides the size would. */
function postChunked(url: string, headers: Record<string, string>, chunk: Buffer, times: number): Promise<number> {
  return new Promise((resolve, reject) => {
    const req = http.request(url, { method: 'POST', headers: { ...headers, 'transfer-encoding': 'chunked' } }, (res) => {
      res.resume();
      resolve(res.statusCode ?? 0);
    });
    req.on('error', (error) => ((error as NodeJS.ErrnoException).code === 'EPIPE' || (error as NodeJS.ErrnoException).code === 'ECONNRESET' ? undefined : reject(error)));
    let sent = 0;
    const pump = () => {
      while (sent < times) {
        sent += 1;
        if (!req.write(chunk)) return void req.once('drain', pump);
      }
      req.end();
    };
    pump();
  });
}

test.describe('malformed or oversized server-action bodies get a 4xx', () => {
  let action: Awaited<ReturnType<typeof captureSignInAction>>;
  let origin: string;

  test.beforeEach(async ({ page }) => {
    action = await captureSignInAction(page);
    origin = ownOrigin(page);
  });

  test('an action id that does not exist', async ({ page }) => {
    const res = await page.request.post(action.url, { headers: actionHeaders(action.headers, { origin, 'next-action': 'f'.repeat(42) }), data: action.body });
    expect(res.status()).toBeGreaterThanOrEqual(400);
    expect(res.status()).toBeLessThan(500);
  });

  test('an action id that is not an id at all', async ({ page }) => {
    const res = await page.request.post(action.url, { headers: actionHeaders(action.headers, { origin, 'next-action': '../../etc/passwd' }), data: action.body });
    expect(res.status()).toBeGreaterThanOrEqual(400);
    expect(res.status()).toBeLessThan(500);
  });

  test('a body over the limit, with its length declared', async ({ page }) => {
    const boundary = '----tidewardenbig';
    const big = Buffer.concat([
      Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="1_email"\r\n\r\n`),
      Buffer.alloc(oneAndAHalfMegabytes, 'a'),
      Buffer.from(`\r\n--${boundary}--\r\n`),
    ]);
    const res = await page.request.post(action.url, {
      headers: actionHeaders(action.headers, { origin, 'content-type': `multipart/form-data; boundary=${boundary}` }),
      data: big,
    });
    expect(res.status()).toBe(413);
  });

  test('a body over the limit, sent in chunks without a length', async () => {
    const status = await postChunked(action.url, { ...actionHeaders(action.headers, { origin }), 'content-type': 'text/plain;charset=UTF-8' }, Buffer.alloc(64 * 1024, 'a'), 40);
    expect(status).toBe(413);
  });

  test('a text body that is not what React sends', async ({ page }) => {
    const res = await page.request.post(action.url, { headers: actionHeaders(action.headers, { origin, 'content-type': 'text/plain;charset=UTF-8' }), data: '{{{ not json' });
    expect(res.status()).toBeGreaterThanOrEqual(400);
    expect(res.status()).toBeLessThan(500);
  });

  test('a multipart body whose boundary never comes', async ({ page }) => {
    const res = await page.request.post(action.url, {
      headers: actionHeaders(action.headers, { origin, 'content-type': 'multipart/form-data; boundary=----nowhere' }),
      data: Buffer.from('--something-else\r\nContent-Disposition: form-data; name="x"\r\n\r\ny'),
    });
    expect(res.status()).toBeGreaterThanOrEqual(400);
    expect(res.status()).toBeLessThan(500);
  });

  test('a body in bytes that are not UTF-8', async ({ page }) => {
    const res = await page.request.post(action.url, { headers: actionHeaders(action.headers, { origin, 'content-type': 'text/plain;charset=UTF-8' }), data: Buffer.from([0xff, 0xfe, 0x00, 0xc3, 0x28]) });
    expect(res.status()).toBeGreaterThanOrEqual(400);
    expect(res.status()).toBeLessThan(500);
  });

  test('a well-formed body still reaches the action', async ({ page }) => {
    const res = await page.request.post(action.url, { headers: actionHeaders(action.headers, { origin }), data: action.body });
    expect(res.status()).toBe(200);
  });
});

// A chunked 200 MB upload (no Content-Length) to the served app: refused with 413 once the limit is
// passed, with the server's memory (RSS of the process listening on the app's port, read from /proc)
// growing by less than 50 MB, and nothing stored.
import { randomUUID } from 'node:crypto';
import { readFileSync, readdirSync, readlinkSync } from 'node:fs';
import http from 'node:http';
import { expect, test } from '@playwright/test';
import { demo, demoUser, signIn } from '../../e2e/helpers';

const MB = 1024 * 1024;
const PNG = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);

/** The pid of the process listening on `port` on this machine (the socket's inode in /proc/net/tcp*, then the fd that holds it). */
function pidListeningOn(port: number): number {
  const hex = port.toString(16).toUpperCase().padStart(4, '0');
  const inodes = new Set<string>();
  for (const table of ['/proc/net/tcp', '/proc/net/tcp6']) {
    for (const line of readFileSync(table, 'utf8').split('\n').slice(1)) {
      const cols = line.trim().split(/\s+/);
      if (cols.length > 9 && cols[1].endsWith(`:${hex}`) && cols[3] === '0A') inodes.add(cols[9]);
    }
  }
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    let fds: string[];
    try {
      fds = readdirSync(`/proc/${pid}/fd`);
    } catch {
      continue;
    }
    for (const fd of fds) {
      try {
        const link = readlinkSync(`/proc/${pid}/fd/${fd}`);
        const inode = /^socket:\[(\d+)\]$/.exec(link)?.[1];
        if (inode && inodes.has(inode)) return Number(pid);
      } catch {
        // the fd closed meanwhile
      }
    }
  }
  throw new Error(`No process of this user listens on port ${port}.`);
}

const rssBytes = (pid: number) => Number(/VmRSS:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))![1]) * 1024;

/** Sends `total` bytes of a multipart photo in chunks (Transfer-Encoding: chunked), stopping when the server answers. */
function chunkedUpload(url: URL, headers: Record<string, string>, total: number): Promise<{ status: number; body: string; sent: number }> {
  return new Promise((resolve, reject) => {
    const boundary = `----probe${randomUUID()}`;
    const req = http.request(url, { method: 'POST', headers: { ...headers, 'content-type': `multipart/form-data; boundary=${boundary}` } });
    let sent = 0;
    let answered = false;
    const chunk = Buffer.alloc(MB, 0x41);
    const pump = () => {
      while (!answered && sent < total) {
        sent += chunk.length;
        if (!req.write(chunk)) return void req.once('drain', pump);
      }
      if (!answered) req.end(`\r\n--${boundary}--\r\n`);
    };
    req.on('response', (res) => {
      answered = true;
      let body = '';
      res.setEncoding('utf8');
      res.on('data', (d) => (body += d));
      res.on('end', () => {
        req.destroy();
        resolve({ status: res.statusCode ?? 0, body, sent });
      });
    });
    req.on('error', (error) => {
      if (!answered) reject(error);
    });
    req.write(Buffer.concat([Buffer.from(`--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="huge-probe.png"\r\nContent-Type: image/png\r\n\r\n`), PNG]));
    pump();
  });
}

test('a chunked 200 MB photo is refused at the limit: 413, memory grows < 50 MB, nothing stored', async ({ page, baseURL }) => {
  test.setTimeout(180_000);
  const slug = demo.organisation.slug;
  await signIn(page, demoUser('inspector').email);
  const origin = new URL(baseURL!).origin;
  const headers = () => ({ origin, 'sec-fetch-site': 'same-origin', 'idempotency-key': randomUUID() });

  const assets = await (await page.request.get(`/api/orgs/${slug}/assets`)).text();
  const assetId = /"id":"([0-9a-f-]{36})"/.exec(assets)![1];
  const created = await page.request.post(`/api/orgs/${slug}/surveys`, { headers: headers(), data: { assetId, surveyedOn: '2026-01-05', method: 'diver', defaultElectrode: 'ag-agcl-seawater', surveyor: 'Upload probe' } });
  expect(created.status(), await created.text()).toBe(201);
  const surveyId = ((await created.json()) as { survey: { id: string } }).survey.id;
  const attachments = `/api/orgs/${slug}/surveys/${surveyId}/attachments`;

  // Warm up the route (its code loaded, the database pool open) with a small photo that is stored.
  const small = await page.request.post(attachments, { headers: headers(), multipart: { file: { name: 'warm-up.png', mimeType: 'image/png', buffer: PNG }, caption: 'Warm-up' } });
  expect(small.status(), await small.text()).toBe(201);

  const cookie = (await page.context().cookies()).map((c) => `${c.name}=${c.value}`).join('; ');
  const pid = pidListeningOn(Number(new URL(baseURL!).port));
  const baseline = rssBytes(pid);
  let peak = baseline;
  const sampler = setInterval(() => (peak = Math.max(peak, rssBytes(pid))), 20);
  let result: Awaited<ReturnType<typeof chunkedUpload>>;
  try {
    result = await chunkedUpload(new URL(attachments, baseURL), { ...headers(), cookie }, 200 * MB);
  } finally {
    clearInterval(sampler);
  }
  peak = Math.max(peak, rssBytes(pid));

  expect(result.status, result.body).toBe(413);
  expect(JSON.parse(result.body).error.message).toBe('The file is larger than 10 MB; nothing was imported.');
  expect(result.sent, 'the server answered before the whole body was sent').toBeLessThan(200 * MB);
  expect(peak - baseline, `RSS grew from ${Math.round(baseline / MB)} MB to ${Math.round(peak / MB)} MB`).toBeLessThan(50 * MB);

  await page.goto(`/o/${slug}/surveys/${surveyId}`);
  await expect(page.getByRole('link', { name: 'warm-up.png' })).toBeVisible();
  await expect(page.getByText('huge-probe.png')).toHaveCount(0);
});

// Against the served app (`next start` as the start scripts run it): a client that writes its own
// X-Forwarded-For is still counted on the address it connects from. The guesses are sent from an address
// of their own in 127/8, so the block they earn does not touch the other specs' sign-ins from 127.0.0.1.
import http from 'node:http';
import { randomInt } from 'node:crypto';
import { expect, test } from '@playwright/test';

const base = new URL(process.env.E2E_BASE_URL ?? 'http://127.0.0.1:3100');
const peer = `127.${randomInt(1, 254)}.${randomInt(1, 254)}.${randomInt(2, 254)}`;

function send(method: 'GET' | 'POST', pathname: string, headers: Record<string, string>, body?: Buffer) {
  return new Promise<{ status: number; text: string }>((resolve, reject) => {
    const request = http.request({ host: base.hostname, port: base.port, method, path: pathname, localAddress: peer, headers: { ...headers, ...(body ? { 'content-length': String(body.length) } : {}) } }, (response) => {
      const chunks: Buffer[] = [];
      response.on('data', (c: Buffer) => chunks.push(c));
      response.on('end', () => resolve({ status: response.statusCode ?? 0, text: Buffer.concat(chunks).toString('utf8') }));
    });
    request.on('error', reject);
    request.end(body);
  });
}

const decode = (s: string) => s.replace(/&quot;/g, '"').replace(/&#x27;/g, "'").replace(/&lt;/g, '<').replace(/&gt;/g, '>').replace(/&amp;/g, '&');

/** The sign-in form's fields as the server rendered them (the action's hidden fields included): a no-script post. */
async function signInForm() {
  const page = await send('GET', '/sign-in', {});
  expect(page.status).toBe(200);
  const form = page.text.match(/<form[^>]*>([\s\S]*?)<\/form>/)?.[1] ?? '';
  const fields: [string, string][] = [];
  for (const [input] of form.matchAll(/<input[^>]*>/g)) {
    const name = input.match(/name="([^"]*)"/)?.[1];
    if (name) fields.push([decode(name), decode(input.match(/value="([^"]*)"/)?.[1] ?? '')]);
  }
  expect(fields.some(([name]) => name.startsWith('$ACTION'))).toBe(true);
  return fields;
}

async function guess(fields: [string, string][], email: string, spoofed: string) {
  const form = new FormData();
  for (const [name, value] of fields) form.append(name, name === 'email' ? email : name === 'password' ? 'Summer2026!-guess' : value);
  if (!fields.some(([n]) => n === 'email')) form.append('email', email);
  if (!fields.some(([n]) => n === 'password')) form.append('password', 'Summer2026!-guess');
  const encoded = new Request('http://x/', { method: 'POST', body: form });
  const body = Buffer.from(await encoded.arrayBuffer());
  const response = await send('POST', '/sign-in', { 'content-type': encoded.headers.get('content-type')!, origin: base.origin, 'x-forwarded-for': spoofed }, body);
  if (response.text.includes('Too many failed sign-ins')) return 'blocked';
  if (response.text.includes('The e-mail address or password is not right.')) return 'refused';
  return `other (${response.status})`;
}

test('60 password guesses over many accounts with a rotating X-Forwarded-For are blocked on the real address', async () => {
  test.setTimeout(180_000);
  const fields = await signInForm();
  const outcomes: string[] = [];
  for (let i = 0; i < 60; i++) {
    outcomes.push(await guess(fields, `spray-${i}-${randomInt(1e9)}@e2e.example`, `10.${i}.${randomInt(255)}.${randomInt(255)}`));
  }
  const firstBlocked = outcomes.indexOf('blocked');
  expect(outcomes.filter((o) => o !== 'refused' && o !== 'blocked')).toEqual([]);
  expect(firstBlocked, outcomes.join(' ')).toBeGreaterThan(0);
  // Once blocked, every further guess stays blocked, whatever the header says.
  expect(outcomes.slice(firstBlocked).every((o) => o === 'blocked')).toBe(true);
  expect(outcomes.filter((o) => o === 'refused').length).toBeLessThanOrEqual(50);
});

import { expect, test } from '@playwright/test';

// The dev inbox shows reset links, so it is served only to this machine while mail goes to the local
// fake. These specs run against the test set-up (SMTP fake on loopback, requests from loopback).

test('the inbox is served to a request from this machine', async ({ request }) => {
  const res = await request.get('/dev/inbox');
  expect(res.status()).toBe(200);
  expect(await res.text()).toContain('Dev inbox');
});

test('a forged peer header is overwritten by the socket address', async ({ request }) => {
  const res = await request.get('/dev/inbox', { headers: { 'x-tidewarden-peer': 'forged 203.0.113.7' } });
  expect(res.status()).toBe(200);
});

test('a request forwarded for another machine (a reverse proxy on this one) gets a 404', async ({ request }) => {
  const forwarded: Record<string, string>[] = [{ 'x-forwarded-for': '203.0.113.7' }, { 'x-real-ip': '203.0.113.7' }, { forwarded: 'for=203.0.113.7' }];
  for (const headers of forwarded) {
    const res = await request.get('/dev/inbox', { headers });
    expect(res.status(), JSON.stringify(headers)).toBe(404);
  }
});

test('a request naming another host is answered as if the inbox did not exist (DNS rebinding)', async ({ request, baseURL }) => {
  const port = new URL(baseURL!).port;
  for (const host of [`attacker.example:${port}`, `127.0.0.1.nip.io:${port}`, 'attacker.example']) {
    const res = await request.get('/dev/inbox', { headers: { host } });
    expect(res.status(), host).toBe(404);
    expect(await res.text()).not.toContain('Dev inbox');
  }
  const attachment = await request.get('/dev/inbox/abc/attachments/0', { headers: { host: `attacker.example:${port}` } });
  expect(attachment.status()).toBe(404);
});

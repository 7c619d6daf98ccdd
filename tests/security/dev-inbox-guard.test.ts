import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { devInboxAvailable, isLoopbackAddress, mailGoesToLocalFake } from '@/lib/server/dev-inbox';
import { installPeerAddressStamp, PEER_HEADER, peerAddress } from '@/lib/server/peer-address';

// The dev inbox shows reset links: it must exist only while mail goes to the local fake, and only for a
// request that came in on a loopback socket and names a loopback host.

const fakeMail = { TIDEWARDEN_ENV: 'development' as const, SMTP_HOST: '127.0.0.1', FAKE_MAIL_API: 'http://127.0.0.1:2526' };
const local = { peer: '127.0.0.1', host: '127.0.0.1:3000' };

describe('when the inbox exists', () => {
  it('is served with the local fake to a loopback socket naming a loopback host', () => {
    expect(devInboxAvailable(fakeMail, local)).toBe(true);
    expect(devInboxAvailable(fakeMail, { peer: '::1', host: 'localhost:3000' })).toBe(true);
    expect(devInboxAvailable(fakeMail, { peer: '::ffff:127.0.0.1', host: '[::1]:3000' })).toBe(true);
  });

  it('is absent when mail goes to a real SMTP server', () => {
    expect(mailGoesToLocalFake({ ...fakeMail, SMTP_HOST: 'smtp.example.com' })).toBe(false);
    expect(devInboxAvailable({ ...fakeMail, SMTP_HOST: 'smtp.example.com' }, local)).toBe(false);
    expect(devInboxAvailable({ ...fakeMail, SMTP_HOST: '10.0.0.5' }, local)).toBe(false);
    expect(devInboxAvailable({ ...fakeMail, FAKE_MAIL_API: undefined }, local)).toBe(false);
    expect(devInboxAvailable({ ...fakeMail, FAKE_MAIL_API: 'http://mail.example.com:2526' }, local)).toBe(false);
  });

  it('is absent in production whatever the mail settings', () => {
    expect(devInboxAvailable({ ...fakeMail, TIDEWARDEN_ENV: 'production' }, local)).toBe(false);
  });

  it('is absent for a socket that is not loopback, whatever the headers say', () => {
    for (const peer of ['203.0.113.7', '::ffff:203.0.113.7', '10.0.0.2', '0.0.0.0', '::', '', null]) {
      expect(devInboxAvailable(fakeMail, { peer, host: '127.0.0.1:3000' }), String(peer)).toBe(false);
    }
  });

  it('is absent for a request naming another host (a rebound DNS name)', () => {
    for (const host of ['attacker.example', 'attacker.example:3000', '127.0.0.1.nip.io:3000', 'localhost.attacker.example', '', null]) {
      expect(devInboxAvailable(fakeMail, { peer: '127.0.0.1', host }), String(host)).toBe(false);
    }
  });

  it('is absent when a forwarding header says the request is for another machine', () => {
    expect(devInboxAvailable(fakeMail, { ...local, forwardedFor: '203.0.113.7' })).toBe(false);
    expect(devInboxAvailable(fakeMail, { ...local, forwardedFor: '127.0.0.1, 203.0.113.7' })).toBe(false);
    expect(devInboxAvailable(fakeMail, { ...local, realIp: '203.0.113.7' })).toBe(false);
    expect(devInboxAvailable(fakeMail, { ...local, forwarded: 'for=203.0.113.7;proto=https' })).toBe(false);
    expect(devInboxAvailable(fakeMail, { ...local, forwarded: 'for="[2001:db8::1]:4711"' })).toBe(false);
    // Next itself fills X-Forwarded-For with the socket's address when nobody sent one.
    expect(devInboxAvailable(fakeMail, { ...local, forwardedFor: '127.0.0.1' })).toBe(true);
    expect(devInboxAvailable(fakeMail, { ...local, forwardedFor: '::ffff:127.0.0.1' })).toBe(true);
  });

  it('is not granted by a forwarding header that claims loopback on a socket that is not', () => {
    expect(devInboxAvailable(fakeMail, { peer: '203.0.113.7', host: '127.0.0.1:3000', forwardedFor: '127.0.0.1', realIp: '127.0.0.1', forwarded: 'for=127.0.0.1' })).toBe(false);
  });

  it('knows loopback addresses from the rest', () => {
    expect(['127.0.0.1', '127.1.2.3', '::1', '::ffff:127.0.0.1'].every(isLoopbackAddress)).toBe(true);
    expect(['128.0.0.1', '::ffff:10.0.0.1', '1.127.0.0.1', '127.0.0.1, 203.0.113.7', 'localhost'].some(isLoopbackAddress)).toBe(false);
  });
});

describe('the socket address, not a header', () => {
  let server: http.Server;
  let url: string;
  const seen: (string | undefined)[] = [];

  beforeAll(async () => {
    installPeerAddressStamp();
    server = http.createServer((req, res) => {
      seen.push(req.headers[PEER_HEADER] as string | undefined);
      res.end('ok');
    });
    await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
    url = `http://127.0.0.1:${(server.address() as AddressInfo).port}/`;
  });

  afterAll(() => new Promise<void>((resolve) => server.close(() => resolve())));

  const get = (headers: Record<string, string>) =>
    new Promise<void>((resolve, reject) => http.get(url, { headers }, (res) => (res.resume(), res.on('end', resolve))).on('error', reject));

  it('stamps the real socket address over a forged peer header and ignores X-Forwarded-For', async () => {
    await get({ [PEER_HEADER]: 'forged 203.0.113.7', 'x-forwarded-for': '203.0.113.7' });
    const stamped = seen.at(-1);
    expect(stamped).toBeDefined();
    expect(stamped).not.toContain('forged');
    expect(peerAddress(stamped)).toBe('127.0.0.1');
  });

  it('does not believe a peer header without the server secret', () => {
    expect(peerAddress('forged 127.0.0.1')).toBeNull();
    expect(peerAddress('127.0.0.1')).toBeNull();
    expect(peerAddress(null)).toBeNull();
  });
});

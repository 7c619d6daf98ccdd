import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { OutboxMessageSchema } from '@/entities';
import { getEm, getOrm } from '@/lib/server/db';
import { Effects } from '@/lib/server/unit-of-work';
import { deliverDueMail, enqueueMail, retryDelayMs } from '@/lib/server/mail/outbox';
import { uniqueEmail } from '../fixtures/factories';

const api = process.env.FAKE_MAIL_API!;
const setFake = (state: 'up' | 'down') => fetch(`${api}/control/${state}`, { method: 'POST' });
const received = async (to: string) => (await (await fetch(`${api}/messages?to=${encodeURIComponent(to)}`)).json()) as { subject: string; attachments: { filename: string }[] }[];

/** Delivers whatever other tests left queued, so each test here sees only its own messages. */
async function drain() {
  await setFake('up');
  for (let i = 0; i < 100; i++) if ((await deliverDueMail(await getEm(), { limit: 100 })).claimed === 0) return;
}

beforeEach(drain);

afterAll(async () => {
  await setFake('up');
  await (await getOrm()).close(true);
});

describe('the e-mail outbox', () => {
  it('keeps a message while the SMTP server is down and delivers it once it is back', async () => {
    const to = uniqueEmail('outbox');
    const em = await getEm();
    const message = enqueueMail({ em, effects: new Effects() }, { to, subject: 'Docking reminder', text: 'Anode list attached.', attachments: [{ filename: 'list.csv', contentType: 'text/csv', content: Buffer.from('a,b').toString('base64') }] });
    await em.flush();

    await setFake('down');
    const first = await deliverDueMail(await getEm());
    expect(first.failed).toBeGreaterThanOrEqual(1);
    let row = await (await getEm()).findOneOrFail(OutboxMessageSchema, { id: message.id });
    expect(row.status).toBe('pending');
    expect(row.attempts).toBe(1);
    expect(row.lastError).toMatch(/421|unavailable/i);
    expect(row.nextAttemptAt.getTime()).toBeGreaterThan(Date.now()); // backed off, not retried in a tight loop
    expect(await received(to)).toHaveLength(0);

    await setFake('up');
    // Not due yet: nothing is sent before the back-off ends.
    await deliverDueMail(await getEm());
    expect(await received(to)).toHaveLength(0);
    await (await getEm()).nativeUpdate(OutboxMessageSchema, { id: message.id }, { nextAttemptAt: new Date(Date.now() - 1000) });
    const second = await deliverDueMail(await getEm());
    expect(second.sent).toBeGreaterThanOrEqual(1);
    row = await (await getEm()).findOneOrFail(OutboxMessageSchema, { id: message.id });
    expect(row.status).toBe('sent');
    expect(row.attempts).toBe(2);
    const inbox = await received(to);
    expect(inbox).toHaveLength(1);
    expect(inbox[0].subject).toBe('Docking reminder');
    expect(inbox[0].attachments[0].filename).toBe('list.csv');

    // Sent messages are never sent again.
    await (await getEm()).nativeUpdate(OutboxMessageSchema, { id: message.id }, { nextAttemptAt: new Date(Date.now() - 1000) });
    await deliverDueMail(await getEm());
    expect(await received(to)).toHaveLength(1);
  });

  it('two deliverers running at once send each message exactly once', async () => {
    const to = uniqueEmail('race');
    const em = await getEm();
    for (let i = 0; i < 6; i++) enqueueMail({ em, effects: new Effects() }, { to, subject: `Message ${i}`, text: 'x' });
    await em.flush();
    await Promise.all([deliverDueMail(await getEm()), deliverDueMail(await getEm()), deliverDueMail(await getEm())]);
    expect(await received(to)).toHaveLength(6);
  });

  it('backs off exponentially and caps at one hour', () => {
    expect(retryDelayMs(1)).toBe(10_000);
    expect(retryDelayMs(2)).toBe(20_000);
    expect(retryDelayMs(4)).toBe(80_000);
    expect(retryDelayMs(30)).toBe(3_600_000);
  });
});

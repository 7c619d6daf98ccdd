import type { EntityManager } from '@mikro-orm/postgresql';
import { OutboxMessageSchema, type OutboxAttachment } from '@/entities';
import { getEnv } from '../env';
import { getTransport } from './transport';
import type { Work } from '../unit-of-work';

export interface MailInput {
  to: string;
  subject: string;
  text: string;
  html?: string;
  attachments?: OutboxAttachment[];
  organisationId?: string | null;
  dedupeKey?: string;
}

/**
 * Queues a message in the caller's unit of work, so it exists exactly when the change does, and asks
 * for delivery right after the commit.
 */
export function enqueueMail(work: Pick<Work, 'em' | 'effects'>, mail: MailInput) {
  work.effects.mailQueued();
  return work.em.create(OutboxMessageSchema, {
    toAddress: mail.to,
    subject: mail.subject,
    textBody: mail.text,
    htmlBody: mail.html ?? null,
    attachments: mail.attachments ?? null,
    organisationId: mail.organisationId ?? null,
    dedupeKey: mail.dedupeKey ?? null,
  });
}

/**
 * Queues a message at most once for its dedupe key, even when two schedulers run at the same time:
 * the unique key makes the second insert a no-op. Returns whether this call queued it.
 */
export async function enqueueMailOnce(em: EntityManager, mail: MailInput & { dedupeKey: string }): Promise<boolean> {
  const rows = await em.execute<{ id: string }[]>(
    `insert into outbox_message (id, organisation_id, to_address, subject, text_body, html_body, attachments, dedupe_key, status, attempts, next_attempt_at, created_at)
     values (gen_random_uuid(), ?, ?, ?, ?, ?, ?::jsonb, ?, 'pending', 0, now(), now())
     on conflict (dedupe_key) do nothing returning id`,
    [mail.organisationId ?? null, mail.to, mail.subject, mail.text, mail.html ?? null, mail.attachments ? JSON.stringify(mail.attachments) : null, mail.dedupeKey],
  );
  return rows.length > 0;
}

export const MAX_ATTEMPTS = 12;

/** Back-off after the n-th failed attempt: 10 s, 20 s, 40 s ... capped at one hour. */
export const retryDelayMs = (attempts: number) => Math.min(10_000 * 2 ** Math.max(0, attempts - 1), 3_600_000);

interface ClaimedRow {
  id: string;
  to_address: string;
  subject: string;
  text_body: string;
  html_body: string | null;
  attachments: OutboxAttachment[] | null;
  attempts: number;
}

/**
 * Delivers the messages that are due. Rows are claimed with FOR UPDATE SKIP LOCKED and leased for
 * two minutes, so several app instances and workers can run this at once without double sending.
 */
export async function deliverDueMail(em: EntityManager, { limit = 25 }: { limit?: number } = {}) {
  const claimed: ClaimedRow[] = await em.execute(
    `update outbox_message set attempts = attempts + 1, next_attempt_at = now() + interval '2 minutes'
     where id in (select id from outbox_message where status = 'pending' and next_attempt_at <= now()
                  order by next_attempt_at limit ? for update skip locked)
     returning id, to_address, subject, text_body, html_body, attachments, attempts`,
    [limit],
  );
  let sent = 0;
  let failed = 0;
  const transport = getTransport();
  const from = getEnv().MAIL_FROM;
  for (const row of claimed) {
    try {
      await transport.sendMail({
        from,
        to: row.to_address,
        subject: row.subject,
        text: row.text_body,
        html: row.html_body ?? undefined,
        attachments: (row.attachments ?? []).map((a) => ({ filename: a.filename, contentType: a.contentType, content: Buffer.from(a.content, 'base64') })),
      });
      await em.execute(`update outbox_message set status = 'sent', sent_at = now(), last_error = null where id = ?`, [row.id]);
      sent++;
    } catch (error) {
      failed++;
      const message = error instanceof Error ? error.message.slice(0, 500) : String(error);
      const giveUp = row.attempts >= MAX_ATTEMPTS;
      await em.execute(
        `update outbox_message set status = ?, last_error = ?, next_attempt_at = now() + (? * interval '1 millisecond') where id = ?`,
        [giveUp ? 'failed' : 'pending', message, retryDelayMs(row.attempts), row.id],
      );
    }
  }
  return { claimed: claimed.length, sent, failed };
}

let kickInFlight: Promise<void> | null = null;
/** Tries to deliver right away after a change queued mail; the worker's loop catches anything missed. */
export function kickOutbox(getEm: () => Promise<EntityManager>) {
  if (kickInFlight) return;
  kickInFlight = getEm()
    .then((em) => deliverDueMail(em))
    .then(() => undefined)
    .catch((error) => console.error('[tidewarden] outbox delivery failed', error instanceof Error ? error.message : error))
    .finally(() => {
      kickInFlight = null;
    });
}

/** Resolves when a delivery started by kickOutbox has finished (tests measure with nothing in flight). */
export async function outboxSettled() {
  await kickInFlight;
}

/** Messages not yet sent, newest first (the development inbox shows what is waiting and why). */
export function listWaitingMail(em: EntityManager, limit = 50) {
  return em.find(OutboxMessageSchema, { status: { $ne: 'sent' } }, { orderBy: { createdAt: 'desc' }, limit });
}

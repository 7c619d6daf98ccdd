// Webhook signing and the delivery schedule.
//
// Signing follows Stripe's scheme so that `stripe.webhooks.constructEvent(rawBody, header, secret)` in the
// app verifies our deliveries: `Stripe-Signature: t=<unix>,v1=<hex HMAC-SHA256("<t>.<payload>", secret)>`.
//
// Delivery is like the hosted service's: each event is attempted at once, and after a non-2xx answer or a
// connection error again on a growing back-off (by default 1 min, 5 min, 30 min, 2 h, 5 h, then every 10 to
// 12 h, about three days in all) before it is marked failed. So events recorded while the app is down (the
// demo seed runs before the app is up) arrive once it is back. One attempt is in flight at a time; due
// attempts go in the order they fell due, so a healthy endpoint sees events in creation order.
import { createHmac } from 'node:crypto';

function signatureHeader(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

const MINUTE = 60_000;
const HOUR = 60 * MINUTE;
/** The hosted service's schedule, roughly: growing delays over about three days (71.6 h). */
export const DEFAULT_RETRY_DELAYS_MS = [1 * MINUTE, 5 * MINUTE, 30 * MINUTE, 2 * HOUR, 5 * HOUR, 10 * HOUR, 10 * HOUR, 10 * HOUR, 12 * HOUR, 12 * HOUR, 10 * HOUR];

interface DeliveryAttempt {
  at: number; // unix ms
  status?: number; // HTTP status of the app's answer
  error?: string; // connection error or timeout
}

export interface Delivery {
  state: 'pending' | 'delivered' | 'failed' | 'not_configured';
  attempts: DeliveryAttempt[];
  /** When the next attempt is due (unix ms) while the state is pending; null otherwise. */
  next_attempt_at?: number | null;
}

interface QueueOptions {
  url: string | null;
  secret: string;
  retryDelaysMs: number[];
  timeoutMs: number;
  /** Serialized event body for an id (the exact bytes we sign and send), or null if it no longer exists. */
  payloadFor(eventId: string): string | null;
  /** Called whenever a delivery record changes (for persistence and the control API). */
  onUpdate(eventId: string, delivery: Delivery): void;
  log(line: string): void;
}

interface Job {
  eventId: string;
  generation: number;
  /** Attempts made so far in this series (a resend starts a new series). */
  attempt: number;
  dueAt: number;
  order: number;
  firstAttempt: (() => void) | null;
}

export class WebhookQueue {
  private jobs: Job[] = [];
  private running = false;
  private timer: NodeJS.Timeout | null = null;
  private order = 0;
  // Bumped by clear(): jobs from before a reset are abandoned.
  private generation = 0;
  private readonly deliveries = new Map<string, Delivery>();

  constructor(private readonly options: QueueOptions) {}

  deliveryOf(eventId: string): Delivery | undefined {
    return this.deliveries.get(eventId);
  }

  /** Restores delivery records loaded from the state file (pending ones are queued again by the caller). */
  restore(records: Record<string, Delivery>): void {
    for (const [id, d] of Object.entries(records)) this.deliveries.set(id, d);
  }

  snapshot(): Record<string, Delivery> {
    return Object.fromEntries(this.deliveries);
  }

  /**
   * Queues an event for delivery, attempted now (or at `dueAt`, for a retry restored after a restart). The
   * promise resolves once the first attempt has finished (whatever its outcome), never rejects, and does
   * not wait for retries.
   */
  enqueue(eventId: string, options: { dueAt?: number; attempt?: number } = {}): Promise<void> {
    const existing = this.deliveries.get(eventId);
    const dueAt = options.dueAt ?? Date.now();
    const delivery: Delivery = { state: this.options.url ? 'pending' : 'not_configured', attempts: existing?.attempts ?? [], next_attempt_at: this.options.url ? dueAt : null };
    this.update(eventId, delivery);
    if (!this.options.url) return Promise.resolve();
    return new Promise<void>((resolve) => {
      this.jobs.push({ eventId, generation: this.generation, attempt: options.attempt ?? 0, dueAt, order: (this.order += 1), firstAttempt: resolve });
      void this.run();
    });
  }

  /** Drops everything (used by the reset control). Waiters of dropped jobs are released. */
  clear(): void {
    this.generation += 1;
    for (const job of this.jobs) job.firstAttempt?.();
    this.jobs = [];
    this.deliveries.clear();
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
  }

  /**
   * Resolves when no attempt is in flight or due before the time-out (or after `timeoutMs`, with false).
   * Retries scheduled later than that do not count: with the hosted service's schedule they can be hours away.
   */
  async idle(timeoutMs: number): Promise<boolean> {
    const deadline = Date.now() + timeoutMs;
    while (this.running || this.jobs.some((j) => j.dueAt <= deadline)) {
      if (Date.now() > deadline) return false;
      await new Promise<void>((resolve) => setTimeout(resolve, 25).unref());
    }
    return true;
  }

  private update(eventId: string, delivery: Delivery) {
    this.deliveries.set(eventId, delivery);
    this.options.onUpdate(eventId, delivery);
  }

  /** The earliest due job (ties in the order they were queued). */
  private nextDue(now: number): Job | undefined {
    let best: Job | undefined;
    for (const job of this.jobs) {
      if (job.dueAt > now) continue;
      if (!best || job.dueAt < best.dueAt || (job.dueAt === best.dueAt && job.order < best.order)) best = job;
    }
    return best;
  }

  private async run(): Promise<void> {
    if (this.running) return;
    this.running = true;
    if (this.timer) clearTimeout(this.timer);
    this.timer = null;
    try {
      for (let job = this.nextDue(Date.now()); job; job = this.nextDue(Date.now())) {
        this.jobs.splice(this.jobs.indexOf(job), 1);
        await this.deliver(job);
      }
    } finally {
      this.running = false;
    }
    // Sleep until the next retry falls due. The timer does not keep the process alive.
    if (this.jobs.length) {
      const wait = Math.max(0, Math.min(...this.jobs.map((j) => j.dueAt)) - Date.now());
      this.timer = setTimeout(() => void this.run(), Math.min(wait, 2 ** 31 - 1));
      this.timer.unref();
    }
  }

  private async deliver(job: Job): Promise<void> {
    const { retryDelaysMs } = this.options;
    const release = () => {
      job.firstAttempt?.();
      job.firstAttempt = null;
    };
    try {
      if (job.generation !== this.generation) return;
      const payload = this.options.payloadFor(job.eventId);
      if (payload === null) return;
      const result = await this.attempt(payload);
      if (job.generation !== this.generation) return;
      const delivery = this.deliveries.get(job.eventId) ?? { state: 'pending', attempts: [] };
      delivery.attempts = [...delivery.attempts, result];
      const ok = result.status !== undefined && result.status >= 200 && result.status < 300;
      const last = job.attempt >= retryDelaysMs.length;
      delivery.state = ok ? 'delivered' : last ? 'failed' : 'pending';
      delivery.next_attempt_at = ok || last ? null : Date.now() + retryDelaysMs[job.attempt];
      this.update(job.eventId, delivery);
      if (!ok) {
        const why = result.status !== undefined ? `HTTP ${result.status}` : result.error;
        const next = delivery.next_attempt_at ? `; next attempt in ${Math.round(retryDelaysMs[job.attempt] / 1000)} s` : '; giving up';
        this.options.log(`webhook ${job.eventId} attempt ${job.attempt + 1} failed (${why})${next}`);
        if (delivery.next_attempt_at) this.jobs.push({ ...job, attempt: job.attempt + 1, dueAt: delivery.next_attempt_at, order: (this.order += 1), firstAttempt: null });
      }
    } finally {
      release();
    }
  }

  private async attempt(payload: string): Promise<DeliveryAttempt> {
    const at = Date.now();
    try {
      // Signed at send time, as Stripe does: a retry carries a fresh timestamp over the same bytes.
      const response = await fetch(this.options.url!, {
        method: 'POST',
        headers: {
          'content-type': 'application/json; charset=utf-8',
          'stripe-signature': signatureHeader(payload, this.options.secret),
          'user-agent': 'TidewardenStripeStandIn/1.0 (local webhook delivery)',
        },
        body: payload,
        signal: AbortSignal.timeout(this.options.timeoutMs),
        redirect: 'manual',
      });
      // Drain the body so the connection can be reused; its content does not matter.
      await response.arrayBuffer().catch(() => undefined);
      return { at, status: response.status };
    } catch (error) {
      // fetch() wraps the interesting part (ECONNREFUSED, "bad port", a timeout) in `cause`.
      const cause = (error as { cause?: { code?: string; message?: string } }).cause;
      return { at, error: cause?.code ?? cause?.message ?? (error as Error).message ?? 'error' };
    }
  }
}

// Webhook signing and the delivery queue.
//
// Signing follows Stripe's scheme so that `stripe.webhooks.constructEvent(rawBody, header, secret)` in the
// app verifies our deliveries: `Stripe-Signature: t=<unix>,v1=<hex HMAC-SHA256("<t>.<payload>", secret)>`.
//
// Delivery is one sequential queue in creation order (like a single Stripe endpoint, minus the parallelism):
// an event is attempted, then retried after each delay in `retryDelaysMs` on a non-2xx answer or a connection
// error, then marked failed. Events behind it wait, so the app always sees them in order.
import { createHmac } from 'node:crypto';

function signatureHeader(payload: string, secret: string, timestamp = Math.floor(Date.now() / 1000)): string {
  const v1 = createHmac('sha256', secret).update(`${timestamp}.${payload}`, 'utf8').digest('hex');
  return `t=${timestamp},v1=${v1}`;
}

interface DeliveryAttempt {
  at: number; // unix ms
  status?: number; // HTTP status of the app's answer
  error?: string; // connection error or timeout
}

export interface Delivery {
  state: 'pending' | 'delivered' | 'failed' | 'not_configured';
  attempts: DeliveryAttempt[];
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
  firstAttempt: () => void;
}

const sleep = (ms: number) => new Promise<void>((resolve) => setTimeout(resolve, ms).unref());

export class WebhookQueue {
  private jobs: Job[] = [];
  private running = false;
  // Bumped by clear(): jobs (and back-off sleeps) from before a reset are abandoned.
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
   * Queues an event for delivery. The promise resolves once the first attempt has finished (whatever its
   * outcome), never rejects, and does not wait for retries.
   */
  enqueue(eventId: string): Promise<void> {
    const existing = this.deliveries.get(eventId);
    const delivery: Delivery = { state: this.options.url ? 'pending' : 'not_configured', attempts: existing?.attempts ?? [] };
    this.update(eventId, delivery);
    if (!this.options.url) return Promise.resolve();
    return new Promise<void>((resolve) => {
      this.jobs.push({ eventId, generation: this.generation, firstAttempt: resolve });
      void this.run();
    });
  }

  /** Drops everything (used by the reset control). Waiters of dropped jobs are released. */
  clear(): void {
    this.generation += 1;
    for (const job of this.jobs) job.firstAttempt();
    this.jobs = [];
    this.deliveries.clear();
  }

  /** Resolves when nothing is queued or in flight (or after `timeoutMs`). */
  async idle(timeoutMs: number): Promise<boolean> {
    const deadline = Date.now() + timeoutMs;
    while (this.running || this.jobs.length > 0) {
      if (Date.now() > deadline) return false;
      await sleep(25);
    }
    return true;
  }

  private update(eventId: string, delivery: Delivery) {
    this.deliveries.set(eventId, delivery);
    this.options.onUpdate(eventId, delivery);
  }

  private async run(): Promise<void> {
    if (this.running) return;
    this.running = true;
    try {
      while (this.jobs.length > 0) {
        const job = this.jobs.shift()!;
        await this.deliver(job);
      }
    } finally {
      this.running = false;
    }
  }

  private async deliver(job: Job): Promise<void> {
    const { retryDelaysMs } = this.options;
    let released = false;
    const release = () => {
      if (!released) {
        released = true;
        job.firstAttempt();
      }
    };
    try {
      for (let attempt = 0; attempt <= retryDelaysMs.length; attempt += 1) {
        if (job.generation !== this.generation) return;
        if (attempt > 0) {
          await sleep(retryDelaysMs[attempt - 1]);
          if (job.generation !== this.generation) return;
        }
        const payload = this.options.payloadFor(job.eventId);
        if (payload === null) return;
        const result = await this.attempt(payload);
        const delivery = this.deliveries.get(job.eventId) ?? { state: 'pending', attempts: [] };
        delivery.attempts = [...delivery.attempts, result];
        const ok = result.status !== undefined && result.status >= 200 && result.status < 300;
        const last = attempt === retryDelaysMs.length;
        delivery.state = ok ? 'delivered' : last ? 'failed' : 'pending';
        this.update(job.eventId, delivery);
        release();
        if (ok) return;
        const why = result.status !== undefined ? `HTTP ${result.status}` : result.error;
        this.options.log(`webhook ${job.eventId} attempt ${attempt + 1} failed (${why})${last ? '; giving up' : '; will retry'}`);
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

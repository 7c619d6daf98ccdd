import { knex, type Knex } from '@mikro-orm/knex';
import { RateLimiterPostgres, RateLimiterRes } from 'rate-limiter-flexible';
import { createHash } from 'node:crypto';
import { AppError } from '../errors';
import { getEnv } from '../env';

/**
 * The rate limits, counted by rate-limiter-flexible in the "rate_limit" table (our migration creates it), so
 * every app instance shares them. Each count is one atomic upsert through a small pool of its own, outside
 * the request's transaction: a refused request still counts, although its own transaction rolls back, and a
 * burst of requests holding every connection of the ORM's pool cannot starve the counts they wait for.
 */
export interface LimitSpec {
  /** What the key counts, e.g. "sign-in:pair". */
  prefix: string;
  /** Allowed per window. */
  points: number;
  /** The window, in seconds. */
  seconds: number;
  /** Once over the limit, refused for this long (seconds; 0 = until the window ends). */
  blockSeconds?: number;
}

const MINUTE = 60;
const HOUR = 3600;

export const LIMITS = {
  /** Failed sign-ins from one address on one account: then that pair is blocked; the owner elsewhere is not. */
  signInPair: { prefix: 'sign-in:pair', points: 5, seconds: 15 * MINUTE, blockSeconds: 15 * MINUTE },
  /** Failed sign-ins from one address across all accounts (password spraying). */
  signInAddress: { prefix: 'sign-in:address', points: 50, seconds: 15 * MINUTE, blockSeconds: 15 * MINUTE },
  /** Sign-in attempts on one account from anywhere before each further attempt waits (progressive delay). */
  signInAccount: { prefix: 'sign-in:account', points: 5, seconds: 15 * MINUTE },
  /** The gate of the progressive delay: one attempt per gap, the gap doubling with every attempt, up to a minute. */
  signInAccountGate: { prefix: 'sign-in:gate', points: 1, seconds: 1 },
  signUpAddress: { prefix: 'sign-up:address', points: 20, seconds: HOUR },
  /** Mail about one address (a sign-up for an existing account, a reset request): more is dropped quietly. */
  mailToAddress: { prefix: 'mail:address', points: 3, seconds: HOUR },
  resetAddress: { prefix: 'reset:address', points: 20, seconds: HOUR },
  inviteAddress: { prefix: 'invite:address', points: 100, seconds: HOUR },
  inviteEmail: { prefix: 'invite:email', points: 5, seconds: HOUR },
} satisfies Record<string, LimitSpec>;

export const MAX_DELAY_SECONDS = 60;

const globalForLimits = globalThis as unknown as { __tidewardenRateLimits?: { pool: Knex; limiters: Map<string, RateLimiterPostgres> } };

function limits() {
  globalForLimits.__tidewardenRateLimits ??= {
    pool: knex({ client: 'pg', connection: getEnv().DATABASE_URL, pool: { min: 0, max: 4, idleTimeoutMillis: 5_000 } }),
    limiters: new Map(),
  };
  return globalForLimits.__tidewardenRateLimits;
}

async function limiterFor(spec: LimitSpec) {
  const { pool, limiters } = limits();
  let limiter = limiters.get(spec.prefix);
  if (!limiter) {
    limiter = new RateLimiterPostgres({
      storeClient: pool,
      storeType: 'knex',
      tableName: 'rate_limit',
      tableCreated: true,
      keyPrefix: spec.prefix,
      points: spec.points,
      duration: spec.seconds,
      blockDuration: spec.blockSeconds ?? 0,
    });
    limiters.set(spec.prefix, limiter);
  }
  return limiter;
}

// Keys are stored as a digest: bounded in length, and no e-mail address sits in the table.
const digest = (key: string) => createHash('sha256').update(key).digest('base64url');

export type LimitOutcome = { allowed: true; used: number } | { allowed: false; used: number; retryAfterSeconds: number };

/** Counts one use of `key` (atomically) and says whether it was within the limit. Errors of the store propagate. */
export async function take(spec: LimitSpec, key: string, options: { windowSeconds?: number } = {}): Promise<LimitOutcome> {
  const limiter = await limiterFor(spec);
  try {
    const res = await limiter.consume(digest(key), 1, options.windowSeconds ? { customDuration: options.windowSeconds } : {});
    return { allowed: true, used: res.consumedPoints };
  } catch (rejection) {
    if (rejection instanceof RateLimiterRes) {
      return { allowed: false, used: rejection.consumedPoints, retryAfterSeconds: Math.max(1, Math.ceil(rejection.msBeforeNext / 1000)) };
    }
    throw rejection;
  }
}

/** Gives one use back (a success that should not count against the limit). */
export async function giveBack(spec: LimitSpec, key: string) {
  await (await limiterFor(spec)).reward(digest(key), 1);
}

/** Forgets the key (a success resets the count). */
export async function clear(spec: LimitSpec, key: string) {
  await (await limiterFor(spec)).delete(digest(key));
}

/** Counts one use and refuses with a 429 and the given message when over the limit. */
export async function takeOrRefuse(spec: LimitSpec, key: string, message: (wait: string) => string) {
  const outcome = await take(spec, key);
  if (!outcome.allowed) throw new AppError('rate-limited', message(waitWords(outcome.retryAfterSeconds)));
  return outcome;
}

/** "40 seconds", "1 minute", "15 minutes", "1 hour". */
export function waitWords(seconds: number) {
  if (seconds < 60) return `${seconds} second${seconds === 1 ? '' : 's'}`;
  const minutes = Math.ceil(seconds / 60);
  if (minutes < 60) return `${minutes} minute${minutes === 1 ? '' : 's'}`;
  const hours = Math.ceil(minutes / 60);
  return `${hours} hour${hours === 1 ? '' : 's'}`;
}

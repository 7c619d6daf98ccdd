import { z } from 'zod';

// The environment, validated once. Every variable is listed in .env.example with a local default.
const envSchema = z.object({
  TIDEWARDEN_ENV: z.enum(['development', 'test', 'production']).default('development'),
  DATABASE_URL: z
    .string({ error: 'DATABASE_URL is not set: start the app with `npm start`, or set it to a postgres:// URL.' })
    .regex(/^postgres(ql)?:\/\//, 'DATABASE_URL must be a postgres:// URL.'),
  APP_URL: z.url('APP_URL must be a full URL such as http://127.0.0.1:3000.').default('http://127.0.0.1:3000'),
  SMTP_HOST: z.string().default('127.0.0.1'),
  SMTP_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  MAIL_FROM: z.string().default('Tidewarden <no-reply@tidewarden.invalid>'),
  // The SMTP fake's HTTP side (dev inbox); absent in production.
  FAKE_MAIL_API: z.url().optional(),
  // Payment settings. The local defaults below are the demo keys the Stripe fake accepts; production
  // has no defaults (see the refinement): it must be given keys of its own.
  STRIPE_SECRET_KEY: z.string().trim().optional(),
  STRIPE_API_HOST: z.string().optional(),
  STRIPE_API_PORT: z.coerce.number().int().optional(),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).optional(),
  STRIPE_WEBHOOK_SECRET: z.string().trim().optional(),
  // Object storage for survey photos and reports (S3-compatible; the local fake in development and tests).
  // The browser talks to S3_ENDPOINT directly (presigned URLs), so it must be reachable from users' browsers.
  S3_ENDPOINT: z.url('S3_ENDPOINT must be a full URL such as http://127.0.0.1:12121.').optional(),
  S3_BUCKET: z.string().trim().regex(/^[a-z0-9][a-z0-9.-]{1,61}[a-z0-9]$/, 'S3_BUCKET must be a bucket name (3 to 63 lower-case letters, digits, dots or hyphens).').optional(),
  S3_ACCESS_KEY_ID: z.string().trim().optional(),
  S3_SECRET_ACCESS_KEY: z.string().trim().optional(),
  S3_REGION: z.string().trim().default('us-east-1'),
  // Path-style addressing (http://host/bucket/key) as the local fake and most self-hosted stores need.
  S3_FORCE_PATH_STYLE: z.enum(['true', 'false', '1', '0']).default('true').transform((v) => v === 'true' || v === '1'),
  // How many proxies in front of the app append to X-Forwarded-For (0: clients connect to the app directly).
  TRUSTED_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
});

/** The demo keys of the local payment fake; accepted everywhere but in production. */
export const DEMO_STRIPE_SECRET_KEY = 'sk_test_tidewarden_local';
export const DEMO_STRIPE_WEBHOOK_SECRET = 'whsec_tidewarden_local';
/** The local object-storage fake's address, bucket and demo keys; accepted everywhere but in production. */
export const DEMO_S3 = { endpoint: 'http://127.0.0.1:12121', bucket: 'tidewarden-local', accessKeyId: 'tidewarden-local', secretAccessKey: 'tidewarden-local-secret' } as const;

const withPaymentKeys = envSchema
  .superRefine((env, ctx) => {
    if (env.TIDEWARDEN_ENV !== 'production') return;
    // In production an unset or demo key would silently bill nobody or accept forged webhooks: refuse to start.
    if (!env.STRIPE_SECRET_KEY) ctx.addIssue({ code: 'custom', path: ['STRIPE_SECRET_KEY'], message: 'it must be set in production (the secret key of your payment account).' });
    else if (env.STRIPE_SECRET_KEY === DEMO_STRIPE_SECRET_KEY) ctx.addIssue({ code: 'custom', path: ['STRIPE_SECRET_KEY'], message: 'it is the demo key of the local payment fake; production needs the secret key of your payment account.' });
    if (!env.STRIPE_WEBHOOK_SECRET) ctx.addIssue({ code: 'custom', path: ['STRIPE_WEBHOOK_SECRET'], message: "it must be set in production (the signing secret of the payment service's webhook endpoint)." });
    else if (env.STRIPE_WEBHOOK_SECRET === DEMO_STRIPE_WEBHOOK_SECRET) ctx.addIssue({ code: 'custom', path: ['STRIPE_WEBHOOK_SECRET'], message: "it is the demo secret of the local payment fake; production needs the signing secret of your webhook endpoint." });
    // Without these the photos and reports would go to a local fake that does not exist in production.
    for (const name of ['S3_ENDPOINT', 'S3_BUCKET', 'S3_ACCESS_KEY_ID', 'S3_SECRET_ACCESS_KEY'] as const) {
      if (!env[name]) ctx.addIssue({ code: 'custom', path: [name], message: 'it must be set in production (the object storage that keeps survey photos and reports).' });
    }
    if (env.S3_SECRET_ACCESS_KEY === DEMO_S3.secretAccessKey) ctx.addIssue({ code: 'custom', path: ['S3_SECRET_ACCESS_KEY'], message: "it is the demo key of the local storage fake; production needs your storage account's key." });
  })
  .transform((env) => ({
    ...env,
    STRIPE_SECRET_KEY: env.STRIPE_SECRET_KEY || DEMO_STRIPE_SECRET_KEY,
    STRIPE_WEBHOOK_SECRET: env.STRIPE_WEBHOOK_SECRET || DEMO_STRIPE_WEBHOOK_SECRET,
    S3_ENDPOINT: (env.S3_ENDPOINT || DEMO_S3.endpoint).replace(/\/+$/, ''),
    S3_BUCKET: env.S3_BUCKET || DEMO_S3.bucket,
    S3_ACCESS_KEY_ID: env.S3_ACCESS_KEY_ID || DEMO_S3.accessKeyId,
    S3_SECRET_ACCESS_KEY: env.S3_SECRET_ACCESS_KEY || DEMO_S3.secretAccessKey,
  }));

export type Env = z.infer<typeof withPaymentKeys>;

let cached: Env | undefined;

export class EnvError extends Error {}

/** Validates an environment (process.env by default); throws an EnvError naming the first bad variable. */
export function parseEnv(source: Record<string, string | undefined>): Env {
  const parsed = withPaymentKeys.safeParse(source);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new EnvError(`Environment variable ${String(first?.path[0] ?? '?')} is invalid: ${first?.message}`);
  }
  return parsed.data;
}

export function getEnv(): Env {
  if (cached) return cached;
  cached = parseEnv(process.env);
  return cached;
}


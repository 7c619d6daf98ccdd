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
  STRIPE_SECRET_KEY: z.string().default('sk_test_tidewarden_local'),
  STRIPE_API_HOST: z.string().optional(),
  STRIPE_API_PORT: z.coerce.number().int().optional(),
  STRIPE_API_PROTOCOL: z.enum(['http', 'https']).optional(),
  STRIPE_WEBHOOK_SECRET: z.string().default('whsec_tidewarden_local'),
  // How many proxies in front of the app append to X-Forwarded-For (0: clients connect to the app directly).
  TRUSTED_PROXY_HOPS: z.coerce.number().int().min(0).max(10).default(0),
});

export type Env = z.infer<typeof envSchema>;

let cached: Env | undefined;

export class EnvError extends Error {}

export function getEnv(): Env {
  if (cached) return cached;
  const parsed = envSchema.safeParse(process.env);
  if (!parsed.success) {
    const first = parsed.error.issues[0];
    throw new EnvError(`Environment variable ${String(first?.path[0] ?? '?')} is invalid: ${first?.message}`);
  }
  cached = parsed.data;
  return cached;
}


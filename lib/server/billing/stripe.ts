import Stripe from 'stripe';
import { getEnv } from '../env';

let client: Stripe | undefined;

/** The official SDK, pointed at the local fake when STRIPE_API_HOST is set (development and tests). */
export function getStripe(): Stripe {
  if (!client) {
    const env = getEnv();
    client = new Stripe(env.STRIPE_SECRET_KEY, {
      ...(env.STRIPE_API_HOST ? { host: env.STRIPE_API_HOST, port: env.STRIPE_API_PORT, protocol: env.STRIPE_API_PROTOCOL ?? 'http' } : {}),
      maxNetworkRetries: env.STRIPE_API_HOST ? 0 : 2,
      telemetry: false,
      timeout: 10_000,
    });
  }
  return client;
}

import { NextResponse } from 'next/server';
import type Stripe from 'stripe';
import { getEm } from '@/lib/server/db';
import { getEnv } from '@/lib/server/env';
import { getStripe } from '@/lib/server/billing/stripe';
import { applyStripeEvent } from '@/lib/server/services/billing/apply-stripe-event';

export const dynamic = 'force-dynamic';

// POST /api/webhooks/stripe: signed events from the payment service. Only a valid signature over the
// exact bytes is trusted; each event is applied once.
export async function POST(req: Request) {
  const raw = await req.text();
  let event: Stripe.Event;
  try {
    event = getStripe().webhooks.constructEvent(raw, req.headers.get('stripe-signature') ?? '', getEnv().STRIPE_WEBHOOK_SECRET);
  } catch {
    console.warn('[tidewarden] webhook refused: the Stripe-Signature header does not match the body');
    return NextResponse.json({ error: { code: 'invalid', message: 'Invalid signature.' } }, { status: 400 });
  }
  try {
    const { outcome } = await applyStripeEvent(await getEm(), event);
    return NextResponse.json({ received: true, outcome });
  } catch (error) {
    // Nothing was recorded for this event; the payment service will send it again.
    console.error('[tidewarden] webhook could not be applied', event.id, event.type, error instanceof Error ? error.message : error);
    return NextResponse.json({ error: { code: 'internal', message: 'Not applied; retry later.' } }, { status: 500 });
  }
}

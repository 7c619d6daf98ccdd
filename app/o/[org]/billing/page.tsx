import type { Metadata } from 'next';
import { format } from 'date-fns';
import { getPageOrgContextWith } from '@/lib/server/page-context';
import { organisationReadOnlyReason } from '@/lib/server/org-context';
import { confirmCheckout, getBillingOverview, hasLiveSubscription } from '@/lib/server/services/billing/manage-subscription';
import { checkSubscriptionNow } from '@/lib/server/services/billing/reconcile-subscription';
import { PLAN_IDS, PLANS, TRIAL_PLAN, assetLimitOf } from '@/lib/billing/plans';
import { INVOICE_STATUS_LABELS, SUBSCRIPTION_STATUS_LABELS } from '@/lib/labels';
import { fmt } from '@/lib/format';
import { PageHeader, Panel, StatusTag } from '@/components/ui/panel';
import { INVOICE_STATUS_TONES, SUBSCRIPTION_STATUS_TONES, toneOf } from '@/lib/status/palette';
import { CancelButton, ChoosePlanButton, PortalButton } from '@/components/billing/billing-forms';
import { countActiveAssets } from '@/lib/server/services/assets/list-asset-choices';
import { TableFrame } from '@/components/ui/table-frame';

export const metadata: Metadata = { title: 'Billing' };
export const dynamic = 'force-dynamic';

export default async function BillingPage({ params, searchParams }: { params: Promise<{ org: string }>; searchParams: Promise<{ checkout?: string; session_id?: string }> }) {
  const { org } = await params;
  const { checkout, session_id: sessionId } = await searchParams;
  const ctx = await getPageOrgContextWith(org, 'billing:manage');
  if (checkout === 'success' && sessionId) {
    await confirmCheckout(ctx, sessionId).catch((error) => console.error('[tidewarden] checkout confirmation failed', error instanceof Error ? error.message : error));
  }
  // The subscription is read back from the payment service (a short time-out); if it does not answer, the
  // last known state is shown and the page says so.
  const { checked } = await checkSubscriptionNow(ctx);
  const o = ctx.organisation;
  const live = hasLiveSubscription(o);
  const [{ invoices, invoicesError }, activeAssets] = await Promise.all([getBillingOverview(ctx), countActiveAssets(ctx)]);
  const readOnly = organisationReadOnlyReason(o);
  const limit = assetLimitOf({ plan: o.plan ?? null, subscriptionStatus: o.subscriptionStatus, trialEndsAt: o.trialEndsAt ?? null, stripeSubscriptionId: o.stripeSubscriptionId ?? null, pastDueSince: o.pastDueSince ?? null });
  const status = SUBSCRIPTION_STATUS_LABELS[o.subscriptionStatus] ?? 'Unknown';
  const tone = readOnly ? 'action' : toneOf(SUBSCRIPTION_STATUS_TONES, o.subscriptionStatus);
  const planName = o.plan ? PLANS[o.plan].name : `${PLANS[TRIAL_PLAN].name} limits during the trial`;
  return (
    <>
      <PageHeader title="Billing" subtitle="Tidewarden is priced by the number of active vessels and structures. Payments go through the payment service; we never see card numbers." />
      {checkout === 'success' ? <p role="status" className="mb-4 rounded-[3px] border border-state-sound/40 bg-state-soundbg px-3 py-2 text-sm text-state-sound">Thank you: the payment went through and the plan is recorded below.</p> : null}
      {!checked ? <p role="alert" className="mb-4 rounded-[3px] border border-rule bg-paper-sunk px-3 py-2 text-sm">The payment service did not answer, so the subscription could not be checked just now. This is the last known state.</p> : null}
      {checkout === 'cancelled' ? <p role="status" className="mb-4 rounded-[3px] border border-rule bg-paper-sunk px-3 py-2 text-sm">Checkout was cancelled; nothing changed.</p> : null}
      <div className="grid grid-cols-1 items-start gap-4 xl:grid-cols-[24rem_minmax(0,1fr)]">
        <Panel title="Subscription">
          <dl className="flex flex-col gap-2 text-sm" aria-label="Subscription">
            <div>
              <dt className="text-2xs uppercase tracking-wide text-ink-faint">Plan</dt>
              <dd className="text-lg font-semibold" data-testid="current-plan">{planName}</dd>
            </div>
            <div>
              <dt className="text-2xs uppercase tracking-wide text-ink-faint">Status</dt>
              <dd><StatusTag tone={tone}>{status}</StatusTag>{readOnly ? <span className="ml-2 text-state-action">Read-only: {readOnly}</span> : null}</dd>
            </div>
            {o.subscriptionStatus === 'trialing' && o.trialEndsAt ? (
              <div>
                <dt className="text-2xs uppercase tracking-wide text-ink-faint">Trial ends</dt>
                <dd>{format(o.trialEndsAt, 'd MMM yyyy')}</dd>
              </div>
            ) : null}
            {o.currentPeriodEnd ? (
              <div>
                <dt className="text-2xs uppercase tracking-wide text-ink-faint">{o.cancelAtPeriodEnd ? 'Ends on' : 'Renews on'}</dt>
                <dd>{format(o.currentPeriodEnd, 'd MMM yyyy')}</dd>
              </div>
            ) : null}
            <div>
              <dt className="text-2xs uppercase tracking-wide text-ink-faint">Active assets</dt>
              <dd className="num text-left">{activeAssets} of {limit === null ? 'unlimited' : limit}</dd>
            </div>
          </dl>
          <div className="mt-4 flex flex-col gap-2">
            {o.stripeCustomerId ? <PortalButton org={org} /> : null}
            {o.stripeSubscriptionId && ['active', 'trialing', 'past_due'].includes(o.subscriptionStatus) ? <CancelButton org={org} cancelling={o.cancelAtPeriodEnd} /> : null}
          </div>
        </Panel>
        <div className="flex flex-col gap-4">
          <Panel title="Plans">
            <div className="grid grid-cols-1 gap-3 md:grid-cols-3">
              {PLAN_IDS.map((id) => {
                const plan = PLANS[id];
                const current = o.plan === id && Boolean(o.stripeSubscriptionId) && ['active', 'trialing', 'past_due'].includes(o.subscriptionStatus);
                return (
                  <section key={id} className={`flex flex-col gap-2 rounded-[4px] border p-4 ${current ? 'border-tide-500 bg-tide-50' : 'border-rule'}`} aria-label={`${plan.name} plan`}>
                    <h3 className="text-lg font-semibold text-tide-700">{plan.name}</h3>
                    <p className="text-sm text-ink-soft">{plan.summary}</p>
                    <p className="num text-left text-xl font-semibold">€{plan.monthlyPriceEur} <span className="text-xs font-normal text-ink-soft">per month</span></p>
                    <ChoosePlanButton org={org} plan={id} current={current} change={live} label={live ? `Change to ${plan.name}` : `Choose ${plan.name}`} />
                  </section>
                );
              })}
            </div>
          </Panel>
          <Panel title="Invoices">
            {invoicesError ? <p role="alert" className="text-sm text-state-action">{invoicesError}</p> : null}
            {invoices.length ? (
              <TableFrame label="Invoices">
              <table className="w-full text-sm" aria-label="Invoices">
                <thead className="text-xs text-ink-soft">
                  <tr className="border-b border-rule">
                    <th className="py-1 text-left font-medium">Date</th>
                    <th className="py-1 text-right font-medium">Amount</th>
                    <th className="py-1 pl-3 text-left font-medium">Status</th>
                    <th><span className="sr-only">Invoice</span></th>
                  </tr>
                </thead>
                <tbody>
                  {invoices.map((i) => (
                    <tr key={i.id} className="border-b border-rule">
                      <td className="py-1">{format(new Date(i.date), 'd MMM yyyy')}</td>
                      <td className="num py-1">{i.currency} {fmt(i.amount, 2)}</td>
                      <td className="py-1 pl-3"><StatusTag tone={toneOf(INVOICE_STATUS_TONES, i.status)}>{INVOICE_STATUS_LABELS[i.status] ?? 'Unknown'}</StatusTag></td>
                      <td className="py-1 text-right">{i.url ? <a className="text-tide-600 underline" href={i.url}>View</a> : null}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
              </TableFrame>
            ) : (
              <p className="text-sm text-ink-faint">No invoices yet.</p>
            )}
          </Panel>
        </div>
      </div>
    </>
  );
}

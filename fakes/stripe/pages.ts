// The fake's own browser pages: hosted checkout, billing portal and invoice. Deliberately plain forms of
// our own design; they only need to be clickable by people and by Playwright (stable button texts).
import { formatMoney } from './api';
import type { CheckoutSessionRec, CustomerRec, InvoiceRec, PortalSessionRec, SubscriptionRec } from './store';

function escapeHtml(value: unknown): string {
  return String(value ?? '')
    .replaceAll('&', '&amp;')
    .replaceAll('<', '&lt;')
    .replaceAll('>', '&gt;')
    .replaceAll('"', '&quot;')
    .replaceAll("'", '&#39;');
}

const date = (unix: number | null) => (unix ? new Date(unix * 1000).toISOString().slice(0, 10) : '—');

const STYLE = `
  body { font: 15px/1.5 system-ui, sans-serif; margin: 0; background: #f4f1ea; color: #1d2b2a; }
  main { max-width: 40rem; margin: 2rem auto; padding: 0 1rem; }
  .notice { background: #fff6cc; border: 1px dashed #b08d00; padding: .5rem .75rem; font-size: 13px; }
  section { background: #fff; border: 1px solid #c9c2b2; padding: 1rem 1.25rem; margin: 1rem 0; }
  h1 { font-size: 1.35rem; margin: 1rem 0 .25rem; }
  h2 { font-size: 1.05rem; margin: 0 0 .5rem; }
  table { border-collapse: collapse; width: 100%; }
  td, th { text-align: left; padding: .25rem .5rem .25rem 0; border-bottom: 1px solid #eee; vertical-align: top; }
  form.inline { display: inline; }
  button { font: inherit; padding: .45rem .8rem; margin: .2rem .3rem .2rem 0; border: 1px solid #1d2b2a; background: #e7efe9; cursor: pointer; }
  button.danger { background: #f7e1dc; }
  button[disabled] { opacity: .55; cursor: default; }
  .error { background: #f7e1dc; border: 1px solid #a33; padding: .5rem .75rem; font-weight: 600; }
  .ok { background: #e1f3e5; border: 1px solid #2e7d45; padding: .5rem .75rem; }
  .muted { color: #5f6b69; font-size: 13px; }
  .status { font-family: ui-monospace, monospace; font-size: 13px; }
`;

function layout(title: string, body: string): string {
  return `<!doctype html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta name="viewport" content="width=device-width, initial-scale=1">
<meta name="robots" content="noindex">
<title>${escapeHtml(title)}</title>
<style>${STYLE}</style>
</head>
<body>
<main>
<p class="notice">Local payment stand-in for development and tests. No real card is charged and nothing leaves this machine.</p>
${body}
</main>
</body>
</html>`;
}

export function messagePage(title: string, message: string): string {
  return layout(title, `<h1>${escapeHtml(title)}</h1><section><p>${escapeHtml(message)}</p></section>`);
}

// ----- checkout -------------------------------------------------------------------------------------------

export interface CheckoutView {
  session: CheckoutSessionRec;
  lines: { name: string; unitAmount: number; currency: string; interval: string; quantity: number }[];
  email: string | null;
  total: number;
}

const CHECKOUT_TITLE = 'Test checkout — local payment stand-in';
const SUCCEED_LABEL = 'Pay with test card 4242 4242 4242 4242 (succeeds)';
const DECLINE_LABEL = 'Pay with test card 4000 0000 0000 0002 (declined)';

export function checkoutPage(view: CheckoutView, error?: string): string {
  const { session } = view;
  const currency = view.lines[0]?.currency ?? 'eur';
  const rows = view.lines
    .map(
      (l) => `<tr><td><strong data-testid="plan-name">${escapeHtml(l.name)}</strong>${l.quantity > 1 ? ` × ${l.quantity}` : ''}</td>
<td data-testid="plan-price">${escapeHtml(formatMoney(l.unitAmount, l.currency))} / ${escapeHtml(l.interval)}</td></tr>`,
    )
    .join('\n');
  const trial = session.trial_period_days
    ? `<p>Includes a free trial of ${session.trial_period_days} days: nothing is due today; the first charge of ${escapeHtml(formatMoney(view.total, currency))} follows when the trial ends.</p>`
    : `<p>Due today: <strong>${escapeHtml(formatMoney(view.total, currency))}</strong>, then every month until cancelled.</p>`;
  const cancel = session.cancel_url ? `<p><a href="${escapeHtml(session.cancel_url)}">Cancel and go back</a></p>` : '';

  let body: string;
  if (session.status !== 'open') {
    const done = session.status === 'complete';
    body = `<section><p class="${done ? 'ok' : 'error'}">${done ? 'This checkout is already complete.' : 'This checkout has expired.'}</p>
${done ? `<p><a href="${escapeHtml(session.success_url.replaceAll('{CHECKOUT_SESSION_ID}', session.id))}">Continue to the app</a></p>` : cancel}</section>`;
  } else {
    body = `${error ? `<p class="error" role="alert">${escapeHtml(error)}</p>` : ''}
<section>
<h2>Subscription</h2>
<table>${rows}</table>
${trial}
${view.email ? `<p class="muted">For ${escapeHtml(view.email)}</p>` : ''}
</section>
<section>
<h2>Choose a test card</h2>
<form method="post" action="/checkout/${escapeHtml(session.id)}/pay">
<input type="hidden" name="card" value="4242424242424242">
<button type="submit">${escapeHtml(SUCCEED_LABEL)}</button>
</form>
<form method="post" action="/checkout/${escapeHtml(session.id)}/pay">
<input type="hidden" name="card" value="4000000000000002">
<button type="submit" class="danger">${escapeHtml(DECLINE_LABEL)}</button>
</form>
</section>
${cancel}`;
  }
  return layout(CHECKOUT_TITLE, `<h1>${escapeHtml(CHECKOUT_TITLE)}</h1>\n<p class="muted">Session ${escapeHtml(session.id)}</p>\n${body}`);
}

// ----- billing portal -------------------------------------------------------------------------------------

export interface PortalView {
  session: PortalSessionRec;
  customer: CustomerRec | undefined;
  subscriptions: {
    rec: SubscriptionRec;
    items: { id: string; priceId: string; name: string; unitAmount: number; currency: string; quantity: number }[];
  }[];
  invoices: InvoiceRec[];
  plans: { priceId: string; name: string; unitAmount: number; currency: string; maxAssets: string }[];
}

const PORTAL_TITLE = 'Billing settings — local payment stand-in';

function subscriptionBlock(view: PortalView, sub: PortalView['subscriptions'][number]): string {
  const { rec } = sub;
  const action = (path: string) => `/portal/${escapeHtml(view.session.id)}/${path}`;
  const hidden = `<input type="hidden" name="subscription" value="${escapeHtml(rec.id)}">`;
  const current = sub.items[0];
  const ended = rec.status === 'canceled';
  const state = ended
    ? `Ended on ${date(rec.ended_at)}.`
    : rec.cancel_at_period_end
      ? `Will end on ${date(rec.current_period_end)} (cancellation scheduled).`
      : rec.status === 'trialing'
        ? `Trial until ${date(rec.trial_end)}.`
        : `Renews on ${date(rec.current_period_end)}.`;

  const planButtons = view.plans
    .map((plan) => {
      const isCurrent = current?.priceId === plan.priceId;
      const label = isCurrent ? `${plan.name} (current plan)` : `Switch to ${plan.name}`;
      return `<form class="inline" method="post" action="${action('change')}">${hidden}<input type="hidden" name="price" value="${escapeHtml(plan.priceId)}">
<button type="submit"${isCurrent ? ' disabled' : ''} title="${escapeHtml(formatMoney(plan.unitAmount, plan.currency))} / month, ${escapeHtml(plan.maxAssets)} assets">${escapeHtml(label)}</button></form>`;
    })
    .join('\n');

  const cancelButtons = rec.cancel_at_period_end
    ? `<form class="inline" method="post" action="${action('cancel')}">${hidden}<input type="hidden" name="when" value="resume"><button type="submit">Keep subscription</button></form>`
    : `<form class="inline" method="post" action="${action('cancel')}">${hidden}<input type="hidden" name="when" value="period_end"><button type="submit" class="danger">Cancel at period end</button></form>`;

  return `<section data-subscription="${escapeHtml(rec.id)}">
<h2>${escapeHtml(current?.name ?? 'Subscription')} — <span class="status">${escapeHtml(rec.status)}</span></h2>
<p>${current ? `${escapeHtml(formatMoney(current.unitAmount, current.currency))} / month${current.quantity > 1 ? ` × ${current.quantity}` : ''}. ` : ''}${escapeHtml(state)}</p>
${
  ended
    ? ''
    : `<div><strong>Change plan</strong><br>${planButtons}</div>
<div><strong>Cancel</strong><br>${cancelButtons}
<form class="inline" method="post" action="${action('cancel')}">${hidden}<input type="hidden" name="when" value="now"><button type="submit" class="danger">Cancel now</button></form></div>`
}
<p class="muted">${escapeHtml(rec.id)}</p>
</section>`;
}

export function portalPage(view: PortalView, flash?: { kind: 'ok' | 'error'; text: string }): string {
  const who = view.customer ? view.customer.name || view.customer.email || view.customer.id : view.session.customer;
  const subs = view.subscriptions.length
    ? view.subscriptions.map((s) => subscriptionBlock(view, s)).join('\n')
    : '<section><p>No subscriptions yet.</p></section>';
  const invoices = view.invoices.length
    ? `<section><h2>Invoices</h2><table>
<tr><th>Date</th><th>Number</th><th>Amount</th><th>Status</th></tr>
${view.invoices
  .map(
    (i) =>
      `<tr><td>${date(i.created)}</td><td><a href="/invoice/${escapeHtml(i.id)}">${escapeHtml(i.number)}</a></td><td>${escapeHtml(formatMoney(i.amount_due, i.currency))}</td><td class="status">${escapeHtml(i.status)}</td></tr>`,
  )
  .join('\n')}
</table></section>`
    : '';
  const back = view.session.return_url ? `<p><a href="${escapeHtml(view.session.return_url)}">Back to the app</a></p>` : '';
  return layout(
    PORTAL_TITLE,
    `<h1>${escapeHtml(PORTAL_TITLE)}</h1>
<p class="muted">For ${escapeHtml(who)}</p>
${flash ? `<p class="${flash.kind}" role="status">${escapeHtml(flash.text)}</p>` : ''}
${back}
${subs}
${invoices}
${back}`,
  );
}

// ----- invoice --------------------------------------------------------------------------------------------

export function invoicePage(invoice: InvoiceRec, customer: CustomerRec | undefined): string {
  const title = `Invoice ${invoice.number}`;
  const lines = invoice.lines
    .map((l) => `<tr><td>${escapeHtml(l.description)}<br><span class="muted">${date(l.period_start)} – ${date(l.period_end)}</span></td><td>${escapeHtml(formatMoney(l.amount, invoice.currency))}</td></tr>`)
    .join('\n');
  return layout(
    title,
    `<h1>${escapeHtml(title)}</h1>
<section>
<p>Status: <span class="status">${escapeHtml(invoice.status)}</span> · Issued ${date(invoice.created)}${invoice.paid_at ? ` · Paid ${date(invoice.paid_at)}` : ''}</p>
<p>Billed to: ${escapeHtml(customer?.name || customer?.email || invoice.customer)}</p>
<table>${lines}
<tr><th>Total</th><th>${escapeHtml(formatMoney(invoice.amount_due, invoice.currency))}</th></tr></table>
</section>`,
  );
}

/** Words for the subscription and its invoices (safe for client code). */
export const SUBSCRIPTION_STATUS_LABELS: Record<string, string> = {
  trialing: 'Free trial',
  active: 'Active',
  past_due: 'Payment overdue',
  canceled: 'Cancelled',
  unpaid: 'Unpaid',
  incomplete: 'Awaiting first payment',
  incomplete_expired: 'First payment not made',
};

export const INVOICE_STATUS_LABELS: Record<string, string> = { draft: 'Draft', open: 'Due', paid: 'Paid', void: 'Void', uncollectible: 'Uncollectible' };

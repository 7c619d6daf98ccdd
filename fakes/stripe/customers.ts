// Customers: created by the app (one per organisation) with email, name and metadata.
import type { Params } from './form';
import { cleanMetadata, mergeMetadata, missing, missingParam, paginate, type Json } from './api';
import { emit, emitUpdated } from './events';
import type { CustomerRec, Store } from './store';

/** A customer that must exist; with `param` it is a reference in a request (400), without it the path id (404). */
export function customerRec(store: Store, id: string, param?: string): CustomerRec {
  const rec = store.customers.get(id);
  if (!rec) throw param ? missingParam('customer', id, param) : missing('customer', id);
  return rec;
}

export function renderCustomer(store: Store, c: CustomerRec): Json {
  const subscriptions = [...store.subscriptions.values()].filter((s) => s.customer === c.id);
  return {
    id: c.id,
    object: 'customer',
    address: null,
    balance: c.balance ?? 0,
    created: c.created,
    // Stripe sets the currency with the first subscription; all plans are in euro.
    currency: subscriptions.length > 0 ? 'eur' : null,
    default_source: null,
    delinquent: subscriptions.some((s) => s.status === 'past_due'),
    description: c.description,
    discount: null,
    email: c.email,
    invoice_prefix: c.id.slice(4, 12).toUpperCase(),
    invoice_settings: { custom_fields: null, default_payment_method: null, footer: null, rendering_options: null },
    livemode: false,
    metadata: { ...c.metadata },
    name: c.name,
    phone: c.phone,
    preferred_locales: [],
    shipping: null,
    tax_exempt: 'none',
    test_clock: null,
  };
}

/** Adds a customer record without recording an event (checkout creates one as a side effect). */
export function insertCustomer(store: Store, fields: Pick<CustomerRec, 'email' | 'name' | 'metadata'>): CustomerRec {
  const rec: CustomerRec = { ...store.base('cus', 14), email: fields.email, name: fields.name, description: null, phone: null, metadata: fields.metadata };
  store.customers.set(rec.id, rec);
  return rec;
}

export function createCustomer(store: Store, p: Params): Json {
  const rec = insertCustomer(store, {
    email: p.string('email', { maxLength: 512 }) || null,
    name: p.string('name', { maxLength: 256 }) || null,
    metadata: cleanMetadata(p.metadata()),
  });
  const out = renderCustomer(store, rec);
  emit(store, 'customer.created', out);
  return out;
}

export function getCustomer(store: Store, id: string): Json {
  return renderCustomer(store, customerRec(store, id));
}

export function updateCustomer(store: Store, id: string, p: Params): Json {
  const rec = customerRec(store, id);
  const before = renderCustomer(store, rec);
  const name = p.string('name', { maxLength: 256 });
  // An empty string unsets the field, as in Stripe's update calls.
  if (name !== undefined) rec.name = name || null;
  rec.metadata = mergeMetadata(rec.metadata, p.metadata());
  const out = renderCustomer(store, rec);
  emitUpdated(store, 'customer.updated', before, out);
  return out;
}

export function listCustomers(store: Store, p: Params): Json {
  const email = p.string('email');
  const items = [...store.customers.values()].filter((c) => !email || c.email === email);
  return paginate(items, p, '/v1/customers', (c) => renderCustomer(store, c));
}

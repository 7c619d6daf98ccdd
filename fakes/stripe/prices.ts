// Products and prices: only the three seeded plans exist (there is no API to create more), found by the app
// through `lookup_keys`.
import type { Params } from './form';
import { badParam, missing, missingParam, nowSeconds, paginate, type Json } from './api';
import type { PriceRec, ProductRec, Store } from './store';

// Fixed ids so that ids the app stored survive a reset of the fake.
export const SEED_PLANS = [
  { key: 'tw_harbour_monthly', product: 'prod_TwHarbour', price: 'price_TwHarbourMonthly', name: 'Harbour', amount: 4900, maxAssets: '3' },
  { key: 'tw_fleet_monthly', product: 'prod_TwFleet', price: 'price_TwFleetMonthly', name: 'Fleet', amount: 29000, maxAssets: '25' },
  { key: 'tw_armada_monthly', product: 'prod_TwArmada', price: 'price_TwArmadaMonthly', name: 'Armada', amount: 89000, maxAssets: 'unlimited' },
] as const;

export function seedPlans(store: Store): void {
  const created = nowSeconds();
  // Fixed ids, unlike store.base(); all seeded at the same second, ordered by seq.
  const base = (id: string) => ({ id, created, seq: (store.seq += 1) });
  // Seeded in reverse so that newest-first lists show Harbour, Fleet, Armada.
  for (const plan of [...SEED_PLANS].reverse()) {
    store.products.set(plan.product, {
      ...base(plan.product),
      name: plan.name,
      description: `Tidewarden ${plan.name}: ${plan.maxAssets === 'unlimited' ? 'unlimited assets' : `up to ${plan.maxAssets} assets`}.`,
      active: true,
      metadata: { max_assets: plan.maxAssets },
      default_price: plan.price,
    });
    store.prices.set(plan.price, {
      ...base(plan.price),
      product: plan.product,
      unit_amount: plan.amount,
      currency: 'eur',
      interval: 'month',
      lookup_key: plan.key,
      nickname: `${plan.name} monthly`,
      active: true,
      // Also on the price, so that code reading either place finds the plan's limit.
      metadata: { max_assets: plan.maxAssets },
    });
  }
}

/** A price that must exist; with `param` it is a reference in a request (400), without it the path id (404). */
export function priceRec(store: Store, id: string, param?: string): PriceRec {
  const rec = store.prices.get(id);
  if (!rec) throw param ? missingParam('price', id, param) : missing('price', id);
  return rec;
}

/** A price referenced by a request, which must also be buyable. */
export function activePriceRec(store: Store, id: string, param: string): PriceRec {
  const rec = priceRec(store, id, param);
  if (!rec.active) throw badParam(`The price specified is inactive: ${id}`, param);
  return rec;
}

/** The product's name, as pages and invoice lines show it. */
export const productName = (store: Store, price: PriceRec) => store.products.get(price.product)?.name ?? price.id;

export function renderProduct(p: ProductRec): Json {
  return {
    id: p.id,
    object: 'product',
    active: p.active,
    created: p.created,
    default_price: p.default_price,
    description: p.description,
    images: [],
    livemode: false,
    marketing_features: [],
    metadata: { ...p.metadata },
    name: p.name,
    package_dimensions: null,
    shippable: null,
    statement_descriptor: null,
    tax_code: null,
    type: 'service',
    unit_label: null,
    updated: p.created,
    url: null,
  };
}

export function renderPrice(p: PriceRec): Json {
  return {
    id: p.id,
    object: 'price',
    active: p.active,
    billing_scheme: 'per_unit',
    created: p.created,
    currency: p.currency,
    custom_unit_amount: null,
    livemode: false,
    lookup_key: p.lookup_key,
    metadata: { ...p.metadata },
    nickname: p.nickname,
    product: p.product,
    recurring: { interval: p.interval, interval_count: 1, meter: null, trial_period_days: null, usage_type: 'licensed' },
    tax_behavior: 'unspecified',
    tiers_mode: null,
    transform_quantity: null,
    type: 'recurring',
    unit_amount: p.unit_amount,
    unit_amount_decimal: String(p.unit_amount),
  };
}

/** The legacy `plan` object that subscription items still carry next to `price`. */
export function renderPlan(p: PriceRec): Json {
  return {
    id: p.id,
    object: 'plan',
    active: p.active,
    amount: p.unit_amount,
    amount_decimal: String(p.unit_amount),
    billing_scheme: 'per_unit',
    created: p.created,
    currency: p.currency,
    interval: p.interval,
    interval_count: 1,
    livemode: false,
    metadata: { ...p.metadata },
    meter: null,
    nickname: p.nickname,
    product: p.product,
    tiers_mode: null,
    transform_usage: null,
    trial_period_days: null,
    usage_type: 'licensed',
  };
}

export function getPrice(store: Store, id: string): Json {
  return renderPrice(priceRec(store, id));
}

export function listPrices(store: Store, p: Params): Json {
  const lookupKeys = p.stringArray('lookup_keys');
  if (lookupKeys && lookupKeys.length > 10) throw badParam('You may pass at most 10 lookup_keys.', 'lookup_keys');
  const active = p.boolean('active');
  const items = [...store.prices.values()].filter(
    (x) => (!lookupKeys || (x.lookup_key !== null && lookupKeys.includes(x.lookup_key))) && (active === undefined || x.active === active),
  );
  return paginate(items, p, '/v1/prices', renderPrice);
}

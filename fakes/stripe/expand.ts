// expand[]: replaces ids in a rendered object by the objects they name.
import { badParam, type Json } from './api';
import { renderProduct } from './prices';
import { renderSubscription } from './subscriptions';
import type { Store } from './store';

/**
 * The objects an id may be expanded into. Only what is expanded in practice is covered: a price's
 * `product` (`data.product`, `line_items.data.price.product`) and a Checkout Session's `subscription`;
 * any other id is a 400, as an unknown field is.
 */
function expandable(store: Store, id: string): Json | null {
  const product = store.products.get(id);
  if (product) return renderProduct(product);
  const subscription = store.subscriptions.get(id);
  return subscription ? renderSubscription(store, subscription) : null;
}

/**
 * Applies `expand[]` paths such as `subscription` or `data.product` to a rendered object: the id found
 * at the end of the path is replaced by the object it names. A `data` segment of a list fans out over its
 * elements. Unknown fields are a 400, as in Stripe.
 */
export function applyExpand(store: Store, value: Json, paths: string[]): Json {
  for (const path of paths) {
    if (path.split('.').length > 4) throw badParam(`You cannot expand more than 4 levels of a property (${path}).`, 'expand');
    expandPath(store, value, path.split('.'), path);
  }
  return value;
}

function expandPath(store: Store, target: unknown, segments: string[], fullPath: string): void {
  if (target === null || target === undefined) return;
  if (Array.isArray(target)) {
    target.forEach((t) => expandPath(store, t, segments, fullPath));
    return;
  }
  if (typeof target !== 'object') throw badParam(`This property cannot be expanded (${fullPath}).`, 'expand');
  const obj = target as Json;
  const [head, ...rest] = segments;
  if (!Object.hasOwn(obj, head)) throw badParam(`This property cannot be expanded (${fullPath}).`, 'expand');
  let child = obj[head];
  if (typeof child === 'string') {
    const found = expandable(store, child);
    if (!found) throw badParam(`This property cannot be expanded (${fullPath}).`, 'expand');
    obj[head] = found;
    child = found;
  }
  if (rest.length > 0) expandPath(store, child, rest, fullPath);
}

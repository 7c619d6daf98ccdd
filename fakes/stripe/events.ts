// Events: every change records one through `emit`; server.ts takes them with `takeEmitted()` and hands them
// to the webhook queue (webhooks.ts), which sends the bytes from `eventPayload()`.
import type { Params } from './form';
import { API_VERSION, newId, nowSeconds, paginate, type Json } from './api';
import type { Store } from './store';

const clone = <T>(value: T): T => JSON.parse(JSON.stringify(value)) as T;

/** Records an event; `object` is copied so that the event keeps the state of the moment it happened. */
export function emit(store: Store, type: string, object: Json, previousAttributes?: Json): void {
  const data: Json = { object: clone(object) };
  if (previousAttributes) data.previous_attributes = clone(previousAttributes);
  const event: Json = {
    id: newId('evt'),
    object: 'event',
    api_version: API_VERSION,
    created: nowSeconds(),
    data,
    livemode: false,
    pending_webhooks: 1,
    request: { id: null, idempotency_key: null },
    type,
  };
  store.events.push(event);
  store.eventIndex.set(event.id as string, event);
  store.emitted.push(event.id as string);
}

/** Records a `*.updated` event with the changed top-level fields' old values as `previous_attributes`. */
export function emitUpdated(store: Store, type: string, before: Json, after: Json): void {
  const previous: Json = {};
  for (const key of Object.keys(after)) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key])) previous[key] = before[key];
  }
  // Stripe sends an update event only when something changed.
  if (Object.keys(previous).length > 0) emit(store, type, after, previous);
}

/** Ids of the events created since the previous call, in creation order. */
export function takeEmitted(store: Store): string[] {
  const ids = store.emitted;
  store.emitted = [];
  return ids;
}

/** The exact bytes delivered for an event. Pretty-printed like Stripe's, so re-serialising breaks the signature. */
export function eventPayload(store: Store, id: string): string | null {
  const event = store.eventIndex.get(id);
  return event ? JSON.stringify(event, null, 2) : null;
}

export function listEvents(store: Store, p: Params): Json {
  // Events have no `seq` of their own; their position in the log is their creation order.
  const entries = store.events.map((e, i) => ({ id: e.id as string, created: e.created as number, seq: i, event: e }));
  return paginate(entries, p, '/v1/events', (e) => e.event);
}

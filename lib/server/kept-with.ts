/**
 * What is derived from an object kept for as long as the object itself: computed on first asking, then given
 * again for the same object and name (a WeakMap, so it goes with the object). For a value derived only from an
 * object that is itself kept while its data stand (the asset page, getAssetPage): its markup and figures are built
 * once per version of the data, not on every request. The name must say everything else the value depends on.
 */
const kept = new WeakMap<object, Map<string, unknown>>();

export function keptWith<T>(owner: object, name: string, compute: () => T): T {
  let values = kept.get(owner);
  if (!values) kept.set(owner, (values = new Map()));
  if (values.has(name)) return values.get(name) as T;
  const value = compute();
  values.set(name, value);
  return value;
}

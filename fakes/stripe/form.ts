// Parses Stripe-style form bodies and query strings into nested values.
//
// The SDK flattens params with bracket notation: `metadata[plan]=fleet`, `expand[0]=data.product`,
// `line_items[0][price]=price_x`. Browsers and hand-written requests also send `expand[]=...`.
// Objects whose keys are all array indices become arrays (ordered by index); `[]` appends.

export type FormValue = string | FormValue[] | FormObject;
export interface FormObject {
  [key: string]: FormValue;
}

export class FormParseError extends Error {
  constructor(
    message: string,
    readonly param: string,
  ) {
    super(message);
  }
}

// Keys that would let a request reach Object.prototype if we ever used plain `obj[key]` writes.
const FORBIDDEN_KEYS = new Set(['__proto__', 'prototype', 'constructor']);
const MAX_DEPTH = 8;
// Internal marker for `[]` segments while building: resolved into sequential indices.
const APPEND = Symbol('append');

type Segment = string | typeof APPEND;

/** Splits `a[b][0][]` into ['a', 'b', '0', APPEND]. Returns null when the brackets are malformed. */
function splitKey(key: string): Segment[] | null {
  const open = key.indexOf('[');
  if (open === -1) return [key];
  const segments: Segment[] = [key.slice(0, open)];
  let rest = key.slice(open);
  while (rest.length > 0) {
    const match = /^\[([^[\]]*)\]/.exec(rest);
    if (!match) return null;
    segments.push(match[1] === '' ? APPEND : match[1]);
    rest = rest.slice(match[0].length);
  }
  return segments;
}

interface Node {
  // Children keyed by segment; `appended` collects `[]` children in arrival order.
  children: Map<string, Node>;
  appended: Node[];
  value?: string;
}

const newNode = (): Node => ({ children: new Map(), appended: [] });

function toValue(node: Node): FormValue {
  if (node.children.size === 0 && node.appended.length === 0) return node.value ?? '';
  const keys = [...node.children.keys()];
  const allIndices = keys.every((k) => /^\d+$/.test(k));
  if (allIndices) {
    const indexed = keys.sort((a, b) => Number(a) - Number(b)).map((k) => toValue(node.children.get(k)!));
    return [...indexed, ...node.appended.map(toValue)];
  }
  if (node.appended.length > 0) {
    // Mixing `a[]=` with `a[name]=` has no sensible meaning; keep named keys, number the appended ones after.
    const obj: FormObject = {};
    for (const k of keys) obj[k] = toValue(node.children.get(k)!);
    node.appended.forEach((child, i) => (obj[String(keys.length + i)] = toValue(child)));
    return obj;
  }
  const obj: FormObject = {};
  for (const k of keys) obj[k] = toValue(node.children.get(k)!);
  return obj;
}

/**
 * Parses `application/x-www-form-urlencoded` text (also a URL's query string without the `?`).
 * Repeated plain keys keep the last value, as Stripe does.
 */
export function parseForm(text: string): FormObject {
  const root = newNode();
  for (const [rawKey, value] of new URLSearchParams(text)) {
    const segments = splitKey(rawKey);
    if (!segments || segments[0] === '' || segments[0] === APPEND) {
      throw new FormParseError(`Invalid parameter name: ${rawKey}`, rawKey);
    }
    if (segments.length > MAX_DEPTH) throw new FormParseError(`Parameter nested too deeply: ${rawKey}`, rawKey);
    let node = root;
    for (const segment of segments) {
      if (segment === APPEND) {
        const child = newNode();
        node.appended.push(child);
        node = child;
        continue;
      }
      if (FORBIDDEN_KEYS.has(segment)) throw new FormParseError(`Invalid parameter name: ${rawKey}`, rawKey);
      let child = node.children.get(segment);
      if (!child) {
        child = newNode();
        node.children.set(segment, child);
      }
      node = child;
    }
    if (node.children.size > 0 || node.appended.length > 0) {
      throw new FormParseError(`Parameter ${rawKey} is given both as a value and as an object`, rawKey);
    }
    node.value = value;
  }
  const result = toValue(root);
  // The root always has named keys (or none), so it is an object.
  return Array.isArray(result) || typeof result === 'string' ? {} : result;
}

/**
 * Typed, validating access to parsed params. Errors name the param in Stripe's bracket notation
 * (`line_items[0][price]`), which the server turns into a 400 `invalid_request_error` with `param` set.
 */
export class Params {
  constructor(
    readonly raw: FormObject,
    private readonly prefix = '',
  ) {}

  /** The bracket-notation name of a key under this object, e.g. `items[0][price]`. */
  name(key: string): string {
    return this.prefix ? `${this.prefix}[${key}]` : key;
  }

  has(key: string): boolean {
    return Object.hasOwn(this.raw, key);
  }

  private fail(key: string, message: string): never {
    throw new FormParseError(message, this.name(key));
  }

  /** A string param; `undefined` when absent. An empty string means "unset" in Stripe's update calls. */
  string(key: string, opts: { maxLength?: number } = {}): string | undefined {
    if (!this.has(key)) return undefined;
    const value = this.raw[key];
    if (typeof value !== 'string') this.fail(key, `Invalid string: ${this.name(key)} must be a string, not an object or array.`);
    if (opts.maxLength !== undefined && value.length > opts.maxLength) {
      this.fail(key, `Invalid string: ${this.name(key)} must be at most ${opts.maxLength} characters long.`);
    }
    return value;
  }

  requiredString(key: string, opts: { maxLength?: number } = {}): string {
    const value = this.string(key, opts);
    if (value === undefined || value === '') this.fail(key, `Missing required param: ${this.name(key)}.`);
    return value;
  }

  integer(key: string, opts: { min?: number; max?: number } = {}): number | undefined {
    const value = this.string(key);
    if (value === undefined || value === '') return undefined;
    if (!/^-?\d+$/.test(value)) this.fail(key, `Invalid integer: ${value}`);
    const n = Number(value);
    if (opts.min !== undefined && n < opts.min) this.fail(key, `Invalid ${this.name(key)}: must be at least ${opts.min}.`);
    if (opts.max !== undefined && n > opts.max) this.fail(key, `Invalid ${this.name(key)}: must be at most ${opts.max}.`);
    return n;
  }

  boolean(key: string): boolean | undefined {
    const value = this.string(key);
    if (value === undefined) return undefined;
    if (value === 'true') return true;
    if (value === 'false') return false;
    this.fail(key, `Invalid boolean: ${value}`);
  }

  oneOf<T extends string>(key: string, allowed: readonly T[]): T | undefined {
    const value = this.string(key);
    if (value === undefined) return undefined;
    if (!(allowed as readonly string[]).includes(value)) {
      this.fail(key, `Invalid ${this.name(key)}: must be one of ${allowed.join(', ')}.`);
    }
    return value as T;
  }

  /** Array of strings; accepts `k[]=a&k[]=b`, `k[0]=a`, and a lone `k=a` (as a one-element list). */
  stringArray(key: string): string[] | undefined {
    if (!this.has(key)) return undefined;
    const value = this.raw[key];
    if (typeof value === 'string') return value === '' ? [] : [value];
    if (!Array.isArray(value)) this.fail(key, `Invalid array: ${this.name(key)}`);
    return value.map((item, i) => {
      if (typeof item !== 'string') throw new FormParseError(`Invalid string: ${this.name(key)}[${i}]`, `${this.name(key)}[${i}]`);
      return item;
    });
  }

  /** Array of sub-objects, e.g. `items[0][price]`. */
  objectArray(key: string): Params[] | undefined {
    if (!this.has(key)) return undefined;
    const value = this.raw[key];
    if (!Array.isArray(value)) this.fail(key, `Invalid array: ${this.name(key)} must be a list such as ${this.name(key)}[0][...]`);
    return value.map((item, i) => {
      const itemName = `${this.name(key)}[${i}]`;
      if (typeof item === 'string' || Array.isArray(item)) throw new FormParseError(`Invalid object: ${itemName}`, itemName);
      return new Params(item, itemName);
    });
  }

  object(key: string): Params | undefined {
    if (!this.has(key)) return undefined;
    const value = this.raw[key];
    if (value === '') return new Params({}, this.name(key));
    if (typeof value === 'string' || Array.isArray(value)) this.fail(key, `Invalid object: ${this.name(key)}`);
    return new Params(value, this.name(key));
  }

  /**
   * Metadata as Stripe handles it: `null` when the whole hash is unset with `metadata=`, otherwise a map
   * in which an empty value means "remove this key" on updates. Stripe's limits: 50 keys, key 40, value 500.
   */
  metadata(key = 'metadata'): Record<string, string> | null | undefined {
    if (!this.has(key)) return undefined;
    const value = this.raw[key];
    if (value === '') return null;
    if (typeof value === 'string' || Array.isArray(value)) this.fail(key, `Invalid object: ${this.name(key)} must be a hash of strings.`);
    const out: Record<string, string> = {};
    const entries = Object.entries(value);
    if (entries.length > 50) this.fail(key, 'Invalid metadata: at most 50 keys are allowed.');
    for (const [k, v] of entries) {
      const param = `${this.name(key)}[${k}]`;
      if (typeof v !== 'string') throw new FormParseError(`Invalid metadata value for ${param}: must be a string.`, param);
      if (k.length > 40) throw new FormParseError(`Invalid metadata key ${k}: at most 40 characters.`, param);
      if (v.length > 500) throw new FormParseError(`Invalid metadata value for ${param}: at most 500 characters.`, param);
      out[k] = v;
    }
    return out;
  }
}

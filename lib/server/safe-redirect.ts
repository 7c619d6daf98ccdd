const BASE = 'http://tidewarden.invalid';
const LONE_SURROGATE = /[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/;

/**
 * Only same-site paths may be used as a "come back here" target, never another host. The value is
 * parsed as a URL the way a browser would (browsers drop tabs and newlines, so "/\t/evil.example"
 * means "//evil.example") and accepted only when it stays on our origin; what is returned is the
 * parsed path, never the raw text. The parsed path is checked again because dot segments collapse:
 * "/.//evil.example" parses to the path "//evil.example", which a browser reads as another host.
 */
export function safeNextPath(value: unknown, fallback = '/orgs'): string {
  if (typeof value !== 'string' || !value.startsWith('/') || value.length > 2000) return fallback;
  // Any control character, backslash or stray surrogate is refused outright rather than guessed at.
  if (/[\u0000-\u001f\u007f\\]/.test(value) || LONE_SURROGATE.test(value)) return fallback;
  let url: URL;
  try {
    url = new URL(value, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE || value.startsWith('//')) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  // A path that begins with two slashes (or a slash and a backslash) is read by browsers as a host.
  if (!path.startsWith('/') || /^\/[/\\]/.test(path)) return fallback;
  // Checked once more as the browser will see it: the Location header, resolved against our origin.
  if (new URL(path, BASE).origin !== BASE) return fallback;
  return path;
}

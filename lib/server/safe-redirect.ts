const BASE = 'http://tidewarden.invalid';

/**
 * Only same-site paths may be used as a "come back here" target, never another host. The value is
 * parsed as a URL the way a browser would (browsers drop tabs and newlines, so "/\t/evil.example"
 * means "//evil.example") and accepted only when it stays on our origin; what is returned is the
 * parsed path, never the raw text.
 */
export function safeNextPath(value: unknown, fallback = '/orgs'): string {
  if (typeof value !== 'string' || !value.startsWith('/') || value.length > 2000) return fallback;
  // Any control character or backslash is refused outright rather than guessed at.
  if (/[\u0000-\u001f\u007f\\]/.test(value)) return fallback;
  let url: URL;
  try {
    url = new URL(value, BASE);
  } catch {
    return fallback;
  }
  if (url.origin !== BASE || value.startsWith('//')) return fallback;
  return `${url.pathname}${url.search}${url.hash}`;
}

// Checks every request passes before it reaches a page, an action or a route handler (run by proxy.ts).
// Plain functions over headers, so they are tested without a server.
import type { ErrorBody } from './errors';

export const UNSAFE_METHODS = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The largest server-action body accepted; next.config.mjs sets the same figure for Next's own check. */
export const ACTION_BODY_LIMIT_BYTES = 1024 * 1024;

/** Route handlers that take a file: multipart (the readings also as a bare CSV body). */
const UPLOAD_ROUTES: { pattern: RegExp; types: string[] }[] = [
  { pattern: /^\/api\/orgs\/[^/]+\/surveys\/[^/]+\/attachments\/?$/, types: ['multipart/form-data'] },
  { pattern: /^\/api\/orgs\/[^/]+\/surveys\/[^/]+\/readings\/?$/, types: ['multipart/form-data', 'text/csv'] },
];

/** Signed by the payment service and sent from its servers, so neither an Origin nor a JSON type applies. */
const EXEMPT_ROUTES = [/^\/api\/webhooks\/stripe\/?$/];

export interface Refusal {
  status: number;
  body: ErrorBody;
}

const refusal = (status: number, code: ErrorBody['error']['code'], message: string): Refusal => ({ status, body: { error: { code, message } } });

/**
 * Same origin: the Origin header names our own origin (APP_URL, or the host the request was sent to),
 * or, from a browser that sends no Origin, Sec-Fetch-Site says the request started on our own pages
 * (or was typed by the user). A request with neither is refused: a script outside a browser can send
 * an Origin header.
 */
export function isSameOrigin(headers: Headers, appUrl: string): boolean {
  const fetchSite = headers.get('sec-fetch-site');
  if (fetchSite === 'cross-site' || fetchSite === 'same-site') return false;
  const origin = headers.get('origin');
  if (origin !== null) {
    if (origin === 'null') return false;
    let parsed: URL;
    try {
      parsed = new URL(origin);
    } catch {
      return false;
    }
    if (parsed.origin === new URL(appUrl).origin) return true;
    const host = headers.get('host')?.toLowerCase();
    return Boolean(host) && parsed.host.toLowerCase() === host && (parsed.protocol === 'http:' || parsed.protocol === 'https:');
  }
  return fetchSite === 'same-origin' || fetchSite === 'none';
}

const mediaType = (headers: Headers) => (headers.get('content-type') ?? '').split(';')[0]!.trim().toLowerCase();

const hasBody = (headers: Headers) => Boolean(headers.get('transfer-encoding')) || Number(headers.get('content-length') ?? '0') > 0;

/**
 * What an unsafe request must satisfy before anything runs: our own origin, and for route handlers the
 * content type the route reads (JSON, or a multipart upload). Null when the request may go on.
 */
export function checkUnsafeRequest(method: string, pathname: string, headers: Headers, appUrl: string): Refusal | null {
  if (!UNSAFE_METHODS.has(method.toUpperCase())) return null;
  if (EXEMPT_ROUTES.some((route) => route.test(pathname))) return null;
  if (!isSameOrigin(headers, appUrl)) {
    return refusal(403, 'forbidden', 'This request did not come from a Tidewarden page, so it was refused and nothing was changed.');
  }
  if (!pathname.startsWith('/api/')) return null;
  const type = mediaType(headers);
  const upload = UPLOAD_ROUTES.find((route) => route.pattern.test(pathname));
  if (upload) {
    if (!upload.types.includes(type)) return refusal(415, 'unsupported', `Send the file as ${upload.types.join(' or ')}; nothing was changed.`);
    return null;
  }
  if (hasBody(headers) && type !== 'application/json') return refusal(415, 'unsupported', 'Send the request body as application/json; nothing was changed.');
  return null;
}

/** A server-action request: a POST to a page that names the action in a header, or a form post to a page. */
export function isActionRequest(method: string, pathname: string, headers: Headers): boolean {
  if (method.toUpperCase() !== 'POST' || pathname.startsWith('/api/')) return false;
  if (headers.get('next-action')) return true;
  const type = mediaType(headers);
  return type === 'multipart/form-data' || type === 'application/x-www-form-urlencoded';
}

/**
 * Reads an action's body up to the limit and checks its outer shape, so that what Next would answer
 * with a 500 (an oversized body, a body that is not what the browser sends) is a 4xx instead.
 * The body read here is the copy Next makes for the proxy; the action reads its own.
 */
export async function checkActionBody(headers: Headers, body: ReadableStream<Uint8Array> | null, limit = ACTION_BODY_LIMIT_BYTES): Promise<Refusal | null> {
  const tooLarge = refusal(413, 'payload-too-large', `The form is larger than ${Math.round(limit / 1024)} KB; nothing was changed.`);
  const declared = headers.get('content-length');
  if (declared !== null && (!/^\d+$/.test(declared) || Number(declared) > limit)) return tooLarge;
  const chunks: Uint8Array[] = [];
  let size = 0;
  if (body) {
    const reader = body.getReader();
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      size += value.length;
      if (size > limit) {
        await reader.cancel().catch(() => undefined);
        return tooLarge;
      }
      chunks.push(value);
    }
  }
  const bytes = new Uint8Array(size);
  let offset = 0;
  for (const chunk of chunks) {
    bytes.set(chunk, offset);
    offset += chunk.length;
  }
  const malformed = refusal(400, 'invalid', 'The form could not be read; reload the page and try again. Nothing was changed.');
  const type = mediaType(headers);
  if (type === 'multipart/form-data') {
    try {
      await new Response(bytes, { headers: { 'content-type': headers.get('content-type')! } }).formData();
    } catch {
      return malformed;
    }
    return null;
  }
  if (type === 'application/x-www-form-urlencoded') return null;
  if (!headers.get('next-action')) return malformed;
  // A fetch action without files is one JSON document (React's encoding of the arguments).
  let text: string;
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
    JSON.parse(text);
  } catch {
    return malformed;
  }
  return null;
}

export interface HeaderOptions {
  nonce: string | null;
  https: boolean;
  development: boolean;
  formTargets: string[];
  /** The object storage's origin: photos are shown from it and uploaded to it directly (presigned links). */
  storageOrigin?: string | null;
}

/**
 * The page policy: scripts and styles only from our origin or carrying this response's nonce (Next
 * puts the nonce on its own scripts), workers (the offline service worker) only from our origin, nothing framed, no plugins,
 * forms only to us and the payment service's checkout and portal; images from and uploads to the object storage.
 */
export function contentSecurityPolicy({ nonce, https, development, formTargets, storageOrigin }: HeaderOptions): string {
  const nonceSource = nonce ? ` 'nonce-${nonce}'` : '';
  const storage = storageOrigin ? ` ${storageOrigin}` : '';
  return [
    "default-src 'self'",
    `script-src 'self'${nonceSource} 'strict-dynamic'${development ? " 'unsafe-eval'" : ''}`,
    `style-src 'self'${nonceSource}`,
    `img-src 'self' blob: data:${storage}`,
    "font-src 'self'",
    `connect-src 'self'${storage}`,
    // The offline service worker (/serwist/sw.js) and nothing else: 'strict-dynamic' would otherwise decide for workers.
    "worker-src 'self'",
    "manifest-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    `form-action 'self'${formTargets.length ? ` ${formTargets.join(' ')}` : ''}`,
    "frame-ancestors 'none'",
    ...(https ? ['upgrade-insecure-requests'] : []),
  ].join('; ');
}

/** Headers every response carries, whatever produced it. Kept in step with next.config.mjs. */
export const STATIC_SECURITY_HEADERS: Record<string, string> = {
  'X-Frame-Options': 'DENY',
  'X-Content-Type-Options': 'nosniff',
  'Referrer-Policy': 'strict-origin-when-cross-origin',
  // The camera is kept for survey photos taken in the browser; everything else is off.
  'Permissions-Policy': 'camera=(self), microphone=(), geolocation=(), payment=(), usb=(), serial=(), bluetooth=(), magnetometer=(), gyroscope=(), accelerometer=(), browsing-topics=()',
};

export const HSTS = 'max-age=31536000; includeSubDomains';

/** The payment service's pages a form (or its redirect) may go to: the hosted checkout and portal, or the local fake. */
export function paymentFormTargets(env: { STRIPE_API_HOST?: string; STRIPE_API_PORT?: string; STRIPE_API_PROTOCOL?: string; FAKE_STRIPE_PUBLIC_URL?: string }): string[] {
  const targets = ['https://checkout.stripe.com', 'https://billing.stripe.com'];
  const local = env.FAKE_STRIPE_PUBLIC_URL ?? (env.STRIPE_API_HOST ? `${env.STRIPE_API_PROTOCOL ?? 'https'}://${env.STRIPE_API_HOST}${env.STRIPE_API_PORT ? `:${env.STRIPE_API_PORT}` : ''}` : null);
  if (local) {
    try {
      targets.push(new URL(local).origin);
    } catch {
      // An unusable address adds nothing to the policy.
    }
  }
  return targets;
}

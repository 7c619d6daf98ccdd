import { NextResponse, type NextRequest } from 'next/server';
import {
  checkActionBody,
  checkUnsafeRequest,
  contentSecurityPolicy,
  HSTS,
  isActionRequest,
  paymentFormTargets,
  STATIC_SECURITY_HEADERS,
  type Refusal,
} from '@/lib/server/request-guard';
import { storageOrigin } from '@/lib/server/storage/storage-origin';
import { DEMO_S3 } from '@/lib/server/env';

// In front of every page, server action and route handler (Node runtime):
//  - unsafe requests (POST, PUT, PATCH, DELETE) must come from our own origin, route handlers must say
//    they send JSON (or a multipart upload), and a server action's body must be within the limit and
//    readable; a refusal is the app's JSON error shape and nothing runs;
//  - every response gets the security headers, and pages a Content-Security-Policy with a fresh nonce
//    that Next puts on its own scripts (pages are therefore rendered per request, see app/layout.tsx).

const appUrl = () => process.env.APP_URL || 'http://127.0.0.1:3000';

function refuse(refusal: Refusal, https: boolean) {
  const response = NextResponse.json(refusal.body, { status: refusal.status });
  response.headers.set('Content-Security-Policy', "default-src 'none'; frame-ancestors 'none'");
  return withStaticHeaders(response, https);
}

function withStaticHeaders(response: NextResponse, https: boolean) {
  for (const [name, value] of Object.entries(STATIC_SECURITY_HEADERS)) response.headers.set(name, value);
  // Browsers only heed HSTS over https, so a forged X-Forwarded-Proto on plain http does nothing.
  if (https) response.headers.set('Strict-Transport-Security', HSTS);
  return response;
}

export async function proxy(request: NextRequest) {
  const { pathname } = request.nextUrl;
  const https = appUrl().startsWith('https:') || request.headers.get('x-forwarded-proto') === 'https';

  const refused = checkUnsafeRequest(request.method, pathname, request.headers, appUrl());
  if (refused) return refuse(refused, https);
  if (isActionRequest(request.method, pathname, request.headers)) {
    const badBody = await checkActionBody(request.headers, request.body);
    if (badBody) return refuse(badBody, https);
  }

  if (pathname.startsWith('/api/')) return withStaticHeaders(NextResponse.next(), https);

  const nonce = Buffer.from(crypto.getRandomValues(new Uint8Array(18))).toString('base64');
  const policy = contentSecurityPolicy({
    nonce,
    https,
    development: process.env.NODE_ENV === 'development',
    storageOrigin: storageOrigin(process.env.S3_ENDPOINT || DEMO_S3.endpoint),
    formTargets: paymentFormTargets({
      FAKE_STRIPE_PUBLIC_URL: process.env.FAKE_STRIPE_PUBLIC_URL,
      STRIPE_API_HOST: process.env.STRIPE_API_HOST,
      STRIPE_API_PORT: process.env.STRIPE_API_PORT,
      STRIPE_API_PROTOCOL: process.env.STRIPE_API_PROTOCOL,
    }),
  });
  // Next reads the nonce from the request's Content-Security-Policy header while rendering.
  const requestHeaders = new Headers(request.headers);
  requestHeaders.set('Content-Security-Policy', policy);
  requestHeaders.set('x-nonce', nonce);
  const response = NextResponse.next({ request: { headers: requestHeaders } });
  response.headers.set('Content-Security-Policy', policy);
  return withStaticHeaders(response, https);
}

export const config = {
  matcher: [
    // Everything but the build's static files and the two upload routes (only those paths themselves: the
    // attachment links and the direct-upload routes below them take every check).
    { source: '/((?!_next/static|_next/image|favicon.ico|api/orgs/[^/]+/surveys/[^/]+/(?:attachments|readings)/?$).*)' },
    // The upload routes too, except a browser's same-origin request: Next copies any body the proxy sees
    // into memory (experimental.proxyClientMaxBodySize), so the app's own uploads go straight to the
    // route, which streams them. Only a browser sets Sec-Fetch-Site, and a page cannot forge it.
    {
      source: '/api/orgs/:org/surveys/:survey/(attachments|readings)',
      missing: [{ type: 'header', key: 'sec-fetch-site', value: 'same-origin' }],
    },
  ],
};

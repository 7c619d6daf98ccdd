// Headers every response carries, including those the proxy (proxy.ts) does not see. Kept in step with
// STATIC_SECURITY_HEADERS in lib/server/request-guard.ts; pages get their nonce-based policy from the proxy.
const securityHeaders = [
  { key: 'X-Frame-Options', value: 'DENY' },
  { key: 'X-Content-Type-Options', value: 'nosniff' },
  { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
  {
    key: 'Permissions-Policy',
    value: 'camera=(self), microphone=(), geolocation=(), payment=(), usb=(), serial=(), bluetooth=(), magnetometer=(), gyroscope=(), accelerometer=(), browsing-topics=()',
  },
];

/** @type {import('next').NextConfig} */
const nextConfig = {
  // `npm test` builds into its own folder so that it never disturbs a running `npm start`.
  distDir: process.env.TIDEWARDEN_DIST_DIR || '.next',
  poweredByHeader: false,
  experimental: {
    // MikroORM names entities by class/schema name; minified server bundles would rename them.
    serverMinification: false,
    // Server actions carry forms, never files (uploads go to route handlers): 1 MB is plenty, and the
    // proxy refuses a larger body with a 413 before Next reads it (ACTION_BODY_LIMIT_BYTES).
    serverActions: { bodySizeLimit: '1mb' },
    // Next copies the body of any request the proxy sees, up to this size, and silently cuts it there.
    // Above the largest upload a route accepts (10 MB plus the multipart framing), so nothing is cut
    // that a route would have taken; the browser's own uploads skip the proxy altogether.
    proxyClientMaxBodySize: '11mb',
  },
  async headers() {
    return [
      { source: '/:path*', headers: securityHeaders },
      // JSON, CSV and PDF from route handlers: nothing to run, nothing to frame.
      { source: '/api/:path*', headers: [{ key: 'Content-Security-Policy', value: "default-src 'none'; frame-ancestors 'none'" }] },
    ];
  },
  serverExternalPackages: [
    '@mikro-orm/core',
    '@mikro-orm/knex',
    '@mikro-orm/postgresql',
    '@mikro-orm/migrations',
    'knex',
    'pg',
    '@node-rs/argon2',
    '@react-pdf/renderer',
    'nodemailer',
    'stripe',
    '@aws-sdk/client-s3',
    '@aws-sdk/s3-request-presigner',
  ],
};

export default nextConfig;

/** @type {import('next').NextConfig} */
const nextConfig = {
  // `npm test` builds into its own folder so that it never disturbs a running `npm start`.
  distDir: process.env.TIDEWARDEN_DIST_DIR || '.next',
  poweredByHeader: false,
  // MikroORM names entities by class/schema name; minified server bundles would rename them.
  experimental: { serverMinification: false },
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
  ],
};

export default nextConfig;

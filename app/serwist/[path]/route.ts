import { createSerwistRoute } from '@serwist/turbopack';

// GET /serwist/sw.js: the service worker (lib/offline/service-worker.ts), bundled with esbuild at build time with
// the list of the build's static files to keep on the phone. Registered by components/offline/offline-support.tsx.
const distDir = (process.env.TIDEWARDEN_DIST_DIR || '.next').replace(/\/$/, '');

export const { dynamic, dynamicParams, revalidate, generateStaticParams, GET } = createSerwistRoute({
  swSrc: 'lib/offline/service-worker.ts',
  useNativeEsbuild: true,
  // The build's scripts, styles, fonts and images, and the icons and manifest in public/ (not the source maps).
  globPatterns: [`${distDir}/static/**/*.{js,css,woff2,png,svg,ico,webmanifest}`, 'public/**/*.{png,svg,ico,webmanifest}'],
  nextConfig: { distDir },
});

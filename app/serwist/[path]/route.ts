import { createSerwistRoute } from '@serwist/turbopack';

// Serves the service worker (app/sw.ts) at /serwist/sw.js, bundled with esbuild when the app is
// built, with the build's hashed static files and the icons as its precache list. Pages are never
// precached: they are per person (the worker keeps field pages as they are visited).
const distDir = (process.env.NEXT_DIST_DIR || '.next').replace(/^\.\//, '').replace(/\/$/, '');

export const { dynamic, dynamicParams, revalidate, generateStaticParams, GET } = createSerwistRoute({
  swSrc: 'app/sw.ts',
  useNativeEsbuild: true,
  globPatterns: [`${distDir}/static/**/*.{js,css,woff2}`, 'public/icons/*.png'],
  // A classic worker: module service workers are not in every phone browser yet.
  esbuildOptions: { format: 'iife' },
});

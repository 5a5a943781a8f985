import type { MetadataRoute } from 'next';

// The web app manifest (/manifest.webmanifest): installable on a phone's home screen, opening on
// Scan, the first thing a technician does at a unit. Icons: docker-free-scripts/make-icons.ts.
export default function manifest(): MetadataRoute.Manifest {
  return {
    id: '/',
    name: 'Rimeline',
    short_name: 'Rimeline',
    description: 'Service records for commercial refrigeration equipment.',
    start_url: '/scan',
    scope: '/',
    display: 'standalone',
    orientation: 'portrait',
    // The header's slate and the page's ground (app/layout.tsx, globals.css).
    theme_color: '#0f172a',
    background_color: '#f8fafc',
    icons: [
      { src: '/icons/icon-192.png', sizes: '192x192', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-512.png', sizes: '512x512', type: 'image/png', purpose: 'any' },
      { src: '/icons/icon-maskable-512.png', sizes: '512x512', type: 'image/png', purpose: 'maskable' },
      { src: '/icons/icon.svg', sizes: 'any', type: 'image/svg+xml', purpose: 'any' },
    ],
  };
}

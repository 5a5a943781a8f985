import type { NextConfig } from 'next';
import { staticSecurityHeaders } from './lib/api/security-headers';

const nextConfig: NextConfig = {
  // A separate build folder lets a developer run a private build beside the test build.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  // server.ts compresses (brotli where the browser takes it); Next's own would only gzip.
  compress: false,
  serverExternalPackages: ['sharp', 'pino', 'pino-pretty'],
  // The stylesheet goes inside each page's HTML: a phone on a slow link paints as the HTML arrives
  // instead of after a second request that competes with the scripts (DEVELOPERS.md, "Phone pages").
  experimental: { inlineCss: true },
  // A private lane may build while someone else's change is half-typed; npm test and CI never set this.
  typescript: { ignoreBuildErrors: process.env.RIMELINE_LANE_SKIP_TYPECHECK === '1' },
  // Static files skip proxy.ts; they still get the fixed headers (the CSP comes from the proxy).
  async headers() {
    return [{ source: '/:path*', headers: Object.entries(staticSecurityHeaders).map(([key, value]) => ({ key, value })) }];
  },
};

export default nextConfig;

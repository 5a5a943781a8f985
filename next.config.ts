import type { NextConfig } from 'next';

const nextConfig: NextConfig = {
  // A separate build folder lets a developer run a private build beside the test build.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  poweredByHeader: false,
  serverExternalPackages: ['sharp', 'pino', 'pino-pretty'],
};

export default nextConfig;

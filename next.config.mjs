import { securityHeaders } from './lib/http/security-headers.mjs';

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads optional drivers with dynamic requires: keep it and its connector out of the bundle.
  serverExternalPackages: ['sequelize', 'mariadb'],
  poweredByHeader: false,
  typedRoutes: false,
  // The browser tests build into their own folder so they never clobber a running `npm start`.
  distDir: process.env.NEXT_DIST_DIR || '.next',
  async headers() {
    return [{ source: '/:path*', headers: securityHeaders() }];
  },
};

export default nextConfig;

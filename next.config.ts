import type { NextConfig } from 'next';

const nextConfig: NextConfig = {
  // forbidden()/unauthorized() give real 403/401 pages for role checks.
  experimental: { authInterrupts: true },
  // postgres.js and nodemailer are server-only Node libraries; keep them out of bundling.
  serverExternalPackages: ['postgres', 'nodemailer', 'smtp-server', 'mailparser'],
  poweredByHeader: false,
  // Lets parallel checkouts' builds (or a developer's test run beside `npm start`) not collide.
  distDir: process.env.PULSELOOM_DIST_DIR ?? '.next',
};

export default nextConfig;

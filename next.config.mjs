/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its driver dynamically and piscina spawns workers from files:
  // both must stay plain Node modules rather than be bundled. BullMQ (queue mode) names optional
  // clients it loads only when asked for, which a bundler would try to resolve.
  serverExternalPackages: [
    'sequelize',
    'mariadb',
    'piscina',
    'pdfkit',
    'exceljs',
    'nodemailer',
    'esbuild',
    'bullmq',
    'ioredis',
  ],
  poweredByHeader: false,
  // A second test slot builds into its own folder (see scripts/test.sh).
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Types are checked once by `tsc --noEmit` in npm test; checking again in every build only doubles the time.
  typescript: { ignoreBuildErrors: true },
  // Fixed security headers on every response; the content security policy (with a nonce per
  // page) and HSTS (only over https) are set per request in proxy.ts.
  async headers() {
    return [
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
          {
            key: 'Permissions-Policy',
            value: 'camera=(), microphone=(), geolocation=(), payment=(), usb=()',
          },
        ],
      },
    ];
  },
};

export default nextConfig;

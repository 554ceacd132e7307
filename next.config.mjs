/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its driver dynamically and piscina spawns workers from files:
  // both must stay plain Node modules rather than be bundled.
  serverExternalPackages: ['sequelize', 'mariadb', 'piscina', 'pdfkit', 'exceljs', 'nodemailer', 'esbuild'],
  poweredByHeader: false,
  // A second test slot builds into its own folder (see scripts/test.sh).
  distDir: process.env.NEXT_DIST_DIR || '.next',
  // Types are checked once by `tsc --noEmit` in npm test; checking again in every build only doubles the time.
  typescript: { ignoreBuildErrors: true },
};

export default nextConfig;

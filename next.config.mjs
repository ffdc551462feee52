// Next.js configuration for Sightward. Telemetry is switched off by the scripts
// (NEXT_TELEMETRY_DISABLED=1) so no build or start sends anything off the machine.

/** @type {import('next').NextConfig} */
const nextConfig = {
  reactStrictMode: true,
  // npm test builds and serves `.next-test` (SIGHTWARD_DIST_DIR) so it never replaces the `.next`
  // that an npm start in the same checkout is serving; `next start` reads the same setting.
  distDir: process.env.SIGHTWARD_DIST_DIR || ".next",
  // Node-only packages stay outside the server bundle: they load native or dynamic code at run time.
  serverExternalPackages: ["pg", "kysely", "bcryptjs", "nodemailer", "mailparser", "smtp-server", "highs"],
  // Our own 403 page rendered by forbidden() from pages (app/forbidden.tsx).
  experimental: { authInterrupts: true },
  poweredByHeader: false,
  typescript: { ignoreBuildErrors: false },
};

export default nextConfig;

// Next.js configuration for Sightward. Telemetry is switched off by the scripts
// (NEXT_TELEMETRY_DISABLED=1) so no build or start sends anything off the machine.

// Headers every answer carries (OWASP Secure Headers Project's recommended set).
const SECURITY_HEADERS = [
  // No other site may show Sightward in a frame (clickjacking); CSP frame-ancestors says the same.
  { key: "X-Frame-Options", value: "DENY" },
  { key: "X-Content-Type-Options", value: "nosniff" },
  // Addresses may hold calendar tokens and room ids: never send them to another site.
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=(), usb=()" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
  { key: "Cross-Origin-Resource-Policy", value: "same-origin" },
];

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
  // Security headers on every answer. Pages get their Content-Security-Policy (with a per-request
  // nonce) from proxy.ts; everything else (API answers, the calendar feed) the deny-all one here.
  async headers() {
    return [
      { source: "/:path*", headers: SECURITY_HEADERS },
      { source: "/api/:path*", headers: [{ key: "Content-Security-Policy", value: "default-src 'none'; frame-ancestors 'none'" }] },
      {
        // HSTS only when the app is reached over TLS (a reverse proxy says so in X-Forwarded-Proto):
        // over plain http the header is ignored by browsers anyway (RFC 6797 section 8.1).
        source: "/:path*",
        has: [{ type: "header", key: "x-forwarded-proto", value: "https" }],
        headers: [{ key: "Strict-Transport-Security", value: "max-age=31536000; includeSubDomains" }],
      },
    ];
  },
};

export default nextConfig;

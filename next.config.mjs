/** Next.js configuration for Sixfold: server-only packages, and the security headers on every answer. */
const csp = [
  "default-src 'self'",
  // Next.js inlines its bootstrap script; no third-party script is ever loaded
  "script-src 'self' 'unsafe-inline'",
  // KaTeX and the chart set inline styles
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data:",
  "font-src 'self' data:",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join("; ");

const securityHeaders = [
  { key: "Content-Security-Policy", value: csp },
  { key: "X-Content-Type-Options", value: "nosniff" },
  { key: "X-Frame-Options", value: "DENY" },
  { key: "Referrer-Policy", value: "same-origin" },
  { key: "Permissions-Policy", value: "camera=(), microphone=(), geolocation=(), payment=()" },
  { key: "Cross-Origin-Opener-Policy", value: "same-origin" },
];

const nextConfig = {
  serverExternalPackages: ["knex", "mysql2", "nodemailer", "smtp-server", "pdf-lib", "piscina"],
  poweredByHeader: false,
  reactStrictMode: true,
  async headers() {
    return [{ source: "/:path*", headers: securityHeaders }];
  },
};

export default nextConfig;

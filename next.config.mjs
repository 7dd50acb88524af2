/** Next.js configuration for Sixfold. */
const nextConfig = {
  serverExternalPackages: ["knex", "mysql2", "nodemailer", "smtp-server"],
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;

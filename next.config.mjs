/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect with a dynamic require; bundling it breaks that (see stack notes).
  serverExternalPackages: ["sequelize", "pg", "pg-hstore"],
  poweredByHeader: false,
  reactStrictMode: true,
};

export default nextConfig;

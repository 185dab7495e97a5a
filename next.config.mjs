/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect with a dynamic require; bundling it breaks that.
  serverExternalPackages: ["sequelize", "pg", "pg-hstore"],
  poweredByHeader: false,
  // Lets several checkouts' builds (or a benchmark and a test run) live side by side; declared
  // with the other variables in lib/env.ts.
  distDir: process.env.SHUNTBOOK_NEXT_DIST_DIR || ".next",
  reactStrictMode: true,
};

export default nextConfig;

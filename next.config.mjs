import { RESOURCE_POLICY, STATIC_SECURITY_HEADERS } from "./lib/http/static-security-headers.mjs";

const fixedHeaders = Object.entries(STATIC_SECURITY_HEADERS).map(([key, value]) => ({ key, value }));
const resourcePolicy = [{ key: "Content-Security-Policy", value: RESOURCE_POLICY }];

/** @type {import('next').NextConfig} */
const nextConfig = {
  // Sequelize loads its dialect with a dynamic require; bundling it breaks that.
  serverExternalPackages: ["sequelize", "pg", "pg-hstore"],
  poweredByHeader: false,
  // Lets several checkouts' builds (or a benchmark and a test run) live side by side; declared
  // with the other variables in lib/env.ts.
  distDir: process.env.SHUNTBOOK_NEXT_DIST_DIR || ".next",
  reactStrictMode: true,
  // The fixed security headers on every response; JSON and files also get the locked-down policy.
  // Pages get theirs, with a nonce, from proxy.ts. Set here rather than in the proxy so that API
  // requests never pass through it: a proxy makes Next.js buffer the request body (up to 10 MB by
  // default, experimental.proxyClientMaxBodySize) before the route's own streamed cap (lib/http/body-stream.ts) sees it.
  async headers() {
    return [
      { source: "/:path*", headers: fixedHeaders },
      { source: "/api/:path*", headers: resourcePolicy },
      { source: "/_next/static/:path*", headers: resourcePolicy },
      { source: "/_next/image", headers: resourcePolicy },
    ];
  },
};

export default nextConfig;

import path from "node:path";
import { configDefaults, defineConfig } from "vitest/config";

// The database, the mail catcher and the built app are brought up once by lib/platform/test-run.ts
// (npm test), which passes their addresses in the environment. Each integration test file then
// takes its own database cloned from a migrated template (tests/support/database.ts).
export default defineConfig({
  resolve: { alias: { "@": path.resolve(__dirname) } },
  test: {
    include: ["tests/**/*.test.ts", "tests/**/*.test.tsx"],
    // the lookup benchmark is run by `npm run benchmark:lookup`, never by vitest (its own tests are tests/unit/benchmarks)
    exclude: [...configDefaults.exclude, "tests/benchmarks/**"],
    environment: "node",
    pool: "forks",
    testTimeout: 30_000,
    hookTimeout: 120_000,
    reporters: ["default"],
  },
});

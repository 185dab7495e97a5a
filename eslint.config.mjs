// ESLint flat config: Next's own rule sets (core web vitals, and its TypeScript rules via
// typescript-eslint). Formatting is Prettier's job, checked separately by `npm run lint`.
import { defineConfig, globalIgnores } from "eslint/config";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";

export default defineConfig([
  ...nextVitals,
  ...nextTypescript,
  {
    // `const { key: _key, ...rest } = row` is how we drop a field from a copy (the seeders drop the
    // scenario's own bookkeeping before a bulk insert; tests compare rows without their ids). The
    // dropped field is unused by design; the rule still reports every other unused name.
    rules: { "@typescript-eslint/no-unused-vars": ["warn", { ignoreRestSiblings: true }] },
  },
  globalIgnores([".next*/**", ".data/**", "node_modules/**", "next-env.d.ts", "coverage/**", "tests/artifacts/**"]),
]);

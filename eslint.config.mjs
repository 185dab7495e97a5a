// ESLint flat config: Next's own rule sets (core web vitals, and its TypeScript rules via
// typescript-eslint). Formatting is Prettier's job, checked separately by `npm run lint`.
import { defineConfig, globalIgnores } from "eslint/config";
import nextVitals from "eslint-config-next/core-web-vitals";
import nextTypescript from "eslint-config-next/typescript";

export default defineConfig([
  ...nextVitals,
  ...nextTypescript,
  globalIgnores([".next*/**", ".data/**", "node_modules/**", "next-env.d.ts", "coverage/**", "tests/artifacts/**"]),
]);

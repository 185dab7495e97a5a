import { randomBytes } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";

// The launcher's source of NEXTAUTH_SECRET when the environment gives none. `npm start` keeps one
// secret per data folder, so sessions survive a restart; `npm test` makes a fresh one per run.

export function randomAuthSecret(): string {
  return randomBytes(32).toString("base64url");
}

/** The secret in <dataDir>/nextauth-secret, created (owner-readable only) on first use. */
export function persistentAuthSecret(dataDir: string): string {
  const file = path.join(dataDir, "nextauth-secret");
  if (existsSync(file)) {
    const kept = readFileSync(file, "utf8").trim();
    if (kept.length >= 32) return kept;
  }
  mkdirSync(dataDir, { recursive: true });
  const secret = randomAuthSecret();
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  return secret;
}

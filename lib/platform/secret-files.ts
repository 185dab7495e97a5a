import { randomBytes } from "node:crypto";
import { chmodSync, existsSync, mkdirSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";

// Secrets the launcher makes itself when the environment gives none: next-auth's session secret
// and the embedded PostgreSQL cluster's passwords. `npm start` keeps each in a file of its own in
// the data folder (owner-readable only, mode 0600), so sessions and the database survive a
// restart; `npm test` keeps them in its throwaway folder, fresh per run.

export function randomSecret(): string {
  return randomBytes(32).toString("base64url");
}

/** The secret in <dataDir>/<name>, created (mode 0600) on first use. */
export function persistentSecret(dataDir: string, name: string): string {
  const file = path.join(dataDir, name);
  if (existsSync(file)) {
    const kept = readFileSync(file, "utf8").trim();
    if (kept.length >= 32) {
      chmodSync(file, 0o600); // a copy restored with looser modes is tightened again
      return kept;
    }
  }
  mkdirSync(dataDir, { recursive: true });
  const secret = randomSecret();
  writeFileSync(file, `${secret}\n`, { mode: 0o600 });
  chmodSync(file, 0o600); // writeFileSync's mode applies only when it creates the file
  return secret;
}

/** next-auth's session secret in <dataDir>/nextauth-secret. */
export function persistentAuthSecret(dataDir: string): string {
  return persistentSecret(dataDir, "nextauth-secret");
}

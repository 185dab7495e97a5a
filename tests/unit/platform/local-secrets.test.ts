import { mkdtempSync, rmSync, statSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { NO_TELEMETRY, serverEnv } from "@/lib/platform/next-build";
import { hbaText } from "@/lib/platform/postgres-cluster";
import { persistentSecret } from "@/lib/platform/secret-files";

const dir = mkdtempSync(path.join(os.tmpdir(), "shuntbook-secrets-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

describe("secrets the launcher keeps in the data folder (issue 12, item 7)", () => {
  it("makes a secret once, owner-readable only (0600), and returns the same one later", () => {
    const first = persistentSecret(dir, "postgres-app-password");
    expect(first.length).toBeGreaterThanOrEqual(32);
    expect(statSync(path.join(dir, "postgres-app-password")).mode & 0o777).toBe(0o600);
    expect(persistentSecret(dir, "postgres-app-password")).toBe(first);
  });

  it("tightens a kept secret whose file was left readable by others", () => {
    const file = path.join(dir, "loose");
    writeFileSync(file, "x".repeat(40), { mode: 0o644 });
    expect(persistentSecret(dir, "loose")).toBe("x".repeat(40));
    expect(statSync(file).mode & 0o777).toBe(0o600);
  });
});

// PostgreSQL 15 manual, 21.1 "The pg_hba.conf File": the first matching line decides; a line
// whose database is `replication` is the only way to allow replication connections.
describe("pg_hba.conf of the embedded cluster", () => {
  it("asks every local and loopback connection for a scram-sha-256 password, and trusts nobody", () => {
    const text = hbaText({ superuser: "shuntbook", allowReplication: false });
    const rules = text.split("\n").filter((l) => l && !l.startsWith("#"));
    expect(rules.length).toBeGreaterThan(0);
    for (const rule of rules) expect(rule.trim().split(/\s+/).at(-1)).toBe("scram-sha-256");
    expect(text).not.toMatch(/\btrust\b|\bpeer\b|\bpassword\b|\bmd5\b/);
  });

  it("has no replication entry unless configured, and then only the superuser's on loopback", () => {
    expect(hbaText({ superuser: "shuntbook", allowReplication: false })).not.toMatch(/replication/);
    const withReplication = hbaText({ superuser: "shuntbook", allowReplication: true });
    expect(withReplication).toMatch(/^host\s+replication\s+shuntbook\s+127\.0\.0\.1\/32\s+scram-sha-256$/m);
  });
});

describe("Next.js telemetry (issue 12, item 9)", () => {
  it("is off in the app server's environment (nextjs.org/telemetry: NEXT_TELEMETRY_DISABLED=1)", () => {
    expect(NO_TELEMETRY.NEXT_TELEMETRY_DISABLED).toBe("1");
    const childEnv: NodeJS.ProcessEnv = serverEnv("/repo", { NODE_ENV: "production", PATH: "/bin" });
    expect(childEnv.NEXT_TELEMETRY_DISABLED).toBe("1");
  });

  it("is off for this test process too, because npm test sets it for every child", () => {
    expect(process.env.NEXT_TELEMETRY_DISABLED).toBe("1");
  });
});

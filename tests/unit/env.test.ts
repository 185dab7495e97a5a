import { describe, expect, it } from "vitest";
import { databaseUrl, parseEnv } from "@/lib/env";

describe("environment validation (lib/env.ts)", () => {
  it("fills in the documented defaults", () => {
    const e = parseEnv({});
    expect(e.PORT).toBe(3000);
    expect(e.SHUNTBOOK_PG_PORT).toBe(54329);
    expect(databaseUrl(e)).toBe("postgres://shuntbook@127.0.0.1:54329/shuntbook");
  });

  it("DATABASE_URL overrides the embedded cluster", () => {
    expect(databaseUrl(parseEnv({ DATABASE_URL: "postgres://u@db.internal:5432/x" }))).toBe("postgres://u@db.internal:5432/x");
  });

  it("names the variable that is wrong", () => {
    expect(() => parseEnv({ PORT: "eighty" })).toThrow(/PORT/);
    expect(() => parseEnv({ SHUNTBOOK_PG_PORT: "70000" })).toThrow(/SHUNTBOOK_PG_PORT/);
    expect(() => parseEnv({ DATABASE_URL: "mysql://x" })).toThrow(/DATABASE_URL: must be a postgres/);
  });
});

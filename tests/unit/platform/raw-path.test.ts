import { createRequire } from "node:module";
import { describe, expect, it } from "vitest";

// lib/platform/raw-path.cjs, the preload that re-points request paths Next.js would misread (issue 12
// finding 6). The HTTP side is in tests/integration/bad-input.test.ts (against the built app).
const { refusedPathTarget } = createRequire(import.meta.url)("../../../lib/platform/raw-path.cjs") as {
  refusedPathTarget: (target: string) => string | null;
};

describe("refusedPathTarget", () => {
  it.each(["/api/v1/%2e%2e/admin", "/api/v1/%2E%2E/%2e%2e/admin", "/api/%2e%2e/boards", "/api/v1/boards/.%2e", "/api/v1/%ZZ", "/api/v1/boards/%E0%A4%A"])(
    "%s: the API's JSON 404",
    (path) => expect(refusedPathTarget(path)).toBe("/api/v1/unreadable-address"),
  );

  it.each(["/boards/%ZZ", "/boards/%2e%2e/admin", "/%"])("%s: the site's not-found page", (path) => {
    expect(refusedPathTarget(path)).toBe("/unreadable-address");
  });

  it.each(["/", "/boards/example-f7?revision=v2", "/api/v1/boards?q=%ZZ", "/boards/f7%2Ev2", "/api/v1/boards/a..b", "/_next/static/x.js", "/boards/caf%C3%A9"])(
    "%s is left alone",
    (path) => expect(refusedPathTarget(path)).toBeNull(),
  );
});

import { describe, expect, it } from "vitest";
import { signInReason } from "@/components/auth/sign-in-reason";

// The daily-paths issue: "the sign-in page does not say why a visitor was sent there".
describe("sign-in reason", () => {
  it("names the page the visitor was on the way to", () => {
    expect(signInReason("/garage")).toMatch(/garage/);
    expect(signInReason("/garage/quads/3?x=1")).toMatch(/garage/);
    expect(signInReason("/moderation/12")).toMatch(/moderators/);
    expect(signInReason("/submit?board=a")).toMatch(/Sending the values/);
  });

  it("says nothing for pages that need no account, and is not fooled by a look-alike prefix", () => {
    expect(signInReason("/boards/x")).toBeNull();
    expect(signInReason("/garageland")).toBeNull();
  });
});

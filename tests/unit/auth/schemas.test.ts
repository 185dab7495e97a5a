import bcrypt from "bcryptjs";
import { describe, expect, it } from "vitest";
import { nameFromEmail } from "@/lib/auth/adapter";
import { verifyPassword } from "@/lib/auth/passwords";
import { ChangePasswordSchema, emailField, newPasswordField, ResetConfirmSchema, SignUpSchema } from "@/lib/auth/schemas";
import { magicLinkMail, passwordResetMail } from "@/lib/mail/templates";

const messages = (r: { success: boolean; error?: { issues: { path: PropertyKey[]; message: string }[] } }) =>
  Object.fromEntries((r.error?.issues ?? []).reverse().map((i) => [String(i.path[0]), i.message])); // first message per field

describe("account field rules (lib/auth/schemas.ts)", () => {
  it("e-mail addresses are trimmed and lower-cased, and nonsense is refused", () => {
    expect(emailField.parse("  Pilot@Example.TEST ")).toBe("pilot@example.test");
    expect(emailField.safeParse("pilot@").success).toBe(false);
    expect(emailField.safeParse(`${"a".repeat(250)}@x.test`).success).toBe(false); // RFC 5321 §4.5.3.1.3: 254 max path, from memory
  });

  it("new passwords: at least 10 characters, at most 72 bytes (bcrypt's limit)", () => {
    expect(newPasswordField.safeParse("123456789").success).toBe(false);
    expect(newPasswordField.safeParse("1234567890").success).toBe(true);
    expect(newPasswordField.safeParse("a".repeat(72)).success).toBe(true);
    expect(newPasswordField.safeParse("a".repeat(73)).success).toBe(false);
    expect(newPasswordField.safeParse("é".repeat(37)).success).toBe(false); // 74 bytes in UTF-8
    expect(newPasswordField.safeParse(" ".repeat(12)).success).toBe(false);
  });

  it("bcrypt really ignores bytes past 72 (the reason for the limit; bcryptjs as the reference)", async () => {
    const hash = await bcrypt.hash("a".repeat(72), 4);
    expect(await bcrypt.compare(`${"a".repeat(72)}anything`, hash)).toBe(true);
  });

  it("sign-up names each bad field, and a mismatched confirmation lands on confirm", () => {
    const r = SignUpSchema.safeParse({ name: " ", email: "x", password: "short", confirm: "other" });
    expect(Object.keys(messages(r)).sort()).toEqual(["confirm", "email", "name", "password"]);
    const mismatch = SignUpSchema.safeParse({ name: "Kit", email: "kit@example.test", password: "long enough 1", confirm: "long enough 2" });
    expect(messages(mismatch)).toEqual({ confirm: "The two passwords differ." });
  });

  it("reset tokens must look like the 32 random bytes we mail; password change needs its confirmation", () => {
    expect(messages(ResetConfirmSchema.safeParse({ token: "abc", password: "long enough 1", confirm: "long enough 1" }))).toHaveProperty("token");
    expect(messages(ChangePasswordSchema.safeParse({ currentPassword: "", newPassword: "long enough 1", confirm: "" }))).toMatchObject({
      currentPassword: "Enter your password.",
      confirm: "Type the password again.",
    });
  });
});

describe("passwords and names", () => {
  it("verifyPassword is false without a hash (and still runs a comparison)", async () => {
    expect(await verifyPassword("anything", null)).toBe(false);
    expect(await verifyPassword("right", await bcrypt.hash("right", 4))).toBe(true);
  });

  it("a magic-link newcomer's name comes from the address", () => {
    expect(nameFromEmail("ada.fenwick+fpv@example.test")).toBe("ada fenwick fpv");
    expect(nameFromEmail("@example.test")).toBe("New member");
  });
});

describe("mail templates (lib/mail/templates.ts)", () => {
  it("carry the link in text and HTML, and escape what goes into HTML", () => {
    const m = passwordResetMail({ name: `<b>Eve</b> & "co"`, url: "http://127.0.0.1:3000/reset-password?token=x&y=1", minutes: 60 });
    expect(m.text).toContain("http://127.0.0.1:3000/reset-password?token=x&y=1");
    expect(m.text).toContain("60 minutes");
    expect(m.html).toContain("token=x&amp;y=1");
    expect(m.html).toContain("&lt;b&gt;Eve&lt;/b&gt; &amp; &quot;co&quot;");
    expect(m.html).not.toContain("<b>Eve</b>");
    expect(magicLinkMail({ url: "http://h/x", minutes: 15 }).subject).toBe("Sign in to Shuntbook");
  });
});

import { describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "@/seeders/demo/accounts";
import { shot, useChromium } from "@/tests/support/browser";

// Sign-in in a real browser against the build `npm test` serves (SHUNTBOOK_TEST_APP_URL): a magic
// link read from the mail catcher's REST API (MAIL_INBOX_URL, maildev's GET /api/email), the demo
// contributor's password, field-level errors, and sign-out. Screenshots go to tests/artifacts/.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;
const inboxUrl = process.env.MAIL_INBOX_URL;

type Mail = { subject: string; text: string; to: { address: string }[] };

/** The newest link to `address` whose path matches `path` (the app's worker sends queued mails every 2 s or so). */
async function linkFor(address: string, path: RegExp, what: string): Promise<string> {
  for (let tries = 0; tries < 100; tries++) {
    const mails = ((await (await fetch(new URL("/api/email", inboxUrl))).json()) as Mail[]).filter((m) => m.to.some((t) => t.address === address));
    const link = mails
      .at(-1)
      ?.text.match(/https?:\/\/\S+/g)
      ?.find((u) => path.test(new URL(u).pathname));
    if (link) return link;
    await new Promise((r) => setTimeout(r, 200));
  }
  throw new Error(`no ${what} mail reached ${address}`);
}

const magicLinkFor = (address: string) => linkFor(address, /^\/api\/auth\/callback\/email$/, "sign-in");

describe.skipIf(!appUrl || !inboxUrl)("auth in Chromium: magic link, password, sign-out", () => {
  const chrome = useChromium();

  it("a magic link from the inbox signs in a new address and shows its profile", async () => {
    const context = await chrome.browser.newContext({ baseURL: appUrl, viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const address = `browser-${Date.now()}@example.test`;
    await page.goto("/signin?next=/profile");
    await shot(page, "auth-signin-phone");
    const linkForm = page.getByRole("region", { name: "With an e-mailed link" });
    await linkForm.getByLabel("E-mail address").fill(address);
    await Promise.all([page.waitForURL(/\/signin\/check-email/), linkForm.getByRole("button", { name: "Mail me a sign-in link" }).click()]);
    expect(await page.getByRole("heading", { name: "Check your mail" }).isVisible()).toBe(true);
    await shot(page, "auth-check-email-phone");

    const link = await magicLinkFor(address);
    expect(new URL(link).origin).toBe(new URL(appUrl!).origin);
    await page.goto(link);
    await page.waitForURL(/\/profile$/);
    expect(await page.getByTestId("profile-email").textContent()).toBe(address);
    expect(await page.getByTestId("profile-role").textContent()).toMatch(/^Contributor/);
    expect(await page.getByRole("heading", { name: "Add a password" }).isVisible()).toBe(true);
    await shot(page, "auth-profile-magic-link-phone");
    await context.close();
  });

  it("the demo contributor signs in with the password after a wrong try, sees the profile, then signs out", async () => {
    const context = await chrome.browser.newContext({ baseURL: appUrl, viewport: { width: 1280, height: 800 }, colorScheme: "dark" });
    const page = await context.newPage();
    await page.goto("/signin");
    const passwordForm = page.getByRole("region", { name: "With your password" });

    // empty fields: a message under each, nothing sent
    await passwordForm.getByRole("button", { name: "Sign in" }).click();
    expect(await passwordForm.getByText("Enter your e-mail address.").isVisible()).toBe(true);
    expect(await passwordForm.getByText("Enter your password.").isVisible()).toBe(true);
    expect(await passwordForm.getByLabel("E-mail address").getAttribute("aria-invalid")).toBe("true");

    await passwordForm.getByLabel("E-mail address").fill(DEMO_ACCOUNTS.contributor.email);
    await passwordForm.getByLabel("Password").fill("not the password");
    await passwordForm.getByRole("button", { name: "Sign in" }).click();
    await passwordForm.getByRole("alert").waitFor();
    expect(await passwordForm.getByRole("alert").textContent()).toMatch(/do not match an account/);
    await shot(page, "auth-signin-wrong-desktop-dark");

    await passwordForm.getByLabel("Password").fill(DEMO_ACCOUNTS.contributor.password);
    await Promise.all([page.waitForURL(/\/profile$/), passwordForm.getByRole("button", { name: "Sign in" }).click()]);
    expect(await page.getByTestId("profile-name").textContent()).toBe(DEMO_ACCOUNTS.contributor.name);
    expect(
      await page
        .getByRole("navigation", { name: "Main" })
        .getByRole("link", { name: /Your profile/ })
        .isVisible(),
    ).toBe(true);
    await shot(page, "auth-profile-desktop-dark");

    await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Sign out" }).click();
    await page.waitForURL(/\/signout$/);
    await Promise.all([page.waitForURL(new URL("/", appUrl).toString()), page.getByRole("button", { name: "Sign out" }).click()]);
    expect(await page.getByRole("navigation", { name: "Main" }).getByRole("link", { name: "Sign in" }).isVisible()).toBe(true);

    // signed out, the profile sends you to sign-in and back
    await page.goto("/profile");
    await page.waitForURL(/\/signin\?next=%2Fprofile$/);
    await context.close();
  });

  // issue 12 deliver 8 changed sign-up: the form says "check your mail" and the mailed link finishes the account
  it("sign-up says 'check your mail'; the mailed link and the chosen password finish the account and sign in", async () => {
    const context = await chrome.browser.newContext({ baseURL: appUrl, viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const address = `sign-up-${Date.now()}@example.test`;
    await page.goto("/signup");
    await page.getByLabel("Name").fill("Test Pilot");
    await page.getByLabel("E-mail address").fill(address);
    await page.getByLabel("Password", { exact: true }).fill("ten chars or more");
    await page.getByLabel("Password again").fill("ten chars or more");
    await page.getByRole("button", { name: "Create my account" }).click();
    const checkMail = page.getByRole("status").filter({ hasText: "Check your mail" });
    await checkMail.waitFor();
    expect(await checkMail.textContent()).toContain(address);
    await shot(page, "auth-signup-check-mail-phone");

    await page.goto(await linkFor(address, /^\/signup\/confirm$/, "sign-up"));
    expect(await page.getByRole("heading", { name: "Finish your account" }).isVisible()).toBe(true);
    await page.getByLabel("Password", { exact: true }).fill("not what I chose");
    await page.getByRole("button", { name: "Finish and sign in" }).click();
    await page.getByText("That is not the password you chose when you signed up.").waitFor();
    await page.getByLabel("Password", { exact: true }).fill("ten chars or more");
    await Promise.all([page.waitForURL(/\/profile$/), page.getByRole("button", { name: "Finish and sign in" }).click()]);
    expect(await page.getByTestId("profile-email").textContent()).toBe(address);
    await shot(page, "auth-signup-done-phone");
    await context.close();
  });

  it("sign-up refuses bad fields one by one, on the phone", async () => {
    const context = await chrome.browser.newContext({ baseURL: appUrl, viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    await page.goto("/signup");
    await page.getByLabel("Name").fill("Test Pilot");
    await page.getByLabel("E-mail address").fill("not-an-address");
    await page.getByLabel("Password", { exact: true }).fill("short");
    await page.getByLabel("Password again").fill("shorter");
    await page.getByRole("button", { name: "Create my account" }).click();
    expect(await page.getByText(/does not look like an e-mail address/).isVisible()).toBe(true);
    expect(await page.getByText("Use at least 10 characters.").isVisible()).toBe(true);
    expect(await page.getByText("The two passwords differ.").isVisible()).toBe(true);
    await shot(page, "auth-signup-errors-phone");
    await context.close();
  });
});

import path from "node:path";
import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_LANDMARKS, buildDemoScenario } from "@/seeders/demo/scenario";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { linkIn, waitForMails } from "@/tests/support/auth";
import { ARTIFACTS_DIR, shot as shotOf, useChromium } from "@/tests/support/browser";

// The whole contributor journey in Chromium against the production build that `npm test` serves
// (SHUNTBOOK_TEST_APP_URL) on a seeded database: sign in with the magic link read from the mail
// catcher (MAIL_INBOX_URL, maildev's GET /api/email), fill in the contribution form with a voltage
// check and a fly-and-recharge cycle, see the field messages first, send, and find it pending in
// My submissions, with the "received" mail in the inbox. Screenshots in tests/artifacts/.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;

const scenario = buildDemoScenario();
const boardSlug = DEMO_LANDMARKS.popularBoards[0];
const board = scenario.boardModels.find((b) => b.slug === boardSlug)!;
const revision = scenario.boardRevisions.find((r) => r.boardSlug === boardSlug)!;
const family = DEMO_FIRMWARE_FAMILIES[0]; // V/V in 0.02, mV/A in 0.02: the figures below are in its steps (the board's ÷13 is 650)
const email = `journey-${Date.now()}@example.test`;

/** Signs in with a magic link: through the /signin page when it offers one, else through next-auth's own form post. */
async function signInWithMagicLink(page: Page, next: string): Promise<void> {
  // the page offers a password and a link; the link's form is the "e-mailed link" card
  const card = page.getByRole("region", { name: /e-?mailed link/i });
  if ((await card.count()) > 0) {
    await card.getByRole("textbox", { name: /e-?mail/i }).fill(email);
    await Promise.all([page.waitForURL(/\/signin\/check-email/), card.getByRole("button").click()]);
  } else {
    const { csrfToken } = await (await page.request.get(`${appUrl}/api/auth/csrf`)).json();
    const res = await page.request.post(`${appUrl}/api/auth/signin/email`, { form: { csrfToken, email, callbackUrl: `${appUrl}${next}`, json: "true" } });
    expect(res.ok()).toBe(true);
  }
  const [mail] = await waitForMails(email, 1, 15_000);
  expect(mail?.subject).toBe("Sign in to Shuntbook");
  await page.goto(linkIn(mail, "/api/auth/callback/email"));
}

describe.skipIf(!appUrl)("contribute: a contributor's journey in Chromium", () => {
  const chrome = useChromium();
  let page: Page;
  const shot = (name: string) => shotOf(page, name);

  beforeAll(async () => {
    const phone = await chrome.browser.newContext({
      baseURL: appUrl,
      viewport: { width: 390, height: 844 },
      colorScheme: "light",
      isMobile: true,
      hasTouch: true,
    });
    page = await phone.newPage();
  });

  it("the form asks for a session first, and the magic link from the inbox brings the person back to it", async () => {
    await page.goto("/submit");
    expect(new URL(page.url()).pathname).toBe("/signin");
    expect(new URL(page.url()).searchParams.get("next")).toBe("/submit");
    await signInWithMagicLink(page, "/submit");
    if (new URL(page.url()).pathname !== "/submit") await page.goto("/submit");
    expect(await page.getByRole("heading", { level: 1 }).innerText()).toMatch(/send your values/i);
  });

  it("sending an empty form shows every problem, each beside its field", async () => {
    await page.getByRole("button", { name: "Send for review" }).click();
    const summary = page.locator("#form-problems");
    await summary.waitFor();
    expect(await summary.innerText()).toMatch(/Choose the board and its revision/);
    expect(await summary.getAttribute("role")).toBe("alert");
    expect(await page.locator("#f-method-error").innerText()).toMatch(/Choose how you checked the values/);
    expect(await page.locator("#f-firmwareFamilyId").getAttribute("aria-invalid")).toBe("true");
    await shot("contribute-errors-phone-light");
  });

  it("fills in board, firmware, method, a voltage check and a recharge cycle, and sees what they imply", async () => {
    await page.getByLabel("Board", { exact: true }).fill(board.name);
    await page
      .getByRole("button", { name: new RegExp(board.name) })
      .first()
      .click();
    await page.getByLabel("Revision").selectOption({ label: revision.label });
    await page.getByLabel("Firmware family").selectOption({ label: family.name });
    await page.getByLabel("Firmware version").fill(family.versions.at(-1)!.version);
    await page.getByLabel("Where the readings come from").selectOption("board_adc");
    await page.getByLabel(/Fly and recharge/).check();
    // the cautions stand beside the section they belong to
    expect(await page.getByRole("heading", { name: "Charging LiPo packs" }).isVisible()).toBe(true);
    await page.getByLabel("I also checked the pack voltage with a multimeter").check();
    expect(await page.getByRole("heading", { name: "Measuring pack voltage" }).isVisible()).toBe(true);

    await page.getByLabel("Voltage scale set while you measured").fill("625");
    await page.locator("#f-voltageCheck-readings-0-cells").fill("4");
    await page.locator("#f-voltageCheck-readings-0-reportedVolts").fill("16.15");
    await page.locator("#f-voltageCheck-readings-0-measuredVolts").fill("16,8"); // a decimal comma, as many phones type it
    await page.locator("#f-cycles-0-scaleUsed").fill("1500");
    await page.locator("#f-cycles-0-reportedMah").fill("1100");
    await page.locator("#f-cycles-0-ratedMah").fill("1500");
    await page.locator("#f-cycles-0-cells").fill("4");
    await page.locator("#f-cycles-0-chargedMah").fill("2500");
    await page.locator("#f-cycles-0-chargedMah").blur();
    // 2500 mAh cannot go back into a 1500 mAh pack: refused beside the field before anything is sent
    await page
      .locator("#f-cycles-0-chargedMah-error")
      .getByText(/cannot have put 2500 mAh into a 1500 mAh pack/)
      .waitFor();
    await page.locator("#f-cycles-0-chargedMah").fill("1290");
    await page.getByLabel("Voltage scale", { exact: true }).fill("650");
    await page.getByLabel("Current scale", { exact: true }).fill("1279");
    await page.getByLabel("Current offset", { exact: true }).click();

    // fly-and-recharge rule (common practice, no source): 1500 × 1100 / 1290 = 1279.1; voltage: 625 × 16.8 / 16.15 = 650.2
    const implied = page.getByRole("region", { name: "What your evidence implies" });
    await implied.getByText("a current scale of 1279.1").waitFor();
    expect(await implied.innerText()).toMatch(/voltage scale of 650\.2/);
    const compare = page.getByRole("region", { name: "How your values compare" });
    await compare
      .getByText(/approved value/)
      .first()
      .waitFor();
    expect(await compare.innerText()).toMatch(/the usual spread/);
    await shot("contribute-form-phone-light");
  });

  it("sends it, lands on My submissions with it pending, and the 'received' mail arrives", async () => {
    await Promise.all([page.waitForURL(/\/my\/submissions\?sent=\d+/), page.getByRole("button", { name: "Send for review" }).click()]);
    const id = new URL(page.url()).searchParams.get("sent");
    expect(await page.getByRole("status").innerText()).toMatch(new RegExp(`Submission #${id} received`));
    const card = page.locator(`#submission-${id}`);
    expect(await card.innerText()).toMatch(new RegExp(board.name, "i"));
    expect(await card.getByText("Pending review").isVisible()).toBe(true);
    expect(await card.getByRole("link", { name: `Edit submission #${id}` }).isVisible()).toBe(true);
    await shot("contribute-my-submissions-phone-light");

    const mails = await waitForMails(email, 2, 20_000);
    expect(mails.map((m) => m.subject)).toContain(`Shuntbook: Submission #${id} received: pending review`);
  });

  it("the edit link opens the form on the stored values", async () => {
    const id = new URL(page.url()).searchParams.get("sent");
    await Promise.all([page.waitForURL(new RegExp(`/my/submissions/${id}/edit$`)), page.getByRole("link", { name: `Edit submission #${id}` }).click()]);
    expect(await page.getByLabel("Current scale", { exact: true }).inputValue()).toBe("1279");
    expect(await page.locator("#f-cycles-0-chargedMah").inputValue()).toBe("1290");
    await page.getByLabel("Current scale", { exact: true }).fill("1280");
    await Promise.all([page.waitForURL(/\/my\/submissions\?updated=\d+/), page.getByRole("button", { name: "Save changes" }).click()]);
    expect(await page.locator(`#submission-${id}`).innerText()).toMatch(/1280/);
  });

  it("the same pages on a desktop in dark mode, signed in as the same person", async () => {
    const desktop = await chrome.browser.newContext({
      baseURL: appUrl,
      viewport: { width: 1280, height: 800 },
      colorScheme: "dark",
      storageState: await page.context().storageState(),
    });
    const wide = await desktop.newPage();
    await wide.goto("/my/submissions");
    expect(await wide.getByRole("heading", { level: 1 }).innerText()).toMatch(/my submissions/i);
    await wide.screenshot({ path: path.join(ARTIFACTS_DIR, "contribute-my-submissions-desktop-dark.png"), fullPage: true });
    await wide.goto(`/submit?board=${boardSlug}`);
    expect(await wide.getByText(board.name, { exact: true }).isVisible()).toBe(true); // ?board= starts on that board
    await wide.getByLabel(/Bench test with a DC clamp meter/).check();
    expect(await wide.getByRole("heading", { name: "Bench tests are dangerous with props on" }).isVisible()).toBe(true);
    await wide.screenshot({ path: path.join(ARTIFACTS_DIR, "contribute-form-desktop-dark.png"), fullPage: true });
    await desktop.close();
  });
});

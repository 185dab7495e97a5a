import type { Page } from "playwright-core";
import { beforeAll, describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "@/seeders/demo/accounts";
import { shot as shotOf, useChromium } from "@/tests/support/browser";

// A moderator's pass through the queue in Chromium against the build `npm test` serves
// (SHUNTBOOK_TEST_APP_URL) on the seeded database, on a 390×844 phone: sign in by the demo
// moderator's password, find a far-off value at the top of the queue (ordered by |modified z|,
// NIST/SEMATECH e-Handbook §1.3.5.17's 3.5 cut-off), open it, find nothing preselected and be
// refused without a choice, approve it only after writing a reason (issue 13), follow "next in
// queue", reject that one with a reason, and find the "not accepted" mail with the reason in the
// mail catcher (MAIL_INBOX_URL, maildev's GET
// /api/email). The job worker that sends it runs inside the app, so the inbox is polled.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;
const inboxUrl = process.env.MAIL_INBOX_URL;
const moderator = DEMO_ACCOUNTS.moderator;

type Mail = { subject: string; text: string; to: { address: string }[] };
async function waitForSubject(subject: string, timeoutMs = 30_000): Promise<Mail> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const res = await fetch(new URL("/api/email", inboxUrl)).catch(() => null);
    const mails = ((await res?.json().catch(() => [])) ?? []) as Mail[];
    const found = mails.find((m) => m.subject === subject);
    if (found) return found;
    if (Date.now() > until) throw new Error(`no mail "${subject}" after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 500));
  }
}

describe.skipIf(!appUrl || !inboxUrl)(
  "moderation in Chromium: a moderator approves only after choosing, then the next is rejected and its contributor told",
  () => {
    const chrome = useChromium();
    let page: Page;
    const shot = (name: string) => shotOf(page, name);

    beforeAll(async () => {
      const phone = await chrome.browser.newContext({ baseURL: appUrl, viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
      page = await phone.newPage();
    });

    it("signs in as the demo moderator and sees the queue with the far-off value first", async () => {
      await page.goto("/moderation");
      await page.waitForURL(/\/signin/);
      const form = page.getByRole("region", { name: "With your password" });
      await form.getByLabel("E-mail address").fill(moderator.email);
      await form.getByLabel("Password").fill(moderator.password);
      await Promise.all([page.waitForURL(/\/moderation$/, { timeout: 30_000 }), form.getByRole("button", { name: "Sign in" }).click()]);
      expect(await page.getByRole("heading", { name: "Review queue" }).isVisible()).toBe(true);
      const first = page.getByTestId("queue-row").first();
      expect(await first.getByText(/^Far off/).isVisible()).toBe(true);
      await shot("moderation-queue-phone");
    }, 60_000);

    it("opens the first row: nothing is chosen, a far-off value is approved only with a reason, then 'next in queue'", async () => {
      const link = page
        .getByTestId("queue-row")
        .first()
        .getByRole("link", { name: /^Review submission #\d+/ });
      const id = Number((await link.getAttribute("aria-label"))!.match(/#(\d+)/)![1]);
      await Promise.all([page.waitForURL(new RegExp(`/moderation/${id}$`)), link.click()]);
      expect(await page.getByRole("heading", { name: "Where the values fall" }).isVisible()).toBe(true);
      // issue 13: plain words, not a raw score; the strip plot has a numbered axis and marks this submission
      expect(
        await page
          .getByText(/far from the others/)
          .first()
          .isVisible(),
      ).toBe(true);
      expect(await page.getByText(/z-score|modified z/).count()).toBe(0);
      expect(await page.getByTestId("strip-tick").count()).toBeGreaterThan(1);
      expect(await page.getByTestId("strip-highlight").count()).toBeGreaterThan(0);
      await shot("moderation-review-phone");

      // nothing preselected: sending without a choice is refused
      for (const name of ["Approve", "Reject", "Ask for changes"]) expect(await page.getByRole("radio", { name }).isChecked()).toBe(false);
      await page.getByRole("button", { name: "Send decision" }).click();
      expect(await page.getByText("Choose approve, reject or ask for changes first.").isVisible()).toBe(true);

      // a flagged value: approving it needs a written reason
      await page.getByRole("radio", { name: "Approve" }).check();
      await page.getByRole("button", { name: "Approve" }).click();
      const why = page.getByLabel("Why approve it although it is flagged");
      expect(await page.getByText(/Say why you approve it although it is flagged/).isVisible()).toBe(true);
      expect(await why.getAttribute("aria-invalid")).toBe("true");
      await why.fill("The photo shows this board's other current sensor; the value fits it.");
      await page.getByRole("button", { name: "Approve" }).click();
      await page.getByRole("status").getByText(`Submission #${id} approved`).waitFor({ timeout: 15_000 });
      await shot("moderation-approved-phone");

      const next = page.getByRole("link", { name: /^Next in queue: #\d+/ });
      const nextId = Number((await next.innerText()).match(/#(\d+)/)![1]);
      expect(nextId).not.toBe(id);
      await Promise.all([page.waitForURL(new RegExp(`/moderation/${nextId}$`)), next.click()]);
      expect(await page.getByRole("heading", { name: new RegExp(`#${nextId}`) }).isVisible()).toBe(true);
    }, 90_000);

    it("rejects the next one, refused without a reason first, and the contributor gets the mail", async () => {
      const id = Number(new URL(page.url()).pathname.split("/").pop());
      await page.getByRole("radio", { name: "Reject" }).check();
      await page.getByRole("button", { name: "Reject" }).click();
      expect(await page.getByText("Say why the submission is rejected: the contributor reads it").isVisible()).toBe(true);
      expect(await page.getByLabel("Reason").getAttribute("aria-invalid")).toBe("true");

      const reason = "The current scale is about ten times the others: a misplaced decimal?";
      await page.getByLabel("Reason").fill(reason);
      await page.getByRole("button", { name: "Reject" }).click();
      await page.getByRole("status").getByText(`Submission #${id} rejected`).waitFor({ timeout: 15_000 });
      await shot("moderation-rejected-phone");

      const mail = await waitForSubject(`Shuntbook: Submission #${id} not accepted`);
      expect(mail.to[0]?.address).not.toBe(moderator.email);
      expect(mail.text).toContain("a misplaced decimal");
    }, 90_000);
  },
);

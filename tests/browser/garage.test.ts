import { describe, expect, it } from "vitest";
import { DEMO_ACCOUNTS } from "@/seeders/demo/accounts";
import { shot, useChromium } from "@/tests/support/browser";

// The garage on a 390×844 phone (issue 13, item 5): the demo contributor's seeded garage shows
// (item 9); "Calibrate this board" (/garage?board=…) starts the new-quad form on that board; a quad,
// a pack and a charge are edited and deleted, each delete asking first; a quad behind a published
// worksheet offers Archive instead; a charge above 150 % of rated shows a warning and needs "Yes,
// this is right". Screenshots go to tests/artifacts/.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;

describe.skipIf(!appUrl)("garage edit and delete in Chromium at 390×844", () => {
  const chrome = useChromium();

  it("edits and deletes a quad, a pack and a charge, asking before each delete", async () => {
    const { boards } = (await (await fetch(new URL("/api/v1/boards?pageSize=1", appUrl))).json()) as { boards: { slug: string; name: string }[] };
    const board = boards[0];
    const context = await chrome.browser.newContext({ baseURL: appUrl, viewport: { width: 390, height: 844 }, isMobile: true, hasTouch: true });
    const page = await context.newPage();
    const target = `/garage?board=${board.slug}`;
    await page.goto(`/signin?next=${encodeURIComponent(target)}`);
    const passwordForm = page.getByRole("region", { name: "With your password" });
    await passwordForm.getByLabel("E-mail address").fill(DEMO_ACCOUNTS.contributor.email);
    await passwordForm.getByLabel("Password").fill(DEMO_ACCOUNTS.contributor.password);
    await Promise.all([page.waitForURL(/\/garage\?board=/), passwordForm.getByRole("button", { name: "Sign in" }).click()]);

    // the seeded garage: two quads as cards with an Open link and the board's starting values
    const quadList = page.getByTestId("quad-list");
    expect(await quadList.getByRole("link", { name: /^Open / }).count()).toBeGreaterThanOrEqual(2);
    expect(await quadList.getByText(/published|from the parts list/).count()).toBeGreaterThan(0);
    expect(await page.getByTestId("pack-list").locator("article").count()).toBeGreaterThanOrEqual(3);
    // a quad behind a published worksheet is archived, not deleted: its delete says so and asks first
    const archivable = quadList.locator("article").filter({ has: page.getByRole("button", { name: "Archive" }) });
    await archivable.first().getByRole("button", { name: "Archive" }).click();
    expect(
      await archivable
        .first()
        .getByText(/archived instead/)
        .isVisible(),
    ).toBe(true);
    await archivable.first().getByRole("button", { name: "No, keep it" }).click();

    // the board from ?board= is already chosen in the new-quad form
    const quadForm = page.getByTestId("quad-form");
    expect(await quadForm.getByText(board.name, { exact: true }).isVisible()).toBe(true);
    const name = `Phone quad ${Date.now()}`;
    await quadForm.getByLabel("Name").fill(name);
    const revision = quadForm.getByLabel("Revision", { exact: true });
    if (await revision.locator("option", { hasText: "Choose the revision" }).count()) await revision.selectOption({ index: 1 });
    await quadForm.getByRole("button", { name: "Save quad" }).click();
    const card = quadList.locator("article").filter({ has: page.getByRole("link", { name, exact: true }) });
    await card.waitFor();
    expect(await card.getByText(board.name, { exact: false }).isVisible()).toBe(true);
    await shot(page, "garage-cards-phone");

    // edit: the form opens in the card with the quad's values, and saving renames it
    await card.getByRole("button", { name: "Edit" }).click();
    const edit = card.locator("form");
    expect(await edit.getByLabel("Name").inputValue()).toBe(name);
    await edit.getByLabel("Name").fill(`${name} renamed`);
    await edit.getByRole("button", { name: "Save changes" }).click();
    const renamed = quadList.locator("article").filter({ has: page.getByRole("link", { name: `${name} renamed`, exact: true }) });
    await renamed.waitFor();

    // delete asks first; "No, keep it" keeps it; "Yes, delete" removes it
    await renamed.getByRole("button", { name: "Delete" }).click();
    await renamed.getByRole("button", { name: "No, keep it" }).click();
    expect(await renamed.isVisible()).toBe(true);
    await renamed.getByRole("button", { name: "Delete" }).click();
    await shot(page, "garage-delete-confirm-phone");
    await renamed.getByRole("button", { name: "Yes, delete" }).click();
    await renamed.waitFor({ state: "detached" });

    // a pack, then a charge far above its rated capacity: warned, refused until confirmed
    const packForm = page.getByTestId("pack-form");
    const label = `Phone pack ${Date.now() % 100000}`;
    await packForm.getByLabel("Label").fill(label);
    await packForm.getByLabel("Cells (S)").fill("4");
    await packForm.getByLabel("Rated mAh").fill("1300");
    await packForm.getByRole("button", { name: "Save pack" }).click();
    const pack = page
      .getByTestId("pack-list")
      .locator("article")
      .filter({ has: page.getByRole("heading", { name: label }) });
    await pack.waitFor();
    const chargeForm = pack.locator("form").filter({ has: page.getByRole("button", { name: "Log charge" }) });
    await chargeForm.getByLabel("mAh put in").fill("99999");
    await chargeForm
      .getByText(/more than 150 % of this pack's rated 1300 mAh/)
      .first()
      .waitFor();
    await chargeForm.getByRole("button", { name: "Log charge" }).click();
    await chargeForm.getByText(/tick "Yes, this is right" to keep it/).waitFor();
    await chargeForm.getByLabel("mAh put in").fill("1200");
    expect(await chargeForm.getByLabel("Yes, this is right").count()).toBe(0);
    await chargeForm.getByRole("button", { name: "Log charge" }).click();
    const charge = pack.locator("li[data-testid^='charge-']").first();
    await charge.getByText(/^1,?200 mAh$/).waitFor();

    // correct the charge, then delete it (asked first)
    await charge.getByRole("button", { name: "Edit" }).click();
    await charge.getByLabel("mAh put in").fill("1250");
    await charge.getByRole("button", { name: "Save changes" }).click();
    await charge.getByText(/^1,?250 mAh$/).waitFor();
    await charge.getByRole("button", { name: "Delete" }).click();
    await charge.getByRole("button", { name: "Yes, delete" }).click();
    await pack.getByText(/^1,?250 mAh$/).waitFor({ state: "detached" });

    // edit the pack's label, then delete the pack
    await pack.getByRole("button", { name: "Edit pack" }).click();
    await pack.locator("form").first().getByLabel("Label").fill(`${label} B`);
    await pack.getByRole("button", { name: "Save changes" }).click();
    const relabelled = page
      .getByTestId("pack-list")
      .locator("article")
      .filter({ has: page.getByRole("heading", { name: `${label} B` }) });
    await relabelled.waitFor();
    await relabelled.getByRole("button", { name: "Delete" }).click();
    await relabelled.getByRole("button", { name: "Yes, delete" }).click();
    await relabelled.waitFor({ state: "detached" });

    // nothing on the page scrolls sideways on the phone
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await shot(page, "garage-phone-after");
    await context.close();
  }, 180_000);
});

import { describe, expect, it } from "vitest";
import { DEMO_LANDMARKS, buildDemoScenario } from "@/seeders/demo/scenario";
import { shot, usePhoneAndDesktop } from "@/tests/support/browser";

// The first pages in a real browser against the production build that `npm test` serves on a
// seeded database (SHUNTBOOK_TEST_APP_URL). Screenshots go to tests/artifacts/ (git-ignored) so a
// person can look at the phone and desktop layouts after a run.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;

const scenario = buildDemoScenario();
const aliasLandmark = DEMO_LANDMARKS.distinctiveAliases[1]; // "Sluicebox": nothing like the board's own name
const aliasBoard = scenario.boardModels.find((b) => b.slug === aliasLandmark.boardSlug)!;

describe.skipIf(!appUrl)("smoke: Shuntbook's first pages in Chromium", () => {
  const browsers = usePhoneAndDesktop(appUrl);

  it("home page: the name, the search box and the catalogue counts", async () => {
    const page = await browsers.phone.newPage();
    const res = await page.goto("/");
    expect(res?.status()).toBe(200);
    await expect(page.title()).resolves.toMatch(/Shuntbook/);
    expect(await page.getByRole("link", { name: "Shuntbook" }).isVisible()).toBe(true);
    expect(await page.getByRole("searchbox", { name: "Find your board" }).isVisible()).toBe(true);
    expect(await page.getByText("Approved values", { exact: true }).isVisible()).toBe(true);
    await shot(page, "home-phone-light");
    await page.close();
  });

  it("search from the home page finds a board by its alias, with the query kept in the URL", async () => {
    const page = await browsers.phone.newPage();
    await page.goto("/");
    await page.getByRole("searchbox", { name: "Find your board" }).fill(aliasLandmark.alias);
    await Promise.all([page.waitForURL(/\/boards\?q=/), page.getByRole("button", { name: "Search" }).click()]);
    expect(new URL(page.url()).searchParams.get("q")).toBe(aliasLandmark.alias);
    const result = page.getByRole("link", { name: aliasBoard.name, exact: true });
    expect(await result.isVisible()).toBe(true);
    await shot(page, "search-phone-light");

    // and on to the board page
    await Promise.all([page.waitForURL(new RegExp(`/boards/${aliasBoard.slug}$`)), result.click()]);
    expect(await page.getByRole("heading", { level: 1 }).innerText()).toMatch(new RegExp(aliasBoard.name, "i"));
    expect(await page.getByRole("heading", { name: "Before you trust a number" }).isVisible()).toBe(true);
    expect(await page.getByText("Revisions and sensor hardware").isVisible()).toBe(true);
    await shot(page, "board-phone-light");
    await page.close();
  });

  it("board page on a desktop in dark mode shows each revision's hardware", async () => {
    const page = await browsers.desktop.newPage();
    const { boardSlug } = DEMO_LANDMARKS.hardwareChange;
    const res = await page.goto(`/boards/${boardSlug}`);
    expect(res?.status()).toBe(200);
    expect(await page.getByRole("heading", { level: 3, name: /^Revision / }).count()).toBe(
      scenario.boardRevisions.filter((r) => r.boardSlug === boardSlug).length,
    );
    // 0.6 mΩ × 45 = 27 mV/A (Ohm's law: sensitivity = R_shunt × gain), computed by lib/calibration/units.ts
    expect(await page.getByText("27 mV/A").first().isVisible()).toBe(true);
    await shot(page, "board-desktop-dark");
    await page.close();
  });

  it("catalogue on a desktop: filters by kind through the URL", async () => {
    const page = await browsers.desktop.newPage();
    await page.goto("/boards");
    await page.getByLabel("Kind").selectOption("pdb");
    await Promise.all([page.waitForURL(/kind=pdb/), page.getByRole("button", { name: "Show boards" }).click()]);
    const expected = scenario.boardModels.filter((b) => b.kind === "pdb").length;
    expect(await page.locator("tbody tr").count()).toBe(Math.min(expected, 20));
    await shot(page, "boards-desktop-dark");
    await page.close();
  });

  it("an unknown board slug gets the designed 404 page", async () => {
    const page = await browsers.phone.newPage();
    const res = await page.goto("/boards/no-such-board-here");
    expect(res?.status()).toBe(404);
    await page.getByRole("heading", { name: "Nothing on the bench here" }).waitFor();
    expect(await page.getByRole("searchbox", { name: "Find your board" }).isVisible()).toBe(true);
    await shot(page, "not-found-phone-light");
    await page.close();
  });

  it("malformed catalogue parameters get a page naming each bad field, never a 500", async () => {
    const page = await browsers.phone.newPage();
    const res = await page.goto(`/boards?page=abc&kind=bogus&sort=xyz&q=${"x".repeat(101)}`);
    // a page cannot set its status in the App Router; what matters is a friendly page, never a 500
    // (a proxy.ts rewrite to the same URL loops under `next start -H 127.0.0.1`, so there is none)
    expect(res?.status()).toBe(200);
    const alert = page.getByRole("alert");
    for (const field of ["page", "kind", "sort", "q"]) {
      expect(
        await alert
          .getByRole("term")
          .filter({ hasText: new RegExp(`^${field}$`) })
          .count(),
      ).toBe(1);
    }
    await shot(page, "bad-params-phone-light");
    await page.close();
  });

  it("keyboard: the skip link is the first stop and moves focus to the content", async () => {
    const page = await browsers.desktop.newPage();
    await page.goto("/boards");
    await page.keyboard.press("Tab");
    expect(await page.evaluate(() => document.activeElement?.textContent)).toBe("Skip to content");
    await page.keyboard.press("Enter");
    expect(await page.evaluate(() => document.activeElement?.id)).toBe("main");
    await page.close();
  });
});

import path from "node:path";
import type { Page } from "playwright-core";
import { describe, expect, it } from "vitest";
import { DEMO_LANDMARKS } from "@/seeders/demo/scenario";
import type { BoardValues, QuantityKey } from "@/lib/published/board-values-types";
import { METHOD_LABELS } from "@/lib/vocabulary";
import { ARTIFACTS_DIR, shot, usePhoneAndDesktop } from "@/tests/support/browser";

// The board page's published starting values in a real browser, against the app `npm test` serves
// on the seeded demo (SHUNTBOOK_TEST_APP_URL). The figures on screen are checked against what the
// public API returns for the same view, so the page and GET /api/v1/boards/{slug}/values agree.
// Screenshots go to tests/artifacts/ for a human look at phone and desktop, light and dark.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;

// Tinsel 25 AIO: v2 halved the shunt, so v1's current scale is wrong for v2
const { boardSlug, before, after } = DEMO_LANDMARKS.hardwareChange;
const KEYS: QuantityKey[] = ["voltageScale", "currentScale", "currentOffset"];
const METHOD_RE = new RegExp(
  Object.values(METHOD_LABELS)
    .map((l) => l.replace(/[()]/g, "\\$&"))
    .join("|"),
);
const DATE_RE = /\b\d{1,2} [A-Z][a-z]{2} \d{4}\b/;

async function apiGroup(revision: string, family: string) {
  const res = await fetch(`${appUrl}/api/v1/boards/${boardSlug}/values?revision=${encodeURIComponent(revision)}&family=${family}`);
  expect(res.status).toBe(200);
  const body = (await res.json()) as BoardValues;
  return body.revisions[0].families[0];
}

/** The three settings the page shows, by quantity. */
async function shownSettings(page: Page): Promise<Record<QuantityKey, string>> {
  const out = {} as Record<QuantityKey, string>;
  for (const k of KEYS) out[k] = (await page.getByTestId(`setting-${k}`).innerText()).trim();
  return out;
}

async function waitForView(page: Page, revision: string, family: string) {
  await page.locator(`[data-testid="values-view"][data-shown="${revision}|${family}"][aria-busy="false"]`).waitFor();
}

describe.skipIf(!appUrl)("board page: published starting values", () => {
  const browsers = usePhoneAndDesktop(appUrl);

  it("phone: shows the recommended values, switches revision and family in place, taps a dot for its method and date", async () => {
    const page = await browsers.phone.newPage();
    const res = await page.goto(`/boards/${boardSlug}?revision=${before}&family=vornel`);
    expect(res?.status()).toBe(200);
    await waitForView(page, before, "vornel");

    // the big numbers are the API's recommended settings, with label and n
    const v1 = await apiGroup(before, "vornel");
    const v1Shown = await shownSettings(page);
    for (const k of KEYS) expect(v1Shown[k]).toBe(String(v1[k]!.recommended.setting));
    const currentCard = page.locator('article[data-quantity="currentScale"]');
    expect(await currentCard.innerText()).toContain(v1.currentScale!.confidence.title.toUpperCase());
    expect(await currentCard.innerText()).toContain(v1.currentScale!.confidence.explanation);
    expect(await currentCard.innerText()).toMatch(new RegExp(`n\\s*=\\s*${v1.currentScale!.n}`));
    expect(await currentCard.innerText()).toMatch(/mV per amp/);
    // the safety box sits with the numbers
    expect(await page.getByRole("heading", { name: "Before you trust a number" }).isVisible()).toBe(true);

    // a marker on window survives only if the page is never reloaded
    await page.evaluate(() => ((window as unknown as { __valuesMarker: string }).__valuesMarker = "still here"));

    await page.getByLabel("Revision", { exact: true }).selectOption(after);
    await waitForView(page, after, "vornel");
    const v2 = await apiGroup(after, "vornel");
    const v2Shown = await shownSettings(page);
    for (const k of KEYS) expect(v2Shown[k]).toBe(String(v2[k]!.recommended.setting));
    // the halved shunt shows in the numbers and in the plain-words note
    expect(Number(v2Shown.currentScale)).toBeLessThan(Number(v1Shown.currentScale) * 0.6);
    expect(await page.getByText(`${after} reads about half the current of ${before} at the same current scale`).isVisible()).toBe(true);
    expect(new URL(page.url()).searchParams.get("revision")).toBe(after);

    await page.getByLabel("Firmware family", { exact: true }).selectOption("skelmar");
    await waitForView(page, after, "skelmar");
    const skelmar = await apiGroup(after, "skelmar");
    const skShown = await shownSettings(page);
    for (const k of KEYS) expect(skShown[k]).toBe(String(skelmar[k]!.recommended.setting));
    expect(skShown.voltageScale).not.toBe(v2Shown.voltageScale);
    const url = new URL(page.url());
    expect([url.searchParams.get("revision"), url.searchParams.get("family")]).toEqual([after, "skelmar"]);

    expect(await page.evaluate(() => (window as unknown as { __valuesMarker?: string }).__valuesMarker)).toBe("still here");
    expect(await page.evaluate(() => performance.getEntriesByType("navigation").length)).toBe(1);

    // each chart has a name and a text summary; nothing prints as NaN or undefined
    const chart = page.getByRole("img", { name: "Current scale: every approved value" });
    expect(await chart.count()).toBe(1);
    const caption = await page.locator('figure[data-quantity="currentScale"] figcaption').innerText();
    expect(caption).toContain(`${skelmar.currentScale!.n} approved values`);
    expect(caption).toMatch(/Median/);
    expect(await page.locator("#values").innerText()).not.toMatch(/NaN|undefined|Infinity/);

    // tap a dot: the tooltip names its method and date
    const dot = page.locator('[data-testid="chart-currentScale"] .recharts-scatter-symbol').first();
    await dot.scrollIntoViewIfNeeded();
    await dot.tap();
    const tooltip = page.getByTestId("value-tooltip");
    await tooltip.waitFor();
    expect(await tooltip.innerText()).toMatch(METHOD_RE);
    expect(await tooltip.innerText()).toMatch(DATE_RE);
    await page.getByTestId("chart-currentScale").screenshot({ path: path.join(ARTIFACTS_DIR, "board-values-tooltip-phone-light.png") });

    // and the address is shareable: a fresh load opens the same view
    const shared = await browsers.phone.newPage();
    await shared.goto(page.url());
    await waitForView(shared, after, "skelmar");
    expect(await shownSettings(shared)).toEqual(skShown);
    await shared.close();

    await page.evaluate(() => window.scrollTo(0, 0));
    await shot(page, "board-values-phone-light");
    await page.close();
  });

  it("desktop, dark: hovering a dot shows its method and date, outliers are crosses", async () => {
    const page = await browsers.desktop.newPage();
    await page.goto(`/boards/${boardSlug}?revision=${before}&family=vornel`);
    await waitForView(page, before, "vornel");
    const dot = page.locator('[data-testid="chart-voltageScale"] .recharts-scatter-symbol').first();
    await dot.hover();
    const tooltip = page.getByTestId("value-tooltip");
    await tooltip.waitFor();
    expect(await tooltip.innerText()).toMatch(METHOD_RE);
    expect(await tooltip.innerText()).toMatch(DATE_RE);

    const res = await fetch(`${appUrl}/api/v1/boards/${boardSlug}/values?revision=${before}&family=vornel&points=1`);
    const group = ((await res.json()) as BoardValues).revisions[0].families[0];
    let outliers = 0;
    for (const k of KEYS) {
      const points = group[k]!.points!;
      // every approved value is drawn, the flagged ones as crosses (shape and colour)
      const chart = page.getByTestId(`chart-${k}`);
      expect(await chart.locator("[data-mark]").count()).toBe(points.length);
      expect(await chart.locator('[data-mark="outlier"]').count()).toBe(points.filter((p) => p.outlier).length);
      outliers += points.filter((p) => p.outlier).length;
    }
    // the demo's v1 under this family has flagged values, so the cross is really exercised
    expect(outliers).toBeGreaterThan(0);
    expect(await page.getByText("Flagged outlier", { exact: true }).first().isVisible()).toBe(true);
    await shot(page, "board-values-desktop-dark");
    await page.close();
  });

  it("phone, first screen: the voltage and current settings with their confidence, and why this revision and family", async () => {
    const page = await browsers.phone.newPage();
    await page.goto(`/boards/${boardSlug}`);
    await page.locator('[data-testid="values-view"][aria-busy="false"]').waitFor();
    const fold = page.viewportSize()!.height;
    for (const k of ["voltageScale", "currentScale"] as const) {
      const box = await page.getByTestId(`setting-${k}`).boundingBox();
      expect(box, k).not.toBeNull();
      expect(box!.y + box!.height, `${k} ends above the fold`).toBeLessThanOrEqual(fold);
      const badge = await page.locator(`article[data-quantity="${k}"] [data-testid="confidence"]`).boundingBox();
      expect(badge!.y + badge!.height, `${k} confidence above the fold`).toBeLessThanOrEqual(fold);
    }
    // it says the builder did not pick this view, and why it was picked
    expect(await page.getByTestId("chosen-because").innerText()).toMatch(/newest revision with values/);
    await shot(page, "board-first-screen-phone-light");
    await page.close();
  });

  it("a revision with no values, and one with too few to judge, say so in words", async () => {
    const page = await browsers.phone.newPage();
    const none = DEMO_LANDMARKS.sparseRevisions.none[0];
    await page.goto(`/boards/${none.boardSlug}?revision=${encodeURIComponent(none.label)}`);
    await page.getByText("No published values yet for this revision and firmware family").waitFor();
    // the empty state invites a contribution on the contribution form, opened on this board
    expect(await page.getByRole("link", { name: "be the first to send yours" }).getAttribute("href")).toBe(`/submit?board=${none.boardSlug}`);
    // every board page offers both ways to add to its values
    expect(await page.getByRole("link", { name: "Send your values" }).getAttribute("href")).toBe(`/submit?board=${none.boardSlug}`);
    expect(await page.getByRole("link", { name: "Calibrate this board" }).getAttribute("href")).toBe(`/garage?board=${none.boardSlug}`);
    expect(await page.locator("#values").innerText()).not.toMatch(/NaN|undefined/);
    await shot(page, "board-values-empty-phone-light");

    const two = DEMO_LANDMARKS.sparseRevisions.two[0];
    await page.goto(`/boards/${two.boardSlug}?revision=${encodeURIComponent(two.label)}`);
    await page.locator('[data-testid="values-view"][aria-busy="false"]').waitFor();
    const text = await page.locator("#values").innerText();
    expect(text).toMatch(/TOO FEW TO JUDGE/);
    expect(text).toMatch(/No 95 % range yet/);
    expect(text).not.toMatch(/NaN|undefined/);
    await shot(page, "board-values-too-few-phone-light");
    await page.close();
  });
});

import { mkdirSync } from "node:fs";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type LaunchOptions, type Page } from "playwright-core";
import { afterAll, beforeAll } from "vitest";

// One place for how every browser test starts Debian's Chromium (never a downloaded browser):
// headless, no sandbox (CI runs as root), and none of the background traffic that this closed
// network refuses. Playwright makes its own empty profile.
export const CHROMIUM_LAUNCH: LaunchOptions = {
  executablePath: "/usr/bin/chromium",
  headless: true,
  args: [
    "--no-sandbox",
    "--disable-gpu",
    "--disable-quic",
    "--disable-background-networking",
    "--disable-component-update",
    "--disable-sync",
    "--no-first-run",
  ],
};

/** Screenshots land here; git ignores the folder. */
export const ARTIFACTS_DIR = path.resolve(__dirname, "../artifacts");

/** A full-page screenshot named for what it shows, in ARTIFACTS_DIR. */
export const shot = (page: Page, name: string) => page.screenshot({ path: path.join(ARTIFACTS_DIR, `${name}.png`), fullPage: true });

/**
 * For the describe block it is called in: one Chromium with a phone (light colours, touch) and a
 * desktop (dark colours) context on the app, closed after the block.
 */
export function usePhoneAndDesktop(appUrl: string | undefined): { phone: BrowserContext; desktop: BrowserContext } {
  let browser: Browser | undefined;
  const contexts = {} as { phone: BrowserContext; desktop: BrowserContext };
  beforeAll(async () => {
    mkdirSync(ARTIFACTS_DIR, { recursive: true });
    browser = await chromium.launch(CHROMIUM_LAUNCH);
    contexts.phone = await browser.newContext({ baseURL: appUrl, viewport: { width: 390, height: 844 }, colorScheme: "light", isMobile: true, hasTouch: true });
    contexts.desktop = await browser.newContext({ baseURL: appUrl, viewport: { width: 1280, height: 800 }, colorScheme: "dark" });
  });
  afterAll(async () => {
    await browser?.close();
  });
  return contexts;
}

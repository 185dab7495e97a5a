import { mkdirSync } from "node:fs";
import path from "node:path";
import { chromium, type Browser, type BrowserContext, type LaunchOptions, type Page } from "playwright-core";
import { afterAll, beforeAll } from "vitest";

// One place for how every browser test starts Debian's Chromium (never a downloaded browser):
// headless, no sandbox (CI runs as root), and none of the background traffic that this closed
// network refuses. Playwright makes its own empty profile.
const CHROMIUM_LAUNCH: LaunchOptions = {
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

/** For the describe block it is called in: one Chromium, launched before the block and closed after it. */
export function useChromium(): { browser: Browser } {
  const holder = {} as { browser: Browser };
  beforeAll(async () => {
    mkdirSync(ARTIFACTS_DIR, { recursive: true });
    holder.browser = await chromium.launch(CHROMIUM_LAUNCH);
  });
  afterAll(async () => {
    await holder.browser?.close();
  });
  return holder;
}

/** useChromium with a phone (light colours, touch) and a desktop (dark colours) context on the app. */
export function usePhoneAndDesktop(appUrl: string | undefined): { phone: BrowserContext; desktop: BrowserContext } {
  const chrome = useChromium();
  const contexts = {} as { phone: BrowserContext; desktop: BrowserContext };
  beforeAll(async () => {
    contexts.phone = await chrome.browser.newContext({
      baseURL: appUrl,
      viewport: { width: 390, height: 844 },
      colorScheme: "light",
      isMobile: true,
      hasTouch: true,
    });
    contexts.desktop = await chrome.browser.newContext({ baseURL: appUrl, viewport: { width: 1280, height: 800 }, colorScheme: "dark" });
  });
  return contexts;
}

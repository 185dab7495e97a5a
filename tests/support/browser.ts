import path from "node:path";
import type { LaunchOptions } from "playwright-core";

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

import type { Metadata, Viewport } from "next";
import { headers } from "next/headers";
import type { ReactNode } from "react";
import { Providers } from "@/components/providers";
import { SiteFooter } from "@/components/site-footer";
import { SiteHeader } from "@/components/site-header";
import { THEME_BOOT_SCRIPT } from "@/components/theme-switch";
import { bodyFont, displayFont, monoFont } from "./fonts";
import "./globals.css";

export const metadata: Metadata = {
  title: { default: "Shuntbook — voltage and current scales for FPV boards", template: "%s · Shuntbook" },
  description:
    "Community-measured voltage scale, current scale and current offset values for FPV flight controllers, AIO boards, ESCs and power modules, per board revision.",
  applicationName: "Shuntbook",
};

export const viewport: Viewport = {
  width: "device-width",
  initialScale: 1,
  themeColor: [
    { media: "(prefers-color-scheme: light)", color: "#f7f3ea" },
    { media: "(prefers-color-scheme: dark)", color: "#0c0f12" },
  ],
};

export default async function RootLayout({ children }: { children: ReactNode }) {
  // the per-request script nonce from proxy.ts (reading it also renders every page per request,
  // as nonces need: a page prerendered at build time would carry none)
  const nonce = (await headers()).get("x-nonce") ?? undefined;
  return (
    // data-theme is set before hydration by the boot script, hence suppressHydrationWarning
    <html lang="en" className={`${bodyFont.variable} ${displayFont.variable} ${monoFont.variable}`} suppressHydrationWarning>
      <head>
        <script nonce={nonce} dangerouslySetInnerHTML={{ __html: THEME_BOOT_SCRIPT }} />
      </head>
      <body className="flex min-h-dvh flex-col bg-paper font-body text-body text-ink">
        <a href="#main" className="sb-skip">
          Skip to content
        </a>
        <Providers>
          <SiteHeader />
          <main id="main" tabIndex={-1} className="mx-auto w-full max-w-page flex-1 px-4 pt-6 focus:outline-none sm:px-6 sm:pt-10">
            {children}
          </main>
          <SiteFooter />
        </Providers>
      </body>
    </html>
  );
}

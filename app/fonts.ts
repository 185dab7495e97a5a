import localFont from "next/font/local";

// Shipped with the app from the installed @fontsource packages (no font CDN at run time).
// Paths are relative to this file. Each family is exposed as a CSS variable that the Tailwind
// theme (tailwind.config.ts) and app/globals.css read.

/** Body text: drawn for low-vision legibility, so 1/l/I and 0/O stay distinct in glare. */
export const bodyFont = localFont({
  variable: "--font-body",
  display: "swap",
  src: [
    { path: "../node_modules/@fontsource/atkinson-hyperlegible-next/files/atkinson-hyperlegible-next-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../node_modules/@fontsource/atkinson-hyperlegible-next/files/atkinson-hyperlegible-next-latin-400-italic.woff2", weight: "400", style: "italic" },
    { path: "../node_modules/@fontsource/atkinson-hyperlegible-next/files/atkinson-hyperlegible-next-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
});

/** Headings and the wordmark: condensed, so long board names fit a phone's width. */
export const displayFont = localFont({
  variable: "--font-display",
  display: "swap",
  src: [
    { path: "../node_modules/@fontsource/barlow-condensed/files/barlow-condensed-latin-600-normal.woff2", weight: "600", style: "normal" },
    { path: "../node_modules/@fontsource/barlow-condensed/files/barlow-condensed-latin-700-normal.woff2", weight: "700", style: "normal" },
    { path: "../node_modules/@fontsource/barlow-condensed/files/barlow-condensed-latin-800-normal.woff2", weight: "800", style: "normal" },
  ],
});

/** Numbers and values: monospaced so columns of figures line up digit under digit. */
export const monoFont = localFont({
  variable: "--font-mono",
  display: "swap",
  src: [
    { path: "../node_modules/@fontsource/atkinson-hyperlegible-mono/files/atkinson-hyperlegible-mono-latin-400-normal.woff2", weight: "400", style: "normal" },
    { path: "../node_modules/@fontsource/atkinson-hyperlegible-mono/files/atkinson-hyperlegible-mono-latin-700-normal.woff2", weight: "700", style: "normal" },
  ],
});

import type { Config } from "tailwindcss";

// Shuntbook's look. Every colour is a CSS variable defined in app/globals.css with light-dark(),
// so one class works in both colour schemes and the theme switch only changes `color-scheme`.
// The palette is picked for reading on a phone in direct sunlight: near-black ink on warm paper,
// a dark copper accent (≥ 7:1 on paper, AAA), and a signal yellow reserved for focus and highlights.
const config: Config = {
  content: ["./app/**/*.{ts,tsx}", "./components/**/*.{ts,tsx}"],
  theme: {
    extend: {
      colors: {
        paper: "var(--sb-paper)",
        surface: "var(--sb-surface)",
        sunken: "var(--sb-sunken)",
        ink: "var(--sb-ink)",
        muted: "var(--sb-muted)",
        rule: "var(--sb-rule)",
        "rule-soft": "var(--sb-rule-soft)",
        copper: "var(--sb-copper)",
        "copper-strong": "var(--sb-copper-strong)",
        "on-copper": "var(--sb-on-copper)",
        signal: "var(--sb-signal)",
        "on-signal": "var(--sb-on-signal)",
        caution: "var(--sb-caution)",
        "caution-edge": "var(--sb-caution-edge)",
        fault: "var(--sb-fault)",
        "fault-wash": "var(--sb-fault-wash)",
        verdigris: "var(--sb-verdigris)",
      },
      fontFamily: {
        body: ["var(--font-body)", "system-ui", "sans-serif"],
        display: ["var(--font-display)", "var(--font-body)", "sans-serif"],
        mono: ["var(--font-mono)", "ui-monospace", "monospace"],
      },
      // Mobile-first type scale: the body is 1.0625rem (17 px) for outdoor reading; display sizes
      // grow with the viewport through clamp() so headings never wrap into a wall on a phone.
      fontSize: {
        small: ["0.9375rem", { lineHeight: "1.45" }],
        body: ["1.0625rem", { lineHeight: "1.55" }],
        lead: ["clamp(1.125rem, 1rem + 0.6vw, 1.375rem)", { lineHeight: "1.45" }],
        heading: ["clamp(1.5rem, 1.25rem + 1.2vw, 2rem)", { lineHeight: "1.05", letterSpacing: "0.01em" }],
        title: ["clamp(2.25rem, 1.6rem + 3.2vw, 3.5rem)", { lineHeight: "0.98", letterSpacing: "0.005em" }],
        display: ["clamp(2.75rem, 1.8rem + 5vw, 5rem)", { lineHeight: "0.92", letterSpacing: "0" }],
        readout: ["clamp(1.75rem, 1.2rem + 2.4vw, 2.75rem)", { lineHeight: "1" }],
      },
      borderWidth: { 3: "3px" },
      maxWidth: { page: "72rem" },
    },
  },
};

export default config;

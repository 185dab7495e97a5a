"use client";

import { useCallback, useSyncExternalStore } from "react";

// Out in the sun a phone set to dark mode is hard to read, so the visitor can pin the light (or
// dark) scheme for this site. The choice lives in localStorage and on <html data-theme>; the
// inline script from THEME_BOOT_SCRIPT applies it before first paint so there is no flash.
const THEME_STORAGE_KEY = "shuntbook-theme";
type Theme = "system" | "light" | "dark";
const ORDER: Theme[] = ["system", "light", "dark"];
const LABEL: Record<Theme, string> = { system: "Auto", light: "Light", dark: "Dark" };

export const THEME_BOOT_SCRIPT = `try{var t=localStorage.getItem(${JSON.stringify(THEME_STORAGE_KEY)});if(t==="light"||t==="dark")document.documentElement.dataset.theme=t}catch(e){}`;

const listeners = new Set<() => void>();
function subscribe(listener: () => void) {
  listeners.add(listener);
  return () => listeners.delete(listener);
}
function currentTheme(): Theme {
  const t = document.documentElement.dataset.theme;
  return t === "light" || t === "dark" ? t : "system";
}

export function ThemeSwitch() {
  const theme = useSyncExternalStore(subscribe, currentTheme, () => "system" as Theme);
  const next = ORDER[(ORDER.indexOf(theme) + 1) % ORDER.length];
  const cycle = useCallback(() => {
    const root = document.documentElement;
    if (next === "system") delete root.dataset.theme;
    else root.dataset.theme = next;
    try {
      if (next === "system") localStorage.removeItem(THEME_STORAGE_KEY);
      else localStorage.setItem(THEME_STORAGE_KEY, next);
    } catch {
      // private mode: the choice lasts for this page only
    }
    listeners.forEach((l) => l());
  }, [next]);

  return (
    <button
      type="button"
      onClick={cycle}
      className="inline-flex min-h-11 items-center gap-2 rounded-md border-2 border-rule px-3 font-display text-base font-semibold uppercase tracking-wide text-ink hover:bg-sunken"
      aria-label={`Colour theme: ${LABEL[theme]}. Switch to ${LABEL[next]}`}
    >
      <ThemeGlyph theme={theme} />
      <span aria-hidden="true" className="hidden sm:inline">
        {LABEL[theme]}
      </span>
    </button>
  );
}

function ThemeGlyph({ theme }: { theme: Theme }) {
  // a half-filled, empty or full disc: auto, light, dark
  return (
    <svg viewBox="0 0 20 20" width="18" height="18" aria-hidden="true" focusable="false">
      <circle cx="10" cy="10" r="8" fill={theme === "dark" ? "currentColor" : "none"} stroke="currentColor" strokeWidth="2.5" />
      {theme === "system" && <path d="M10 2 A8 8 0 0 1 10 18 Z" fill="currentColor" />}
    </svg>
  );
}

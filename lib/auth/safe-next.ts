// Where to send someone after sign-in. Only a path on this site is accepted (not "//host" or
// "/\\host", which browsers treat as another origin), so a crafted link cannot bounce a fresh
// session to someone else's page.
export function safeNextPath(value: unknown, fallback = "/profile"): string {
  if (typeof value !== "string" || value.length > 2000) return fallback;
  if (!value.startsWith("/") || value.startsWith("//") || value.startsWith("/\\")) return fallback;
  if (/[\u0000-\u001f]/.test(value)) return fallback;
  return value;
}

export function signInPath(nextPath: string): string {
  return `/signin?next=${encodeURIComponent(safeNextPath(nextPath, "/"))}`;
}

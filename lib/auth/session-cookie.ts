import { decode, encode, type JWT } from "next-auth/jwt";
import { env } from "@/lib/env";
import type { Role } from "@/lib/vocabulary";

// The session cookie next-auth issues (strategy "jwt"): an encrypted JWT (JWE, A256GCM) whose key
// is derived from NEXTAUTH_SECRET. The guard reads it itself instead of going through
// getServerSession, so that it needs no next-auth request object and the same code serves pages,
// server actions and route handlers (and tests can hand it a cookie signed by tests/support/auth.ts).

/** How long a session lasts (next-auth's maxAge); the cookie and the JWT expire together. */
export const SESSION_MAX_AGE_SECONDS = 30 * 24 * 60 * 60;

/** next-auth's rule: the __Secure- prefix (and the Secure flag) exactly when the site is served over https. */
function usesSecureCookies(): boolean {
  return env().NEXTAUTH_URL?.startsWith("https://") ?? false;
}

export function sessionCookieName(): string {
  return `${usesSecureCookies() ? "__Secure-" : ""}next-auth.session-token`;
}

export function authSecret(): string {
  const secret = env().NEXTAUTH_SECRET;
  if (!secret) throw new Error("NEXTAUTH_SECRET is not set: npm start and npm test set it; see lib/env.ts");
  return secret;
}

/**
 * The session token from a set of cookies. next-auth splits a token longer than a cookie may be
 * into `<name>.0`, `<name>.1`, …; those are joined back in order.
 */
export function sessionTokenFrom(cookies: ReadonlyMap<string, string>): string | undefined {
  const name = sessionCookieName();
  const whole = cookies.get(name);
  if (whole) return whole;
  const chunks = [...cookies.entries()]
    .filter(([key]) => key.startsWith(`${name}.`) && /^\d+$/.test(key.slice(name.length + 1)))
    .sort(([a], [b]) => Number(a.slice(name.length + 1)) - Number(b.slice(name.length + 1)));
  return chunks.length ? chunks.map(([, value]) => value).join("") : undefined;
}

/** A Cookie request header as a map (RFC 6265 §5.4 syntax; values are not decoded: JWTs need none). */
export function parseCookieHeader(header: string | null | undefined): Map<string, string> {
  const out = new Map<string, string>();
  for (const raw of (header ?? "").split(";")) {
    const part = raw.trim();
    const eq = part.indexOf("=");
    if (eq <= 0) continue;
    const key = part.slice(0, eq).trim();
    if (!out.has(key)) out.set(key, part.slice(eq + 1).trim());
  }
  return out;
}

/** The token's claims, or null when it is missing, forged, expired or made with another secret. */
export async function decodeSessionToken(token: string | undefined): Promise<JWT | null> {
  if (!token) return null;
  try {
    return await decode({ token, secret: authSecret() });
  } catch {
    return null; // a bad cookie is the same as no cookie: the caller is anonymous
  }
}

/** What Shuntbook puts into the session JWT besides next-auth's own name/email/sub. */
export type SessionClaims = {
  sub: string;
  email: string;
  name: string;
  /** A display hint only: the guard reads the role from the database. */
  role: Role;
  /** When this person signed in (epoch ms). Sessions from before their last password change stop working. */
  authTime: number;
  /** users.session_version at sign-in; the session ends when the user's moves on. */
  sessionVersion?: number;
  /** This session's id, made at sign-in; a sign-out lists it in ended_sessions. */
  sid?: string;
};

export async function encodeSessionToken(claims: SessionClaims, maxAgeSeconds = SESSION_MAX_AGE_SECONDS): Promise<string> {
  return encode({ token: { ...claims } satisfies JWT, secret: authSecret(), maxAge: maxAgeSeconds });
}

/**
 * The Set-Cookie value that deletes the session cookie. Over https it must carry Secure too: a
 * browser ignores a __Secure- cookie set (or cleared) without it.
 */
export function sessionClearCookie(): string {
  return sessionSetCookie("", 0);
}

/** A Set-Cookie value next-auth would accept as its own session cookie (same name and flags). */
export function sessionSetCookie(token: string, maxAgeSeconds = SESSION_MAX_AGE_SECONDS): string {
  const secure = usesSecureCookies() ? "; Secure" : "";
  return `${sessionCookieName()}=${token}; Path=/; HttpOnly; SameSite=Lax; Max-Age=${maxAgeSeconds}${secure}`;
}

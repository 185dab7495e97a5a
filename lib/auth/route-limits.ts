import { tooManyRequests } from "@/lib/http/respond";
import { clearAttempts, clientIp, limitKey, spendAttempt } from "./rate-limit";

// Rate limits in front of next-auth's own endpoints, which have no hook that sees the caller's
// address: a password attempt (POST /api/auth/callback/credentials) and a magic-link request
// (POST /api/auth/signin/email) each spend one "signIn" attempt for IP + e-mail. Over the limit,
// the request never reaches next-auth and gets a 429 in the API's error shape. A successful
// password sign-in clears the count.

type Guarded = { blocked: Response } | { blocked: null; afterwards: (response: Response) => Promise<void> };

const LIMITED = new Set(["callback/credentials", "signin/email"]);

async function emailOf(request: Request): Promise<string> {
  const type = request.headers.get("content-type") ?? "";
  try {
    if (type.includes("application/json")) return String(((await request.clone().json()) as { email?: unknown }).email ?? "");
    if (type.includes("application/x-www-form-urlencoded")) return new URLSearchParams(await request.clone().text()).get("email") ?? "";
  } catch {
    // an unreadable body is next-auth's to refuse
  }
  return "";
}

/** Whether a next-auth response means "signed in": it sends the browser on to anywhere but an error. */
async function succeeded(response: Response): Promise<boolean> {
  let target = response.headers.get("location");
  if (!target && response.headers.get("content-type")?.includes("application/json")) {
    target =
      (
        (await response
          .clone()
          .json()
          .catch(() => ({}))) as { url?: string }
      ).url ?? null;
  }
  return Boolean(target) && !/[?&]error=/.test(target!) && response.headers.get("set-cookie")?.includes("session-token") === true;
}

export async function limitAuthRequest(request: Request, segments: string[]): Promise<Guarded> {
  const route = segments.slice(0, 2).join("/");
  if (request.method !== "POST" || !LIMITED.has(route)) return { blocked: null, afterwards: async () => undefined };
  const key = limitKey(clientIp(request.headers), await emailOf(request));
  const verdict = await spendAttempt("signIn", key);
  if (!verdict.ok) return { blocked: tooManyRequests(verdict.message, verdict.retryAfterSeconds) };
  return {
    blocked: null,
    afterwards: async (response) => {
      if (route === "callback/credentials" && (await succeeded(response))) await clearAttempts("signIn", key);
    },
  };
}

import { tooManyRequests } from "@/lib/http/respond";
import { accountLocked, clearFailures, recordFailure } from "./account-lock";
import { clientAddress } from "./client-address";
import { clearAttempts, limitKey, spendAttempts } from "./rate-limit";

// Rate limits in front of next-auth's own endpoints, which have no hook that sees the caller's
// address. A password attempt (POST /api/auth/callback/credentials) and a sign-in-link request
// (POST /api/auth/signin/email) each spend one attempt for the address and one for address +
// e-mail; a password attempt is also refused while the account is locked (./account-lock.ts).
// Over a limit the request never reaches next-auth and gets a 429 in the API's error shape. A
// successful password sign-in clears its counts; a failed one counts against the account.
// The form was checked by ./next-auth-input.ts first: every field appears once, so the e-mail
// counted here is the one next-auth signs in.

type Guarded = { blocked: Response } | { blocked: null; afterwards: (response: Response) => Promise<void> };

const LIMITED = new Set(["callback/credentials", "signin/email"]);
const NOTHING: Guarded = { blocked: null, afterwards: async () => undefined };

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

export async function limitAuthRequest(request: Request, segments: string[], form: URLSearchParams | null): Promise<Guarded> {
  const route = segments.slice(0, 2).join("/");
  if (request.method !== "POST" || !LIMITED.has(route)) return NOTHING;
  const address = clientAddress(request.headers);
  const email = form?.get("email") ?? "";
  const key = limitKey(address, email);
  const verdict = await spendAttempts(["signInAddress", address], ["signIn", key]);
  if (!verdict.ok) return { blocked: tooManyRequests(verdict.message, verdict.retryAfterSeconds) };
  if (route !== "callback/credentials") return NOTHING;
  const locked = await accountLocked(email);
  if (!locked.ok) return { blocked: tooManyRequests(locked.message, locked.retryAfterSeconds) };
  return {
    blocked: null,
    afterwards: async (response) => {
      if (await succeeded(response)) await Promise.all([clearAttempts("signIn", key), clearFailures(email)]);
      else if (email) await recordFailure(email);
    },
  };
}

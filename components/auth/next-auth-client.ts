import { ApiFetchError, apiFetch, errorFromResponse, UNREACHABLE_MESSAGE } from "@/lib/client/api-fetch";

// Browser-side calls to next-auth's own endpoints (sign in by password or e-mailed link, sign out).
// next-auth's client (signIn from next-auth/react) is not used because it cannot see our 429
// answers: it expects every reply to be next-auth's { url }. These send the same form fields
// next-auth expects (CSRF token, json=true). Our own account endpoints go through apiFetch
// (components/hooks/use-account.ts); this is the one other place the browser posts.

const NEXT_AUTH_ERRORS: Record<string, string> = {
  CredentialsSignin: "That e-mail address and password do not match an account. Check both, or use a sign-in link instead.",
  EmailSignin: "The sign-in mail could not be sent just now. Try again in a minute.",
  Verification: "That sign-in link has expired or was already used. Ask for a new one below.",
  SessionRequired: "Sign in to see that page.",
  Default: "Signing in did not work. Try again.",
};

export function signInErrorMessage(code: string | null | undefined): string | null {
  if (!code) return null;
  return NEXT_AUTH_ERRORS[code] ?? NEXT_AUTH_ERRORS.Default;
}

async function csrfToken(): Promise<string> {
  return (await apiFetch<{ csrfToken: string }>("/api/auth/csrf")).csrfToken;
}

/**
 * POST to one of next-auth's endpoints ("callback/credentials", "signin/email", "signout") and
 * return the URL next-auth sends the browser on to. Throws ApiFetchError like apiFetch does: our
 * rate limiter's 429 with its message, next-auth's error code in words, status 0 when unreachable.
 */
export async function nextAuthPost(path: string, fields: Record<string, string>, callbackUrl: string): Promise<string> {
  let res: Response;
  try {
    const body = new URLSearchParams({ ...fields, csrfToken: await csrfToken(), callbackUrl, json: "true" });
    // a CSRF form post, not JSON: apiFetch only sends JSON bodies, so this is fetch's one other use
    res = await fetch(`/api/auth/${path}`, { method: "POST", headers: { "Content-Type": "application/x-www-form-urlencoded" }, body });
  } catch (error) {
    if (error instanceof ApiFetchError) throw error;
    throw new ApiFetchError(0, UNREACHABLE_MESSAGE);
  }
  if (res.status === 429) throw await errorFromResponse(res);
  const data = (await res.json().catch(() => ({}))) as { url?: string };
  if (!data.url) throw new ApiFetchError(res.status, NEXT_AUTH_ERRORS.Default);
  const error = new URL(data.url, window.location.href).searchParams.get("error");
  if (error) throw new ApiFetchError(res.status, signInErrorMessage(error)!);
  return data.url;
}

// Browser-side calls to the sign-in endpoints. next-auth's own client (signIn from
// next-auth/react) is not used because it cannot see our 429 answers: it expects every reply to
// be next-auth's { url }. These send the same form fields next-auth expects (CSRF token, json=true).

export type FieldErrors = Record<string, string[]>;
export type Outcome =
  | { ok: true; url: string; body?: unknown }
  | { ok: false; status: number; message: string; fieldErrors: FieldErrors };

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

async function errorOf(res: Response): Promise<Outcome & { ok: false }> {
  const body = (await res.json().catch(() => null)) as { error?: { message?: string; fieldErrors?: FieldErrors } } | null;
  return {
    ok: false,
    status: res.status,
    message: body?.error?.message ?? `The server answered ${res.status}. Try again in a moment.`,
    fieldErrors: body?.error?.fieldErrors ?? {},
  };
}

async function csrfToken(): Promise<string> {
  const res = await fetch("/api/auth/csrf", { cache: "no-store" });
  return ((await res.json()) as { csrfToken: string }).csrfToken;
}

/** POST to one of next-auth's endpoints ("callback/credentials", "signin/email", "signout"). */
export async function nextAuthPost(path: string, fields: Record<string, string>, callbackUrl: string): Promise<Outcome> {
  try {
    const body = new URLSearchParams({ ...fields, csrfToken: await csrfToken(), callbackUrl, json: "true" });
    const res = await fetch(`/api/auth/${path}`, {
      method: "POST",
      headers: { "Content-Type": "application/x-www-form-urlencoded" },
      body,
    });
    if (res.status === 429) return errorOf(res);
    const data = (await res.json().catch(() => ({}))) as { url?: string };
    if (!data.url) return { ok: false, status: res.status, message: NEXT_AUTH_ERRORS.Default, fieldErrors: {} };
    const error = new URL(data.url, window.location.href).searchParams.get("error");
    if (error) return { ok: false, status: res.status, message: signInErrorMessage(error)!, fieldErrors: {} };
    return { ok: true, url: data.url };
  } catch {
    return { ok: false, status: 0, message: "The server could not be reached. Check the connection and try again.", fieldErrors: {} };
  }
}

/** JSON to one of our account endpoints; the API's error body comes back as field errors. */
export async function accountRequest(path: string, method: "POST" | "PATCH", payload: unknown): Promise<Outcome> {
  try {
    const res = await fetch(path, { method, headers: { "Content-Type": "application/json" }, body: JSON.stringify(payload) });
    if (!res.ok) return errorOf(res);
    return { ok: true, url: "", body: await res.json().catch(() => null) };
  } catch {
    return { ok: false, status: 0, message: "The server could not be reached. Check the connection and try again.", fieldErrors: {} };
  }
}

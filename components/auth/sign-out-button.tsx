"use client";

import { useState } from "react";
import { asApiFetchError } from "@/components/form-errors";
import { nextAuthPost } from "./next-auth-client";

/** Ends the session (next-auth's sign-out POST, with its CSRF token) and reloads at the front page. */
export function SignOutButton({ className = "sb-button" }: { className?: string }) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <div className="space-y-3">
      <button
        type="button"
        className={className}
        disabled={busy}
        onClick={async () => {
          setBusy(true);
          try {
            await nextAuthPost("signout", {}, new URL("/", window.location.origin).toString());
          } catch (error) {
            setBusy(false);
            return setProblem(asApiFetchError(error).message);
          }
          // a whole new document, not router.push: the header, the server components and the query
          // cache all hold the signed-out user's data, and a fresh load is the one way to drop them all
          // eslint-disable-next-line @next/next/no-location-assign-relative-destination
          window.location.assign("/");
        }}
      >
        {busy ? "Signing out…" : "Sign out"}
      </button>
      {problem && (
        <p role="alert" className="font-semibold text-fault">
          {problem}
        </p>
      )}
    </div>
  );
}

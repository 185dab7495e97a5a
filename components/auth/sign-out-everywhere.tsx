"use client";

import { useState } from "react";
import { asApiFetchError } from "@/components/form-errors";
import { useSignOutEverywhere } from "@/components/hooks/use-account";
import { FormMessage } from "./fields";

/** Ends every session of the account, on every device, then reloads at the front page signed out. */
export function SignOutEverywhere() {
  const signOut = useSignOutEverywhere();
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <div className="space-y-3">
      <p className="text-small text-muted">
        Lost a phone, or signed in on a shared computer? This signs your account out on every device at once, this one too. Signing out the usual way ends only
        the session on the device you use.
      </p>
      {problem && <FormMessage tone="fault">{problem}</FormMessage>}
      <button
        type="button"
        className="sb-button"
        disabled={signOut.isPending}
        onClick={async () => {
          setProblem(null);
          try {
            await signOut.mutateAsync();
          } catch (error) {
            return setProblem(asApiFetchError(error).message);
          }
          // a whole new document: the header and the query cache still hold the signed-in user
          // eslint-disable-next-line @next/next/no-location-assign-relative-destination
          window.location.assign("/");
        }}
      >
        {signOut.isPending ? "Signing out everywhere…" : "Sign out everywhere"}
      </button>
    </div>
  );
}

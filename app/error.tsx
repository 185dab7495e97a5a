"use client";

import Link from "next/link";
import { useEffect } from "react";

// Anything that fails while rendering a page lands here instead of a bare 500 screen. The
// message stays general (no stack, no SQL) and offers a retry, since most causes are transient.
export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  useEffect(() => {
    console.error(error);
  }, [error]);

  return (
    <div className="max-w-2xl space-y-6">
      <p className="font-mono text-lg font-bold text-fault">Error</p>
      <h1 className="font-display text-title uppercase">Something tripped on our side</h1>
      <p className="text-lead">
        This page could not be shown just now. It is not something you did. Try again in a moment; if it keeps happening, the catalogue may be down for
        maintenance.
      </p>
      {error.digest && (
        <p className="text-small text-muted">
          Reference for a bug report: <code className="font-mono">{error.digest}</code>
        </p>
      )}
      <div className="flex flex-wrap gap-3">
        <button type="button" onClick={() => reset()} className="sb-button">
          Try again
        </button>
        <Link href="/" className="sb-button sb-button-quiet">
          Front page
        </Link>
      </div>
    </div>
  );
}

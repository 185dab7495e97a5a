"use client";

import { useRouter } from "next/navigation";
import { useState } from "react";
import { useGarageDelete } from "@/components/hooks/use-garage";

// Delete for a garage row, in two steps: the button asks, saying what goes with the row (or that the
// row is archived instead, when a published worksheet used it), and only "Yes" sends the DELETE.

export function ConfirmDelete({
  endpoint,
  name,
  consequence,
  archives = false,
  testId,
}: {
  endpoint: string;
  /** What is deleted, as the question names it: "the quad “Field five”". */
  name: string;
  /** What goes with it, in one sentence. */
  consequence: string;
  /** True when the server will archive rather than delete (a published worksheet used the row). */
  archives?: boolean;
  testId?: string;
}) {
  const router = useRouter();
  const [asking, setAsking] = useState(false);
  const remove = useGarageDelete(endpoint);
  const verb = archives ? "Archive" : "Delete";

  if (!asking) {
    return (
      <button type="button" className="sb-button sb-button-quiet" onClick={() => setAsking(true)} data-testid={testId}>
        {verb}
      </button>
    );
  }
  return (
    <div
      role="group"
      aria-label={`${verb} ${name}?`}
      className="w-full space-y-2 rounded-md border-2 border-fault bg-fault-wash p-3"
      data-testid={testId && `${testId}-confirm`}
    >
      <p className="font-semibold">
        {verb} {name}?
      </p>
      <p className="text-small">{consequence}</p>
      {remove.error && (
        <p role="alert" className="font-semibold text-fault">
          ⚠ {remove.error.message}
        </p>
      )}
      <div className="flex flex-wrap gap-2">
        <button type="button" className="sb-button" disabled={remove.isPending} onClick={() => remove.mutate(undefined, { onSuccess: () => router.refresh() })}>
          {remove.isPending ? "Working…" : `Yes, ${verb.toLowerCase()}`}
        </button>
        <button type="button" className="sb-button sb-button-quiet" disabled={remove.isPending} onClick={() => setAsking(false)}>
          No, keep it
        </button>
      </div>
    </div>
  );
}

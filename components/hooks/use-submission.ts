"use client";

import { useMutation } from "@tanstack/react-query";
import { apiFetch } from "@/lib/client/api-fetch";
import type { SubmissionInput } from "@/lib/submissions/schema";

// Sending a contribution: POST /api/v1/submissions for a new one, with an Idempotency-Key that
// lives as long as the draft (so a retry after a dropped connection can never create a second),
// or PATCH /api/v1/submissions/{id} with the version the edit started from.

export type SendTarget = { kind: "create"; idempotencyKey: string } | { kind: "edit"; id: number; version: number };

/** Said when the form could not reach the server: nothing was sent, and sending again is safe. */
const NOT_SENT_UNREACHABLE =
  "It was not sent: Shuntbook could not be reached. Check your connection and send again; sending twice is safe, it will not make two.";

const fallbackMessage = (status: number) => `It was not saved (HTTP ${status}).`;

export function useSendSubmission() {
  return useMutation({
    mutationFn: ({ target, body }: { target: SendTarget; body: SubmissionInput }) =>
      target.kind === "create"
        ? apiFetch<{ submission: { id: number } }>("/api/v1/submissions", {
            json: body,
            headers: { "idempotency-key": target.idempotencyKey },
            unreachableMessage: NOT_SENT_UNREACHABLE,
            fallbackMessage,
          })
        : apiFetch<{ submission: { id: number } }>(`/api/v1/submissions/${target.id}`, {
            method: "PATCH",
            json: { ...body, version: target.version },
            unreachableMessage: NOT_SENT_UNREACHABLE,
            fallbackMessage,
          }),
  });
}

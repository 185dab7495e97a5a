"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { apiFetch } from "@/lib/client/api-fetch";
import type { BulkResult, DecisionResult } from "@/lib/moderation/actions";
import type { BulkApproveBody, RevertBody, UserPatchBody } from "@/lib/moderation/schemas";
import type { UserUpdateResult } from "@/lib/moderation/users";
import type { Decision } from "@/lib/vocabulary";

// Moderators' and admins' writes (app/api/v1/moderation, app/api/v1/admin), one mutation each over
// apiFetch. The pages that show what they change are rendered on the server, so a success
// refreshes the route (router.refresh keeps the forms' own state, e.g. a confirmation).

const DECISION_PATHS: Record<Decision, string> = { approve: "approve", reject: "reject", request_changes: "request-changes" };

function useRefreshingMutation<V, R>(mutationFn: (values: V) => Promise<R>, when: "success" | "settled" = "success") {
  const router = useRouter();
  const refresh = () => router.refresh();
  return useMutation(when === "success" ? { mutationFn, onSuccess: refresh } : { mutationFn, onSettled: refresh });
}

/** One decision on one submission: { version, note? | reason | message } by decision. */
export const useDecide = (submissionId: number) =>
  useRefreshingMutation(({ decision, body }: { decision: Decision; body: Record<string, unknown> }) =>
    apiFetch<DecisionResult>(`/api/v1/moderation/submissions/${submissionId}/${DECISION_PATHS[decision]}`, { method: "POST", json: body }),
  );

/** Refreshes the queue whatever the answer, as the page showed it before: it lists what is pending now. */
export const useBulkApprove = () =>
  useRefreshingMutation((body: BulkApproveBody) => apiFetch<BulkResult>("/api/v1/moderation/bulk-approve", { method: "POST", json: body }), "settled");

export const useUpdateUser = (userId: string) =>
  useRefreshingMutation((body: UserPatchBody) =>
    apiFetch<UserUpdateResult>(`/api/v1/admin/users/${encodeURIComponent(userId)}`, { method: "PATCH", json: body }),
  );

export const useRevertEvent = (eventId: number) =>
  useRefreshingMutation((body: RevertBody) => apiFetch<DecisionResult>(`/api/v1/admin/events/${eventId}/revert`, { method: "POST", json: body }));

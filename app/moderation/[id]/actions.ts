"use server";

import { revalidatePath } from "next/cache";
import { ApiError } from "@/lib/http/errors";
import { requireRole } from "@/lib/auth";
import { decide } from "@/lib/moderation/actions";
import type { Decision } from "@/lib/moderation/vocabulary";

// The review form's decision, through lib/moderation's one decide(): the version makes it
// optimistic (a stale one comes back as 409 "Someone else acted on this first"), and a missing
// reason or message comes back keyed by its field.
export type DecisionState = { ok: boolean; message: string; fieldErrors: Record<string, string[]>; conflict: boolean } | null;

export async function decideAction(id: number, decision: Decision, body: Record<string, unknown>): Promise<DecisionState> {
  try {
    const actor = await requireRole("moderator");
    const result = await decide(actor, id, decision, body);
    revalidatePath("/moderation");
    const done = { approved: "approved", rejected: "rejected", changes_requested: "sent back for changes", pending: "left pending" }[result.submission.status];
    return { ok: true, message: `Submission #${id} ${done}. The contributor gets an e-mail.`, fieldErrors: {}, conflict: false };
  } catch (error) {
    if (error instanceof ApiError) return { ok: false, message: error.message, fieldErrors: error.fieldErrors as Record<string, string[]>, conflict: error.status === 409 };
    throw error;
  }
}

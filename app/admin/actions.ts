"use server";

import { revalidatePath } from "next/cache";
import { ApiError } from "@/lib/http/errors";
import { requireRole } from "@/lib/auth";
import { revertEvent } from "@/lib/moderation/revert";
import { updateUser } from "@/lib/moderation/users";

// Admin forms, through lib/moderation: every refusal comes back with its field-level messages.
export type AdminState = { ok: boolean; message: string; fieldErrors: Record<string, string[]> } | null;

async function run(work: (actor: { id: string }) => Promise<string>): Promise<AdminState> {
  try {
    const actor = await requireRole("admin");
    const message = await work(actor);
    revalidatePath("/admin");
    return { ok: true, message, fieldErrors: {} };
  } catch (error) {
    if (error instanceof ApiError) return { ok: false, message: error.message, fieldErrors: error.fieldErrors as Record<string, string[]> };
    throw error;
  }
}

export async function updateUserAction(_prev: AdminState, form: FormData): Promise<AdminState> {
  const trusted = String(form.get("trusted") ?? "record");
  return run(async (actor) => {
    const { user } = await updateUser(actor, String(form.get("userId")), {
      role: String(form.get("role")),
      trusted: trusted === "yes" ? true : trusted === "no" ? false : null,
      reason: String(form.get("reason") ?? "").trim() || null,
    });
    return `Saved: ${user.name} is now ${user.role}, ${user.trust.trusted ? "trusted" : "not trusted"}.`;
  });
}

export async function revertAction(_prev: AdminState, form: FormData): Promise<AdminState> {
  return run(async (actor) => {
    const id = Number(form.get("eventId"));
    const result = await revertEvent(actor, id, { reason: String(form.get("reason") ?? "") });
    return `Reverted: submission #${result.submission.id} is ${result.submission.status.replace("_", " ")} again.`;
  });
}

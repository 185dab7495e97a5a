"use server";

import { revalidatePath } from "next/cache";
import { ApiError } from "@/lib/http/errors";
import { requireRole } from "@/lib/auth";
import { bulkApprove } from "@/lib/moderation/actions";

// Bulk approval from the queue through lib/moderation's bulkApprove: each item has its own
// version check, and flagged ones are refused there too, not only hidden here.
export type BulkState = { ok: boolean; message: string };

export async function bulkApproveAction(items: { id: number; version: number }[]): Promise<BulkState> {
  try {
    const actor = await requireRole("moderator");
    const r = await bulkApprove(actor, { items });
    revalidatePath("/moderation");
    const parts = [`Approved ${r.approved.length}`];
    if (r.conflicted.length) parts.push(`someone else acted on ${r.conflicted.map((id) => `#${id}`).join(", ")} first`);
    if (r.refused.length) parts.push(`refused ${r.results.filter((x) => x.outcome === "refused").map((x) => ("message" in x ? x.message : `#${x.id}`)).join(" ")}`);
    return { ok: r.conflicted.length === 0 && r.refused.length === 0, message: `${parts.join("; ")}.` };
  } catch (error) {
    if (error instanceof ApiError) return { ok: false, message: error.message };
    throw error;
  }
}

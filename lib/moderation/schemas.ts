import { z } from "zod";
import { multiLine } from "@/lib/input/text";
import { BULK_MAX_ITEMS, NOTE_MAX_LENGTH, ROLES } from "@/lib/vocabulary";

// The bodies of the moderation and admin endpoints, with field-level messages. Plain zod and
// browser-safe imports only: the moderation UI can check a form with the schema the handler uses.

const version = z
  .number({ error: "Send the version of the submission you reviewed (it is in the queue row and the review)" })
  .int("version is a whole number")
  .min(0, "version is 0 or more");

/** A text a person reads later (the contributor, or an admin reading the log): trimmed, 1–4000 characters. */
const text = (what: string, missing: string) =>
  multiLine(z.string({ error: missing }).trim().min(1, missing).max(NOTE_MAX_LENGTH, `${what} is at most ${NOTE_MAX_LENGTH} characters`), what);

export const ApproveBodySchema = z.object({
  version,
  /** Optional word to the contributor, shown with the approval. */
  note: text("The note", "Leave the note out, or write something").nullish(),
  /** Why it is approved, for the log; required when a value is far from the others or the evidence disagrees (FlaggedApproveBodySchema). */
  reason: text("The reason", "Leave the reason out, or write something").nullish(),
});

/**
 * Approving a flagged submission (a value far from the approved ones, or evidence that disagrees
 * with the values): the moderator must say why, in words that stay in the log. The server applies
 * it to the locked row's flags, so a value that became flagged meanwhile cannot slip through.
 */
export const FlaggedApproveBodySchema = ApproveBodySchema.extend({
  reason: text("The reason", "Say why you approve it although it is flagged: the reason stays in the log"),
});

export const RejectBodySchema = z.object({
  version,
  reason: text("The reason", "Say why the submission is rejected: the contributor reads it"),
});

export const RequestChangesBodySchema = z.object({
  version,
  message: text("The message", "Say what should change: the contributor reads it"),
});

export const BulkApproveBodySchema = z
  .object({
    items: z
      .array(
        z.object({
          id: z
            .number({ error: "id is a submission id" })
            .int("id is a submission id")
            .min(1, "id is a submission id")
            .max(2_147_483_647, "id is a submission id"),
          version,
        }),
        { error: "Send items: a list of { id, version } from the queue" },
      )
      .min(1, "Choose at least one submission to approve")
      .max(BULK_MAX_ITEMS, `Approve at most ${BULK_MAX_ITEMS} submissions at once`),
  })
  .superRefine((body, ctx) => {
    const seen = new Set<number>();
    body.items.forEach((item, i) => {
      if (seen.has(item.id)) ctx.addIssue({ code: "custom", path: ["items", i, "id"], message: `Submission ${item.id} is listed twice` });
      seen.add(item.id);
    });
  });

export const RevertBodySchema = z.object({
  reason: text("The reason", "Say why this decision is being reverted: it stays in the log"),
});

export const UserPatchBodySchema = z
  .object({
    role: z.enum(ROLES, { error: `role is one of: ${ROLES.join(", ")}` }).optional(),
    /** true: trusted regardless of record; false: never auto-approved; null: by record. */
    trusted: z.boolean({ error: "trusted is true, false, or null (decided by their record)" }).nullable().optional(),
    reason: text("The reason", "Leave the reason out, or write something").nullish(),
  })
  .refine((b) => b.role !== undefined || b.trusted !== undefined, { message: "Send role, trusted, or both", path: ["role"] });

export type BulkApproveBody = z.input<typeof BulkApproveBodySchema>;
export type RevertBody = z.input<typeof RevertBodySchema>;
export type UserPatchBody = z.input<typeof UserPatchBodySchema>;

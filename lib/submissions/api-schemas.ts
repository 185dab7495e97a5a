import { z } from "zod";
import type { SubmissionView } from "@/lib/submissions/view";
import { MEASURED_AT, METHODS, SENSING_SOURCES, STATUSES } from "@/lib/vocabulary";

// The body of /api/v1/submissions answers, for the OpenAPI document. The request body is the
// contribution schema itself (lib/submissions/schema.ts); this describes what comes back. The
// compile-time check at the bottom fails when lib/submissions' SubmissionView stops fitting it.

const iso = z.iso.datetime({ offset: true }).meta({ description: "ISO 8601 date and time, UTC." });
const steps = (what: string) => z.number().meta({ description: `${what}, in steps of the firmware family's unit.` });

const VoltageCheckSchema = z.object({
  scaleUsed: steps("The voltage scale in force while reading"),
  readings: z.array(
    z.object({
      cells: z.number().int(),
      reportedVolts: z.number().meta({ description: "The pack voltage the display showed." }),
      measuredVolts: z.number().meta({ description: "The multimeter's reading at the same moment." }),
      measuredAt: z.enum(MEASURED_AT),
    }),
  ),
});

const CycleSchema = z.object({
  scaleUsed: steps("The current scale flown with"),
  reportedMah: z.number().meta({ description: "mAh the display said were used." }),
  chargedMah: z.number().meta({ description: "mAh the charger put back." }),
  ratedMah: z.number(),
  cells: z.number().int(),
});

const BenchSchema = z.object({
  scaleUsed: steps("The current scale in force"),
  offsetUsed: steps("The current offset in force"),
  points: z.array(z.object({ reportedAmps: z.number(), measuredAmps: z.number().meta({ description: "The DC clamp meter's reading." }) })),
});

const SubmissionSchema = z
  .object({
    id: z.number().int(),
    status: z.enum(STATUSES),
    version: z.number().int().meta({ description: "Send it back with PATCH; an edit made from an older version is refused with 409." }),
    editable: z.boolean().meta({ description: "Pending or sent back for changes, so its contributor may still edit it." }),
    createdAt: iso,
    updatedAt: iso,
    board: z.object({ slug: z.string(), name: z.string(), minCells: z.number().int(), maxCells: z.number().int() }),
    revision: z.object({ id: z.number().int(), label: z.string() }),
    family: z.object({ id: z.number().int(), slug: z.string(), name: z.string() }),
    firmwareVersion: z.string(),
    sensingSource: z.enum(SENSING_SOURCES),
    method: z.enum(METHODS),
    voltageScale: steps("Voltage scale").nullable(),
    currentScale: steps("Current scale").nullable(),
    currentOffset: steps("Current offset").nullable(),
    notes: z.string().nullable().meta({ description: "Markdown, as sent; shown sanitised." }),
    voltageCheck: VoltageCheckSchema.nullable(),
    cycles: z.array(CycleSchema),
    bench: BenchSchema.nullable(),
    evidence: z.object({
      mismatch: z.boolean().meta({ description: "The evidence implies values further from the claimed ones than the stated tolerance." }),
      summary: z
        .record(z.string(), z.unknown())
        .nullable()
        .meta({ description: "What the server worked out from the evidence: the implied values and each check against the tolerance." }),
    }),
    moderatorNote: z.string().nullable().meta({ description: "The moderator's reason or request, once there is one." }),
    links: z.object({ self: z.string(), edit: z.string().nullable(), list: z.string(), board: z.string() }),
  })
  .meta({ id: "Submission", description: "One contribution as its contributor sees it." });

export const SubmissionResponseSchema = z.object({ submission: SubmissionSchema }).meta({ id: "SubmissionResponse", description: "One submission." });
export const SubmissionListResponseSchema = z
  .object({
    submissions: z.array(SubmissionSchema),
    status: z.enum(STATUSES).nullable().meta({ description: "The status filter, or null for all." }),
    page: z.number().int(),
    pageSize: z.number().int(),
    total: z.number().int().meta({ description: "Submissions under the status filter, over all pages." }),
    pageCount: z.number().int(),
    counts: z.record(z.enum([...STATUSES, "all"]), z.number().int()).meta({ description: "The caller's submissions per status, and in all." }),
  })
  .meta({ id: "SubmissionList", description: "A page of the caller's submissions, newest first." });

// Compile-time proof that what lib/submissions returns is what the schema describes.
const fits = (view: SubmissionView): z.infer<typeof SubmissionSchema> => view;
void fits;

import type { ChosenBoard, FamilyOption } from "@/lib/submissions/form-data";
import { METHOD_EVIDENCE, type SubmissionInput } from "@/lib/submissions/schema";
import type { SubmissionView } from "@/lib/submissions/view";
import type { Method } from "@/lib/vocabulary";

// What the form holds while it is being filled in (the "draft"), and the request body made from it.
// Every evidence section stays in the draft whatever the method, so switching method back and forth
// loses nothing; toPayload keeps only the sections the chosen method uses, with the same field
// paths, so the schema's messages (client or server) land on the fields they name.

export type Num = number | null;
export type ReadingDraft = { cells: Num; reportedVolts: Num; measuredVolts: Num; measuredAt: string };
export type CycleDraft = { scaleUsed: Num; reportedMah: Num; chargedMah: Num; ratedMah: Num; cells: Num };
export type BenchPointDraft = { reportedAmps: Num; measuredAmps: Num };

export type SubmissionDraft = {
  boardRevisionId: Num;
  firmwareFamilyId: Num;
  firmwareVersion: string;
  sensingSource: string;
  method: string;
  voltageScale: Num;
  currentScale: Num;
  currentOffset: Num;
  notes: string;
  /** Form only: whether a fly-and-recharge or bench submission also carries a voltage check. */
  includeVoltageCheck: boolean;
  voltageCheck: { scaleUsed: Num; readings: ReadingDraft[] };
  cycles: CycleDraft[];
  bench: { scaleUsed: Num; offsetUsed: Num; points: BenchPointDraft[] };
  photoIds: string[];
};

export type { ChosenBoard, FamilyOption };

export const emptyReading = (): ReadingDraft => ({ cells: null, reportedVolts: null, measuredVolts: null, measuredAt: "main_lead" });
export const emptyCycle = (): CycleDraft => ({ scaleUsed: null, reportedMah: null, chargedMah: null, ratedMah: null, cells: null });
export const emptyPoint = (): BenchPointDraft => ({ reportedAmps: null, measuredAmps: null });

export function emptyDraft(): SubmissionDraft {
  return {
    boardRevisionId: null,
    firmwareFamilyId: null,
    firmwareVersion: "",
    sensingSource: "",
    method: "",
    voltageScale: null,
    currentScale: null,
    currentOffset: null,
    notes: "",
    includeVoltageCheck: false,
    voltageCheck: { scaleUsed: null, readings: [emptyReading()] },
    cycles: [emptyCycle()],
    bench: { scaleUsed: null, offsetUsed: 0, points: [emptyPoint(), emptyPoint()] },
    photoIds: [],
  };
}

/** The edit form's starting point: a stored submission back in draft form. */
export function draftFromView(v: SubmissionView): SubmissionDraft {
  const empty = emptyDraft();
  return {
    boardRevisionId: v.revision.id,
    firmwareFamilyId: v.family.id,
    firmwareVersion: v.firmwareVersion,
    sensingSource: v.sensingSource,
    method: v.method,
    voltageScale: v.voltageScale,
    currentScale: v.currentScale,
    currentOffset: v.currentOffset,
    notes: v.notes ?? "",
    includeVoltageCheck: v.voltageCheck !== null,
    voltageCheck: v.voltageCheck ?? empty.voltageCheck,
    cycles: v.cycles.length ? v.cycles : empty.cycles,
    bench: v.bench ?? empty.bench,
    photoIds: [],
  };
}

/** Which evidence sections the method shows; the voltage check also when ticked for an optional one. */
export function sectionsFor(method: string, includeVoltageCheck: boolean) {
  const needs = METHOD_EVIDENCE[method as Method];
  if (!needs) return { voltageCheck: false, voltageCheckOptional: false, cycles: false, bench: false };
  return {
    voltageCheck: needs.voltageCheck === "required" || (needs.voltageCheck === "optional" && includeVoltageCheck),
    voltageCheckOptional: needs.voltageCheck === "optional",
    cycles: needs.cycles,
    bench: needs.bench,
  };
}

/** The request body for POST/PATCH /api/v1/submissions (before the schema's own parsing). */
export function toPayload(d: SubmissionDraft): SubmissionInput {
  const shown = sectionsFor(d.method, d.includeVoltageCheck);
  return {
    boardRevisionId: d.boardRevisionId as number,
    firmwareFamilyId: d.firmwareFamilyId as number,
    firmwareVersion: d.firmwareVersion,
    sensingSource: d.sensingSource as SubmissionInput["sensingSource"],
    method: d.method as SubmissionInput["method"],
    voltageScale: d.voltageScale,
    currentScale: d.currentScale,
    currentOffset: d.currentOffset,
    notes: d.notes,
    voltageCheck: shown.voltageCheck ? (d.voltageCheck as SubmissionInput["voltageCheck"]) : null,
    cycles: shown.cycles ? (d.cycles as SubmissionInput["cycles"]) : [],
    bench: shown.bench ? (d.bench as SubmissionInput["bench"]) : null,
    photoIds: d.photoIds,
  };
}

/**
 * What a number box holds: null when empty, NaN for text that is no number (the schema then says
 * so). A decimal comma is read as a point, as phones in many languages type it.
 */
export function numberFromInput(raw: unknown): Num {
  if (raw === null || raw === undefined) return null;
  if (typeof raw === "number") return raw;
  const text = String(raw).trim().replace(",", ".");
  if (text === "") return null;
  return /^[+-]?(\d+\.?\d*|\.\d+)$/.test(text) ? Number(text) : Number.NaN;
}

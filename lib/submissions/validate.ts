import type { Transaction } from "sequelize";
import { badRequest } from "@/lib/http/errors";
import { BoardModel, BoardRevision, FirmwareFamily, db } from "@/models";
import { fieldErrorsOf } from "@/lib/http/field-errors";
import { submissionSchema, type SubmissionPayload } from "./schema";

// The server side of the form's validation: load what the body points at (the board revision and
// the firmware family), then parse through the same schema the form used, made for that context.

export type ValidatedSubmission = {
  payload: SubmissionPayload;
  family: FirmwareFamily;
  revision: BoardRevision & { boardModel: BoardModel };
};

const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);
const idOf = (v: unknown) => (typeof v === "number" && Number.isSafeInteger(v) && v > 0 ? v : null);

/** The validated submission, or ApiError 400 whose fieldErrors are keyed by the form's field paths. Writes nothing. */
export async function validateSubmission(body: unknown, transaction?: Transaction): Promise<ValidatedSubmission> {
  if (!isRecord(body)) throw badRequest({ body: ["Send the submission as a JSON object"] });
  db();
  const revisionId = idOf(body.boardRevisionId);
  const familyId = idOf(body.firmwareFamilyId);
  const [revision, family] = await Promise.all([
    revisionId ? BoardRevision.findByPk(revisionId, { include: [{ model: BoardModel, as: "boardModel" }], transaction }) : null,
    familyId ? FirmwareFamily.findByPk(familyId, { transaction }) : null,
  ]);
  const board = revision?.boardModel ?? null;
  const parsed = submissionSchema({ family, board }).safeParse(body);
  const fieldErrors = parsed.success ? {} : fieldErrorsOf(parsed.error.issues);
  if (revisionId && !revision) (fieldErrors.boardRevisionId ??= []).push(`There is no board revision with id ${revisionId}; choose the board again`);
  if (familyId && !family) (fieldErrors.firmwareFamilyId ??= []).push(`There is no firmware family with id ${familyId}; choose the family again`);
  if (!parsed.success || Object.keys(fieldErrors).length > 0) throw badRequest(fieldErrors);
  return { payload: parsed.data, family: family!, revision: revision as ValidatedSubmission["revision"] };
}

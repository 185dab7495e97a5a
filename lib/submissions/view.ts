import type { Transaction } from "sequelize";
import type { EvidenceSummary } from "@/lib/calibration/evidence";
import { BoardModel, BoardRevision, FirmwareFamily, Submission, SubmissionBenchPoint, SubmissionCycle, SubmissionVoltageReading, db } from "@/models";
import { EDITABLE_STATUSES, type SubmissionStatus } from "@/lib/vocabulary";
import { claimedValues, type ClaimedValues } from "./claimed";
import { evidenceFromRows } from "./evidence-rows";
import type { SubmissionPayload } from "./schema";

// One submission as its owner sees it: the API's response body, the "My submissions" rows and the
// edit form's starting values all come from here. Mapped field by field, so a column added to the
// table does not silently become part of the API.

export type SubmissionView = ClaimedValues & {
  id: number;
  status: SubmissionStatus;
  /** Send it back with PATCH: an edit based on an older version is refused with 409. */
  version: number;
  editable: boolean;
  createdAt: string;
  updatedAt: string;
  board: { slug: string; name: string; minCells: number; maxCells: number };
  revision: { id: number; label: string };
  family: { id: number; slug: string; name: string };
  voltageCheck: SubmissionPayload["voltageCheck"];
  cycles: SubmissionPayload["cycles"];
  bench: SubmissionPayload["bench"];
  evidence: { mismatch: boolean; summary: EvidenceSummary | null };
  moderatorNote: string | null;
  links: { self: string; edit: string | null; list: string; board: string };
};

type Loaded = Submission & {
  boardRevision: BoardRevision & { boardModel: BoardModel };
  firmwareFamily: FirmwareFamily;
  voltageReadings: SubmissionVoltageReading[];
  cycles: SubmissionCycle[];
  benchPoints: SubmissionBenchPoint[];
};

const submissionApiPath = (id: number) => `/api/v1/submissions/${id}`;
export const submissionEditPath = (id: number) => `/my/submissions/${id}/edit`;
export const MY_SUBMISSIONS_PATH = "/my/submissions";

const NEWEST_FIRST: [string, string][] = [
  ["createdAt", "DESC"],
  ["id", "DESC"],
];

const INCLUDE = [
  { model: BoardRevision, as: "boardRevision", include: [{ model: BoardModel, as: "boardModel" }] },
  { model: FirmwareFamily, as: "firmwareFamily" },
  { model: SubmissionVoltageReading, as: "voltageReadings" },
  { model: SubmissionCycle, as: "cycles" },
  { model: SubmissionBenchPoint, as: "benchPoints" },
];

function toView(s: Loaded): SubmissionView {
  const board = s.boardRevision.boardModel;
  const editable = EDITABLE_STATUSES.includes(s.status);
  return {
    id: s.id,
    status: s.status,
    version: s.version,
    editable,
    createdAt: s.createdAt.toISOString(),
    updatedAt: s.updatedAt.toISOString(),
    board: { slug: board.slug, name: board.name, minCells: board.minCells, maxCells: board.maxCells },
    revision: { id: s.boardRevision.id, label: s.boardRevision.label },
    family: { id: s.firmwareFamily.id, slug: s.firmwareFamily.slug, name: s.firmwareFamily.name },
    ...claimedValues(s),
    ...evidenceFromRows(s),
    evidence: { mismatch: s.evidenceMismatch, summary: s.evidenceSummary },
    moderatorNote: s.moderatorNote,
    links: {
      self: submissionApiPath(s.id),
      edit: editable ? submissionEditPath(s.id) : null,
      list: MY_SUBMISSIONS_PATH,
      board: `/boards/${encodeURIComponent(board.slug)}`,
    },
  };
}

/** One submission with everything its view needs, or null. */
export async function loadSubmissionView(id: number, transaction?: Transaction): Promise<SubmissionView | null> {
  db();
  const s = await Submission.findByPk(id, { include: INCLUDE, transaction });
  return s ? toView(s as Loaded) : null;
}

/** A page of the contributor's own submissions, newest first, optionally of one status (own-list.ts pages and counts). */
export async function loadOwnPage(contributorId: string, status: SubmissionStatus | null, limit: number, offset: number): Promise<SubmissionView[]> {
  db();
  // Ids first, then the rows with their evidence: LIMIT on a query with has-many includes would
  // page the joined rows, not the submissions.
  const ids = await Submission.findAll({
    attributes: ["id"],
    where: status ? { contributorId, status } : { contributorId },
    order: NEWEST_FIRST,
    limit,
    offset,
    raw: true,
  });
  if (ids.length === 0) return [];
  const rows = await Submission.findAll({ where: { id: ids.map((r) => r.id) }, include: INCLUDE, order: NEWEST_FIRST });
  return rows.map((s) => toView(s as Loaded));
}

/** The submission if `contributorId` owns it, else null (someone else's looks like none at all). */
export async function getOwnSubmission(contributorId: string, id: number): Promise<SubmissionView | null> {
  if (!Number.isSafeInteger(id) || id <= 0) return null;
  db();
  const s = await Submission.findOne({ where: { id, contributorId }, include: INCLUDE });
  return s ? toView(s as Loaded) : null;
}

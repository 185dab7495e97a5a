import { QueryTypes } from "sequelize";
import { describeFlags } from "@/lib/stats";
import { type ConfidenceLabel, type Method, QUANTITIES, type Quantity, type SubmissionStatus } from "@/lib/vocabulary";
import { publishedFromValues, type ApprovedPoint } from "@/lib/published/from-values";
import type { GroupKey } from "@/lib/published/group-key";
import { QUANTITY_KEYS, type QuantityKey } from "@/lib/published/board-values-types";
import { placeValue, type Placement } from "@/lib/submissions/placement";
import { loadSubmissionView, type SubmissionView } from "@/lib/submissions/view";
import { db, EvidencePhoto } from "@/models";
import { listAuditEvents, type AuditEventView } from "./audit";
import { flagsOfRow, scoredSubmission, type SubmissionFlags } from "./flags";
import { contributorRecord, trustOf, type ContributorRecord, type TrustState } from "./trust";

// Everything a moderator needs to decide on one submission: the submission and its evidence
// (readings, cycles, bench points, photos — removed photos too, marked), its flags, for each value
// the group's approved values and where this one falls among them, how the published figures WOULD
// MOVE if it were approved, the contributor's record, and the submission's log.
//
// "Would move" is computed with lib/stats over the approved values plus this one, turned into
// board_stats' figures by lib/published's own derivePublished (recommended setting, confidence),
// so it is what the refresh would publish: lib/stats and the SQL aggregates are held to 1e-9 on the
// same data by tests/unit/published. "Now" is computed the same way from the approved values alone,
// so the two sides of each comparison come from one implementation.

type Figures = {
  n: number;
  median: number;
  ciLow: number | null;
  ciHigh: number | null;
  mad: number;
  recommendedValue: number;
  confidence: ConfidenceLabel;
  outlierCount: number;
};

type GroupPoint = { submissionId: number; value: number; method: Method; date: string; outlier: boolean; modifiedZ: number | null };

type QuantityReview = {
  quantity: QuantityKey;
  /** This submission's value; null when it leaves this quantity out (then nothing would move). */
  value: number | null;
  /** The group's approved values, oldest first, flagged among themselves by lib/stats. */
  approved: GroupPoint[];
  /** Where the value falls: its modified z against the approved values (placement.ts), and the share of approved values below it. */
  placement: (Placement & { belowShare: number | null }) | null;
  /**
   * The figures of the OTHER approved values (for a submission that is not approved, exactly what
   * is published now; null when there are none) and of those plus this one, which is what
   * approving it would publish.
   */
  now: Figures | null;
  ifApproved: Figures | null;
  /** ifApproved − now for each figure both sides have; null when either side lacks it. */
  moves: { median: number | null; ciLow: number | null; ciHigh: number | null; recommendedValue: number | null; n: number } | null;
};

type ReviewPhoto = {
  id: string;
  url: string;
  contentType: string;
  width: number;
  height: number;
  byteSize: number;
  createdAt: string;
  removedAt: string | null;
};

type OtherSubmission = {
  id: number;
  status: SubmissionStatus;
  createdAt: string;
  revision: string;
  family: string;
  values: Record<QuantityKey, number | null>;
};

export type Review = {
  submission: SubmissionView;
  contributor: { id: string; name: string; record: ContributorRecord; trust: TrustState; otherForBoard: OtherSubmission[] };
  photos: ReviewPhoto[];
  flags: SubmissionFlags;
  quantities: QuantityReview[];
  events: AuditEventView[];
};

type ApprovedRow = { id: number; method: Method; updatedAt: Date } & Record<Quantity, number | null>;

/** board_stats' figures for a set of values, by lib/stats and lib/published's derivation. */
function figuresOf(group: GroupKey, quantity: Quantity, points: ApprovedPoint[]): Figures | null {
  const published = publishedFromValues(group, quantity, points);
  if (!published) return null;
  return {
    n: published.n,
    median: published.median,
    ciLow: published.ciLow,
    ciHigh: published.ciHigh,
    mad: published.mad,
    recommendedValue: published.recommendedValue,
    confidence: published.confidence,
    outlierCount: published.outlierCount,
  };
}

const diff = (a: number | null, b: number | null) => (a === null || b === null ? null : b - a);

function quantityReview(group: GroupKey, quantity: Quantity, value: number | null, method: Method, approvedRows: ApprovedRow[]): QuantityReview {
  const present = approvedRows.filter((r) => r[quantity] !== null);
  const flags = describeFlags(present.map((r) => r[quantity]!)).points;
  const approved = present.map((r, i) => ({
    submissionId: r.id,
    value: r[quantity]!,
    method: r.method,
    date: new Date(r.updatedAt).toISOString(),
    outlier: flags[i].outlier,
    modifiedZ: flags[i].modifiedZ,
  }));
  const points = present.map((r) => ({ value: r[quantity]!, method: r.method, date: new Date(r.updatedAt) }));
  const now = figuresOf(group, quantity, points);
  if (value === null) return { quantity: QUANTITY_KEYS[quantity], value, approved, placement: null, now, ifApproved: now, moves: null };
  const values = approved.map((p) => p.value);
  const placement = now
    ? { ...placeValue(value, { n: now.n, median: now.median, mad: now.mad }, values), belowShare: values.filter((v) => v < value).length / values.length }
    : null;
  const ifApproved = figuresOf(group, quantity, [...points, { value, method, date: new Date() }]);
  const moves = ifApproved && {
    median: diff(now?.median ?? null, ifApproved.median),
    ciLow: diff(now?.ciLow ?? null, ifApproved.ciLow),
    ciHigh: diff(now?.ciHigh ?? null, ifApproved.ciHigh),
    recommendedValue: diff(now?.recommendedValue ?? null, ifApproved.recommendedValue),
    n: ifApproved.n - (now?.n ?? 0),
  };
  return { quantity: QUANTITY_KEYS[quantity], value, approved, placement, now, ifApproved, moves };
}

/** The review of one submission (any status), or null when there is none. */
export async function getReview(submissionId: number): Promise<Review | null> {
  if (!Number.isSafeInteger(submissionId) || submissionId <= 0 || submissionId > 2_147_483_647) return null;
  const sequelize = db();
  const [submission, scored] = await Promise.all([loadSubmissionView(submissionId), scoredSubmission(submissionId)]);
  if (!submission || !scored) return null;
  const group: GroupKey = { boardRevisionId: scored.revisionId, firmwareFamilyId: scored.familyId };

  const [approvedRows, photos, record, trust, others, events] = await Promise.all([
    // submissions_group_status_idx; oldest first, as the board page draws them
    sequelize.query<ApprovedRow>(
      `SELECT id, method, updated_at AS "updatedAt", voltage_scale, current_scale, current_offset
         FROM submissions WHERE board_revision_id = :r AND firmware_family_id = :f AND status = 'approved' AND id <> :id
        ORDER BY updated_at, id`,
      { replacements: { r: group.boardRevisionId, f: group.firmwareFamilyId, id: submissionId }, type: QueryTypes.SELECT },
    ),
    // evidence_photos_submission_idx; removed photos stay visible to moderators, marked
    EvidencePhoto.findAll({ where: { submissionId }, paranoid: false, order: [["createdAt", "ASC"]] }),
    contributorRecord(scored.contributorId),
    trustOf(scored.contributorId),
    // submissions_contributor_created_idx, then the board by its revisions
    sequelize.query<{ id: number; status: SubmissionStatus; createdAt: Date; revision: string; family: string } & Record<Quantity, number | null>>(
      `SELECT s.id, s.status, s.created_at AS "createdAt", br.label AS revision, ff.name AS family, s.voltage_scale, s.current_scale, s.current_offset
         FROM submissions s JOIN board_revisions br ON br.id = s.board_revision_id JOIN firmware_families ff ON ff.id = s.firmware_family_id
        WHERE s.contributor_id = :c AND br.board_model_id = :board AND s.id <> :id
        ORDER BY s.created_at DESC, s.id DESC`,
      { replacements: { c: scored.contributorId, board: scored.boardId, id: submissionId }, type: QueryTypes.SELECT },
    ),
    listAuditEvents({ submission: submissionId, pageSize: 100 }),
  ]);

  return {
    submission,
    contributor: {
      id: scored.contributorId,
      name: scored.contributorName,
      record,
      trust: trust!,
      otherForBoard: others.map((o) => ({
        id: o.id,
        status: o.status,
        createdAt: new Date(o.createdAt).toISOString(),
        revision: o.revision,
        family: o.family,
        values: { voltageScale: o.voltage_scale, currentScale: o.current_scale, currentOffset: o.current_offset },
      })),
    },
    photos: photos.map((p) => ({
      id: p.id,
      url: `/api/v1/photos/${p.id}`,
      contentType: p.contentType,
      width: p.width,
      height: p.height,
      byteSize: p.byteSize,
      createdAt: p.createdAt.toISOString(),
      removedAt: p.deletedAt ? p.deletedAt.toISOString() : null,
    })),
    flags: flagsOfRow(scored),
    quantities: QUANTITIES.map((q) => quantityReview(group, q, scored[QUANTITY_KEYS[q]], scored.method as Method, approvedRows)),
    events: events.events,
  };
}

import { QueryTypes, type Transaction } from "sequelize";
import { type AuditAction, type ConfidenceLabel, QUANTITIES, type Quantity } from "@/lib/vocabulary";
import { BoardStat, db, PublishedValueHistory, type BoardStatRow } from "@/models";
import { QUANTITY_KEYS, type QuantityKey } from "./board-values-types";
import { publishedFiguresMoved } from "./from-values";
import type { GroupKey } from "./group-key";
import { refreshGroups, type PublishedStats } from "./refresh";

// The history of published values (migrations/20261210001200-…) and the board page's timeline of it. A moderation action that can
// move a group's figures refreshes the group through refreshWithHistory, which compares what
// board_stats published before and after and appends one row per quantity whose recommended
// value, n or interval changed, naming the audit event that caused it. The first time a quantity
// changes, the figures it had before are recorded first as a baseline row (no event), so a
// timeline always starts from what readers saw.

/** The published figures of one quantity that the history keeps. */
type PublishedFigures = Pick<BoardStatRow, "recommendedValue" | "n" | "median" | "ciLow" | "ciHigh" | "confidence" | "computedAt">;

/** board_stats of one group by quantity, read by primary key. */
async function publishedFigures(group: GroupKey, transaction?: Transaction): Promise<Map<Quantity, PublishedFigures>> {
  db();
  const rows = await BoardStat.findAll({
    attributes: ["quantity", "recommendedValue", "n", "median", "ciLow", "ciHigh", "confidence", "computedAt"],
    where: { boardRevisionId: group.boardRevisionId, firmwareFamilyId: group.firmwareFamilyId },
    raw: true,
    transaction,
  });
  return new Map(rows.map(({ quantity, ...figures }) => [quantity, figures]));
}

const figuresOf = (row: PublishedStats): PublishedFigures => ({
  recommendedValue: row.recommendedValue,
  n: row.n,
  median: row.median,
  ciLow: row.ciLow,
  ciHigh: row.ciHigh,
  confidence: row.confidence,
  computedAt: new Date(),
});

function historyRow(group: GroupKey, quantity: Quantity, f: PublishedFigures | undefined, eventId: number | null, at?: Date) {
  return {
    boardRevisionId: group.boardRevisionId,
    firmwareFamilyId: group.firmwareFamilyId,
    quantity,
    recommendedValue: f?.recommendedValue ?? null,
    n: f?.n ?? 0,
    median: f?.median ?? null,
    ciLow: f?.ciLow ?? null,
    ciHigh: f?.ciHigh ?? null,
    confidence: f?.confidence ?? null,
    causedByEventId: eventId,
    ...(at ? { at } : {}),
  };
}

/**
 * Recomputes one group's board_stats inside `transaction` (lib/published refreshGroups) and
 * appends the history rows of what changed, caused by `eventId`. Returns the quantities that
 * changed. The group's advisory lock is taken before the "before" read and held to commit
 * (refreshGroups takes the same lock again, which PostgreSQL allows), so no other refresh of the
 * group can slip between the read and the write.
 */
export async function refreshWithHistory(group: GroupKey, eventId: number, transaction: Transaction): Promise<Quantity[]> {
  const sequelize = db();
  await sequelize.query("SELECT pg_advisory_xact_lock(:r, :f)", { replacements: { r: group.boardRevisionId, f: group.firmwareFamilyId }, transaction });
  const before = await publishedFigures(group, transaction);
  const after = new Map((await refreshGroups(sequelize, [group], transaction)).map((row) => [row.quantity, figuresOf(row)]));
  const moved = QUANTITIES.filter((q) => publishedFiguresMoved(before.get(q), after.get(q)));
  if (moved.length === 0) return [];

  // quantities that have no history yet get their previous figures as a baseline first
  const recorded = await sequelize.query<{ quantity: Quantity }>(
    `SELECT DISTINCT quantity FROM published_value_history WHERE board_revision_id = :r AND firmware_family_id = :f AND quantity IN (:q)`,
    { replacements: { r: group.boardRevisionId, f: group.firmwareFamilyId, q: moved }, type: QueryTypes.SELECT, transaction },
  );
  const hasHistory = new Set(recorded.map((r) => r.quantity));
  const rows = moved.flatMap((q) => {
    const previous = before.get(q);
    const baseline = !hasHistory.has(q) && previous ? [historyRow(group, q, previous, null, previous.computedAt)] : [];
    return [...baseline, historyRow(group, q, after.get(q), eventId)];
  });
  await PublishedValueHistory.bulkCreate(rows, { transaction });
  return moved;
}

export type HistoryPoint = {
  at: string;
  /** Null when the quantity stopped being published (n = 0). */
  recommendedValue: number | null;
  n: number;
  median: number | null;
  ciLow: number | null;
  ciHigh: number | null;
  confidence: ConfidenceLabel | null;
  /** What caused the change; null for a baseline (what was published before the first recorded change). */
  event: { id: number; action: AuditAction } | null;
};

export type HistorySeries = {
  revision: { id: number; label: string };
  family: { id: number; slug: string; name: string };
  quantity: QuantityKey;
  /** Oldest first. */
  points: HistoryPoint[];
};

export type ValueHistory = { board: { slug: string; name: string }; series: HistorySeries[] };

type HistoryRow = Omit<HistoryPoint, "at" | "event"> & {
  at: Date;
  revisionId: number;
  revisionLabel: string;
  familyId: number;
  familySlug: string;
  familyName: string;
  quantity: Quantity;
  eventId: number | null;
  eventAction: AuditAction | null;
};

/**
 * The board page's timeline: every recorded change of each published value, per revision,
 * firmware family and quantity (revisions by position, families by name, quantities in the
 * page's order), oldest first. Null when no board has this slug. Moderators' reasons and names
 * are not part of it: the page is public.
 */
export async function getValueHistory(boardSlug: string): Promise<ValueHistory | null> {
  if (boardSlug.length > 120) return null;
  const sequelize = db();
  const [board] = await sequelize.query<{ id: number; slug: string; name: string }>("SELECT id, slug, name FROM board_models WHERE slug = :slug", {
    replacements: { slug: boardSlug },
    type: QueryTypes.SELECT,
  });
  if (!board) return null;
  // board_revisions_model_position_idx, then published_value_history_group_idx per revision
  const rows = await sequelize.query<HistoryRow>(
    `SELECT h.at, h.recommended_value AS "recommendedValue", h.n, h.median, h.ci_low AS "ciLow", h.ci_high AS "ciHigh", h.confidence,
            br.id AS "revisionId", br.label AS "revisionLabel", ff.id AS "familyId", ff.slug AS "familySlug", ff.name AS "familyName",
            h.quantity, e.id AS "eventId", e.action AS "eventAction"
       FROM board_revisions br
       JOIN published_value_history h ON h.board_revision_id = br.id
       JOIN firmware_families ff ON ff.id = h.firmware_family_id
       LEFT JOIN audit_events e ON e.id = h.caused_by_event_id
      WHERE br.board_model_id = :board
      ORDER BY br.position, br.id, ff.name, ff.id, array_position(ARRAY[${QUANTITIES.map((q) => `'${q}'`).join(", ")}], h.quantity), h.id`,
    { replacements: { board: board.id }, type: QueryTypes.SELECT },
  );
  const series: HistorySeries[] = [];
  for (const r of rows) {
    let last = series.at(-1);
    if (!last || last.revision.id !== r.revisionId || last.family.id !== r.familyId || last.quantity !== QUANTITY_KEYS[r.quantity]) {
      last = {
        revision: { id: r.revisionId, label: r.revisionLabel },
        family: { id: r.familyId, slug: r.familySlug, name: r.familyName },
        quantity: QUANTITY_KEYS[r.quantity],
        points: [],
      };
      series.push(last);
    }
    last.points.push({
      at: new Date(r.at).toISOString(),
      recommendedValue: r.recommendedValue,
      n: r.n,
      median: r.median,
      ciLow: r.ciLow,
      ciHigh: r.ciHigh,
      confidence: r.confidence,
      event: r.eventId !== null ? { id: r.eventId, action: r.eventAction! } : null,
    });
  }
  return { board: { slug: board.slug, name: board.name }, series };
}

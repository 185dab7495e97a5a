import bcrypt from "bcryptjs";
import { QueryTypes, type QueryInterface, type QueryOptions, type Transaction } from "sequelize";
import type { SubmissionState } from "@/lib/moderation/audit";
import { DEMO_BCRYPT_COST } from "./accounts";
import type { DemoScenario } from "./scenario";

// Writes a built DemoScenario with a handful of multi-row INSERTs (a few seconds at most), mapping
// the scenario's slugs and revision keys to the ids the database assigns. Used by the seeder.

const SUBMISSION_CHUNK = 500;

/** bulkInsert passes `returning` through to PostgreSQL, but its typings leave it out. */
type ReturningOptions = QueryOptions & { returning: string[] };
const returning = (transaction: Transaction, columns: string[]): ReturningOptions => ({ transaction, returning: columns });

/** camelCase attribute names to the snake_case columns of the migrations. */
function toColumns(row: Record<string, unknown>): Record<string, unknown> {
  return Object.fromEntries(Object.entries(row).map(([k, v]) => [k.replace(/[A-Z]/g, (c) => `_${c.toLowerCase()}`), v]));
}

async function insertReturningIds(
  qi: QueryInterface,
  table: string,
  rows: Record<string, unknown>[],
  keyColumn: string,
  transaction: Transaction,
): Promise<Map<string, number>> {
  if (rows.length === 0) return new Map();
  const inserted = (await qi.bulkInsert(table, rows.map(toColumns), returning(transaction, ["id", keyColumn]))) as unknown as Array<Record<string, unknown>>;
  if (!Array.isArray(inserted) || inserted.length !== rows.length) {
    throw new Error(`demo seed: expected ${rows.length} ids back from ${table}, got ${Array.isArray(inserted) ? inserted.length : typeof inserted}`);
  }
  return new Map(inserted.map((r) => [String(r[keyColumn]), Number(r.id)]));
}

function idOf(map: Map<string, number>, key: string, what: string): number {
  const id = map.get(key);
  if (id == null) throw new Error(`demo seed: no ${what} for ${JSON.stringify(key)}`);
  return id;
}

export type InsertCounts = Record<
  | "manufacturers"
  | "boardModels"
  | "boardRevisions"
  | "boardAliases"
  | "firmwareFamilies"
  | "users"
  | "submissions"
  | "evidenceRows"
  | "auditEvents"
  | "valueHistory"
  | "garageRows",
  number
>;

/** What a seeded approval records (lib/moderation/audit.ts SubmissionState): the revert path reads these back. */
const DEMO_APPROVAL_BEFORE: SubmissionState = { status: "pending", moderatorNote: null, version: 0 };
const DEMO_APPROVAL_AFTER: SubmissionState = { status: "approved", moderatorNote: null, version: 1 };

export async function insertDemoScenario(qi: QueryInterface, s: DemoScenario, transaction: Transaction): Promise<InsertCounts> {
  const makerIds = await insertReturningIds(qi, "manufacturers", s.manufacturers, "slug", transaction);

  const boardIds = await insertReturningIds(
    qi,
    "board_models",
    s.boardModels.map(({ manufacturerSlug, tier: _tier, ...cols }) => ({ ...cols, manufacturerId: idOf(makerIds, manufacturerSlug, "manufacturer") })),
    "slug",
    transaction,
  );

  const revisionRows = s.boardRevisions.map(({ key: _key, boardSlug, fixedSubmissionCount: _fixed, ...cols }) => ({
    ...cols,
    boardModelId: idOf(boardIds, boardSlug, "board model"),
  }));
  // revisions have no slug: read back (board id, label) and rebuild the scenario's keys from it
  const revisionReturned = (await qi.bulkInsert(
    "board_revisions",
    revisionRows.map(toColumns),
    returning(transaction, ["id", "board_model_id", "label"]),
  )) as unknown as Array<{ id: number; board_model_id: number; label: string }>;
  const slugByBoardId = new Map([...boardIds].map(([slug, id]) => [id, slug]));
  const revisionIds = new Map(revisionReturned.map((r) => [`${slugByBoardId.get(Number(r.board_model_id))}@${r.label}`, Number(r.id)]));

  if (s.boardAliases.length > 0) {
    await qi.bulkInsert(
      "board_aliases",
      s.boardAliases.map(({ boardSlug, alias }) => toColumns({ boardModelId: idOf(boardIds, boardSlug, "board model"), alias })),
      { transaction },
    );
  }

  const familyIds = await insertReturningIds(
    qi,
    "firmware_families",
    s.firmwareFamilies.map(({ versions: _v, defaults: _d, share: _s, ...cols }) => cols),
    "slug",
    transaction,
  );

  const users = await Promise.all(
    s.users.map(async ({ password, ...cols }) => ({
      ...cols,
      passwordHash: password ? await bcrypt.hash(password, DEMO_BCRYPT_COST) : null,
      updatedAt: cols.createdAt,
    })),
  );
  await qi.bulkInsert("users", users.map(toColumns), { transaction });

  const submissionRows = s.submissions.map(({ revisionKey, familySlug, anomaly: _anomaly, evidence: _evidence, evidenceSummary, ...cols }) =>
    toColumns({
      ...cols,
      // bulkInsert does not know the column is jsonb: send the text PostgreSQL casts on insert
      evidenceSummary: evidenceSummary ? JSON.stringify(evidenceSummary) : null,
      boardRevisionId: idOf(revisionIds, revisionKey, "board revision"),
      firmwareFamilyId: idOf(familyIds, familySlug, "firmware family"),
    }),
  );
  const submissionIds: number[] = [];
  for (let i = 0; i < submissionRows.length; i += SUBMISSION_CHUNK) {
    const chunk = submissionRows.slice(i, i + SUBMISSION_CHUNK);
    const back = (await qi.bulkInsert("submissions", chunk, returning(transaction, ["id", "created_at"]))) as unknown as Array<{
      id: number;
      created_at: Date;
    }>;
    // a multi-row INSERT … RETURNING gives its rows back in VALUES order; check rather than trust it
    back.forEach((r, k) => {
      if (new Date(r.created_at).getTime() !== (chunk[k].created_at as Date).getTime()) throw new Error("demo seed: submission ids came back out of order");
    });
    submissionIds.push(...back.map((r) => Number(r.id)));
  }

  const evidence = await insertEvidence(qi, s, submissionIds, transaction);
  const history = await insertModerationPast(qi, s, { submissionIds, revisionIds, familyIds }, transaction);
  const garageRows = await insertDemoGarage(qi, s, { submissionIds, revisionIds, familyIds }, transaction);

  return {
    manufacturers: makerIds.size,
    boardModels: boardIds.size,
    boardRevisions: revisionIds.size,
    boardAliases: s.boardAliases.length,
    firmwareFamilies: familyIds.size,
    users: users.length,
    submissions: submissionRows.length,
    evidenceRows: evidence,
    auditEvents: s.approvals.length,
    valueHistory: history,
    garageRows,
  };
}

/** The demo contributor's quads, packs, charges and worksheets with their entries; returns the rows written. */
async function insertDemoGarage(
  qi: QueryInterface,
  s: DemoScenario,
  ids: { submissionIds: number[]; revisionIds: Map<string, number>; familyIds: Map<string, number> },
  transaction: Transaction,
): Promise<number> {
  const g = s.garage;
  const ownerId = g.ownerId;
  const quadIds = await insertReturningIds(
    qi,
    "quads",
    g.quads.map(({ revisionKey, familySlug, ...cols }) => ({
      ...cols,
      ownerId,
      boardRevisionId: idOf(ids.revisionIds, revisionKey, "board revision"),
      firmwareFamilyId: idOf(ids.familyIds, familySlug, "firmware family"),
      updatedAt: cols.createdAt,
    })),
    "name",
    transaction,
  );
  const packIds = await insertReturningIds(
    qi,
    "packs",
    g.packs.map(({ charges: _charges, ...cols }) => ({ ...cols, ownerId, updatedAt: cols.createdAt })),
    "label",
    transaction,
  );
  const packId = (i: number) => idOf(packIds, g.packs[i].label, "demo pack");
  const charges = g.packs.flatMap((p, i) => p.charges.map((c) => ({ ...c, packId: packId(i), createdAt: new Date(`${c.chargedOn}T18:00:00Z`) })));
  await bulkInsertChunked(qi, "pack_charges", charges, transaction);
  let rows = g.quads.length + g.packs.length + charges.length;
  for (const w of g.worksheets) {
    const [sheet] = (await qi.bulkInsert(
      "worksheets",
      [
        toColumns({
          ownerId,
          quadId: idOf(quadIds, g.quads[w.quad].name, "demo quad"),
          packId: w.pack == null ? null : packId(w.pack),
          kind: w.kind,
          firmwareFamilyId: idOf(ids.familyIds, w.familySlug, "firmware family"),
          ratedMah: w.ratedMah,
          cells: w.cells,
          startingScale: w.startingScale,
          startingOffset: w.startingOffset,
          startingSource: "own",
          submissionId: w.submission == null ? null : ids.submissionIds[w.submission],
          createdAt: w.createdAt,
          updatedAt: w.createdAt,
        }),
      ],
      returning(transaction, ["id"]),
    )) as unknown as Array<{ id: number }>;
    const worksheetId = Number(sheet.id);
    const entry = <T extends object>(list: T[]) => list.map((e, position) => ({ ...e, worksheetId, position, createdAt: w.createdAt }));
    rows +=
      1 +
      (await bulkInsertChunked(qi, "worksheet_steps", entry(w.steps), transaction)) +
      (await bulkInsertChunked(qi, "worksheet_voltage_readings", entry(w.readings), transaction)) +
      (await bulkInsertChunked(qi, "worksheet_bench_points", entry(w.points), transaction));
  }
  return rows;
}

async function bulkInsertChunked(qi: QueryInterface, table: string, rows: Record<string, unknown>[], transaction: Transaction): Promise<number> {
  for (let i = 0; i < rows.length; i += SUBMISSION_CHUNK) await qi.bulkInsert(table, rows.slice(i, i + SUBMISSION_CHUNK).map(toColumns), { transaction });
  return rows.length;
}

/** The evidence tables, one row per reading, cycle or point, as lib/submissions/evidence-rows.ts writeEvidence lays them out. */
async function insertEvidence(qi: QueryInterface, s: DemoScenario, submissionIds: number[], transaction: Transaction): Promise<number> {
  const readings: Record<string, unknown>[] = [];
  const cycles: Record<string, unknown>[] = [];
  const points: Record<string, unknown>[] = [];
  s.submissions.forEach(({ evidence, createdAt }, i) => {
    const submissionId = submissionIds[i];
    const check = evidence.voltageCheck;
    check?.readings.forEach((r, position) => readings.push({ submissionId, position, scaleUsed: check.scaleUsed, ...r, createdAt }));
    evidence.cycles.forEach((c, position) => cycles.push({ submissionId, position, ...c, createdAt }));
    const bench = evidence.bench;
    bench?.points.forEach((p, position) => points.push({ submissionId, position, scaleUsed: bench.scaleUsed, offsetUsed: bench.offsetUsed, ...p, createdAt }));
  });
  return (
    (await bulkInsertChunked(qi, "submission_voltage_readings", readings, transaction)) +
    (await bulkInsertChunked(qi, "submission_cycles", cycles, transaction)) +
    (await bulkInsertChunked(qi, "submission_bench_points", points, transaction))
  );
}

/** Approval events (lib/moderation/audit.ts shape: pending v0 → approved v1) and the value history they caused. */
async function insertModerationPast(
  qi: QueryInterface,
  s: DemoScenario,
  ids: { submissionIds: number[]; revisionIds: Map<string, number>; familyIds: Map<string, number> },
  transaction: Transaction,
): Promise<number> {
  const eventIds: number[] = [];
  for (let i = 0; i < s.approvals.length; i += SUBMISSION_CHUNK) {
    const rows = s.approvals.slice(i, i + SUBMISSION_CHUNK).map((a) => ({
      actor_id: a.actorId,
      action: "approve",
      entity_type: "submission",
      submission_id: ids.submissionIds[a.submission],
      before: JSON.stringify(DEMO_APPROVAL_BEFORE),
      after: JSON.stringify(DEMO_APPROVAL_AFTER),
      reason: null,
      at: a.at,
    }));
    const back = (await qi.bulkInsert("audit_events", rows, returning(transaction, ["id", "submission_id"]))) as unknown as Array<{
      id: number;
      submission_id: number;
    }>;
    back.forEach((r, k) => {
      if (Number(r.submission_id) !== rows[k].submission_id) throw new Error("demo seed: audit event ids came back out of order");
    });
    eventIds.push(...back.map((r) => Number(r.id)));
  }
  const history = s.valueHistory.map(({ revisionKey, familySlug, approval, ...cols }) => ({
    ...cols,
    boardRevisionId: idOf(ids.revisionIds, revisionKey, "board revision"),
    firmwareFamilyId: idOf(ids.familyIds, familySlug, "firmware family"),
    causedByEventId: eventIds[approval],
  }));
  return bulkInsertChunked(qi, "published_value_history", history, transaction);
}

/**
 * Removes the demo rows, children first: everything under the demo makers and boards, every
 * submission made under a demo firmware family or by a demo person, then the parents. Rows that
 * real users added elsewhere are left alone.
 */
export async function deleteDemoScenario(qi: QueryInterface, s: DemoScenario, transaction: Transaction): Promise<void> {
  const replacements = {
    makers: s.manufacturers.map((m) => m.slug),
    boards: s.boardModels.map((b) => b.slug),
    families: s.firmwareFamilies.map((f) => f.slug),
    emails: s.users.map((u) => u.email.toLowerCase()),
  };
  const boards = `SELECT id FROM board_models WHERE slug IN (:boards) OR manufacturer_id IN (SELECT id FROM manufacturers WHERE slug IN (:makers))`;
  const revisions = `SELECT id FROM board_revisions WHERE board_model_id IN (${boards})`;
  const families = `SELECT id FROM firmware_families WHERE slug IN (:families)`;
  const statements: string[] = [];
  // the demo people's garages first: their worksheets hold on to demo firmware families
  statements.push(
    "DELETE FROM quads WHERE owner_id IN (SELECT id FROM users WHERE lower(email) IN (:emails))",
    "DELETE FROM packs WHERE owner_id IN (SELECT id FROM users WHERE lower(email) IN (:emails))",
  );
  // derived statistics (migration 20261202000900) point at revisions and families: drop those first
  const [{ exists }] = await qi.sequelize.query<{ exists: boolean }>("SELECT to_regclass('board_stats') IS NOT NULL AS exists", {
    transaction,
    type: QueryTypes.SELECT,
  });
  if (exists) statements.push(`DELETE FROM board_stats WHERE board_revision_id IN (${revisions}) OR firmware_family_id IN (${families})`);
  const people = `SELECT id FROM users WHERE lower(email) IN (:emails)`;
  const submissions = `SELECT id FROM submissions WHERE board_revision_id IN (${revisions}) OR firmware_family_id IN (${families}) OR contributor_id IN (${people})`;
  // The moderation log and the value history are append-only for the app (triggers); removing the
  // demo is the one place their demo rows go, so the triggers are off for this transaction only.
  const events = `SELECT id FROM audit_events WHERE submission_id IN (${submissions}) OR actor_id IN (${people}) OR target_user_id IN (${people})`;
  statements.push(
    "ALTER TABLE published_value_history DISABLE TRIGGER published_value_history_no_update_delete",
    "ALTER TABLE audit_events DISABLE TRIGGER audit_events_no_update_delete",
    `DELETE FROM published_value_history WHERE board_revision_id IN (${revisions}) OR firmware_family_id IN (${families}) OR caused_by_event_id IN (${events})`,
    // reverts first: they point at the events they undid
    `DELETE FROM audit_events WHERE reverts_event_id IS NOT NULL AND id IN (${events})`,
    `DELETE FROM audit_events WHERE id IN (${events})`,
    "ALTER TABLE audit_events ENABLE TRIGGER audit_events_no_update_delete",
    "ALTER TABLE published_value_history ENABLE TRIGGER published_value_history_no_update_delete",
  );
  statements.push(
    `DELETE FROM submissions WHERE id IN (${submissions})`,
    `DELETE FROM board_aliases WHERE board_model_id IN (${boards})`,
    `DELETE FROM board_revisions WHERE board_model_id IN (${boards})`,
    `DELETE FROM board_models WHERE id IN (${boards})`,
    `DELETE FROM manufacturers WHERE slug IN (:makers)`,
    `DELETE FROM firmware_families WHERE slug IN (:families)`,
    `DELETE FROM users WHERE lower(email) IN (:emails)`,
  );
  for (const sql of statements) await qi.sequelize.query(sql, { replacements, transaction, type: QueryTypes.DELETE });
}

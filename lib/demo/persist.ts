import bcrypt from "bcryptjs";
import { QueryTypes, type QueryInterface, type QueryOptions, type Transaction } from "sequelize";
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
  const inserted = (await qi.bulkInsert(table, rows.map(toColumns), returning(transaction, ["id", keyColumn]))) as unknown as Array<
    Record<string, unknown>
  >;
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

export type InsertCounts = Record<"manufacturers" | "boardModels" | "boardRevisions" | "boardAliases" | "firmwareFamilies" | "users" | "submissions", number>;

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
  const revisionReturned = (await qi.bulkInsert("board_revisions", revisionRows.map(toColumns), returning(transaction, ["id", "board_model_id", "label"]))) as unknown as Array<{ id: number; board_model_id: number; label: string }>;
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

  const submissionRows = s.submissions.map(({ revisionKey, familySlug, anomaly: _anomaly, ...cols }) =>
    toColumns({
      ...cols,
      boardRevisionId: idOf(revisionIds, revisionKey, "board revision"),
      firmwareFamilyId: idOf(familyIds, familySlug, "firmware family"),
    }),
  );
  for (let i = 0; i < submissionRows.length; i += SUBMISSION_CHUNK) {
    await qi.bulkInsert("submissions", submissionRows.slice(i, i + SUBMISSION_CHUNK), { transaction });
  }

  return {
    manufacturers: makerIds.size,
    boardModels: boardIds.size,
    boardRevisions: revisionIds.size,
    boardAliases: s.boardAliases.length,
    firmwareFamilies: familyIds.size,
    users: users.length,
    submissions: submissionRows.length,
  };
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
  // derived statistics (migration 20261202000900) point at revisions and families: drop those first
  const [{ exists }] = await qi.sequelize.query<{ exists: boolean }>("SELECT to_regclass('board_stats') IS NOT NULL AS exists", {
    transaction,
    type: QueryTypes.SELECT,
  });
  if (exists) statements.push(`DELETE FROM board_stats WHERE board_revision_id IN (${revisions}) OR firmware_family_id IN (${families})`);
  statements.push(
    `DELETE FROM submissions WHERE board_revision_id IN (${revisions})
       OR firmware_family_id IN (${families})
       OR contributor_id IN (SELECT id FROM users WHERE lower(email) IN (:emails))`,
    `DELETE FROM board_aliases WHERE board_model_id IN (${boards})`,
    `DELETE FROM board_revisions WHERE board_model_id IN (${boards})`,
    `DELETE FROM board_models WHERE id IN (${boards})`,
    `DELETE FROM manufacturers WHERE slug IN (:makers)`,
    `DELETE FROM firmware_families WHERE slug IN (:families)`,
    `DELETE FROM users WHERE lower(email) IN (:emails)`,
  );
  for (const sql of statements) await qi.sequelize.query(sql, { replacements, transaction, type: QueryTypes.DELETE });
}

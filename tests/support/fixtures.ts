import type { Sequelize, Transaction } from "sequelize";
import { QueryTypes } from "sequelize";

// Minimal rows for integration tests that build their own data on a migrated (empty) database.
// Names here are test scaffolding, not part of the demo scenario.
export type Fixture = { familyId: number; revisionIds: number[]; userId: string; boardId: number };

export async function insertFixture(sequelize: Sequelize, opts: { revisions?: number } = {}): Promise<Fixture> {
  const one = async <T extends object>(sql: string, bind: unknown[] = []): Promise<T> => {
    const [row] = await sequelize.query<T>(sql, { bind, type: QueryTypes.SELECT });
    if (!row) throw new Error(`fixture insert returned no row: ${sql}`);
    return row;
  };
  const maker = await one<{ id: number }>("INSERT INTO manufacturers (slug, name) VALUES ('fixture-maker', 'Fixture Maker') RETURNING id");
  const board = await one<{ id: number }>(
    "INSERT INTO board_models (manufacturer_id, slug, name, kind, mounting_pattern, max_cells) VALUES ($1, 'fixture-board', 'Fixture Board', 'flight_controller', '20x20', 6) RETURNING id",
    [maker.id],
  );
  const revisionIds: number[] = [];
  for (let i = 0; i < (opts.revisions ?? 1); i++) {
    const rev = await one<{ id: number }>("INSERT INTO board_revisions (board_model_id, label, position) VALUES ($1, $2, $3) RETURNING id", [
      board.id,
      `r${i + 1}`,
      i,
    ]);
    revisionIds.push(rev.id);
  }
  const family = await one<{ id: number }>(`
    INSERT INTO firmware_families (slug, name, voltage_scale_unit, voltage_scale_step, voltage_scale_response, voltage_scale_min, voltage_scale_max,
      current_scale_unit, current_scale_step, current_scale_response, current_scale_min, current_scale_max,
      current_offset_unit, current_offset_step, current_offset_min, current_offset_max)
    VALUES ('fixture-fw', 'Fixture FW', 'V/V', 0.1, 'proportional', 10, 2550, 'mV/A', 0.1, 'inverse', 1, 100000, 'mV', 1, -10000, 10000) RETURNING id`);
  const user = await one<{ id: string }>("INSERT INTO users (name, email) VALUES ('Fixture Person', 'fixture@example.test') RETURNING id");
  return { familyId: family.id, revisionIds, userId: user.id, boardId: board.id };
}

export type SubmissionValues = {
  voltageScale?: number | null;
  currentScale?: number | null;
  currentOffset?: number | null;
  method?: string;
  status?: string;
};

export async function insertSubmissions(
  sequelize: Sequelize,
  fx: Fixture,
  revisionId: number,
  rows: SubmissionValues[],
  transaction?: Transaction,
): Promise<void> {
  if (rows.length === 0) return;
  const bind: unknown[] = [];
  const tuples = rows.map((r) => {
    const values = [
      revisionId,
      fx.familyId,
      "1.0.0",
      fx.userId,
      "board_adc",
      r.method ?? "fly_recharge",
      r.voltageScale ?? null,
      r.currentScale ?? null,
      r.currentOffset ?? null,
      r.status ?? "approved",
    ];
    const start = bind.length;
    bind.push(...values);
    return `(${values.map((_, i) => `$${start + i + 1}`).join(", ")})`;
  });
  await sequelize.query(
    `INSERT INTO submissions (board_revision_id, firmware_family_id, firmware_version, contributor_id, sensing_source, method,
       voltage_scale, current_scale, current_offset, status) VALUES ${tuples.join(", ")}`,
    { bind, transaction },
  );
}

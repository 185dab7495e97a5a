import type { QueryInterface } from "sequelize";

// Every change of a published value, per (board revision, firmware family, quantity): the
// recommended setting, n, median, the median's interval and the confidence label as board_stats
// had them after the change, when, and the audit event that caused it (lib/published/history.ts).
// n = 0 records that the quantity stopped being published (its last approved value went). Rows
// with no event are baselines: what was published before the first recorded change of that
// quantity. Append-only, like audit_events: a revert adds rows, it never removes any.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE published_value_history (
      id                  serial PRIMARY KEY,
      board_revision_id   integer NOT NULL REFERENCES board_revisions(id) ON DELETE RESTRICT,
      firmware_family_id  integer NOT NULL REFERENCES firmware_families(id) ON DELETE RESTRICT,
      quantity            text NOT NULL CHECK (quantity IN ('voltage_scale', 'current_scale', 'current_offset')),
      recommended_value   double precision,
      n                   integer NOT NULL CHECK (n >= 0),
      median              double precision,
      ci_low              double precision,
      ci_high             double precision,
      confidence          text CHECK (confidence IN ('strong', 'fair', 'weak', 'too_few')),
      at                  timestamptz NOT NULL DEFAULT now(),
      caused_by_event_id  integer REFERENCES audit_events(id) ON DELETE RESTRICT,
      CHECK ((n = 0) = (recommended_value IS NULL) AND (n = 0) = (median IS NULL) AND (n = 0) = (confidence IS NULL)),
      CHECK ((ci_low IS NULL) = (ci_high IS NULL) AND (ci_low IS NULL OR ci_low <= ci_high)),
      CHECK (n > 0 OR ci_low IS NULL)
    )`);
  await queryInterface.sequelize.query(`
    CREATE INDEX published_value_history_group_idx ON published_value_history (board_revision_id, firmware_family_id, quantity, id DESC);
    CREATE INDEX published_value_history_event_idx ON published_value_history (caused_by_event_id) WHERE caused_by_event_id IS NOT NULL;
    CREATE INDEX published_value_history_family_idx ON published_value_history (firmware_family_id);`);
  await queryInterface.sequelize.query(`
    CREATE FUNCTION published_value_history_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'published_value_history is append-only: % is not allowed', TG_OP USING ERRCODE = 'insufficient_privilege';
    END $$;
    CREATE TRIGGER published_value_history_no_update_delete BEFORE UPDATE OR DELETE ON published_value_history
      FOR EACH ROW EXECUTE FUNCTION published_value_history_append_only();
    CREATE TRIGGER published_value_history_no_truncate BEFORE TRUNCATE ON published_value_history
      FOR EACH STATEMENT EXECUTE FUNCTION published_value_history_append_only();`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE published_value_history; DROP FUNCTION published_value_history_append_only();");
}

import type { QueryInterface } from "sequelize";

// Published statistics per (board revision, firmware family, quantity), over approved submissions
// only. Rows are derived data: lib/published refreshes a group inside the transaction that changes
// one of its approved submissions, and `npm run stats:rebuild` recomputes all of them. A group with
// no approved value has no row.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE board_stats (
      board_revision_id   integer NOT NULL REFERENCES board_revisions(id) ON DELETE RESTRICT,
      firmware_family_id  integer NOT NULL REFERENCES firmware_families(id) ON DELETE RESTRICT,
      quantity            text NOT NULL CHECK (quantity IN ('voltage_scale', 'current_scale', 'current_offset')),
      n                   integer NOT NULL CHECK (n >= 1),
      median              double precision NOT NULL,
      q1                  double precision NOT NULL,
      q3                  double precision NOT NULL,
      iqr                 double precision NOT NULL CHECK (iqr >= 0),
      mad                 double precision NOT NULL CHECK (mad >= 0),
      scaled_mad          double precision NOT NULL CHECK (scaled_mad >= 0),
      mean_abs_dev        double precision NOT NULL CHECK (mean_abs_dev >= 0),
      ci_low              double precision,
      ci_high             double precision,
      ci_coverage         double precision CHECK (ci_coverage > 0 AND ci_coverage <= 1),
      ci_lower_rank       integer,
      ci_upper_rank       integer,
      z_scale_rule        text NOT NULL CHECK (z_scale_rule IN ('mad', 'mean_abs_dev', 'no_spread', 'too_few')),
      outlier_count       integer NOT NULL CHECK (outlier_count >= 0),
      tukey_count         integer NOT NULL CHECK (tukey_count >= 0),
      method_counts       jsonb NOT NULL DEFAULT '{}'::jsonb,
      recommended_value   double precision NOT NULL,
      confidence          text NOT NULL CHECK (confidence IN ('strong', 'fair', 'weak', 'too_few')),
      last_value_at       timestamptz NOT NULL,
      computed_at         timestamptz NOT NULL DEFAULT now(),
      PRIMARY KEY (board_revision_id, firmware_family_id, quantity),
      CHECK (q1 <= median AND median <= q3),
      CHECK ((ci_low IS NULL) = (ci_high IS NULL) AND (ci_low IS NULL OR ci_low <= ci_high))
    )`);
  await queryInterface.sequelize.query("CREATE INDEX board_stats_family_idx ON board_stats (firmware_family_id)");
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE board_stats");
}

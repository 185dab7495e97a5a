import type { QueryInterface } from "sequelize";

// A per-board change stamp for the published values (lib/published/board-values.ts).
//
// board_models.values_version holds the id of the transaction that last changed anything the
// board's values response is built from (pg_current_xact_id(): 64-bit, never reused, so two
// committed states of a board never share one). It replaces a stamp query whose five subqueries
// counted the board's approved submissions on every revalidation (docs/benchmarks.md, finding 4).
//
// Who sets it, always inside the transaction that makes the change:
//  - refreshGroups (lib/published/refresh.ts) for the boards whose board_stats it rewrote; every
//    change to an approved submission refreshes its group in the same transaction;
//  - the triggers below, for the catalogue rows shown in the response: the board row itself (any
//    UPDATE), its maker's name and slug, its revisions, and the firmware families (units and the
//    list of slugs, shared by every board: a change there bumps them all; it is rare).
//
// The index serves the cache's change feed: "which boards changed in transactions I may not
// have seen yet" (values_version >= the oldest transaction running at the previous look).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    ALTER TABLE board_models ADD COLUMN values_version xid8 NOT NULL DEFAULT pg_current_xact_id();
    CREATE INDEX board_models_values_version_idx ON board_models (values_version);

    CREATE FUNCTION board_models_bump_values_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      NEW.values_version := pg_current_xact_id();
      RETURN NEW;
    END $$;
    CREATE TRIGGER board_models_values_version BEFORE UPDATE ON board_models
      FOR EACH ROW EXECUTE FUNCTION board_models_bump_values_version();

    CREATE FUNCTION manufacturers_bump_values_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      UPDATE board_models SET values_version = pg_current_xact_id() WHERE manufacturer_id = NEW.id;
      RETURN NULL;
    END $$;
    CREATE TRIGGER manufacturers_values_version AFTER UPDATE ON manufacturers
      FOR EACH ROW WHEN (OLD.slug IS DISTINCT FROM NEW.slug OR OLD.name IS DISTINCT FROM NEW.name)
      EXECUTE FUNCTION manufacturers_bump_values_version();

    CREATE FUNCTION board_revisions_bump_values_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      IF TG_OP IN ('UPDATE', 'DELETE') THEN
        UPDATE board_models SET values_version = pg_current_xact_id() WHERE id = OLD.board_model_id;
      END IF;
      IF TG_OP IN ('INSERT', 'UPDATE') THEN
        UPDATE board_models SET values_version = pg_current_xact_id() WHERE id = NEW.board_model_id;
      END IF;
      RETURN NULL;
    END $$;
    CREATE TRIGGER board_revisions_values_version AFTER INSERT OR UPDATE OR DELETE ON board_revisions
      FOR EACH ROW EXECUTE FUNCTION board_revisions_bump_values_version();

    CREATE FUNCTION firmware_families_bump_values_version() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      UPDATE board_models SET values_version = pg_current_xact_id();
      RETURN NULL;
    END $$;
    CREATE TRIGGER firmware_families_values_version AFTER INSERT OR UPDATE OR DELETE ON firmware_families
      FOR EACH STATEMENT EXECUTE FUNCTION firmware_families_bump_values_version();`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    DROP TRIGGER firmware_families_values_version ON firmware_families;
    DROP FUNCTION firmware_families_bump_values_version();
    DROP TRIGGER board_revisions_values_version ON board_revisions;
    DROP FUNCTION board_revisions_bump_values_version();
    DROP TRIGGER manufacturers_values_version ON manufacturers;
    DROP FUNCTION manufacturers_bump_values_version();
    DROP TRIGGER board_models_values_version ON board_models;
    DROP FUNCTION board_models_bump_values_version();
    ALTER TABLE board_models DROP COLUMN values_version;`);
}

import type { QueryInterface } from "sequelize";

// The moderation audit log: who did what to which submission or user, the state before and after,
// the reason they gave, and when. Append-only: a trigger refuses UPDATE, DELETE and TRUNCATE, so a
// decision can only be undone by a new event ('revert', pointing at the one it undoes), never by
// rewriting history. actor_id is NULL only for what the system does on its own (auto-approval of a
// trusted contributor). before/after hold the fields the action changed (lib/moderation/audit.ts).
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE audit_events (
      id                serial PRIMARY KEY,
      actor_id          uuid REFERENCES users(id) ON DELETE RESTRICT,
      action            text NOT NULL CHECK (action IN ('approve', 'reject', 'request_changes', 'auto_approve', 'revert', 'user_update')),
      entity_type       text NOT NULL CHECK (entity_type IN ('submission', 'user')),
      submission_id     integer REFERENCES submissions(id) ON DELETE RESTRICT,
      target_user_id    uuid REFERENCES users(id) ON DELETE RESTRICT,
      before            jsonb NOT NULL CHECK (jsonb_typeof(before) = 'object'),
      after             jsonb NOT NULL CHECK (jsonb_typeof(after) = 'object'),
      reason            text CHECK (reason IS NULL OR length(btrim(reason)) BETWEEN 1 AND 4000),
      -- one revert per event: undoing a revert is a revert of the revert
      reverts_event_id  integer UNIQUE REFERENCES audit_events(id) ON DELETE RESTRICT,
      at                timestamptz NOT NULL DEFAULT now(),
      CHECK ((entity_type = 'submission') = (submission_id IS NOT NULL)),
      CHECK ((entity_type = 'user') = (target_user_id IS NOT NULL)),
      CHECK ((action = 'user_update') = (entity_type = 'user')),
      CHECK ((action = 'revert') = (reverts_event_id IS NOT NULL)),
      CHECK ((actor_id IS NULL) = (action = 'auto_approve')),
      -- a rejection and a request for changes always say why
      CHECK (action NOT IN ('reject', 'request_changes', 'revert') OR reason IS NOT NULL)
    )`);
  await queryInterface.sequelize.query(`
    CREATE INDEX audit_events_at_idx ON audit_events (at DESC, id DESC);
    CREATE INDEX audit_events_submission_idx ON audit_events (submission_id, at DESC) WHERE submission_id IS NOT NULL;
    CREATE INDEX audit_events_target_user_idx ON audit_events (target_user_id, at DESC) WHERE target_user_id IS NOT NULL;
    CREATE INDEX audit_events_actor_idx ON audit_events (actor_id, at DESC) WHERE actor_id IS NOT NULL;
    CREATE INDEX audit_events_action_idx ON audit_events (action, at DESC);`);
  await queryInterface.sequelize.query(`
    CREATE FUNCTION audit_events_append_only() RETURNS trigger LANGUAGE plpgsql AS $$
    BEGIN
      RAISE EXCEPTION 'audit_events is append-only: % is not allowed; record a new event instead', TG_OP
        USING ERRCODE = 'insufficient_privilege';
    END $$;
    CREATE TRIGGER audit_events_no_update_delete BEFORE UPDATE OR DELETE ON audit_events
      FOR EACH ROW EXECUTE FUNCTION audit_events_append_only();
    CREATE TRIGGER audit_events_no_truncate BEFORE TRUNCATE ON audit_events
      FOR EACH STATEMENT EXECUTE FUNCTION audit_events_append_only();`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE audit_events; DROP FUNCTION audit_events_append_only();");
}

import type { QueryInterface } from "sequelize";

// Photos a contributor uploads as evidence for a submission (a meter beside the OSD, the charger's
// mAh readout). A photo is uploaded while the form is being filled in, so submission_id stays NULL
// until the submission is created. The image bytes live in the object store under object_key,
// re-encoded without metadata; the numbers here describe the stored object, and the CHECKs repeat
// lib/storage/limits.ts. Nothing is hard-deleted: removal sets deleted_at.
export async function up(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query(`
    CREATE TABLE evidence_photos (
      id             uuid PRIMARY KEY DEFAULT gen_random_uuid(),
      uploader_id    uuid NOT NULL REFERENCES users(id) ON DELETE RESTRICT,
      submission_id  integer REFERENCES submissions(id) ON DELETE RESTRICT,
      object_key     text NOT NULL UNIQUE CHECK (object_key ~ '^[a-z0-9-]+/[0-9a-f-]{36}\\.(jpg|webp)$'),
      content_type   text NOT NULL CHECK (content_type IN ('image/jpeg', 'image/webp')),
      byte_size      integer NOT NULL CHECK (byte_size BETWEEN 1 AND 8388608),
      width          integer NOT NULL CHECK (width >= 1),
      height         integer NOT NULL CHECK (height >= 1),
      sha256         text NOT NULL CHECK (sha256 ~ '^[0-9a-f]{64}$'),
      created_at     timestamptz NOT NULL DEFAULT now(),
      deleted_at     timestamptz CHECK (deleted_at IS NULL OR deleted_at >= created_at),
      CHECK (width::bigint * height <= 40000000)
    )`);
  // uploader: "my photos" and the unattached-photo quota; submission: a submission's evidence
  await queryInterface.sequelize.query(`
    CREATE INDEX evidence_photos_uploader_created_idx ON evidence_photos (uploader_id, created_at DESC);
    CREATE INDEX evidence_photos_submission_idx ON evidence_photos (submission_id) WHERE submission_id IS NOT NULL;`);
}

export async function down(queryInterface: QueryInterface) {
  await queryInterface.sequelize.query("DROP TABLE evidence_photos");
}

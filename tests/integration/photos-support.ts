import { randomBytes } from "node:crypto";
import { QueryTypes, type Sequelize } from "sequelize";
import { beforeAll } from "vitest";
import { POST } from "@/app/api/v1/photos/route";
import { DELETE, GET } from "@/app/api/v1/photos/[id]/route";
import { resetEnvCache } from "@/lib/env";
import { listObjectKeys } from "@/lib/storage/object-store";
import { callRoute, withCookie } from "@/tests/support/auth";
import { insertFixture, type Fixture } from "@/tests/support/fixtures";

// Shared by tests/integration/photos-*.test.ts: calls of the photo routes as Next makes them, a
// bucket of the file's own (s3rver is shared by every test file), and small SQL helpers.

/**
 * Points the object store at a fresh bucket for this test file, which lib/storage then creates
 * on first use, so that object counts see only this file's writes.
 */
export function setupOwnBucket(): void {
  beforeAll(() => {
    process.env.S3_BUCKET = `photos-test-${randomBytes(4).toString("hex")}`;
    resetEnvCache();
  });
}

const BASE = "http://test.local/api/v1/photos";
const ctx = (id: string) => ({ params: Promise.resolve({ id }) });

export function uploadForm(bytes: Uint8Array, opts: { name?: string; type?: string } = {}): Request {
  const form = new FormData();
  form.append("file", new File([bytes as BlobPart], opts.name ?? "evidence.jpg", { type: opts.type ?? "image/jpeg" }));
  return new Request(BASE, { method: "POST", body: form });
}

export function upload(cookie: string, request: Request): Promise<Response> {
  return callRoute(POST, withCookie(request, cookie));
}

export function getPhoto(cookie: string, id: string, headers: Record<string, string> = {}): Promise<Response> {
  return callRoute(GET, withCookie(new Request(`${BASE}/${id}`, { headers }), cookie), ctx(id));
}

export function deletePhoto(cookie: string, id: string): Promise<Response> {
  return callRoute(DELETE, withCookie(new Request(`${BASE}/${id}`, { method: "DELETE" }), cookie), ctx(id));
}

/** Rows (removed ones included) and stored objects: what a refused upload must leave unchanged. */
export async function writes(sequelize: Sequelize): Promise<{ rows: number; objects: number }> {
  const [{ n }] = await sequelize.query<{ n: number }>("SELECT count(*)::int AS n FROM evidence_photos", { type: QueryTypes.SELECT });
  return { rows: n, objects: (await listObjectKeys()).length };
}

export async function photoRow(sequelize: Sequelize, id: string) {
  const [row] = await sequelize.query<{ object_key: string; submission_id: number | null; deleted_at: Date | null; uploader_id: string; sha256: string }>(
    "SELECT object_key, submission_id, deleted_at, uploader_id, sha256 FROM evidence_photos WHERE id = $1",
    { bind: [id], type: QueryTypes.SELECT },
  );
  return row;
}

/** A submission by `contributorId` in the given status, on the fixture's board and family. */
export async function insertSubmission(sequelize: Sequelize, fx: Fixture, contributorId: string, status = "pending"): Promise<number> {
  const [{ id }] = await sequelize.query<{ id: number }>(
    `INSERT INTO submissions (board_revision_id, firmware_family_id, firmware_version, contributor_id, sensing_source, method, voltage_scale, status)
     VALUES ($1, $2, '1.0.0', $3, 'board_adc', 'multimeter', 110, $4) RETURNING id`,
    { bind: [fx.revisionIds[0], fx.familyId, contributorId, status], type: QueryTypes.SELECT },
  );
  return id;
}

export async function attachDirectly(sequelize: Sequelize, photoId: string, submissionId: number): Promise<void> {
  await sequelize.query("UPDATE evidence_photos SET submission_id = $1 WHERE id = $2", { bind: [submissionId, photoId] });
}

export { insertFixture };

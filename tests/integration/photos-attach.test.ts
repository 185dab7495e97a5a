import { beforeAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { ApiError } from "@/lib/http/errors";
import { attachPhotosToSubmission, listSubmissionPhotos } from "@/lib/storage/evidence-photos";
import { MAX_PHOTOS_PER_SUBMISSION } from "@/lib/storage/limits";
import { db } from "@/models";
import { sessionCookieFor, testAccount } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import type { Fixture } from "@/tests/support/fixtures";
import { jpegWithGps } from "@/tests/unit/storage/photo-fixtures";
import { deletePhoto, getPhoto, insertFixture, insertSubmission, photoRow, upload, uploadForm, setupOwnBucket } from "./photos-support";

// attachPhotosToSubmission, as the submission form calls it inside the transaction that creates
// the submission: only the caller's own, live, unattached photos, all or none.
setupTestDatabase("migrated");
setupOwnBucket();

let fx: Fixture;
let me: { id: string; cookie: string };
let other: { id: string; cookie: string };

beforeAll(async () => {
  fx = await insertFixture(db());
  me = { id: (await testAccount("contributor")).id, cookie: await sessionCookieFor("contributor") };
  const email = "attach-other@auth.test";
  other = { id: (await testAccount("contributor", { email })).id, cookie: await sessionCookieFor("contributor", { email }) };
});

async function photoOf(cookie: string): Promise<string> {
  const res = await upload(cookie, uploadForm(await jpegWithGps()));
  expect(res.status).toBe(201);
  return ((await res.json()) as { id: string }).id;
}

/** Runs the attach in its own transaction, as the caller would, and returns what it threw. */
async function attachError(photoIds: string[], submissionId: number, userId = me.id): Promise<ApiError> {
  const error = await db()
    .transaction((t) => attachPhotosToSubmission(photoIds, submissionId, userId, t))
    .then(
      () => undefined,
      (e: unknown) => e,
    );
  expect(error).toBeInstanceOf(ApiError);
  expect((error as ApiError).status).toBe(400);
  expect(Object.keys((error as ApiError).fieldErrors)).toEqual(["photoIds"]);
  return error as ApiError;
}

describe("attachPhotosToSubmission", () => {
  it("attaches the caller's photos in the caller's transaction and lists them for the submission", async () => {
    const sequelize = db();
    const submission = await insertSubmission(sequelize, fx, me.id);
    const ids = [await photoOf(me.cookie), await photoOf(me.cookie)];
    const attached = await sequelize.transaction((t) => attachPhotosToSubmission([...ids, ids[0]], submission, me.id, t));
    expect(attached.map((p) => p.id).sort()).toEqual([...ids].sort());
    for (const id of ids) expect((await photoRow(sequelize, id)).submission_id).toBe(submission);
    expect((await listSubmissionPhotos(submission)).map((p) => p.id).sort()).toEqual([...ids].sort());
  });

  it("photos already on this submission are accepted again (an edit resends its list), and counted once", async () => {
    const sequelize = db();
    const submission = await insertSubmission(sequelize, fx, me.id);
    const first = await photoOf(me.cookie);
    await sequelize.transaction((t) => attachPhotosToSubmission([first], submission, me.id, t));
    const second = await photoOf(me.cookie);
    const again = await sequelize.transaction((t) => attachPhotosToSubmission([first, second], submission, me.id, t));
    expect(again.map((p) => p.id)).toEqual([first, second]);
    expect((await listSubmissionPhotos(submission)).map((p) => p.id).sort()).toEqual([first, second].sort());
  });

  it("an empty list attaches nothing", async () => {
    const submission = await insertSubmission(db(), fx, me.id);
    expect(await db().transaction((t) => attachPhotosToSubmission([], submission, me.id, t))).toEqual([]);
  });

  it("all or none: with one bad id, the caller's rollback leaves every photo unattached", async () => {
    const sequelize = db();
    const submission = await insertSubmission(sequelize, fx, me.id);
    const mine = await photoOf(me.cookie);
    const theirs = await photoOf(other.cookie);
    const error = await attachError([mine, theirs], submission);
    expect(error.fieldErrors.photoIds[0]).toMatch(/One photo is no longer available/);
    expect((await photoRow(sequelize, mine)).submission_id).toBeNull();
    expect((await photoRow(sequelize, theirs)).submission_id).toBeNull();
  });

  it("refuses photos already on a submission, removed ones and malformed ids", async () => {
    const sequelize = db();
    const first = await insertSubmission(sequelize, fx, me.id);
    const second = await insertSubmission(sequelize, fx, me.id);
    const taken = await photoOf(me.cookie);
    await sequelize.transaction((t) => attachPhotosToSubmission([taken], first, me.id, t));
    expect((await attachError([taken], second)).fieldErrors.photoIds[0]).toMatch(/already part of another submission/);

    const removed = await photoOf(me.cookie);
    expect((await deletePhoto(me.cookie, removed)).status).toBe(204);
    expect((await attachError([removed], second)).fieldErrors.photoIds[0]).toMatch(/removed/);

    expect((await attachError(["nope", "1; DROP TABLE x"], second)).fieldErrors.photoIds[0]).toMatch(/Not a photo id: nope/);
  });

  it(`caps a submission at ${MAX_PHOTOS_PER_SUBMISSION} photos`, async () => {
    const sequelize = db();
    const submission = await insertSubmission(sequelize, fx, me.id);
    const ids: string[] = [];
    for (let i = 0; i <= MAX_PHOTOS_PER_SUBMISSION; i++) ids.push(await photoOf(me.cookie));
    expect((await attachError(ids, submission)).fieldErrors.photoIds[0]).toMatch(new RegExp(`at most ${MAX_PHOTOS_PER_SUBMISSION} photos; remove 1`));
    await sequelize.transaction((t) => attachPhotosToSubmission(ids.slice(0, MAX_PHOTOS_PER_SUBMISSION), submission, me.id, t));
    expect((await attachError(ids.slice(-1), submission)).fieldErrors.photoIds[0]).toMatch(/remove 1/);
  });

  it("a submission that is not the user's is a programming error, not a 400", async () => {
    const submission = await insertSubmission(db(), fx, other.id);
    const mine = await photoOf(me.cookie);
    await expect(db().transaction((t) => attachPhotosToSubmission([mine], submission, me.id, t))).rejects.toThrow(/does not belong/);
  });

  it("once attached to a pending submission, the photo is still the uploader's to see and to remove", async () => {
    const sequelize = db();
    const submission = await insertSubmission(sequelize, fx, me.id);
    const id = await photoOf(me.cookie);
    await sequelize.transaction((t) => attachPhotosToSubmission([id], submission, me.id, t));
    expect((await getPhoto(other.cookie, id)).status).toBe(404);
    expect((await getPhoto(me.cookie, id)).status).toBe(200);
    expect((await deletePhoto(me.cookie, id)).status).toBe(204);
    expect(await listSubmissionPhotos(submission)).toEqual([]);
  });
});

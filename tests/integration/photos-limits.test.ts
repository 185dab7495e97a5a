import sharp from "sharp";
import { QueryTypes } from "sequelize";
import { describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { MAX_UNATTACHED_PHOTOS_PER_USER } from "@/lib/storage/limits";
import { db } from "@/models";
import { sessionCookieFor, testAccount } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { jpegWithGps } from "@/tests/unit/storage/photo-fixtures";
import { setupOwnBucket, upload, uploadForm, writes } from "./photos-support";

// Issue 12, finding 3: a 38 KB PNG of 6300 × 6300 pixels was accepted after 4.4 s and 189 MB
// (three at once took 549 MB), and the cap of 30 photos outside a submission was check-then-
// insert, so 16 uploads at once took a person from 26 to 37.
setupTestDatabase("migrated");
setupOwnBucket();

/** A real, decodable 8-bit grey PNG of one flat shade: deflate packs it about 800 to 1 (under 50 kB at 6300 × 6300). */
async function blankPng(width: number, height: number): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 250, g: 250, b: 250 } } })
    .toColourspace("b-w")
    .png({ compressionLevel: 9 })
    .toBuffer();
}

const unattached = async (uploaderId: string) =>
  (
    await db().query<{ n: number }>("SELECT count(*)::int AS n FROM evidence_photos WHERE uploader_id = $1 AND submission_id IS NULL AND deleted_at IS NULL", {
      bind: [uploaderId],
      type: QueryTypes.SELECT,
    })
  )[0].n;

describe("image bombs are refused from the header, before decoding", () => {
  it("a PNG under 64 kB of 6300 × 6300 (39.7 megapixels) is refused quickly with the size named on `file`", async () => {
    const bomb = await blankPng(6300, 6300);
    expect(bomb.byteLength).toBeLessThan(64 * 1024);
    const cookie = await sessionCookieFor("contributor", { email: "bomber@auth.test" });
    const before = await writes(db());
    const started = performance.now();
    const res = await upload(cookie, uploadForm(bomb, { name: "meter.png", type: "image/png" }));
    const elapsed = performance.now() - started;
    expect(res.status).toBe(400);
    const { error } = await res.json();
    expect(Object.keys(error.fieldErrors)).toEqual(["file"]);
    expect(error.fieldErrors.file[0]).toMatch(/6300 × 6300 pixels \(40 megapixels\); the limit is 24 megapixels/);
    // decoding it took 4.4 s; reading the header takes milliseconds (generous for a loaded machine)
    expect(elapsed).toBeLessThan(1500);
    expect(await writes(db())).toEqual(before);
  });

  it("three bombs at once are all refused quickly too", async () => {
    const bomb = await blankPng(6300, 6300);
    const cookie = await sessionCookieFor("contributor", { email: "bomber@auth.test" });
    const started = performance.now();
    const answers = await Promise.all([1, 2, 3].map(() => upload(cookie, uploadForm(bomb, { name: "meter.png", type: "image/png" }))));
    expect(answers.map((r) => r.status)).toEqual([400, 400, 400]);
    expect(performance.now() - started).toBeLessThan(3000);
  });

  it("a photo just inside the pixel limit is still accepted", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "bomber@auth.test" });
    const res = await upload(cookie, uploadForm(await blankPng(4000, 3000), { name: "meter.png", type: "image/png" }));
    expect(res.status).toBe(201);
    expect(await res.json()).toMatchObject({ width: 4000, height: 3000 });
  });
});

describe("the cap on photos outside a submission holds under concurrent uploads", () => {
  it("16 uploads at once from a person holding 26 end at 30; the other 12 get a 400 naming `file`, and leave no object", async () => {
    const sequelize = db();
    const account = await testAccount("contributor", { email: "racer@auth.test" });
    await sequelize.query(
      `INSERT INTO evidence_photos (uploader_id, object_key, content_type, byte_size, width, height, sha256)
       SELECT $1, 'evidence/' || gen_random_uuid() || '.jpg', 'image/jpeg', 100, 10, 10, repeat('a', 64) FROM generate_series(1, 26)`,
      { bind: [account.id] },
    );
    const cookie = await sessionCookieFor("contributor", { email: "racer@auth.test" });
    const before = await writes(sequelize);
    const photo = await jpegWithGps();
    const answers = await Promise.all(Array.from({ length: 16 }, () => upload(cookie, uploadForm(photo))));
    const statuses = answers.map((r) => r.status).sort();
    expect(statuses.filter((s) => s === 201)).toHaveLength(MAX_UNATTACHED_PHOTOS_PER_USER - 26);
    expect(statuses.filter((s) => s === 400)).toHaveLength(12);
    for (const res of answers.filter((r) => r.status === 400)) {
      expect((await res.json()).error.fieldErrors.file[0]).toMatch(/not yet part of a submission \(the limit is 30\)/);
    }
    expect(await unattached(account.id)).toBe(MAX_UNATTACHED_PHOTOS_PER_USER);
    // 4 new rows and their 4 objects; a refused upload's object was removed again
    expect(await writes(sequelize)).toEqual({ rows: before.rows + 4, objects: before.objects + 4 });
  });
});

import { createHash } from "node:crypto";
import sharp from "sharp";
import { beforeAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { MAX_PHOTO_BYTES } from "@/lib/storage/limits";
import { getObjectBytes, listObjectKeys } from "@/lib/storage/object-store";
import { PRIVATE_PHOTO_CACHE_CONTROL, PUBLIC_PHOTO_CACHE_CONTROL } from "@/lib/storage/photo-response";
import { db } from "@/models";
import { ANONYMOUS, sessionCookieFor, testAccount } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import type { Fixture } from "@/tests/support/fixtures";
import {
  BLUE,
  GPS_DATUM_MARKER,
  METADATA_MARKER,
  RED,
  SCRIPT,
  SVG,
  gif,
  jpegWithGps,
  near,
  pixelAt,
  pngClaiming,
  pngWithAlpha,
} from "@/tests/unit/storage/photo-fixtures";
import { attachDirectly, deletePhoto, getPhoto, insertFixture, insertSubmission, photoRow, upload, uploadForm, setupOwnBucket, writes } from "./photos-support";

// POST/GET/DELETE /api/v1/photos against a migrated database and the S3 fake that npm test runs,
// each file in a bucket of its own.
setupTestDatabase("migrated");
setupOwnBucket();

let fx: Fixture; // a board revision and firmware family for the submissions photos get attached to
beforeAll(async () => {
  fx = await insertFixture(db());
});

type Uploaded = { id: string; width: number; height: number; byteSize: number };

async function uploaded(cookie: string, bytes?: Uint8Array): Promise<Uploaded> {
  const res = await upload(cookie, uploadForm(bytes ?? (await jpegWithGps())));
  expect(res.status).toBe(201);
  return res.json();
}

const otherContributor = () => sessionCookieFor("contributor", { email: "second-contributor@auth.test", name: "Second contributor" });

describe("POST /api/v1/photos", () => {
  it("stores a photo with EXIF and GPS stripped: the object in the bucket has no exif/gps/icc/xmp, and its pixels", async () => {
    const cookie = await sessionCookieFor("contributor");
    const input = await jpegWithGps();
    const res = await upload(cookie, uploadForm(input));
    expect(res.status).toBe(201);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const body = (await res.json()) as Uploaded;
    expect(Object.keys(body).sort()).toEqual(["byteSize", "height", "id", "width"]);
    expect(res.headers.get("location")).toBe(`/api/v1/photos/${body.id}`);
    expect([body.width, body.height]).toEqual([20, 40]); // EXIF orientation 6 applied

    // download the stored object straight from the store, not through our handler
    const row = await photoRow(db(), body.id);
    const stored = await getObjectBytes(row.object_key);
    expect(stored).not.toBeNull();
    const meta = await sharp(stored!).metadata();
    expect(meta.format).toBe("jpeg");
    expect(meta.exif).toBeUndefined();
    expect(meta.icc).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(meta.iptc).toBeUndefined();
    const raw = Buffer.from(stored!);
    for (const marker of ["Exif\0\0", GPS_DATUM_MARKER, METADATA_MARKER, "ICC_PROFILE", "<x:xmpmeta"])
      expect(raw.includes(Buffer.from(marker)), marker).toBe(false);
    // the pixels are still there, upright
    expect([meta.width, meta.height]).toEqual([20, 40]);
    expect(near(await pixelAt(stored!, 10, 5), RED)).toBe(true);
    expect(near(await pixelAt(stored!, 10, 35), BLUE)).toBe(true);
    // what the database says matches the object
    expect(body.byteSize).toBe(stored!.byteLength);
    expect(row.sha256).toBe(createHash("sha256").update(stored!).digest("hex"));
  });

  it("accepts the raw body with a Content-Type, and PNG becomes WebP", async () => {
    const cookie = await sessionCookieFor("contributor");
    const bytes = await pngWithAlpha();
    const res = await upload(
      cookie,
      new Request("http://test.local/api/v1/photos", { method: "POST", body: bytes as BodyInit, headers: { "content-type": "image/png" } }),
    );
    expect(res.status).toBe(201);
    const { id } = (await res.json()) as Uploaded;
    const got = await getPhoto(cookie, id);
    expect(got.headers.get("content-type")).toBe("image/webp");
  });

  it("authorisation: anonymous 401; contributor, moderator and admin may upload", async () => {
    for (const [who, cookie, status] of [
      ["anonymous", ANONYMOUS, 401],
      ["contributor", await sessionCookieFor("contributor"), 201],
      ["moderator", await sessionCookieFor("moderator"), 201],
      ["admin", await sessionCookieFor("admin"), 201],
    ] as const) {
      const res = await upload(cookie, uploadForm(await jpegWithGps()));
      expect(res.status, who).toBe(status);
      if (status === 401) expect((await res.json()).error.code).toBe("unauthorized");
    }
  });

  it("refused uploads write nothing: no row and no object, each with a field-level error on `file`", async () => {
    const sequelize = db();
    const cookie = await sessionCookieFor("contributor");
    const before = await writes(sequelize);
    const oversized = new Uint8Array(MAX_PHOTO_BYTES + 1);
    oversized.set(await jpegWithGps());
    const cases: Array<[string, string, Request, number, RegExp]> = [
      ["anonymous", ANONYMOUS, uploadForm(await jpegWithGps()), 401, /Sign in/],
      [
        "GIF named .jpg and declared image/jpeg",
        cookie,
        uploadForm(await gif(), { name: "photo.jpg", type: "image/jpeg" }),
        400,
        /not a JPEG, PNG or WebP image/,
      ],
      ["SVG declared image/png", cookie, uploadForm(SVG, { name: "x.png", type: "image/png" }), 400, /not a JPEG, PNG or WebP image/],
      ["a script declared image/jpeg", cookie, uploadForm(SCRIPT), 400, /not a JPEG, PNG or WebP image/],
      ["over 8 MB", cookie, uploadForm(oversized), 413, /8 MB/],
      ["a decompression bomb", cookie, uploadForm(await pngClaiming(20_000, 20_000), { name: "bomb.png", type: "image/png" }), 400, /megapixels/],
      ["no file at all", cookie, new Request("http://test.local/api/v1/photos", { method: "POST", body: new FormData() }), 400, /Choose a photo/],
    ];
    for (const [name, who, request, status, message] of cases) {
      const res = await upload(who, request);
      expect(res.status, name).toBe(status);
      const { error } = await res.json();
      if (status === 400 || status === 413) {
        expect(Object.keys(error.fieldErrors), name).toEqual(["file"]);
        expect(error.fieldErrors.file[0], name).toMatch(message);
      } else {
        expect(error.message, name).toMatch(message);
      }
    }
    expect(await writes(sequelize)).toEqual(before);
  });

  it("caps the photos one person may hold outside a submission", async () => {
    const sequelize = db();
    const account = await testAccount("contributor", { email: "hoarder@auth.test" });
    // 30 unattached rows, written directly: the cap counts rows, not objects
    await sequelize.query(
      `INSERT INTO evidence_photos (uploader_id, object_key, content_type, byte_size, width, height, sha256)
       SELECT $1, 'evidence/' || gen_random_uuid() || '.jpg', 'image/jpeg', 100, 10, 10, repeat('a', 64) FROM generate_series(1, 30)`,
      { bind: [account.id] },
    );
    const cookie = await sessionCookieFor("contributor", { email: "hoarder@auth.test" });
    const before = await writes(sequelize);
    const res = await upload(cookie, uploadForm(await jpegWithGps()));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fieldErrors.file[0]).toMatch(/30 photos not yet part of a submission/);
    expect(await writes(sequelize)).toEqual(before);
  });
});

describe("GET /api/v1/photos/{id}", () => {
  it("streams the stored bytes with the stored type, an ETag, nosniff and a sandboxing CSP; 304 on a matching If-None-Match", async () => {
    const cookie = await sessionCookieFor("contributor");
    const photo = await uploaded(cookie);
    const res = await getPhoto(cookie, photo.id);
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("image/jpeg");
    expect(res.headers.get("x-content-type-options")).toBe("nosniff");
    expect(res.headers.get("content-security-policy")).toContain("sandbox");
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect(bytes.byteLength).toBe(photo.byteSize);
    expect(Number(res.headers.get("content-length"))).toBe(photo.byteSize);
    const row = await photoRow(db(), photo.id);
    expect(Buffer.from(bytes).equals(Buffer.from((await getObjectBytes(row.object_key))!))).toBe(true);

    const etag = res.headers.get("etag")!;
    expect(etag).toBe(`"${row.sha256}"`);
    const again = await getPhoto(cookie, photo.id, { "if-none-match": etag });
    expect(again.status).toBe(304);
    expect(again.headers.get("cache-control")).toBe(PRIVATE_PHOTO_CACHE_CONTROL);
  });

  it("visibility: uploader and staff always; anyone once the submission is approved; otherwise 404 (never 403)", async () => {
    const sequelize = db();
    const uploaderCookie = await sessionCookieFor("contributor");
    const uploader = await testAccount("contributor");
    const viewers = {
      anonymous: ANONYMOUS,
      uploader: uploaderCookie,
      "another contributor": await otherContributor(),
      moderator: await sessionCookieFor("moderator"),
      admin: await sessionCookieFor("admin"),
    };
    const states: Record<string, { setup: (photoId: string) => Promise<void>; visible: Array<keyof typeof viewers>; cache: string }> = {
      unattached: { setup: async () => undefined, visible: ["uploader", "moderator", "admin"], cache: PRIVATE_PHOTO_CACHE_CONTROL },
      "pending submission": {
        setup: async (id) => attachDirectly(sequelize, id, await insertSubmission(sequelize, fx, uploader.id, "pending")),
        visible: ["uploader", "moderator", "admin"],
        cache: PRIVATE_PHOTO_CACHE_CONTROL,
      },
      "rejected submission": {
        setup: async (id) => attachDirectly(sequelize, id, await insertSubmission(sequelize, fx, uploader.id, "rejected")),
        visible: ["uploader", "moderator", "admin"],
        cache: PRIVATE_PHOTO_CACHE_CONTROL,
      },
      "approved submission": {
        setup: async (id) => attachDirectly(sequelize, id, await insertSubmission(sequelize, fx, uploader.id, "approved")),
        visible: ["anonymous", "uploader", "another contributor", "moderator", "admin"],
        cache: PUBLIC_PHOTO_CACHE_CONTROL,
      },
      removed: {
        setup: async (id) => void expect((await deletePhoto(uploaderCookie, id)).status).toBe(204),
        visible: ["moderator", "admin"],
        cache: PRIVATE_PHOTO_CACHE_CONTROL,
      },
    };
    for (const [state, { setup, visible, cache }] of Object.entries(states)) {
      const { id } = await uploaded(uploaderCookie);
      await setup(id);
      for (const [viewer, cookie] of Object.entries(viewers)) {
        const res = await getPhoto(cookie, id);
        const expected = visible.includes(viewer as keyof typeof viewers) ? 200 : 404;
        expect(res.status, `${state}, seen by ${viewer}`).toBe(expected);
        if (expected === 200) {
          expect(res.headers.get("cache-control"), `${state}, seen by ${viewer}`).toBe(cache);
          await res.arrayBuffer();
        } else {
          expect(res.headers.get("cache-control")).toBe("no-store");
          expect((await res.json()).error.code).toBe("not_found");
        }
      }
    }
  });

  it("a malformed or unknown id is the same 404", async () => {
    const cookie = await sessionCookieFor("admin");
    for (const id of ["not-a-uuid", "00000000-0000-4000-8000-000000000000", "'; DROP TABLE evidence_photos; --"]) {
      const res = await getPhoto(cookie, id);
      expect(res.status, id).toBe(404);
    }
  });
});

describe("DELETE /api/v1/photos/{id}", () => {
  it("authorisation: anonymous 401; each role may remove a photo it uploaded", async () => {
    const owner = await sessionCookieFor("contributor");
    const photo = await uploaded(owner);
    const anon = await deletePhoto(ANONYMOUS, photo.id);
    expect(anon.status).toBe(401);
    for (const role of ["contributor", "moderator", "admin"] as const) {
      const cookie = await sessionCookieFor(role);
      const own = await uploaded(cookie);
      expect((await deletePhoto(cookie, own.id)).status, role).toBe(204);
    }
  });

  it("someone else's photo: 404 when they cannot see it, 403 for staff who can", async () => {
    const owner = await sessionCookieFor("contributor");
    const photo = await uploaded(owner);
    expect((await deletePhoto(await otherContributor(), photo.id)).status).toBe(404);
    for (const role of ["moderator", "admin"] as const) {
      const res = await deletePhoto(await sessionCookieFor(role), photo.id);
      expect(res.status, role).toBe(403);
      expect((await res.json()).error.message).toMatch(/Only the person who uploaded/);
    }
    expect((await getPhoto(owner, photo.id)).status).toBe(200);
  });

  it("is a soft delete: the row keeps its data with deleted_at set, the object stays, the uploader then gets 404", async () => {
    const sequelize = db();
    const cookie = await sessionCookieFor("contributor");
    const photo = await uploaded(cookie);
    const objectsBefore = await listObjectKeys();
    expect((await deletePhoto(cookie, photo.id)).status).toBe(204);
    const row = await photoRow(sequelize, photo.id);
    expect(row.deleted_at).toBeInstanceOf(Date);
    expect(await listObjectKeys()).toEqual(objectsBefore);
    expect((await getPhoto(cookie, photo.id)).status).toBe(404);
    expect((await deletePhoto(cookie, photo.id)).status).toBe(404);
  });

  it("allowed while unattached or pending; refused with 409 once the submission was reviewed", async () => {
    const sequelize = db();
    const cookie = await sessionCookieFor("contributor");
    const me = await testAccount("contributor");
    for (const [status, expected] of [
      ["pending", 204],
      ["approved", 409],
      ["rejected", 409],
      ["changes_requested", 409],
    ] as const) {
      const photo = await uploaded(cookie);
      await attachDirectly(sequelize, photo.id, await insertSubmission(sequelize, fx, me.id, status));
      const res = await deletePhoto(cookie, photo.id);
      expect(res.status, status).toBe(expected);
      if (expected === 409) {
        expect((await res.json()).error.message).toMatch(/reviewed/);
        expect((await photoRow(sequelize, photo.id)).deleted_at, status).toBeNull();
      }
    }
  });
});

describe("other methods", () => {
  it("answer 405 with Allow", async () => {
    const { GET: listPhotos } = await import("@/app/api/v1/photos/route");
    const res = await listPhotos(new Request("http://test.local/api/v1/photos"), { params: Promise.resolve({}) });
    expect(res.status).toBe(405);
    expect(res.headers.get("allow")).toBe("POST");
  });
});

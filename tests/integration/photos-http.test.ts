import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { db, User } from "@/models";
import { ANONYMOUS, sessionCookieForAccount } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { GPS_DATUM_MARKER, gif, jpegWithGps } from "@/tests/unit/storage/photo-fixtures";

// The photo routes through the production build that npm test serves (SHUNTBOOK_TEST_APP_URL):
// what only the running app shows — the bundled file-type and sharp, the real multipart parser,
// the headers as they leave Next. The app's database is a clone of the seeded template, like this
// file's, so a seeded person's id is the same in both and a cookie made here signs in there.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;
setupTestDatabase("seeded");

async function seededCookie(email: string): Promise<string> {
  db();
  const user = await User.findOne({ where: { email } });
  if (!user) throw new Error(`the seeded demo has no ${email}`);
  return sessionCookieForAccount({ id: user.id, email: user.email, name: user.name, role: user.role });
}

function post(cookie: string, body: BodyInit, headers: Record<string, string> = {}) {
  return fetch(`${appUrl}/api/v1/photos`, { method: "POST", body, headers: { ...headers, ...(cookie ? { cookie } : {}) } });
}

function form(bytes: Uint8Array, name = "meter.jpg", type = "image/jpeg"): FormData {
  const f = new FormData();
  f.append("file", new File([bytes as BlobPart], name, { type }));
  return f;
}

describe.skipIf(!appUrl)("evidence photos served by next start", () => {
  it("upload, fetch back without EXIF/GPS, hidden from visitors, removed by the uploader", async () => {
    const cookie = await seededCookie("contributor@shuntbook.test");
    const res = await post(cookie, form(await jpegWithGps()));
    expect(res.status).toBe(201);
    const photo = (await res.json()) as { id: string; width: number; height: number; byteSize: number };
    expect([photo.width, photo.height]).toEqual([20, 40]);

    const got = await fetch(`${appUrl}/api/v1/photos/${photo.id}`, { headers: { cookie } });
    expect(got.status).toBe(200);
    expect(got.headers.get("content-type")).toBe("image/jpeg");
    expect(got.headers.get("cache-control")).toBe("private, no-cache");
    expect(got.headers.get("x-content-type-options")).toBe("nosniff");
    const bytes = Buffer.from(await got.arrayBuffer());
    expect(bytes.byteLength).toBe(photo.byteSize);
    const meta = await sharp(bytes).metadata();
    expect([meta.exif, meta.icc, meta.xmp]).toEqual([undefined, undefined, undefined]);
    expect(bytes.includes(Buffer.from(GPS_DATUM_MARKER))).toBe(false);

    const anonymous = await fetch(`${appUrl}/api/v1/photos/${photo.id}`);
    expect(anonymous.status).toBe(404);
    expect((await anonymous.json()).error.code).toBe("not_found");

    const removed = await fetch(`${appUrl}/api/v1/photos/${photo.id}`, { method: "DELETE", headers: { cookie } });
    expect(removed.status).toBe(204);
    expect((await fetch(`${appUrl}/api/v1/photos/${photo.id}`, { headers: { cookie } })).status).toBe(404);
  });

  it("refusals leave the app as JSON with the field named: anonymous 401, a GIF named .jpg 400, a huge body 413", async () => {
    const anon = await post(ANONYMOUS, form(await jpegWithGps()));
    expect(anon.status).toBe(401);
    const cookie = await seededCookie("contributor@shuntbook.test");
    const wrong = await post(cookie, form(await gif(), "photo.jpg"));
    expect(wrong.status).toBe(400);
    expect((await wrong.json()).error.fieldErrors.file[0]).toMatch(/not a JPEG, PNG or WebP image/);
    const huge = await post(cookie, new Uint8Array(9 * 1024 * 1024), { "content-type": "image/jpeg" });
    expect(huge.status).toBe(413);
    expect((await huge.json()).error.fieldErrors.file[0]).toMatch(/larger than 8 MB/);
  });
});

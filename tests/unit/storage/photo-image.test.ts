import sharp from "sharp";
import { describe, expect, it } from "vitest";
import { ApiError } from "@/lib/http/errors";
import { MAX_PHOTO_BYTES, MAX_PHOTO_PIXELS } from "@/lib/storage/limits";
import { sanitisePhoto, sniffPhotoType } from "@/lib/storage/photo-image";
import {
  BLUE,
  GPS_DATUM_MARKER,
  METADATA_MARKER,
  PDF,
  RED,
  SCRIPT,
  SVG,
  gif,
  jpegWithGps,
  near,
  pixelAt,
  pngClaiming,
  pngWithAlpha,
  tiff,
  webp,
} from "./photo-fixtures";

async function refusal(bytes: Uint8Array): Promise<string> {
  const error = await sanitisePhoto(bytes).then(
    () => undefined,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(ApiError);
  const api = error as ApiError;
  expect(api.status).toBe(400);
  expect(Object.keys(api.fieldErrors)).toEqual(["file"]);
  return api.fieldErrors.file[0];
}

/** Byte strings that mark each kind of metadata block inside a JPEG or WebP file. */
const METADATA_SIGNATURES = [
  "Exif\0\0",
  "ICC_PROFILE",
  "http://ns.adobe.com/xap/1.0/",
  "<x:xmpmeta",
  "Photoshop 3.0",
  METADATA_MARKER,
  GPS_DATUM_MARKER,
  "Testmaker",
  "SN-0042",
];

describe("the fixture really carries what a phone photo carries", () => {
  it("EXIF with GPS, orientation 6, XMP and an ICC profile", async () => {
    const input = await jpegWithGps();
    const meta = await sharp(input).metadata();
    expect(meta.format).toBe("jpeg");
    expect(meta.orientation).toBe(6);
    expect(meta.exif?.includes(Buffer.from(GPS_DATUM_MARKER))).toBe(true); // GPSMapDatum lives in the GPS IFD
    expect(meta.exif?.includes(Buffer.from(METADATA_MARKER))).toBe(true);
    expect(meta.xmp).toBeDefined();
    expect(meta.icc).toBeDefined();
  });
});

describe("sanitisePhoto", () => {
  it("re-encodes a JPEG with no EXIF, GPS, ICC or XMP left, upright, with its pixels", async () => {
    const input = await jpegWithGps();
    const out = await sanitisePhoto(input);
    expect(out.contentType).toBe("image/jpeg");

    const meta = await sharp(out.data).metadata();
    expect(meta.exif).toBeUndefined();
    expect(meta.icc).toBeUndefined();
    expect(meta.xmp).toBeUndefined();
    expect(meta.iptc).toBeUndefined();
    expect(meta.orientation).toBeUndefined();
    const raw = Buffer.from(out.data);
    for (const signature of METADATA_SIGNATURES) expect(raw.includes(Buffer.from(signature)), signature).toBe(false);

    // orientation 6 applied: 40 × 20 stored became 20 × 40, and the red left half is now on top
    expect([out.width, out.height]).toEqual([20, 40]);
    expect([meta.width, meta.height]).toEqual([20, 40]);
    expect(near(await pixelAt(out.data, 10, 5), RED)).toBe(true);
    expect(near(await pixelAt(out.data, 10, 35), BLUE)).toBe(true);
  });

  it("hashes and measures the bytes it returns", async () => {
    const out = await sanitisePhoto(await jpegWithGps());
    const { createHash } = await import("node:crypto");
    expect(out.sha256).toBe(createHash("sha256").update(out.data).digest("hex"));
    expect(out.byteSize).toBe(out.data.byteLength);
  });

  it("turns PNG into WebP, keeping transparency and dropping XMP", async () => {
    const out = await sanitisePhoto(await pngWithAlpha());
    expect(out.contentType).toBe("image/webp");
    expect(out.extension).toBe("webp");
    const meta = await sharp(out.data).metadata();
    expect(meta.format).toBe("webp");
    expect(meta.xmp).toBeUndefined();
    expect(meta.hasAlpha).toBe(true);
    expect((await pixelAt(out.data, 5, 0))[3]).toBeLessThan(16); // transparent top row
    expect(near(await pixelAt(out.data, 5, 10), RED)).toBe(true);
    expect(near(await pixelAt(out.data, 35, 10), BLUE)).toBe(true);
  });

  it("re-encodes WebP, dropping its EXIF", async () => {
    const input = await webp();
    expect((await sharp(input).metadata()).exif).toBeDefined();
    const out = await sanitisePhoto(input);
    expect(out.contentType).toBe("image/webp");
    expect((await sharp(out.data).metadata()).exif).toBeUndefined();
    expect(Buffer.from(out.data).includes(Buffer.from(METADATA_MARKER))).toBe(false);
  });

  it.each([
    ["GIF", gif],
    ["TIFF", tiff],
    ["SVG (with an onload handler)", async () => SVG],
    ["PDF", async () => PDF],
    ["a shell script", async () => SCRIPT],
  ])("refuses %s by its bytes", async (_name, make) => {
    expect(await refusal(await make())).toMatch(/not a JPEG, PNG or WebP image/);
  });

  it("goes by the bytes only: the type sniffer ignores what a client would declare", async () => {
    expect(await sniffPhotoType(await jpegWithGps())).toBe("image/jpeg");
    expect(await sniffPhotoType(await pngWithAlpha())).toBe("image/png");
    expect(await sniffPhotoType(await webp())).toBe("image/webp");
    expect(await sniffPhotoType(SVG)).toBeNull();
  });

  it("refuses an empty file and one over the byte limit, naming the limit", async () => {
    expect(await refusal(new Uint8Array(0))).toMatch(/empty/);
    const big = new Uint8Array(MAX_PHOTO_BYTES + 1);
    big.set(await jpegWithGps());
    expect(await refusal(big)).toMatch(/limit is 8 MB/);
  });

  it("refuses a decompression bomb from its header, before decoding: a tiny PNG claiming 10,000 × 10,000", async () => {
    const bomb = await pngClaiming(10_000, 10_000);
    expect(bomb.byteLength).toBeLessThan(200);
    expect(await refusal(bomb)).toMatch(/10000 × 10000 pixels \(100 megapixels\); the limit is 24 megapixels/);
    // beyond libvips' own default limit too, still refused with the size named
    expect(await refusal(await pngClaiming(60_000, 60_000))).toMatch(/60000 × 60000 pixels \(3600 megapixels\)/);
  });

  it("accepts the pixel limit itself and refuses one row more (header check)", async () => {
    const width = 8000;
    const atLimit = MAX_PHOTO_PIXELS / width; // 3000 rows
    expect(await refusal(await pngClaiming(width, atLimit + 1))).toMatch(/megapixels/);
    // at the limit the header passes; the pixels then fail to decode (they are not there)
    expect(await refusal(await pngClaiming(width, atLimit))).toMatch(/could not be decoded/);
  });

  it("refuses a truncated JPEG with a clear message", async () => {
    const whole = await jpegWithGps(400, 300);
    expect(await refusal(whole.subarray(0, Math.floor(whole.byteLength / 2)))).toMatch(/damaged or incomplete/);
  });
});

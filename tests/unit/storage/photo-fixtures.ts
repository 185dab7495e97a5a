import { crc32 } from "node:zlib";
import sharp from "sharp";

// Images for the photo tests (unit and tests/integration/photos-*), made with sharp at test time,
// so that no binary file is committed.

export const RED = { r: 220, g: 20, b: 20 };
export const BLUE = { r: 20, g: 20, b: 220 };

/** A marker we write into the EXIF and XMP so a test can search the raw bytes for it. */
export const METADATA_MARKER = "Fixture Person";
export const GPS_DATUM_MARKER = "WGS-84";

const XMP = `<x:xmpmeta xmlns:x="adobe:ns:meta/"><rdf:RDF xmlns:rdf="http://www.w3.org/1999/02/22-rdf-syntax-ns#"><rdf:Description xmlns:dc="http://purl.org/dc/elements/1.1/"><dc:creator>${METADATA_MARKER}</dc:creator></rdf:Description></rdf:RDF></x:xmpmeta>`;

/** width × height, left half red and right half blue, so orientation and pixels can be checked. */
function twoTone(width: number, height: number, channels: 3 | 4 = 3) {
  const half = Math.floor(width / 2);
  return sharp({ create: { width, height, channels, background: { ...BLUE, alpha: 1 } } }).composite([
    { input: { create: { width: half, height, channels, background: { ...RED, alpha: 1 } } }, left: 0, top: 0 },
  ]);
}

/**
 * A phone-like JPEG: EXIF with camera, owner and a GPS position (IFD3), EXIF orientation 6 (the
 * camera was turned: display after rotating 90° clockwise), an XMP packet and a Display P3 ICC
 * profile. The stored pixels are 40 × 20, red on the left.
 */
export async function jpegWithGps(width = 40, height = 20): Promise<Buffer> {
  const flat = await twoTone(width, height).png().toBuffer();
  return sharp(flat)
    .jpeg({ quality: 95 })
    .withExif({
      IFD0: { Make: "Testmaker", Model: "Bench Cam 1", Copyright: METADATA_MARKER, Artist: METADATA_MARKER },
      IFD2: { DateTimeOriginal: "2026:11:30 14:05:00", BodySerialNumber: "SN-0042" },
      IFD3: {
        GPSLatitudeRef: "N",
        GPSLatitude: "51/1 28/1 3800/100",
        GPSLongitudeRef: "W",
        GPSLongitude: "0/1 0/1 500/100",
        GPSAltitude: "35/1",
        GPSMapDatum: GPS_DATUM_MARKER,
      },
    })
    .withMetadata({ orientation: 6 })
    .withIccProfile("p3")
    .withXmp(XMP)
    .toBuffer();
}

/** RGBA, red left and blue right like the others, with a fully transparent top row. */
export async function pngWithAlpha(width = 40, height = 20): Promise<Buffer> {
  const rgba = Buffer.alloc(width * height * 4);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) {
      const c = x < width / 2 ? RED : BLUE;
      rgba.set([c.r, c.g, c.b, y === 0 ? 0 : 255], (y * width + x) * 4);
    }
  }
  return sharp(rgba, { raw: { width, height, channels: 4 } })
    .png()
    .withXmp(XMP)
    .toBuffer();
}

export async function webp(width = 40, height = 20): Promise<Buffer> {
  const flat = await twoTone(width, height).png().toBuffer();
  return sharp(flat)
    .webp({ quality: 90 })
    .withExif({ IFD0: { Artist: METADATA_MARKER } })
    .toBuffer();
}

export async function gif(): Promise<Buffer> {
  return twoTone(8, 8).gif().toBuffer();
}

export async function tiff(): Promise<Buffer> {
  return twoTone(8, 8).tiff().toBuffer();
}

export const SVG = Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="10" height="10" onload="alert(1)"><rect width="10" height="10"/></svg>');
export const PDF = Buffer.from("%PDF-1.7\n1 0 obj\n<< /Type /Catalog >>\nendobj\ntrailer\n<< /Root 1 0 R >>\n%%EOF\n");
export const SCRIPT = Buffer.from("#!/bin/sh\necho not a photo\n");

/**
 * A PNG whose header claims width × height while holding only a few bytes of pixels: what a
 * decompression bomb looks like to a decoder. The IHDR's CRC is recomputed so it parses.
 */
export async function pngClaiming(width: number, height: number): Promise<Buffer> {
  const png = Buffer.from(
    await sharp({ create: { width: 1, height: 1, channels: 3, background: RED } })
      .png()
      .toBuffer(),
  );
  // signature (8) | length (4) | "IHDR" (4) | width (4) | height (4) | … 5 more bytes | CRC (4)
  png.writeUInt32BE(width, 16);
  png.writeUInt32BE(height, 20);
  png.writeUInt32BE(crc32(png.subarray(12, 29)), 29);
  return png;
}

/** The RGB of one pixel of a decoded image. */
export async function pixelAt(image: Uint8Array, x: number, y: number): Promise<number[]> {
  const { data, info } = await sharp(image).raw().toBuffer({ resolveWithObject: true });
  const at = (y * info.width + x) * info.channels;
  return [...data.subarray(at, at + info.channels)];
}

export function near(actual: readonly number[], expected: { r: number; g: number; b: number }, tolerance = 24): boolean {
  return Math.abs(actual[0] - expected.r) <= tolerance && Math.abs(actual[1] - expected.g) <= tolerance && Math.abs(actual[2] - expected.b) <= tolerance;
}

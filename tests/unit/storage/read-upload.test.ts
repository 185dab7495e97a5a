import { describe, expect, it } from "vitest";
import { ApiError } from "@/lib/http/errors";
import { MAX_PHOTO_BYTES } from "@/lib/storage/limits";
import { readUpload } from "@/lib/storage/read-upload";

const URL_ = "http://test.local/api/v1/photos";

async function refusal(request: Request, status = 400): Promise<string> {
  const error = await readUpload(request).then(
    () => undefined,
    (e: unknown) => e,
  );
  expect(error).toBeInstanceOf(ApiError);
  expect((error as ApiError).status).toBe(status);
  return (error as ApiError).fieldErrors.file[0];
}

/** A request body that counts what was pulled from it, and fails the test if read past `allowed`. */
function countingStream(totalBytes: number, chunk = 64 * 1024) {
  const seen = { pulled: 0, cancelled: false };
  const stream = new ReadableStream<Uint8Array>({
    pull(controller) {
      if (seen.pulled >= totalBytes) return controller.close();
      const n = Math.min(chunk, totalBytes - seen.pulled);
      seen.pulled += n;
      controller.enqueue(new Uint8Array(n));
    },
    cancel() {
      seen.cancelled = true;
    },
  });
  return { stream, seen };
}

function streamed(body: ReadableStream<Uint8Array>, headers: Record<string, string> = {}) {
  return new Request(URL_, { method: "POST", body, headers, duplex: "half" } as RequestInit);
}

describe("readUpload", () => {
  it("takes the `file` part of multipart/form-data, with its declared type and name", async () => {
    const form = new FormData();
    form.append("note", "ignored");
    form.append("file", new File([new Uint8Array([1, 2, 3])], "meter.jpg", { type: "image/jpeg" }));
    const upload = await readUpload(new Request(URL_, { method: "POST", body: form }));
    expect([...upload.bytes]).toEqual([1, 2, 3]);
    expect(upload.declaredType).toBe("image/jpeg");
    expect(upload.fileName).toBe("meter.jpg");
  });

  it("takes a single file part under another name", async () => {
    const form = new FormData();
    form.append("photo", new File([new Uint8Array([9])], "x.png"));
    expect([...(await readUpload(new Request(URL_, { method: "POST", body: form }))).bytes]).toEqual([9]);
  });

  it("refuses a form with no file, or with two files and no `file` field", async () => {
    const none = new FormData();
    none.append("note", "text only");
    expect(await refusal(new Request(URL_, { method: "POST", body: none }))).toMatch(/Choose a photo/);
    const two = new FormData();
    two.append("a", new File([new Uint8Array([1])], "a.jpg"));
    two.append("b", new File([new Uint8Array([2])], "b.jpg"));
    expect(await refusal(new Request(URL_, { method: "POST", body: two }))).toMatch(/one photo per request/);
  });

  it("takes a raw body with any declared type (the bytes decide later)", async () => {
    const upload = await readUpload(
      new Request(URL_, { method: "POST", body: new Uint8Array([7, 8]), headers: { "content-type": "application/octet-stream" } }),
    );
    expect([...upload.bytes]).toEqual([7, 8]);
    expect(upload.declaredType).toBe("application/octet-stream");
  });

  it("refuses an empty raw body", async () => {
    expect(await refusal(new Request(URL_, { method: "POST", headers: { "content-type": "image/jpeg" } }))).toMatch(/no photo/);
  });

  it("refuses a body announced as too large without reading any of it", async () => {
    const { stream, seen } = countingStream(MAX_PHOTO_BYTES * 4);
    const request = streamed(stream, { "content-type": "image/jpeg", "content-length": String(MAX_PHOTO_BYTES * 4) });
    expect(await refusal(request, 413)).toMatch(/larger than 8 MB/);
    expect(seen.pulled).toBeLessThanOrEqual(64 * 1024); // at most the stream's first eager pull
  });

  // Not cancelled (issue 12): cancelling the platform's request stream destroys the socket before
  // the 413 is written; the rest stays unread and lib/http closes the connection after answering.
  it("stops reading a body without a length as soon as it passes the limit, leaving the rest unread", async () => {
    const { stream, seen } = countingStream(MAX_PHOTO_BYTES * 10);
    expect(await refusal(streamed(stream, { "content-type": "image/jpeg" }), 413)).toMatch(/larger than 8 MB/);
    expect(seen.pulled).toBeLessThan(MAX_PHOTO_BYTES + 3 * 64 * 1024);
    expect(seen.cancelled).toBe(false);
  });

  it("accepts exactly the limit as a raw body", async () => {
    const { stream } = countingStream(MAX_PHOTO_BYTES);
    expect((await readUpload(streamed(stream, { "content-type": "image/png" }))).bytes.byteLength).toBe(MAX_PHOTO_BYTES);
  });

  it("refuses a multipart body whose file is over the limit, whatever the form's total", async () => {
    const form = new FormData();
    form.append("file", new File([new Uint8Array(MAX_PHOTO_BYTES + 1)], "big.jpg", { type: "image/jpeg" }));
    expect(await refusal(new Request(URL_, { method: "POST", body: form }), 413)).toMatch(/limit is 8 MB/);
  });

  it("refuses multipart that cannot be parsed, naming the field", async () => {
    const request = new Request(URL_, { method: "POST", body: "garbage", headers: { "content-type": "multipart/form-data; boundary=xyz" } });
    expect(await refusal(request)).toMatch(/form data could not be read/);
  });
});

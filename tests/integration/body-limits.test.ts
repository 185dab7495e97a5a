import http from "node:http";
import { NextRequest } from "next/server";
import { QueryTypes } from "sequelize";
import { afterAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { POST as nextAuthPost } from "@/app/api/auth/[...nextauth]/route";
import { POST as resetPost } from "@/app/api/auth/password-reset/route";
import { POST as signUpPost } from "@/app/api/auth/sign-up/route";
import { POST as photoPost } from "@/app/api/v1/photos/route";
import { POST as submissionPost } from "@/app/api/v1/submissions/route";
import { ACCOUNT_BODY_BYTES } from "@/lib/auth/schemas";
import { env } from "@/lib/env";
import { MAX_JSON_DEPTH } from "@/lib/http/json-depth";
import { stopBoss } from "@/lib/jobs";
import { MAX_PHOTO_BYTES } from "@/lib/storage/limits";
import { db, User } from "@/models";
import { callRoute, sessionCookieFor, sessionCookieForAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

// Issue 12, finding 2: a chunked body without Content-Length was read whole before its size was
// checked (64 MB streamed to sign-up and to password reset were read completely, memory +117 MB,
// before a 400); finding 6: a body nested 5,000 levels deep on POST /api/v1/submissions answered
// 500, the idempotency hash recursing through it before validation. Here every body is a stream
// that counts the bytes pulled from it, so "read no further than the cap" is measured, not assumed.

setupTestDatabase("seeded");
afterAll(() => stopBoss());

const MB = 1024 * 1024;
const CHUNK = 4 * 1024;

/** A body of `totalBytes` zero-ish bytes made on demand, counting how many the reader pulled. */
function countingBody(totalBytes: number, fill = 0x20) {
  const seen = { pulled: 0 };
  const body = new ReadableStream<Uint8Array>(
    {
      pull(controller) {
        if (seen.pulled >= totalBytes) return controller.close();
        seen.pulled += CHUNK;
        controller.enqueue(new Uint8Array(CHUNK).fill(fill));
      },
    },
    { highWaterMark: 0 },
  );
  return { body, seen };
}

/** A POST whose body streams without a Content-Length, as a chunked upload arrives. */
function chunkedPost(url: string, body: ReadableStream<Uint8Array>, headers: Record<string, string>): Request {
  return new Request(url, { method: "POST", body, headers, duplex: "half" } as RequestInit);
}

/** `midStream`: refused part-way through, so the connection is closed rather than drained. */
async function expectTooLarge(res: Response, field = "body", midStream = true) {
  expect(res.status).toBe(413);
  expect(res.headers.get("content-type")).toMatch(/^application\/json/);
  expect(res.headers.get("connection")).toBe(midStream ? "close" : null);
  const { error } = await res.json();
  expect(error).toMatchObject({ status: 413, code: "content_too_large" });
  expect(Object.keys(error.fieldErrors)).toEqual([field]);
  expect(error.fieldErrors[field][0]).toMatch(/larger than/);
  return error;
}

const base = () => env().NEXTAUTH_URL ?? "http://test.local";

describe("request bodies are capped while they stream (issue 12, finding 2)", () => {
  it("sign-up: 64 MB streamed without a length is refused with 413 after reading about its 8 kB cap", async () => {
    const { body, seen } = countingBody(64 * MB);
    const res = await callRoute(signUpPost, chunkedPost(`${base()}/api/auth/sign-up`, body, { "content-type": "application/json" }));
    expect(seen.pulled).toBeLessThanOrEqual(ACCOUNT_BODY_BYTES + 2 * CHUNK); // it was 64 MB, all of it
    const error = await expectTooLarge(res);
    expect(error.message).toMatch(/8 kB/);
  });

  it("password reset: the same 64 MB is refused after reading about the cap", async () => {
    const { body, seen } = countingBody(64 * MB);
    const res = await callRoute(resetPost, chunkedPost(`${base()}/api/auth/password-reset`, body, { "content-type": "application/json" }));
    expect(seen.pulled).toBeLessThanOrEqual(ACCOUNT_BODY_BYTES + 2 * CHUNK);
    await expectTooLarge(res);
  });

  it("next-auth's own sign-in endpoint: a streamed form is refused with 413 in the one error shape", async () => {
    const { body, seen } = countingBody(64 * MB, 0x61);
    const request = new NextRequest(`${base()}/api/auth/callback/credentials`, {
      method: "POST",
      body,
      headers: { "content-type": "application/x-www-form-urlencoded" },
      duplex: "half",
    } as ConstructorParameters<typeof NextRequest>[1]);
    const res = await callRoute(nextAuthPost, request, { params: Promise.resolve({ nextauth: ["callback", "credentials"] }) });
    expect(seen.pulled).toBeLessThanOrEqual(ACCOUNT_BODY_BYTES + 2 * CHUNK);
    await expectTooLarge(res);
  });

  it("a signed-in JSON endpoint: 64 MB streamed to submissions stops at its 256 kB cap", async () => {
    const cookie = await sessionCookieFor("contributor");
    const { body, seen } = countingBody(64 * MB);
    const request = withCookie(chunkedPost(`${base()}/api/v1/submissions`, body, { "content-type": "application/json" }), cookie);
    const res = await callRoute(submissionPost, request);
    expect(seen.pulled).toBeLessThanOrEqual(256 * 1024 + 2 * CHUNK);
    await expectTooLarge(res);
  });

  it("a body announced over the cap is refused before a byte is read", async () => {
    const { body, seen } = countingBody(64 * MB);
    const headers = { "content-type": "application/json", "content-length": String(64 * MB) };
    await expectTooLarge(await callRoute(signUpPost, chunkedPost(`${base()}/api/auth/sign-up`, body, headers)), "body", false);
    expect(seen.pulled).toBe(0);
  });

  it("photo upload (multipart): 64 MB streamed is refused with 413 naming `file`, after reading about its 8 MB cap", async () => {
    const cookie = await sessionCookieFor("contributor");
    const { body, seen } = countingBody(64 * MB);
    const request = chunkedPost(`${base()}/api/v1/photos`, body, { "content-type": "multipart/form-data; boundary=x" });
    const res = await callRoute(photoPost, withCookie(request, cookie));
    expect(seen.pulled).toBeLessThanOrEqual(MAX_PHOTO_BYTES + 64 * 1024 + 2 * CHUNK);
    const error = await expectTooLarge(res, "file");
    expect(error.message).toMatch(/8 MB/);
  });

  it("a body of exactly the cap, streamed, still goes through", async () => {
    const json = JSON.stringify({ email: "someone@example.test" });
    const text = json + " ".repeat(ACCOUNT_BODY_BYTES - json.length); // JSON allows trailing whitespace
    const bytes = new TextEncoder().encode(text);
    const body = new ReadableStream<Uint8Array>({
      start(controller) {
        for (let at = 0; at < bytes.length; at += CHUNK) controller.enqueue(bytes.slice(at, at + CHUNK));
        controller.close();
      },
    });
    const res = await callRoute(resetPost, chunkedPost(`${base()}/api/auth/password-reset`, body, { "content-type": "application/json" }));
    expect(res.status).toBe(202);
  });
});

describe("JSON nested past the depth limit is refused before anything walks it (issue 12, finding 6)", () => {
  const nested = (depth: number) => '{"a":'.repeat(depth) + "1" + "}".repeat(depth);
  const count = async (table: string) => (await db().query<{ n: number }>(`SELECT count(*)::int AS n FROM ${table}`, { type: QueryTypes.SELECT }))[0].n;

  it("a submission 5,000 (and 40,000) levels deep with an Idempotency-Key answers 400 naming the body, and writes nothing", async () => {
    const cookie = await sessionCookieFor("contributor");
    const before = [await count("submissions"), await count("idempotency_keys")];
    for (const depth of [5_000, 40_000]) {
      const request = new Request(`${base()}/api/v1/submissions`, {
        method: "POST",
        headers: { "content-type": "application/json", "idempotency-key": `deep-${depth}` },
        body: nested(depth),
      });
      const res = await callRoute(submissionPost, withCookie(request, cookie));
      expect(res.status, `depth ${depth}`).toBe(400);
      const { error } = await res.json();
      expect(error.code).toBe("bad_request");
      expect(error.fieldErrors.body[0]).toMatch(new RegExp(`more than ${MAX_JSON_DEPTH} levels`));
    }
    expect([await count("submissions"), await count("idempotency_keys")]).toEqual(before);
  });

  it("arrays count too, and sign-up refuses them the same way before any rate limit or lookup", async () => {
    const res = await callRoute(
      signUpPost,
      new Request(`${base()}/api/auth/sign-up`, { method: "POST", headers: { "content-type": "application/json" }, body: "[".repeat(3000) + "]".repeat(3000) }),
    );
    expect(res.status).toBe(400);
    expect((await res.json()).error.fieldErrors.body[0]).toMatch(/levels deep/);
  });
});

// The same through the production build (SHUNTBOOK_TEST_APP_URL): Next hands the route the
// socket's stream, and a 413 must leave before the client has sent the rest. The client counts
// what it had written when the answer came; the loopback socket's buffers hold a few MB of that.
const appUrl = process.env.SHUNTBOOK_TEST_APP_URL;

type Streamed = { status: number; connection: string | undefined; body: { error: { code: string; fieldErrors: Record<string, string[]> } }; written: number };

/** POSTs `totalBytes` chunked (no Content-Length) as fast as the socket takes them; resolves at the answer. */
function streamOverHttp(path: string, headers: Record<string, string>, totalBytes: number): Promise<Streamed> {
  return new Promise((resolve, reject) => {
    let written = 0;
    let answered = false;
    const req = http.request(new URL(path, appUrl), { method: "POST", headers: { ...headers, "transfer-encoding": "chunked" } }, (res) => {
      answered = true;
      const at = written;
      const chunks: Buffer[] = [];
      res.on("data", (c: Buffer) => chunks.push(c));
      res.on("end", () => {
        req.destroy();
        resolve({ status: res.statusCode!, connection: res.headers.connection, body: JSON.parse(Buffer.concat(chunks).toString()), written: at });
      });
    });
    req.on("error", (e) => {
      if (!answered) reject(e);
    });
    const chunk = Buffer.alloc(64 * 1024, 0x20);
    const drained = () =>
      new Promise<void>((done) => {
        const finish = () => {
          req.off("drain", finish);
          req.off("close", finish);
          done();
        };
        req.on("drain", finish);
        req.on("close", finish);
      });
    void (async () => {
      while (written < totalBytes && !answered && !req.destroyed) {
        written += chunk.byteLength;
        if (!req.write(chunk)) await drained();
      }
      if (!req.destroyed) req.end();
    })();
  });
}

describe.skipIf(!appUrl)("bodies capped as they stream, through next start", () => {
  const json = { "content-type": "application/json" };

  it.each([
    ["/api/auth/sign-up", json],
    ["/api/auth/password-reset", json],
    ["/api/auth/callback/credentials", { "content-type": "application/x-www-form-urlencoded" }],
  ])("%s: 64 MB chunked gets 413 long before it is all sent", async (path, headers) => {
    const res = await streamOverHttp(path, headers, 64 * MB);
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe("content_too_large");
    expect(res.connection).toBe("close");
    expect(res.written).toBeLessThan(16 * MB);
  });

  it("photo upload: 64 MB chunked multipart gets 413 naming `file` soon after the 8 MB cap", async () => {
    db();
    const person = await User.findOne({ where: { email: "contributor@shuntbook.test" } });
    if (!person) throw new Error("the seeded demo has no contributor@shuntbook.test");
    const cookie = await sessionCookieForAccount({ id: person.id, email: person.email, name: person.name, role: person.role });
    const res = await streamOverHttp("/api/v1/photos", { "content-type": "multipart/form-data; boundary=x", cookie }, 64 * MB);
    expect(res.status).toBe(413);
    expect(Object.keys(res.body.error.fieldErrors)).toEqual(["file"]);
    expect(res.written).toBeLessThan(MAX_PHOTO_BYTES + 16 * MB);
  });
});

import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { stopBoss } from "@/lib/jobs";
import { boss } from "@/lib/jobs/boss";
import { PURGE_KEYS_CRON, PURGE_KEYS_JOB, registerSubmissionJobs } from "@/lib/submissions/jobs";
import { KEY_TTL_HOURS } from "@/lib/submissions";
import { db } from "@/models";
import { sessionCookieFor, testAccount } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { expectError, pickTarget, post, rowCounts, validBody, type Target } from "./submissions-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Idempotency-Key on POST /api/v1/submissions, against real PostgreSQL: a retry gets the first
// response and never a second row; another body under the same key is a 422; keys are per user
// and kept at least 24 hours; two identical requests at the same instant create one row.
setupTestDatabase("seeded");
afterAll(() => stopBoss());

let target: Target;
let alice: string;
let bob: string;
let aliceId: string;
beforeAll(async () => {
  target = await pickTarget();
  alice = await sessionCookieFor("contributor");
  aliceId = (await testAccount("contributor")).id;
  bob = await sessionCookieFor("contributor", { email: "second-contributor@auth.test", name: "Second Contributor" });
});

const bobId = async () =>
  (await db().query<{ id: string }>("SELECT id FROM users WHERE email = 'second-contributor@auth.test'", { type: QueryTypes.SELECT }))[0].id;
const submissionsOf = async (userId: string) =>
  (await db().query<{ n: number }>("SELECT count(*)::int AS n FROM submissions WHERE contributor_id = $1", { bind: [userId], type: QueryTypes.SELECT }))[0].n;

describe("Idempotency-Key", () => {
  it("a retry with the same key and body returns the first response and creates nothing more", async () => {
    const body = validBody(target);
    const first = await post(body, alice, "retry-key-1");
    expect(first.status).toBe(201);
    const firstBody = await first.json();
    const before = await rowCounts();

    const again = await post(body, alice, "retry-key-1");
    expect(again.status).toBe(201);
    expect(again.headers.get("idempotent-replayed")).toBe("true");
    expect(await again.json()).toEqual(firstBody);
    expect(await rowCounts()).toEqual(before);
  });

  it("key order in the JSON does not make a different body", async () => {
    const body = validBody(target, { currentScale: 1840 });
    const first = await (await post(body, alice, "order-key")).json();
    const reordered = Object.fromEntries(Object.entries(body).reverse());
    const again = await post(reordered, alice, "order-key");
    expect(again.status).toBe(201);
    expect((await again.json()).submission.id).toBe(first.submission.id);
  });

  it("the same key with a different body is a 422 naming the header, and writes nothing", async () => {
    expect((await post(validBody(target), alice, "changed-body-key")).status).toBe(201);
    const before = await rowCounts();
    const error = await expectError(await post(validBody(target, { currentScale: 1850 }), alice, "changed-body-key"), 422, "Idempotency-Key");
    expect(error.code).toBe("unprocessable_content");
    expect(error.message).toMatch(/different request body/);
    expect(await rowCounts()).toEqual(before);
  });

  it("keys are per user: another person's identical key is theirs alone", async () => {
    const res = await post(validBody(target), bob, "retry-key-1");
    expect(res.status).toBe(201);
    expect(res.headers.get("idempotent-replayed")).toBeNull();
  });

  it(`a key is kept at least ${KEY_TTL_HOURS} hours, and may be used afresh after it expired`, async () => {
    expect((await post(validBody(target), alice, "ttl-key")).status).toBe(201);
    const [row] = await db().query<{ hours: number }>(
      "SELECT (extract(epoch FROM expires_at - created_at) / 3600)::float8 AS hours FROM idempotency_keys WHERE user_id = $1 AND key = 'ttl-key'",
      { bind: [aliceId], type: QueryTypes.SELECT },
    );
    expect(row.hours).toBeGreaterThanOrEqual(24);
    // age the key past its time (the CHECK keeps the 24-hour span, so both ends move)
    await db().query(
      "UPDATE idempotency_keys SET created_at = now() - interval '25 hours', expires_at = now() - interval '1 hour' WHERE user_id = $1 AND key = 'ttl-key'",
      { bind: [aliceId] },
    );
    const count = await submissionsOf(aliceId);
    const fresh = await post(validBody(target, { currentScale: 1855 }), alice, "ttl-key");
    expect(fresh.status).toBe(201);
    expect(fresh.headers.get("idempotent-replayed")).toBeNull();
    expect(await submissionsOf(aliceId)).toBe(count + 1);
  });

  it("a refused body stores no key: the corrected retry under the same key goes through", async () => {
    const before = await rowCounts();
    await expectError(await post(validBody(target, { currentScale: 0 }), alice, "fix-and-retry"), 400, "currentScale");
    expect(await rowCounts()).toEqual(before);
    expect((await post(validBody(target), alice, "fix-and-retry")).status).toBe(201);
  });

  it("a key that cannot be one is a 400 on the header", async () => {
    await expectError(await post(validBody(target), alice, "has spaces in it"), 400, "Idempotency-Key");
    await expectError(await post(validBody(target), alice, "x".repeat(256)), 400, "Idempotency-Key");
  });

  it("two identical requests at the same instant create one row and both get its response", async () => {
    const count = await submissionsOf(aliceId);
    const body = validBody(target, { currentScale: 1835 });
    const responses = await Promise.all(Array.from({ length: 4 }, () => post(body, alice, "same-instant")));
    expect(responses.map((r) => r.status)).toEqual([201, 201, 201, 201]);
    const ids = new Set(await Promise.all(responses.map(async (r) => (await r.json()).submission.id)));
    expect(ids.size).toBe(1);
    expect(await submissionsOf(aliceId)).toBe(count + 1);
    expect(responses.filter((r) => r.headers.get("idempotent-replayed") === "true")).toHaveLength(3);
  });

  it("without a key, each POST is a new submission (the form always sends one)", async () => {
    const count = await submissionsOf(aliceId);
    await post(validBody(target), alice);
    await post(validBody(target), alice);
    expect(await submissionsOf(aliceId)).toBe(count + 2);
  });
});

describe("the hourly purge of expired keys", () => {
  const keysOf = async (userId: string) =>
    (await db().query<{ key: string }>("SELECT key FROM idempotency_keys WHERE user_id = $1 ORDER BY key", { bind: [userId], type: QueryTypes.SELECT })).map(
      (r) => r.key,
    );

  it("is scheduled every hour and, when worked, deletes only the keys past their time", async () => {
    expect((await post(validBody(target, { currentScale: 1860 }), bob, "purge-live")).status).toBe(201);
    expect((await post(validBody(target, { currentScale: 1865 }), bob, "purge-dead")).status).toBe(201);
    await db().query(
      "UPDATE idempotency_keys SET created_at = now() - interval '25 hours', expires_at = now() - interval '1 hour' WHERE user_id = $1 AND key = 'purge-dead'",
      { bind: [await bobId()] },
    );
    const submissionsBefore = await submissionsOf(await bobId());

    const queue = await boss();
    await registerSubmissionJobs(queue);
    const [schedule] = await db().query<{ cron: string; timezone: string }>("SELECT cron, timezone FROM pgboss.schedule WHERE name = :name", {
      replacements: { name: PURGE_KEYS_JOB },
      type: QueryTypes.SELECT,
    });
    expect(schedule).toEqual({ cron: PURGE_KEYS_CRON, timezone: "UTC" });

    // a job as the schedule would create it is worked by the worker registered above
    await queue.send(PURGE_KEYS_JOB, {});
    const until = Date.now() + 20_000;
    while ((await keysOf(await bobId())).includes("purge-dead") && Date.now() < until) await new Promise((r) => setTimeout(r, 250));
    const left = await keysOf(await bobId());
    expect(left).not.toContain("purge-dead");
    expect(left).toContain("purge-live");
    // the submission made under the purged key stays: the key was only a guard against a retry
    expect(await submissionsOf(await bobId())).toBe(submissionsBefore);
  });
});

import fc from "fast-check";
import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { POST as postPack } from "@/app/api/v1/garage/packs/route";
import { POST as postCharge } from "@/app/api/v1/garage/packs/[id]/charges/route";
import { POST as postQuad } from "@/app/api/v1/garage/quads/route";
import { POST as postWorksheet } from "@/app/api/v1/garage/worksheets/route";
import { POST as postSubmission } from "@/app/api/v1/submissions/route";
import { ErrorBodySchema } from "@/lib/http/error-body";
import { stopBoss } from "@/lib/jobs";
import { BoardRevision, db, FirmwareFamily } from "@/models";
import { ANONYMOUS, callRoute, sessionCookieFor, testAccount, withCookie } from "@/tests/support/auth";
import { badBodies, type BadBody } from "@/tests/support/bad-bodies";
import { setupTestDatabase } from "@/tests/support/database";
import { fillTemplate, isMutating, listRoutes, type ListedRoute } from "@/tests/support/route-list";
import { flyRechargeBody } from "@/tests/support/submission-body";

// Issue 12 item 10: bad bodies (tests/support/bad-bodies.ts, fast-check) against every mutating
// endpoint of the route list, anonymously and signed in as an admin (who passes every declared
// auth, so the body is what is judged): never a 5xx, always the one error shape, and a refused
// request writes nothing (a fingerprint of every table, taken every CHUNK requests, is unchanged
// when none of them was accepted). `npm run fuzz` runs the same with SHUNTBOOK_FUZZ_RUNS=10000
// and prints the report; npm test runs a few hundred per endpoint.

const RUNS = Number(process.env.SHUNTBOOK_FUZZ_RUNS ?? 200);
const SEED = Number(process.env.SHUNTBOOK_FUZZ_SEED ?? 20261215);
const CHUNK = 50;

setupTestDatabase("seeded");
afterAll(() => stopBoss());

type Tally = {
  endpoint: string;
  caller: string;
  runs: number;
  statuses: Record<number, number>;
  fiveXX: number;
  badShape: number;
  accepted: number;
  writtenWhenRefused: number;
};
const tallies: Tally[] = [];

/** count and md5 of every row of every table in the public schema, in one query */
async function fingerprint(): Promise<string> {
  const sequelize = db();
  const tables = await sequelize.query<{ name: string }>(
    "SELECT table_name AS name FROM information_schema.tables WHERE table_schema = 'public' AND table_type = 'BASE TABLE' ORDER BY 1",
    { type: QueryTypes.SELECT },
  );
  const sql = tables
    .map(({ name }) => `SELECT '${name}' AS t, count(*) AS n, md5(coalesce(string_agg(x::text, '|' ORDER BY x::text), '')) AS h FROM "${name}" x`)
    .join(" UNION ALL ");
  const rows = await sequelize.query<{ t: string; n: string; h: string }>(sql, { type: QueryTypes.SELECT });
  return rows.map((r) => `${r.t}:${r.n}:${r.h}`).join("\n");
}

const routes = (await listRoutes()).filter((r) => isMutating(r) && r.method !== "DELETE");
const params: Record<string, Record<string, string>> = {};
let adminCookie = "";

beforeAll(async () => {
  adminCookie = await sessionCookieFor("admin", { email: "fuzz-admin@fuzz.test" });
  const contributor = await testAccount("contributor", { email: "fuzz-contributor@fuzz.test" });
  db();
  const revision = (await BoardRevision.findOne({ order: [["id", "ASC"]] }))!;
  const family = (await FirmwareFamily.findOne({ order: [["id", "ASC"]] }))!;
  const post = async (handler: (r: Request, c: never) => Promise<Response>, url: string, body: unknown, p: Record<string, string> = {}) => {
    const req = withCookie(
      new Request(`http://test${url}`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
      adminCookie,
    );
    const res = await callRoute(handler, req, { params: Promise.resolve(p) } as never);
    return res.status < 300 ? ((await res.json()) as Record<string, { id: number; charges?: { id: number }[] }>) : {};
  };
  // rows of the admin's own, so that ids in paths name something and the body is what is judged
  const quad = (await post(postQuad, "/api/v1/garage/quads", { name: "Fuzz quad", boardRevisionId: revision.id, firmwareFamilyId: family.id })).quad;
  const pack = (await post(postPack, "/api/v1/garage/packs", { label: "Fuzz pack", chemistry: "lipo", cells: 4, ratedMah: 1500 })).pack;
  const charged = (await post(postCharge, `/api/v1/garage/packs/${pack?.id}/charges`, { chargedOn: "2026-01-02", chargedMah: 1200 }, { id: String(pack?.id) }))
    .pack;
  const sheet = (await post(postWorksheet, "/api/v1/garage/worksheets", { quadId: quad?.id, ratedMah: 1500, cells: 4, startingScale: 2000 })).worksheet;
  const submission = (await post(postSubmission, "/api/v1/submissions", flyRechargeBody({ boardRevisionId: revision.id, firmwareFamilyId: family.id })))
    .submission;
  const ids: Record<string, string> = {
    "garage/quads": String(quad?.id ?? 1),
    "garage/packs": String(pack?.id ?? 1),
    "garage/worksheets": String(sheet?.id ?? 1),
    submissions: String(submission?.id ?? 1),
    "admin/users": contributor.id,
  };
  for (const route of routes) {
    const owner = Object.keys(ids).find((k) => route.template.includes(`/${k}/`));
    params[`${route.method} ${route.template}`] = Object.fromEntries(
      route.paramNames.map((name) => [name, name === "id" ? (owner ? ids[owner] : "1") : name === "chargeId" ? String(charged?.charges?.[0]?.id ?? 1) : "1"]),
    );
  }
});

afterAll(() => {
  if (!process.env.SHUNTBOOK_FUZZ_REPORT) return;
  const total = (k: keyof Tally) => tallies.reduce((sum, t) => sum + (t[k] as number), 0);
  const lines = tallies.map(
    (t) =>
      `${t.endpoint.padEnd(62)} ${t.caller.padEnd(9)} runs ${String(t.runs).padStart(6)}  5xx ${t.fiveXX}  bad shape ${t.badShape}  accepted ${t.accepted}  written when refused ${t.writtenWhenRefused}  statuses ${JSON.stringify(t.statuses)}`,
  );
  console.log(
    [
      `fuzz report (seed ${SEED}, ${RUNS} bodies per endpoint and caller, ${routes.length} mutating endpoints)`,
      ...lines,
      `TOTAL requests ${total("runs")}  5xx ${total("fiveXX")}  bad shape ${total("badShape")}  accepted ${total("accepted")}  written when refused ${total("writtenWhenRefused")}`,
    ].join("\n"),
  );
});

async function send(route: ListedRoute, cookie: string, body: BadBody): Promise<Response> {
  const p = params[`${route.method} ${route.template}`];
  const headers: Record<string, string> = body.contentType ? { "content-type": body.contentType } : {};
  const request = withCookie(new Request(`http://test${fillTemplate(route.template, p)}`, { method: route.method, headers, body: body.text }), cookie);
  return callRoute(route.handler, request, { params: Promise.resolve(p) });
}

describe("bad bodies on every mutating endpoint", () => {
  it("lists the mutating endpoints", () => expect(routes.length).toBeGreaterThan(12));

  const cases = routes.flatMap((route) => [
    [`${route.method} ${route.template} signed in`, route, "signed in"] as const,
    [`${route.method} ${route.template} anonymous`, route, "anonymous"] as const,
  ]);
  it.each(cases)(
    "%s: no 5xx, the error shape, nothing written",
    async (endpoint, route, caller) => {
      vi.spyOn(console, "error").mockImplementation(() => undefined);
      const cookie = caller === "anonymous" ? ANONYMOUS : adminCookie;
      const tally: Tally = {
        endpoint: `${route.method} ${route.template}`,
        caller,
        runs: 0,
        statuses: {},
        fiveXX: 0,
        badShape: 0,
        accepted: 0,
        writtenWhenRefused: 0,
      };
      tallies.push(tally);
      // anonymous calls stop at the sign-in check; half as many suffice
      const bodies = fc.sample(badBodies, { numRuns: caller === "anonymous" && route.spec.auth !== "public" ? Math.ceil(RUNS / 2) : RUNS, seed: SEED });
      const failures: string[] = [];
      for (let start = 0; start < bodies.length; start += CHUNK) {
        const before = await fingerprint();
        let acceptedInChunk = 0;
        for (const body of bodies.slice(start, start + CHUNK)) {
          const res = await send(route, cookie, body);
          tally.runs++;
          tally.statuses[res.status] = (tally.statuses[res.status] ?? 0) + 1;
          const sample = `${res.status} for ${body.contentType} ${body.text.slice(0, 120)}`;
          if (res.status >= 500) {
            tally.fiveXX++;
            failures.push(`5xx: ${sample}`);
          }
          if (res.status < 300) {
            tally.accepted++;
            acceptedInChunk++;
            continue;
          }
          if (!ErrorBodySchema.safeParse(await res.json().catch(() => null)).success) {
            tally.badShape++;
            failures.push(`not the error shape: ${sample}`);
          }
        }
        if (acceptedInChunk === 0 && (await fingerprint()) !== before) {
          tally.writtenWhenRefused++;
          failures.push(`rows changed although every request of bodies ${start}–${start + CHUNK - 1} was refused`);
        }
      }
      expect(failures.slice(0, 5), endpoint).toEqual([]);
    },
    600_000,
  );
});

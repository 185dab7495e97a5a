import pg from "pg";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import * as boardRoute from "@/app/api/v1/boards/[slug]/route";
import * as valuesRoute from "@/app/api/v1/boards/[slug]/values/route";
import * as boardsRoute from "@/app/api/v1/boards/route";
import * as usersRoute from "@/app/api/v1/admin/users/route";
import * as revertRoute from "@/app/api/v1/admin/events/[id]/revert/route";
import * as packsRoute from "@/app/api/v1/garage/packs/route";
import * as quadsRoute from "@/app/api/v1/garage/quads/route";
import * as worksheetRoute from "@/app/api/v1/garage/worksheets/[id]/route";
import * as publishWorksheetRoute from "@/app/api/v1/garage/worksheets/[id]/publish/route";
import * as worksheetStepRoute from "@/app/api/v1/garage/worksheets/[id]/steps/[position]/route";
import * as worksheetStepsRoute from "@/app/api/v1/garage/worksheets/[id]/steps/route";
import * as worksheetsRoute from "@/app/api/v1/garage/worksheets/route";
import * as eventsRoute from "@/app/api/v1/moderation/events/route";
import * as queueRoute from "@/app/api/v1/moderation/queue/route";
import * as approveRoute from "@/app/api/v1/moderation/submissions/[id]/approve/route";
import * as rejectRoute from "@/app/api/v1/moderation/submissions/[id]/reject/route";
import * as reviewRoute from "@/app/api/v1/moderation/submissions/[id]/route";
import * as ownRoute from "@/app/api/v1/submissions/[id]/route";
import * as submissionsRoute from "@/app/api/v1/submissions/route";
import { authenticate } from "@/lib/auth/accounts";
import { requestPasswordReset } from "@/lib/auth/password-reset";
import { completeSignUp, startSignUp } from "@/lib/auth/sign-up";
import { hashPassword } from "@/lib/auth/passwords";
import { getHomeCounts } from "@/lib/catalogue/home-counts";
import { listMountingPatterns } from "@/lib/catalogue/mounting-patterns";
import { getSequelize } from "@/lib/db/sequelize";
import { stopBoss } from "@/lib/jobs";
import { getValueHistory } from "@/lib/published/history";
import { contributorRecord } from "@/lib/moderation/trust";
import { chosenBoard } from "@/lib/submissions/form-data";
import { listQuadWorksheets, openWorksheetId } from "@/lib/worksheets";
import { callRoute, sessionCookieFor, testAccount, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { pickTarget, validBody } from "./submissions-helpers";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// Every query that a page or endpoint runs has an index behind it (a rule of this project), checked
// against PostgreSQL itself rather than by reading the code. This file's database is told
// `enable_seqscan = off`, so the planner reads a table whole only when no index can serve the
// query at all (the setting makes a sequential scan very expensive, not impossible; PostgreSQL
// manual, "Planner Method Configuration"). Then the endpoints and the pages' lib calls run, and the
// per-table counter pg_stat_user_tables.seq_scan (manual, "The Cumulative Statistics System")
// shows every table that was read whole anyway. The demo's tables are small, so without the
// setting the planner would rightly scan them and prove nothing.
const database = setupTestDatabase("seeded");
afterAll(() => stopBoss());

/** Tables read whole on purpose, each with the reason; anything else read whole fails the test. */
const READ_WHOLE: Record<string, string> = {
  // the submission form and the values response list every family: a handful of rows, all wanted
  firmware_families: "every family is listed (a handful of rows)",
};

async function withClient<T>(fn: (c: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: database.url() });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

async function seqScans(c: pg.Client): Promise<Map<string, number>> {
  const { rows } = await c.query<{ relname: string; seq_scan: string }>("SELECT relname, seq_scan FROM pg_stat_user_tables WHERE schemaname = 'public'");
  return new Map(rows.map((r) => [r.relname, Number(r.seq_scan)]));
}

const REPORT_DEADLINE_MS = 20_000;

/**
 * The scan counters once every connection that ran the site's queries has reported. A server
 * process flushes its counts to the shared statistics just before going idle, but not more often
 * than once a second, so an idle one may hold the last of them for a while; it always flushes when
 * it exits (PostgreSQL manual, "The Cumulative Statistics System"). So the app's pool and the job
 * queue are closed, and this polls until no other client is connected to the file's database and
 * two reads in a row agree, failing after a deadline instead of waiting a fixed time.
 */
async function seqScansOnceReported(): Promise<Map<string, number>> {
  await getSequelize().close();
  await stopBoss();
  return withClient(async (c) => {
    const deadline = Date.now() + REPORT_DEADLINE_MS;
    let settled: string | undefined;
    for (;;) {
      await c.query("SELECT pg_stat_clear_snapshot()"); // read fresh counters, not this session's cached copy
      const { rows } = await c.query<{ others: number }>(
        "SELECT count(*)::int AS others FROM pg_stat_activity WHERE datname = current_database() AND pid <> pg_backend_pid() AND backend_type = 'client backend'",
      );
      const scans = await seqScans(c);
      const reading = JSON.stringify([...scans].sort());
      if (rows[0].others === 0 && reading === settled) return scans;
      if (Date.now() > deadline) throw new Error(`scan counters not settled after ${REPORT_DEADLINE_MS} ms (${rows[0].others} other connection(s) open)`);
      settled = rows[0].others === 0 ? reading : undefined;
      await new Promise((r) => setTimeout(r, 200));
    }
  });
}

const get = (handler: unknown, url: string, cookie: string, params: Record<string, string> = {}) =>
  callRoute(handler as (r: Request, c: unknown) => Promise<Response>, withCookie(new Request(`http://test${url}`), cookie), {
    params: Promise.resolve(params),
  });
const send = (handler: unknown, method: string, url: string, cookie: string, body: unknown, params: Record<string, string> = {}) =>
  callRoute(
    handler as (r: Request, c: unknown) => Promise<Response>,
    withCookie(new Request(`http://test${url}`, { method, headers: { "content-type": "application/json" }, body: JSON.stringify(body) }), cookie),
    { params: Promise.resolve(params) },
  );

let slug: string;
let contributor: string;
let moderator: string;
let admin: string;
beforeAll(async () => {
  // before this file's first connection, so every pooled connection starts with it; the clone's
  // statistics start empty, so every scan counted below is this file's
  const name = new URL(database.url()).pathname.slice(1);
  await withClient((c) => c.query(`ALTER DATABASE ${name} SET enable_seqscan = off`));
  contributor = await sessionCookieFor("contributor");
  moderator = await sessionCookieFor("moderator");
  admin = await sessionCookieFor("admin");
});

describe("every query an endpoint or page runs has an index behind it", () => {
  it("runs the reads and writes of the site, then finds no table read whole", { timeout: 60_000 }, async () => {
    const ok = async (res: Response | Promise<Response>, status = 200) => {
      const r = await res;
      expect(r.status, await r.clone().text()).toBe(status);
      return r.json();
    };
    // the catalogue, every way the page and the API ask for it; the board with the most values first
    const top = await ok(get(boardsRoute.GET, "/api/v1/boards?sort=values&pageSize=1", ""));
    slug = top.boards[0].slug;
    for (const q of ["", "?q=f7", "?q=zz-nothing", "?kind=flight_controller&sort=values", "?mounting=30.5x30.5&sort=newest&page=2", "?sort=name&pageSize=5"]) {
      await ok(get(boardsRoute.GET, `/api/v1/boards${q}`, ""));
    }
    await ok(get(boardRoute.GET, `/api/v1/boards/${slug}`, "", { slug }));
    const values = await ok(get(valuesRoute.GET, `/api/v1/boards/${slug}/values?points=1`, "", { slug }));
    const revision = values.revisions[0].label as string;
    await ok(get(valuesRoute.GET, `/api/v1/boards/${slug}/values?revision=${revision}&family=${values.families[0].slug}`, "", { slug }));
    await getHomeCounts();
    await listMountingPatterns();
    await getValueHistory(slug);
    await chosenBoard(slug);

    // accounts: sign-up (the queued job and the confirmation), password sign-in, a reset request, all by address
    const passwordHash = await hashPassword("index-check-password");
    const signUpToken = await startSignUp({ name: "Index Check", email: "index-check@auth.test", passwordHash });
    await completeSignUp(signUpToken!, "index-check-password");
    expect(await startSignUp({ name: "Index Check", email: "index-check@auth.test", passwordHash })).toBeNull();
    expect(await authenticate("Index-Check@auth.test", "index-check-password")).not.toBeNull();
    expect(await requestPasswordReset("index-check@auth.test")).not.toBeNull();

    // a contribution, the contributor's own pages, the garage
    const target = await pickTarget();
    const created = await ok(send(submissionsRoute.POST, "POST", "/api/v1/submissions", contributor, validBody(target)), 201);
    const id = String(created.submission.id);
    await ok(get(submissionsRoute.GET, "/api/v1/submissions", contributor));
    await ok(get(submissionsRoute.GET, "/api/v1/submissions?status=pending&page=2&pageSize=1", contributor));
    await ok(get(ownRoute.GET, `/api/v1/submissions/${id}`, contributor, { id }));
    await ok(send(quadsRoute.POST, "POST", "/api/v1/garage/quads", contributor, { name: "Index check quad" }), 201);
    await ok(get(quadsRoute.GET, "/api/v1/garage/quads", contributor));
    await ok(get(packsRoute.GET, "/api/v1/garage/packs", contributor));
    // a saved voltage worksheet: started, two readings, one taken back, read, listed, published
    const { quad } = await ok(
      send(quadsRoute.POST, "POST", "/api/v1/garage/quads", contributor, {
        name: "Index check sheets",
        boardRevisionId: target.revisionId,
        firmwareFamilyId: target.familyId,
        firmwareVersion: "avocet",
      }),
      201,
    );
    const { worksheet } = await ok(
      send(worksheetsRoute.POST, "POST", "/api/v1/garage/worksheets", contributor, { kind: "voltage", quadId: quad.id, scaleUsed: 550 }), // ÷11 in Vornel's 0.02 steps
      201,
    );
    const sheetId = String(worksheet.id);
    for (const measuredVolts of [16.4, 16.5]) {
      await ok(
        send(
          worksheetStepsRoute.POST,
          "POST",
          `/api/v1/garage/worksheets/${sheetId}/steps`,
          contributor,
          { cells: 4, reportedVolts: 16, measuredVolts, measuredAt: "main_lead" },
          { id: sheetId },
        ),
        201,
      );
    }
    await ok(send(worksheetStepRoute.DELETE, "DELETE", `/api/v1/garage/worksheets/${sheetId}/steps/1`, contributor, undefined, { id: sheetId, position: "1" }));
    await ok(get(worksheetRoute.GET, `/api/v1/garage/worksheets/${sheetId}`, contributor, { id: sheetId }));
    const builder = (await testAccount("contributor")).id;
    expect(await listQuadWorksheets(builder, quad.id)).toHaveLength(1);
    expect(await openWorksheetId(builder, quad.id, "voltage")).toBe(worksheet.id);
    await ok(send(publishWorksheetRoute.POST, "POST", `/api/v1/garage/worksheets/${sheetId}/publish`, contributor, {}, { id: sheetId }), 201);

    // moderation: the queue every way it is filtered, a review, decisions, the log, a revert
    for (const q of ["", "?flag=outlier", "?flag=none&age=older", `?board=${slug}&sort=oldest`, "?sort=newest&page=2"]) {
      await ok(get(queueRoute.GET, `/api/v1/moderation/queue${q}`, moderator));
    }
    await ok(get(reviewRoute.GET, `/api/v1/moderation/submissions/${id}`, moderator, { id }));
    await contributorRecord((await testAccount("contributor")).id);
    await ok(
      send(
        approveRoute.POST,
        "POST",
        `/api/v1/moderation/submissions/${id}/approve`,
        moderator,
        { version: created.submission.version, reason: "Index check." },
        { id },
      ),
    );
    const second = await ok(
      send(
        submissionsRoute.POST,
        "POST",
        "/api/v1/submissions",
        contributor,
        validBody(target, { currentScale: (validBody(target).currentScale ?? 2000) + 1 }),
      ),
      201,
    );
    const secondId = String(second.submission.id);
    await ok(
      send(
        rejectRoute.POST,
        "POST",
        `/api/v1/moderation/submissions/${secondId}/reject`,
        moderator,
        { version: second.submission.version, reason: "Index check." },
        { id: secondId },
      ),
    );
    const log = await ok(get(eventsRoute.GET, `/api/v1/moderation/events?submission=${id}`, moderator));
    await ok(get(eventsRoute.GET, "/api/v1/moderation/events?action=approve", moderator));
    const eventId = String(log.events[0].id);
    await ok(send(revertRoute.POST, "POST", `/api/v1/admin/events/${eventId}/revert`, admin, { reason: "Index check." }, { id: eventId }));
    await ok(get(usersRoute.GET, "/api/v1/admin/users?role=contributor", admin));
    // the admin's people search (issue 13): any part of a name or address, paged
    await ok(get(usersRoute.GET, "/api/v1/admin/users?q=demo", admin));
    await ok(get(usersRoute.GET, "/api/v1/admin/users?q=example&page=2&role=contributor", admin));

    const readWhole = [...(await seqScansOnceReported())].filter(([table, n]) => n > 0 && !(table in READ_WHOLE)).map(([table, n]) => `${table} (${n}×)`);
    expect(readWhole, "tables read whole although enable_seqscan is off: add the index their query needs").toEqual([]);
  });
});

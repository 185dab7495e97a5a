import { QueryTypes } from "sequelize";
import { expect } from "vitest";
import { PATCH as patchRoute } from "@/app/api/v1/submissions/[id]/route";
import { POST as postRoute } from "@/app/api/v1/submissions/route";
import type { SubmissionInput } from "@/lib/submissions/schema";
import { db } from "@/models";
import { callRoute, withCookie } from "@/tests/support/auth";
import { flyRechargeBody } from "@/tests/support/submission-body";

// Shared by the submissions-*.test.ts files: a real target in the seeded demo database, a valid
// body for it, the two routes called in process, and the row counts a refused request must leave.

export type Target = { revisionId: number; familyId: number; boardSlug: string; minCells: number; maxCells: number; familySlug: string };

/** A board revision of a 4S-capable board and the demo's first family (V/V 0.02, mV/A 0.02, offset 0.5 mV). */
export async function pickTarget(): Promise<Target> {
  const [row] = await db().query<Target>(
    `SELECT br.id AS "revisionId", f.id AS "familyId", bm.slug AS "boardSlug", bm.min_cells AS "minCells",
            bm.max_cells AS "maxCells", f.slug AS "familySlug"
       FROM board_revisions br JOIN board_models bm ON bm.id = br.board_model_id
       CROSS JOIN (SELECT * FROM firmware_families ORDER BY id LIMIT 1) f
      WHERE bm.min_cells <= 4 AND bm.max_cells >= 4 AND f.voltage_scale_unit = 'V/V' AND f.current_scale_unit = 'mV/A'
      ORDER BY br.id LIMIT 1`,
    { type: QueryTypes.SELECT },
  );
  if (!row) throw new Error("the seeded demo has no 4S board under a V/V + mV/A family");
  return row;
}

/** A valid fly-and-recharge submission for the target; the implied scale is 2000 × 1200/1300 ≈ 1846.2. */
export function validBody(t: Target, overrides: Partial<SubmissionInput> = {}): SubmissionInput {
  return flyRechargeBody({ boardRevisionId: t.revisionId, firmwareFamilyId: t.familyId }, overrides);
}

export function postRequest(body: unknown, cookie: string, key?: string, raw = false): Request {
  const headers: Record<string, string> = { "content-type": "application/json" };
  if (key) headers["idempotency-key"] = key;
  const request = new Request("http://test.local/api/v1/submissions", { method: "POST", headers, body: raw ? String(body) : JSON.stringify(body) });
  return withCookie(request, cookie);
}

export const post = (body: unknown, cookie: string, key?: string) => callRoute(postRoute, postRequest(body, cookie, key));

export function patch(id: number | string, body: unknown, cookie: string): Promise<Response> {
  const request = new Request(`http://test.local/api/v1/submissions/${id}`, {
    method: "PATCH",
    headers: { "content-type": "application/json" },
    body: JSON.stringify(body),
  });
  return callRoute(patchRoute, withCookie(request, cookie), { params: Promise.resolve({ id: String(id) }) });
}

/** Rows in every table a submission writes to, including the mail jobs in pg-boss's queue. */
export async function rowCounts(): Promise<Record<string, number>> {
  const [row] = await db().query<Record<string, number>>(
    `SELECT (SELECT count(*)::int FROM submissions) AS submissions,
            (SELECT count(*)::int FROM submission_voltage_readings) AS readings,
            (SELECT count(*)::int FROM submission_cycles) AS cycles,
            (SELECT count(*)::int FROM submission_bench_points) AS bench,
            (SELECT count(*)::int FROM idempotency_keys) AS keys,
            (SELECT count(*)::int FROM pgboss.job WHERE name = 'mail.send') AS mails`,
    { type: QueryTypes.SELECT },
  );
  return row;
}

/** The mail jobs queued for an address, oldest first. */
export async function mailsTo(email: string): Promise<{ to: string; subject: string; text: string }[]> {
  return db()
    .query(`SELECT data FROM pgboss.job WHERE name = 'mail.send' AND data->>'to' = $1 ORDER BY created_on`, {
      bind: [email],
      type: QueryTypes.SELECT,
    })
    .then((rows) => (rows as { data: { to: string; subject: string; text: string } }[]).map((r) => r.data));
}

/** Checks the one error shape and returns its error object. */
export async function expectError(res: Response, status: number, field?: string) {
  expect(res.status).toBe(status);
  expect(res.headers.get("cache-control")).toBe("no-store");
  const body = await res.json();
  expect(Object.keys(body)).toEqual(["error"]);
  expect(body.error.status).toBe(status);
  if (field) expect(body.error.fieldErrors[field]?.[0], `fieldErrors.${field} in ${JSON.stringify(body.error.fieldErrors)}`).toEqual(expect.any(String));
  return body.error as { status: number; code: string; message: string; fieldErrors: Record<string, string[]> };
}

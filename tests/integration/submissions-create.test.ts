import { QueryTypes } from "sequelize";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { stopBoss } from "@/lib/jobs";
import { queueStatusMail } from "@/lib/submissions";
import { db } from "@/models";
import { sessionCookieFor, testAccount } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { expectError, mailsTo, pickTarget, post, postRequest, rowCounts, validBody, type Target } from "./submissions-helpers";
import { POST } from "@/app/api/v1/submissions/route";
import { callRoute } from "@/tests/support/auth";

vi.mock("next/headers", () => import("@/tests/support/next-headers"));

// POST /api/v1/submissions against real PostgreSQL (a clone of the seeded demo): what a valid
// submission writes, what the evidence implies, and that every refusal writes nothing at all.
setupTestDatabase("seeded");
afterAll(() => stopBoss());

let target: Target;
let cookie: string;
let email: string;
beforeAll(async () => {
  target = await pickTarget();
  cookie = await sessionCookieFor("contributor");
  email = (await testAccount("contributor")).email;
});

describe("a valid submission", () => {
  it("is stored pending with its cycles, the evidence verdict and a 'received' mail in the same transaction", async () => {
    const before = await rowCounts();
    const res = await post(validBody(target), cookie);
    expect(res.status).toBe(201);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const { submission } = await res.json();
    expect(res.headers.get("location")).toBe(`/api/v1/submissions/${submission.id}`);
    expect(submission).toMatchObject({ status: "pending", version: 0, editable: true, method: "fly_recharge", currentScale: 1846, moderatorNote: null });
    expect(submission.cycles).toHaveLength(2);
    // fly-and-recharge rule (common practice, no source): 2000 × 1200 / 1300 and 2000 × 1100 / 1192, median of the two
    const implied = (2000 * 1200) / 1300 / 2 + (2000 * 1100) / 1192 / 2;
    expect(submission.evidence.summary.cycles.implied).toBeCloseTo(implied, 9);
    expect(submission.evidence.mismatch).toBe(false);

    const after = await rowCounts();
    expect(after).toEqual({ ...before, submissions: before.submissions + 1, cycles: before.cycles + 2, mails: before.mails + 1 });
    const [row] = await db().query<{ status: string; contributor: string; mismatch: boolean }>(
      `SELECT s.status, u.email AS contributor, s.evidence_mismatch AS mismatch FROM submissions s JOIN users u ON u.id = s.contributor_id WHERE s.id = $1`,
      { bind: [submission.id], type: QueryTypes.SELECT },
    );
    expect(row).toEqual({ status: "pending", contributor: email, mismatch: false });
    const mail = (await mailsTo(email)).at(-1)!;
    expect(mail.subject).toBe(`Shuntbook: Submission #${submission.id} received: pending review`);
    expect(mail.text).toMatch(new RegExp(`/my/submissions/${submission.id}/edit`));
  });

  it("a claimed value more than 2 % from what the evidence implies is stored flagged, not refused", async () => {
    const res = await post(validBody(target, { currentScale: 2000 }), cookie); // implied ≈ 1845.9: 8 % off
    expect(res.status).toBe(201);
    const { submission } = await res.json();
    expect(submission.evidence.mismatch).toBe(true);
    const check = submission.evidence.summary.checks[0];
    expect(check).toMatchObject({ quantity: "current_scale", source: "recharge_cycles", claimed: 2000, mismatch: true });
    const [{ mismatch }] = await db().query<{ mismatch: boolean }>("SELECT evidence_mismatch AS mismatch FROM submissions WHERE id = $1", {
      bind: [submission.id],
      type: QueryTypes.SELECT,
    });
    expect(mismatch).toBe(true);
  });

  it("a multimeter check and a bench fit are stored as rows and summarised through the family's units", async () => {
    // V/V proportional in Vornel's 0.02 steps: 500 × 16.8 / 15.27 ≈ 550.1, i.e. ÷11
    // (voltage divider 10 k / 1 k: Vout = Vin·R2/(R1+R2), Horowitz & Hill §1.2.3, from memory)
    const voltageCheck = { scaleUsed: 500, readings: [{ cells: 4, reportedVolts: 15.27, measuredVolts: 16.8, measuredAt: "balance_outer_pins" as const }] };
    const multimeter = await post(validBody(target, { method: "multimeter", voltageScale: 550, currentScale: null, cycles: [], voltageCheck }), cookie);
    expect(multimeter.status).toBe(201);
    const m = (await multimeter.json()).submission;
    expect(m.voltageCheck).toEqual(voltageCheck);
    expect(m.evidence.summary.voltage.implied).toBeCloseTo((500 * 16.8) / 15.27, 9);

    // 25 mV/A true (0.5 mΩ × 50, Ohm's law) read with 40 mV/A set: reported = 0.625 × measured + 12/40;
    // in Vornel's steps 25 mV/A is 1250, 40 mV/A is 2000, and the 12 mV zero error is 24 steps of 0.5 mV
    const points = [5, 10, 20].map((measuredAmps) => ({ measuredAmps, reportedAmps: 0.625 * measuredAmps + 0.3 }));
    const bench = await post(
      validBody(target, { method: "bench_clamp", currentScale: 1250, currentOffset: 24, cycles: [], bench: { scaleUsed: 2000, offsetUsed: 0, points } }),
      cookie,
    );
    expect(bench.status).toBe(201);
    const b = (await bench.json()).submission;
    expect(b.bench.points).toEqual(points);
    expect(b.evidence.summary.bench.impliedScale).toBeCloseTo(1250, 9);
    expect(b.evidence.summary.bench.impliedOffset).toBeCloseTo(24, 9);
    expect(b.evidence.mismatch).toBe(false);
  });
});

describe("the status mail belongs to its transaction", () => {
  it("rolled back with the change, it is never sent", async () => {
    const { submission } = await (await post(validBody(target), cookie)).json();
    const before = await rowCounts();
    await expect(
      db().transaction(async (transaction) => {
        await queueStatusMail(submission.id, transaction, "decided");
        throw new Error("the status change failed after the mail was queued");
      }),
    ).rejects.toThrow(/status change failed/);
    expect(await rowCounts()).toEqual(before);
  });
});

describe("a refused submission writes nothing", () => {
  const refusals: [string, (t: Target) => unknown, string][] = [
    ["a scale that is not positive", (t) => validBody(t, { currentScale: 0 }), "currentScale"],
    [
      "a reported-to-charged ratio outside 0.2–5",
      (t) => validBody(t, { cycles: [{ scaleUsed: 2000, reportedMah: 9000, chargedMah: 1300, ratedMah: 1500, cells: 4 }] }),
      "cycles.0.reportedMah",
    ],
    [
      "negative mAh",
      (t) => validBody(t, { cycles: [{ scaleUsed: 2000, reportedMah: 1200, chargedMah: -1, ratedMah: 1500, cells: 4 }] }),
      "cycles.0.chargedMah",
    ],
    [
      "a cell count that is not possible",
      (t) => validBody(t, { cycles: [{ scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: 15 }] }),
      "cycles.0.cells",
    ],
    [
      "a cell count outside the board's range",
      (t) => validBody(t, { cycles: [{ scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: t.maxCells + 1 }] }),
      "cycles.0.cells",
    ],
    [
      "charged mAh more than 1.5 × rated",
      (t) => validBody(t, { cycles: [{ scaleUsed: 2000, reportedMah: 2000, chargedMah: 2400, ratedMah: 1500, cells: 4 }] }),
      "cycles.0.chargedMah",
    ],
    [
      "a reported voltage impossible for the cell count",
      (t) =>
        validBody(t, {
          method: "multimeter",
          voltageScale: 550,
          cycles: [],
          voltageCheck: { scaleUsed: 500, readings: [{ cells: 4, reportedVolts: 80, measuredVolts: 16.8, measuredAt: "main_lead" }] },
        }),
      "voltageCheck.readings.0.reportedVolts",
    ],
    ["a scale outside the family's range", (t) => validBody(t, { currentScale: 12501 }), "currentScale"],
    ["no value at all", (t) => validBody(t, { method: "unverified", currentScale: null, cycles: [] }), "voltageScale"],
    ["an unknown board revision", (t) => validBody(t, { boardRevisionId: 999_999 }), "boardRevisionId"],
    ["an unknown family", (t) => validBody(t, { firmwareFamilyId: 999_999 }), "firmwareFamilyId"],
    ["a photo id that is not the sender's", (t) => validBody(t, { photoIds: ["00000000-0000-4000-8000-000000000000"] }), "photoIds"],
    ["not an object", () => [1, 2, 3], "body"],
  ];

  it.each(refusals)("%s: 400 naming %s… no row anywhere", async (_name, make, field) => {
    const before = await rowCounts();
    const error = await expectError(await post(make(target), cookie), 400, field);
    expect(error.code).toBe("bad_request");
    expect(await rowCounts()).toEqual(before);
  });

  it("several faults come back together, each under its field's path", async () => {
    const error = await expectError(
      await post(
        validBody(target, {
          firmwareVersion: "not a version",
          cycles: [
            { scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: 4 },
            { scaleUsed: 0, reportedMah: -3, chargedMah: 1300, ratedMah: 1500, cells: 4 },
          ],
        }),
        cookie,
      ),
      400,
    );
    expect(Object.keys(error.fieldErrors).sort()).toEqual(["cycles.1.reportedMah", "cycles.1.scaleUsed", "firmwareVersion"]);
    expect(error.message).toMatch(/Bad parameters: .*cycles\.1\.reportedMah/);
  });

  it("a body that is not JSON, or not sent as JSON, is a 400 on body / Content-Type", async () => {
    const before = await rowCounts();
    await expectError(await callRoute(POST, postRequest("{not json", cookie, undefined, true)), 400, "body");
    const textPlain = postRequest(validBody(target), cookie);
    textPlain.headers.set("content-type", "text/plain");
    await expectError(await callRoute(POST, textPlain), 400, "Content-Type");
    expect(await rowCounts()).toEqual(before);
  });
});

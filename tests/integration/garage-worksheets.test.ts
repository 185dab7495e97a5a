import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { POST as postQuad } from "@/app/api/v1/garage/quads/route";
import { POST as startSheet } from "@/app/api/v1/garage/worksheets/route";
import { GET as getSheet } from "@/app/api/v1/garage/worksheets/[id]/route";
import { POST as postStep } from "@/app/api/v1/garage/worksheets/[id]/steps/route";
import { POST as publish } from "@/app/api/v1/garage/worksheets/[id]/publish/route";
import { DELETE as removeStep } from "@/app/api/v1/garage/worksheets/[id]/steps/[position]/route";
import { stopBoss } from "@/lib/jobs";
import { db, Submission, WorksheetStep } from "@/models";
import { callRoute, sessionCookieFor, withCookie } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { insertFixture, type Fixture } from "@/tests/support/fixtures";

setupTestDatabase("migrated");
// publishing queues mail through pg-boss; stop it before the database is dropped
afterAll(() => stopBoss());

const req = (url: string, cookie: string, body?: unknown) =>
  withCookie(
    new Request(`http://test${url}`, body === undefined ? {} : { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify(body) }),
    cookie,
  );
const params = (id: number) => ({ params: Promise.resolve({ id: String(id) }) });

let fx: Fixture;
beforeAll(async () => {
  fx = await insertFixture(db());
});

async function startOne(cookie: string) {
  const { quad } = await (
    await callRoute(
      postQuad,
      req("/api/v1/garage/quads", cookie, { name: "Bench quad", boardRevisionId: fx.revisionIds[0], firmwareFamilyId: fx.familyId, firmwareVersion: "1.2.0" }),
    )
  ).json();
  const noStart = await callRoute(startSheet, req("/api/v1/garage/worksheets", cookie, { quadId: quad.id, ratedMah: 1500, cells: 4 }));
  // nothing is published for the fixture board: the builder must say what the quad flies with now
  expect(noStart.status).toBe(400);
  expect((await noStart.json()).error.fieldErrors.startingScale[0]).toMatch(/Nothing is published/);
  const res = await callRoute(startSheet, req("/api/v1/garage/worksheets", cookie, { quadId: quad.id, ratedMah: 1500, cells: 4, startingScale: 400 }));
  expect(res.status).toBe(201);
  return (await res.json()).worksheet;
}

describe("fly-and-recharge worksheet, saved step by step", () => {
  it("computes the next scale after each stored step and publishes a pending submission with the cycles", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "pilot@garage.test" });
    const sheet = await startOne(cookie);
    expect(sheet).toMatchObject({ startingScale: 400, startingSource: "own", steps: [] });

    // fixture family: mV/A, an 'inverse' unit, so next = scale × reported ÷ charged
    // (the fly-and-recharge rule: common practice, no source): 400 × 1200 ÷ 1300 = 369.23…
    let view = (await (await callRoute(postStep, req(`/x`, cookie, { scaleUsed: 400, reportedMah: 1200, chargedMah: 1300 }), params(sheet.id))).json())
      .worksheet;
    expect(view.result.iterations[0].impliedScale).toBeCloseTo((400 * 1200) / 1300, 9);
    expect(view.result.next.down.setting).toBe(369);
    expect(view.result.next.up.setting).toBe(370);
    // a smaller inverse scale makes the display read high: the safe, over-reporting side (common practice, no source)
    expect(view.result.next.safeSide).toBe("down");
    expect(view.result.next.down.reads).toBe("high");
    view = (await (await callRoute(postStep, req(`/x`, cookie, { scaleUsed: 369, reportedMah: 1296, chargedMah: 1300 }), params(sheet.id))).json()).worksheet;
    view = (await (await callRoute(postStep, req(`/x`, cookie, { scaleUsed: 368, reportedMah: 1300, chargedMah: 1301 }), params(sheet.id))).json()).worksheet;
    expect(view.steps).toHaveLength(3);
    expect(view.result.stop.met).toBe(true);
    expect(view.result.convergence).toHaveLength(3);

    const res = await callRoute(publish, req(`/x`, cookie, {}), params(sheet.id));
    expect(res.status).toBe(201);
    const { submission } = await res.json();
    db();
    const row = await Submission.findByPk(submission.id);
    expect(row).toMatchObject({ status: "pending", method: "fly_recharge", currentScale: view.result.recommendedSetting });
    expect((await callRoute(publish, req(`/x`, cookie, {}), params(sheet.id))).status).toBe(409);
  });

  it("an implausible step is explained by field and not stored", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "pilot@garage.test" });
    const sheet = await startOne(cookie);
    const res = await callRoute(postStep, req(`/x`, cookie, { scaleUsed: 400, reportedMah: 100, chargedMah: 1300 }), params(sheet.id));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fieldErrors.reportedMah[0]).toMatch(/cannot be the same flight/);
    const over = await callRoute(postStep, req(`/x`, cookie, { scaleUsed: 400, reportedMah: 2900, chargedMah: 3000 }), params(sheet.id));
    expect((await over.json()).error.fieldErrors.chargedMah[0]).toMatch(/cannot have put 3000 mAh/);
    db();
    expect(await WorksheetStep.count({ where: { worksheetId: sheet.id } })).toBe(0);
  });

  it("another person's worksheet is 404", async () => {
    const owner = await sessionCookieFor("contributor", { email: "pilot@garage.test" });
    const other = await sessionCookieFor("contributor", { email: "other@garage.test" });
    const sheet = await startOne(owner);
    expect((await callRoute(getSheet, req(`/x`, other), params(sheet.id))).status).toBe(404);
    expect((await callRoute(postStep, req(`/x`, other, { scaleUsed: 400, reportedMah: 1200, chargedMah: 1300 }), params(sheet.id))).status).toBe(404);
  });

  it("a mistyped iteration is taken back: kept and shown, no longer counted or published, and only the last one", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "pilot@garage.test" });
    const sheet = await startOne(cookie);
    const step = (body: object) => callRoute(postStep, req(`/x`, cookie, body), params(sheet.id));
    const takeBack = (position: number) =>
      callRoute(removeStep, withCookie(new Request("http://test/x", { method: "DELETE" }), cookie), {
        params: Promise.resolve({ id: String(sheet.id), position: String(position) }),
      });
    await step({ scaleUsed: 400, reportedMah: 1200, chargedMah: 1300 });
    // 1380 typed for 1300: plausible, so stored, but wrong
    await step({ scaleUsed: 369, reportedMah: 1296, chargedMah: 1380 });

    const notLast = await takeBack(0);
    expect(notLast.status).toBe(409);
    expect((await notLast.json()).error.fieldErrors.position[0]).toMatch(/iteration 2 first/);
    const res = await takeBack(1);
    expect(res.status).toBe(200);
    const { worksheet, removed } = await res.json();
    expect(removed).toMatchObject({ position: 1, chargedMah: 1380 });
    expect(worksheet.steps).toHaveLength(1);
    expect(worksheet.removed).toEqual([expect.objectContaining({ chargedMah: 1380, removedAt: expect.any(String) })]);
    // a double tap takes back nothing more
    expect((await takeBack(1)).status).toBe(409);
    // the corrected iteration takes position 1 again; the taken-back row is still in the table
    const fixed = (await (await step({ scaleUsed: 369, reportedMah: 1296, chargedMah: 1300 })).json()).worksheet;
    expect(fixed.steps.map((s: { position: number; chargedMah: number }) => [s.position, s.chargedMah])).toEqual([
      [0, 1300],
      [1, 1300],
    ]);
    db();
    expect(await WorksheetStep.count({ where: { worksheetId: sheet.id } })).toBe(3);
    // published: only the live iterations are evidence, and nothing can be taken back any more
    const { submission } = await (await callRoute(publish, req(`/x`, cookie, {}), params(sheet.id))).json();
    expect(submission.cycles.map((c: { chargedMah: number }) => c.chargedMah)).toEqual([1300, 1300]);
    expect((await takeBack(1)).status).toBe(409);
  });
});

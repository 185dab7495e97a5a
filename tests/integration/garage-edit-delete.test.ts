import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { GET as listQuadsRoute, POST as postQuad } from "@/app/api/v1/garage/quads/route";
import { DELETE as deleteQuadRoute, PUT as putQuad } from "@/app/api/v1/garage/quads/[id]/route";
import { GET as listPacksRoute, POST as postPack } from "@/app/api/v1/garage/packs/route";
import { DELETE as deletePackRoute, PUT as putPack } from "@/app/api/v1/garage/packs/[id]/route";
import { POST as postCharge } from "@/app/api/v1/garage/packs/[id]/charges/route";
import { DELETE as deleteChargeRoute, PUT as putCharge } from "@/app/api/v1/garage/packs/[id]/charges/[chargeId]/route";
import { POST as startSheet } from "@/app/api/v1/garage/worksheets/route";
import { POST as postStep } from "@/app/api/v1/garage/worksheets/[id]/steps/route";
import { POST as publish } from "@/app/api/v1/garage/worksheets/[id]/publish/route";
import { listPacks } from "@/lib/garage/packs";
import { listQuads } from "@/lib/garage/quads";
import { stopBoss } from "@/lib/jobs";
import { db, Pack, PackCharge, Quad, Submission, Worksheet } from "@/models";
import { callRoute, sessionCookieFor, jsonRequest as call, routeParams as params } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";
import { insertFixture, type Fixture } from "@/tests/support/fixtures";

// Issue 13, item 5: edit and delete in the garage. A quad or pack behind a published worksheet is
// archived (hidden, kept) rather than deleted; a charge above 150 % of the rated capacity needs an
// explicit confirmation; a charge dated before the purchase or in the future is refused by field.
setupTestDatabase("migrated");
afterAll(() => stopBoss());

const isoDay = (offsetDays: number) => new Date(Date.now() + offsetDays * 86_400_000).toISOString().slice(0, 10);

let fx: Fixture;
beforeAll(async () => {
  fx = await insertFixture(db());
});

async function newPack(cookie: string, body: Record<string, unknown> = {}) {
  const res = await callRoute(
    postPack,
    call("/api/v1/garage/packs", cookie, "POST", { label: "Red 3", chemistry: "lipo", cells: 4, ratedMah: 1300, purchasedOn: "2026-01-10", ...body }),
  );
  expect(res.status).toBe(201);
  return (await res.json()).pack as { id: number };
}

async function newQuad(cookie: string) {
  const res = await callRoute(
    postQuad,
    call("/api/v1/garage/quads", cookie, "POST", {
      name: "Field five",
      boardRevisionId: fx.revisionIds[0],
      firmwareFamilyId: fx.familyId,
      firmwareVersion: "1.2.0",
    }),
  );
  expect(res.status).toBe(201);
  return (await res.json()).quad as { id: number };
}

/** A fly-and-recharge worksheet on the quad, started from the pack, with three steps (enough to publish). */
async function sheetWithSteps(cookie: string, quadId: number, packId: number | null) {
  const started = await callRoute(
    startSheet,
    call("/api/v1/garage/worksheets", cookie, "POST", { quadId, packId, ratedMah: 1300, cells: 4, startingScale: 400 }),
  );
  expect(started.status).toBe(201);
  const { worksheet } = await started.json();
  for (const step of [
    { scaleUsed: 400, reportedMah: 1200, chargedMah: 1300 },
    { scaleUsed: 369, reportedMah: 1296, chargedMah: 1300 },
    { scaleUsed: 368, reportedMah: 1300, chargedMah: 1301 },
  ]) {
    expect((await callRoute(postStep, call("/x", cookie, "POST", step), params({ id: String(worksheet.id) }))).status).toBe(201);
  }
  return worksheet.id as number;
}

describe("deleting a quad or a pack", () => {
  it("deletes one that no published worksheet used, with its unpublished worksheets", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "del@garage.test" });
    const quad = await newQuad(cookie);
    const pack = await newPack(cookie);
    const sheetId = await sheetWithSteps(cookie, quad.id, pack.id);
    expect((await callRoute(deletePackRoute, call("/x", cookie, "DELETE"), params({ id: String(pack.id) }))).status).toBe(204);
    expect((await callRoute(deleteQuadRoute, call("/x", cookie, "DELETE"), params({ id: String(quad.id) }))).status).toBe(204);
    db();
    expect(await Quad.findByPk(quad.id)).toBeNull();
    expect(await Pack.findByPk(pack.id)).toBeNull();
    expect(await Worksheet.findByPk(sheetId)).toBeNull();
  });

  it("archives one behind a published worksheet: hidden from the lists, kept, the submission untouched", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "arch@garage.test" });
    const quad = await newQuad(cookie);
    const pack = await newPack(cookie);
    const sheetId = await sheetWithSteps(cookie, quad.id, pack.id);
    const published = await callRoute(publish, call("/x", cookie, "POST", {}), params({ id: String(sheetId) }));
    expect(published.status, JSON.stringify(await published.clone().json())).toBe(201);
    const { submission } = await published.json();
    db();
    const before = (await Submission.findByPk(submission.id))!.toJSON();

    for (const [route, id] of [
      [deleteQuadRoute, quad.id],
      [deletePackRoute, pack.id],
    ] as const) {
      const res = await callRoute(route, call("/x", cookie, "DELETE"), params({ id: String(id) }));
      expect(res.status).toBe(200);
      expect(await res.json()).toEqual({ archived: true });
    }
    expect((await Quad.findByPk(quad.id))!.archivedAt).toBeInstanceOf(Date);
    expect((await Pack.findByPk(pack.id))!.archivedAt).toBeInstanceOf(Date);
    expect((await Worksheet.findByPk(sheetId))!.submissionId).toBe(submission.id);
    expect((await Submission.findByPk(submission.id))!.toJSON()).toEqual(before);

    const user = (await Worksheet.findByPk(sheetId))!.ownerId;
    expect((await (await callRoute(listQuadsRoute, call("/x", cookie, "GET"))).json()).quads).toEqual([]);
    expect((await (await callRoute(listPacksRoute, call("/x", cookie, "GET"))).json()).packs).toEqual([]);
    expect((await listQuads(user, { archived: true })).map((q) => q.id)).toEqual([quad.id]);
    expect((await listPacks(user, { archived: true })).map((p) => p.id)).toEqual([pack.id]);
  });

  it("a worksheet cannot name someone else's pack", async () => {
    const alice = await sessionCookieFor("contributor", { email: "alice2@garage.test" });
    const bob = await sessionCookieFor("contributor", { email: "bob2@garage.test" });
    const quad = await newQuad(alice);
    const bobsPack = await newPack(bob);
    const res = await callRoute(
      startSheet,
      call("/api/v1/garage/worksheets", alice, "POST", { quadId: quad.id, packId: bobsPack.id, ratedMah: 1300, cells: 4, startingScale: 400 }),
    );
    expect(res.status).toBe(400);
    expect((await res.json()).error.fieldErrors.packId).toEqual(["Choose one of your own packs, or type the figures"]);
  });
});

describe("editing", () => {
  it("a quad's and a pack's edits are saved; bad input is a field-level 400 that changes nothing", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "edit@garage.test" });
    const quad = await newQuad(cookie);
    const ok = await callRoute(
      putQuad,
      call("/x", cookie, "PUT", { name: "Field six", boardRevisionId: null, esc: "4-in-1" }),
      params({ id: String(quad.id) }),
    );
    expect((await ok.json()).quad).toMatchObject({ name: "Field six", boardRevisionId: null, firmwareFamilyId: null, esc: "4-in-1" });
    const bad = await callRoute(putQuad, call("/x", cookie, "PUT", { name: "" }), params({ id: String(quad.id) }));
    expect((await bad.json()).error.fieldErrors.name).toEqual(["Enter the quad's name"]);
    db();
    expect((await Quad.findByPk(quad.id))!.name).toBe("Field six");

    const pack = await newPack(cookie);
    const edited = await callRoute(
      putPack,
      call("/x", cookie, "PUT", { label: "Red 4", chemistry: "lihv", cells: 6, ratedMah: 1100 }),
      params({ id: String(pack.id) }),
    );
    expect((await edited.json()).pack).toMatchObject({ label: "Red 4", chemistry: "lihv", cells: 6, ratedMah: 1100, purchasedOn: null });
  });

  it("a purchase date after a logged charge is refused on purchasedOn", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "edit2@garage.test" });
    const pack = await newPack(cookie);
    const id = String(pack.id);
    expect((await callRoute(postCharge, call("/x", cookie, "POST", { chargedOn: "2026-02-01", chargedMah: 1200 }), params({ id }))).status).toBe(201);
    const res = await callRoute(
      putPack,
      call("/x", cookie, "PUT", { label: "Red 3", chemistry: "lipo", cells: 4, ratedMah: 1300, purchasedOn: "2026-03-01" }),
      params({ id }),
    );
    expect(res.status).toBe(400);
    expect((await res.json()).error.fieldErrors.purchasedOn[0]).toMatch(/after the first logged charge \(2026-02-01\)/);
    db();
    expect((await Pack.findByPk(pack.id))!.purchasedOn).toBe("2026-01-10");
  });

  it("a charge is corrected with PUT under the same rules, and removed with DELETE", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "edit3@garage.test" });
    const pack = await newPack(cookie);
    const id = String(pack.id);
    const logged = await (await callRoute(postCharge, call("/x", cookie, "POST", { chargedOn: "2026-02-01", chargedMah: 1200 }), params({ id }))).json();
    const chargeId = String(logged.pack.charges[0].id);
    const fixed = await callRoute(
      putCharge,
      call("/x", cookie, "PUT", { chargedOn: "2026-02-02", chargedMah: 1250, restingVoltsPerCell: 3.8, afterFullFlight: false }),
      params({ id, chargeId }),
    );
    expect(fixed.status).toBe(200);
    expect((await fixed.json()).pack.charges).toEqual([
      { id: Number(chargeId), chargedOn: "2026-02-02", chargedMah: 1250, restingVoltsPerCell: 3.8, afterFullFlight: false },
    ]);
    const refused = await callRoute(putCharge, call("/x", cookie, "PUT", { chargedOn: "2026-01-01", chargedMah: 1250 }), params({ id, chargeId }));
    expect((await refused.json()).error.fieldErrors.chargedOn[0]).toMatch(/before the pack's purchase date/);
    db();
    expect((await PackCharge.findByPk(Number(chargeId)))!.chargedOn).toBe("2026-02-02");

    const other = await sessionCookieFor("contributor", { email: "edit4@garage.test" });
    expect((await callRoute(putCharge, call("/x", other, "PUT", { chargedOn: "2026-02-02", chargedMah: 1 }), params({ id, chargeId }))).status).toBe(404);
    expect((await callRoute(deleteChargeRoute, call("/x", cookie, "DELETE"), params({ id, chargeId }))).status).toBe(200);
    expect(await PackCharge.findByPk(Number(chargeId))).toBeNull();
  });
});

describe("charge rules", () => {
  it("above 150 % of the rated capacity needs confirmOverCapacity; at 150 % it does not (our own rule)", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "big@garage.test" });
    const pack = await newPack(cookie);
    const id = String(pack.id);
    // the case: 99,999 mAh into a 1,300 mAh pack
    const refused = await callRoute(postCharge, call("/x", cookie, "POST", { chargedOn: "2026-02-01", chargedMah: 99999 }), params({ id }));
    expect(refused.status).toBe(400);
    const { fieldErrors } = (await refused.json()).error;
    expect(Object.keys(fieldErrors)).toEqual(["chargedMah"]);
    expect(fieldErrors.chargedMah[0]).toMatch(/more than 150 % of this pack's rated 1300 mAh/);
    db();
    expect(await PackCharge.count({ where: { packId: pack.id } })).toBe(0);

    // 1.5 × 1300 = 1950 is still accepted without the flag; 1951 is not
    expect((await callRoute(postCharge, call("/x", cookie, "POST", { chargedOn: "2026-02-01", chargedMah: 1950 }), params({ id }))).status).toBe(201);
    expect((await callRoute(postCharge, call("/x", cookie, "POST", { chargedOn: "2026-02-01", chargedMah: 1951 }), params({ id }))).status).toBe(400);
    const confirmed = await callRoute(
      postCharge,
      call("/x", cookie, "POST", { chargedOn: "2026-02-01", chargedMah: 1951, confirmOverCapacity: true }),
      params({ id }),
    );
    expect(confirmed.status).toBe(201);
    expect(await PackCharge.count({ where: { packId: pack.id } })).toBe(2);
  });

  it("a charge before the purchase date or in the future is refused on chargedOn", async () => {
    const cookie = await sessionCookieFor("contributor", { email: "dates@garage.test" });
    const pack = await newPack(cookie, { purchasedOn: isoDay(-30) });
    const id = String(pack.id);
    const early = await callRoute(postCharge, call("/x", cookie, "POST", { chargedOn: isoDay(-31), chargedMah: 1200 }), params({ id }));
    expect(early.status).toBe(400);
    expect((await early.json()).error.fieldErrors).toEqual({ chargedOn: [`The charge date cannot be before the pack's purchase date (${isoDay(-30)})`] });
    const future = await callRoute(postCharge, call("/x", cookie, "POST", { chargedOn: isoDay(2), chargedMah: 1200 }), params({ id }));
    expect(future.status).toBe(400);
    expect((await future.json()).error.fieldErrors.chargedOn).toEqual(["The charge date cannot be in the future"]);
    db();
    expect(await PackCharge.count({ where: { packId: pack.id } })).toBe(0);
    expect((await callRoute(postCharge, call("/x", cookie, "POST", { chargedOn: isoDay(-30), chargedMah: 1200 }), params({ id }))).status).toBe(201);
  });
});

import { describe, expect, it, vi } from "vitest";
vi.mock("next/headers", () => import("@/tests/support/next-headers"));

import { GET as listQuadsRoute, POST as postQuad } from "@/app/api/v1/garage/quads/route";
import { DELETE as deleteQuadRoute, GET as getQuadRoute, PUT as putQuad } from "@/app/api/v1/garage/quads/[id]/route";
import { POST as postPack } from "@/app/api/v1/garage/packs/route";
import { GET as getPackRoute } from "@/app/api/v1/garage/packs/[id]/route";
import { POST as postCharge } from "@/app/api/v1/garage/packs/[id]/charges/route";
import { db, PackCharge } from "@/models";
import { ANONYMOUS, callRoute, sessionCookieFor, jsonRequest as json, routeParams as params } from "@/tests/support/auth";
import { setupTestDatabase } from "@/tests/support/database";

setupTestDatabase("migrated");

describe("garage quads (app/api/v1/garage/quads)", () => {
  it("needs a sign-in, and keeps each owner's quads private (404 for others)", async () => {
    expect((await callRoute(listQuadsRoute, json("/api/v1/garage/quads", ANONYMOUS, "GET"))).status).toBe(401);
    const alice = await sessionCookieFor("contributor", { email: "alice@garage.test" });
    const bob = await sessionCookieFor("contributor", { email: "bob@garage.test" });

    const created = await callRoute(
      postQuad,
      json("/api/v1/garage/quads", alice, "POST", { name: "  Field five  ", esc: "Test 4-in-1", firmwareVersion: "2.1" }),
    );
    expect(created.status).toBe(201);
    const { quad } = await created.json();
    expect(quad).toMatchObject({ name: "Field five", esc: "Test 4-in-1", notes: null, boardRevisionId: null });

    expect((await callRoute(getQuadRoute, json(`/api/v1/garage/quads/${quad.id}`, bob, "GET"), params({ id: String(quad.id) }))).status).toBe(404);
    expect((await callRoute(deleteQuadRoute, json(`/api/v1/garage/quads/${quad.id}`, bob, "DELETE"), params({ id: String(quad.id) }))).status).toBe(404);
    expect((await (await callRoute(listQuadsRoute, json("/api/v1/garage/quads", bob, "GET"))).json()).quads).toEqual([]);

    const renamed = await callRoute(putQuad, json(`/api/v1/garage/quads/${quad.id}`, alice, "PUT", { name: "Field six" }), params({ id: String(quad.id) }));
    expect((await renamed.json()).quad.name).toBe("Field six");
    expect((await callRoute(deleteQuadRoute, json(`/api/v1/garage/quads/${quad.id}`, alice, "DELETE"), params({ id: String(quad.id) }))).status).toBe(204);
  });

  it("a blank name is a field-level 400", async () => {
    const alice = await sessionCookieFor("contributor", { email: "alice@garage.test" });
    const res = await callRoute(postQuad, json("/api/v1/garage/quads", alice, "POST", { name: " " }));
    expect(res.status).toBe(400);
    expect((await res.json()).error.fieldErrors.name).toEqual(["Enter the quad's name"]);
  });
});

describe("garage packs and charge logs", () => {
  it("counts cycles and estimates usable capacity from the log through packLandingGuide", async () => {
    const alice = await sessionCookieFor("contributor", { email: "alice@garage.test" });
    const res = await callRoute(
      postPack,
      json("/api/v1/garage/packs", alice, "POST", { label: "Pack A", chemistry: "lipo", cells: 4, ratedMah: 1500, purchasedOn: "2026-01-10" }),
    );
    expect(res.status).toBe(201);
    const { pack } = await res.json();
    const id = String(pack.id);
    for (const [day, mah] of [
      ["2026-02-01", 1300],
      ["2026-02-02", 1350],
      ["2026-02-03", 1250],
    ] as const) {
      const r = await callRoute(
        postCharge,
        json(`/api/v1/garage/packs/${id}/charges`, alice, "POST", { chargedOn: day, chargedMah: mah, restingVoltsPerCell: 4.19 }),
        params({ id }),
      );
      expect(r.status).toBe(201);
    }
    const { pack: after } = await (await callRoute(getPackRoute, json(`/api/v1/garage/packs/${id}`, alice, "GET"), params({ id }))).json();
    // median of 1300, 1350, 1250 is 1300 (definition of the median); 80 % of it is 1040 mAh
    // (the 80 % warning: common practice, no source)
    expect(after.landing.capacity).toMatchObject({ cycleCount: 3, estimatedUsableMah: 1300, basis: "charge log" });
    expect(after.landing.usedCapacityAlert.mah).toBe(1040);
    // 4.2 V a cell full for LiPo (UW EH&S battery guidance): 16.8 V for 4S
    expect(after.landing.full.pack).toBeCloseTo(16.8, 10);
  });

  it("implausible readings get a field-level explanation and nothing is saved", async () => {
    const alice = await sessionCookieFor("contributor", { email: "alice@garage.test" });
    const { pack } = await (
      await callRoute(postPack, json("/api/v1/garage/packs", alice, "POST", { label: "Pack B", chemistry: "lihv", cells: 6, ratedMah: 1100 }))
    ).json();
    const id = String(pack.id);
    db();
    const before = await PackCharge.count({ where: { packId: pack.id } });
    const res = await callRoute(
      postCharge,
      json(`/api/v1/garage/packs/${id}/charges`, alice, "POST", { chargedOn: "2026-02-01", chargedMah: -5, restingVoltsPerCell: 25.1 }),
      params({ id }),
    );
    expect(res.status).toBe(400);
    const { fieldErrors } = (await res.json()).error;
    expect(fieldErrors.chargedMah[0]).toMatch(/more than 0 mAh/);
    expect(fieldErrors.restingVoltsPerCell[0]).toMatch(/whole pack's voltage/);
    expect(await PackCharge.count({ where: { packId: pack.id } })).toBe(before);

    const badPack = await callRoute(postPack, json("/api/v1/garage/packs", alice, "POST", { label: "X", chemistry: "nimh", cells: 40, ratedMah: 1500.5 }));
    expect(Object.keys((await badPack.json()).error.fieldErrors).sort()).toEqual(["cells", "chemistry", "ratedMah"]);
  });

  it("another person's pack is 404 for reading and for logging a charge", async () => {
    const alice = await sessionCookieFor("contributor", { email: "alice@garage.test" });
    const bob = await sessionCookieFor("contributor", { email: "bob@garage.test" });
    const { pack } = await (
      await callRoute(postPack, json("/api/v1/garage/packs", alice, "POST", { label: "Pack C", chemistry: "liion", cells: 2, ratedMah: 3000 }))
    ).json();
    const id = String(pack.id);
    expect((await callRoute(getPackRoute, json(`/api/v1/garage/packs/${id}`, bob, "GET"), params({ id }))).status).toBe(404);
    expect(
      (await callRoute(postCharge, json(`/api/v1/garage/packs/${id}/charges`, bob, "POST", { chargedOn: "2026-02-01", chargedMah: 900 }), params({ id })))
        .status,
    ).toBe(404);
  });
});

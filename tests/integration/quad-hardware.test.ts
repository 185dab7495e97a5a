import { beforeAll, describe, expect, it } from "vitest";
import { quadHardware } from "@/lib/worksheets/hardware";
import { BoardRevision, db } from "@/models";
import { setupTestDatabase } from "@/tests/support/database";
import { insertFixture, type Fixture } from "@/tests/support/fixtures";

// The hardware worksheet's starting figures come from the quad's board revision row as stored:
// known parts as numbers, unknown ones as null (never 0), the board's largest pack for headroom.
setupTestDatabase("migrated");

let fx: Fixture;
beforeAll(async () => {
  fx = await insertFixture(db(), { revisions: 2 });
  await BoardRevision.update(
    { dividerTopOhms: 10_000, dividerBottomOhms: 1_000, currentSensor: "shunt", shuntMilliohms: 0.5, amplifierGain: 50, adcBits: 12, adcReferenceVolts: 3.3 },
    { where: { id: fx.revisionIds[0] } },
  );
});

describe("quadHardware", () => {
  it("reads a revision's parts and its board's largest pack", async () => {
    expect(await quadHardware({ boardRevisionId: fx.revisionIds[0] })).toEqual({
      board: { name: "Fixture Board", revisionLabel: "r1" },
      figures: {
        dividerTopOhms: 10_000,
        dividerBottomOhms: 1_000,
        currentSensor: "shunt",
        shuntMilliohms: 0.5,
        amplifierGain: 50,
        hallMvPerAmp: null,
        adcBits: 12,
        adcReferenceVolts: 3.3,
        maxCells: 6,
      },
    });
  });

  it("a revision with nothing recorded gives unknowns, and a quad without a revision no board", async () => {
    const bare = await quadHardware({ boardRevisionId: fx.revisionIds[1] });
    expect(bare.board).toEqual({ name: "Fixture Board", revisionLabel: "r2" });
    expect(
      Object.entries(bare.figures)
        .filter(([k]) => k !== "maxCells")
        .every(([, v]) => v === null),
    ).toBe(true);
    expect(await quadHardware({ boardRevisionId: null })).toEqual({ board: null, figures: expect.objectContaining({ dividerTopOhms: null, maxCells: null }) });
  });
});

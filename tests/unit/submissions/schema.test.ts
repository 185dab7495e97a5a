import { describe, expect, it } from "vitest";
import { DEMO_FIRMWARE_FAMILIES } from "@/seeders/demo/firmware-families";
import { fieldErrorsOf as fieldErrorsByPath } from "@/lib/http/field-errors";
import { submissionSchema, type SubmissionInput } from "@/lib/submissions/schema";
import { flyRechargeBody } from "@/tests/support/submission-body";

// The one schema of a contribution, as the form and the API use it. Each refusal must land on the
// field the form shows it beside, keyed by the same dotted path the API returns.

const family = DEMO_FIRMWARE_FAMILIES[0]; // V/V in 0.02, mV/A in 0.02, offset in 0.5 mV; ranges 50–2500, 50–12500, ±6600 (÷11 = 550, 25 mV/A = 1250)
const board = { minCells: 3, maxCells: 6 };
const schema = submissionSchema({ family, board });

const base: SubmissionInput = flyRechargeBody(
  { boardRevisionId: 1, firmwareFamilyId: 1 },
  {
    notes: "",
    cycles: [
      { scaleUsed: 2000, reportedMah: 1200, chargedMah: 1300, ratedMah: 1500, cells: 4 },
      { scaleUsed: 1846, reportedMah: 1290, chargedMah: 1300, ratedMah: 1500, cells: 4 },
    ],
  },
);

function errorsOf(input: unknown, s = schema): Record<string, string[]> {
  const parsed = s.safeParse(input);
  return parsed.success ? {} : fieldErrorsByPath(parsed.error.issues);
}

describe("a whole contribution", () => {
  it("a fly-and-recharge submission with two cycles passes, notes blank become null", () => {
    const parsed = schema.parse(base);
    expect(parsed.notes).toBeNull();
    expect(parsed.photoIds).toEqual([]);
    expect(parsed.cycles).toHaveLength(2);
  });

  it("at least one of the three values", () => {
    expect(errorsOf({ ...base, method: "unverified", cycles: [], currentScale: null })).toEqual({
      voltageScale: ["Enter at least one value: a voltage scale, a current scale or a current offset"],
    });
  });

  it("names an empty board, family, method and version field", () => {
    const e = errorsOf({ ...base, boardRevisionId: null, firmwareFamilyId: undefined, method: "guess", firmwareVersion: "" });
    expect(e.boardRevisionId).toEqual(["Choose the board and its revision"]);
    expect(e.firmwareFamilyId).toEqual(["Choose the firmware family"]);
    expect(e.method).toEqual(["Choose how you checked the values"]);
    expect(e.firmwareVersion?.[0]).toMatch(/Enter the firmware version/);
  });
  it("a body that is not an object is one clear refusal of the whole, never a crash", () => {
    for (const body of [null, "text", 42, [base]]) {
      expect(errorsOf(body), JSON.stringify(body)).toEqual({ body: ["Send the submission as one JSON object of its fields"] });
    }
  });
});

describe("settings: whole steps inside the family's range", () => {
  it("a scale that is not positive is refused with the reason", () => {
    expect(errorsOf({ ...base, currentScale: 0 }).currentScale).toEqual([
      "Current scale must be more than 0: a scale of 0 cannot turn a sensor reading into volts or amps",
    ]);
    expect(errorsOf({ ...base, currentScale: -5 }).currentScale?.[0]).toMatch(/more than 0/);
  });

  it("a fraction is refused: the firmware stores integers", () => {
    expect(errorsOf({ ...base, currentScale: 1846.5 }).currentScale?.[0]).toMatch(/whole number of setting steps \(1 step = 0.02 mV\/A\)/);
  });

  it("outside the family's min/max is refused, naming the family", () => {
    expect(errorsOf({ ...base, method: "unverified", cycles: [], voltageScale: 3000 }).voltageScale).toEqual([
      "Voltage scale must be between 50 and 2500 in Vornel (1 step = 0.02 V/V)",
    ]);
  });

  it("an offset may be zero or negative, within its range", () => {
    expect(errorsOf({ ...base, currentOffset: -12 })).toEqual({});
    expect(errorsOf({ ...base, currentOffset: 0 })).toEqual({});
    expect(errorsOf({ ...base, currentOffset: -7000 }).currentOffset?.[0]).toMatch(/between -6600 and 6600/);
  });

  it("text where a number belongs says so", () => {
    expect(errorsOf({ ...base, currentScale: "abc" }).currentScale).toEqual(["current scale must be a number"]);
    expect(errorsOf({ ...base, currentScale: Number.NaN }).currentScale).toEqual(["current scale must be a number"]);
  });
});

describe("fly-and-recharge cycles: impossible figures refused", () => {
  const withCycle = (c: Partial<NonNullable<SubmissionInput["cycles"]>[number]>) => ({
    ...base,
    cycles: [base.cycles![0], base.cycles![1], { ...base.cycles![0], ...c }],
  });

  it("a reported-to-charged ratio outside 0.2–5, keyed cycles.2.reportedMah", () => {
    expect(errorsOf(withCycle({ reportedMah: 7000, chargedMah: 1300, ratedMah: 1500 }))["cycles.2.reportedMah"]?.[0]).toMatch(/5.38 × .*outside 0.2–5/);
    expect(errorsOf(withCycle({ reportedMah: 200, chargedMah: 1300 }))["cycles.2.reportedMah"]?.[0]).toMatch(/0.15 ×/);
  });

  it("negative mAh", () => {
    expect(errorsOf(withCycle({ chargedMah: -10 }))["cycles.2.chargedMah"]).toEqual(["The charged mAh cannot be negative"]);
  });

  it("charged more than 1.5 × rated, keyed cycles.2.chargedMah", () => {
    expect(errorsOf(withCycle({ reportedMah: 2000, chargedMah: 2300, ratedMah: 1500 }))["cycles.2.chargedMah"]?.[0]).toMatch(
      /cannot have put 2300 mAh into a 1500 mAh pack/,
    );
  });

  it("a cell count that is not possible, or not for this board", () => {
    expect(errorsOf(withCycle({ cells: 15 }))["cycles.2.cells"]).toEqual(["A pack has 1 to 14 cells; 15 is not possible"]);
    expect(errorsOf(withCycle({ cells: 8 }))["cycles.2.cells"]).toEqual(["This board takes 3–6S packs; 8S is outside that"]);
    expect(errorsOf(withCycle({ cells: 2.5 }))["cycles.2.cells"]?.[0]).toMatch(/whole number/);
  });

  it("the fly-and-recharge method needs a cycle and a current scale", () => {
    expect(errorsOf({ ...base, cycles: [] }).cycles?.[0]).toMatch(/at least one fly-and-recharge cycle/);
    expect(errorsOf({ ...base, currentScale: null, voltageScale: 550 }).currentScale?.[0]).toMatch(/current scale your measurements led to/);
  });
});

describe("voltage check readings", () => {
  const multimeter = (reading: object) => ({
    ...base,
    method: "multimeter",
    cycles: [],
    voltageScale: 550, // the check implies 500 × 16.8 / 15.3 = 549.0
    voltageCheck: { scaleUsed: 500, readings: [{ cells: 4, reportedVolts: 15.3, measuredVolts: 16.8, measuredAt: "main_lead", ...reading }] },
  });

  it("a plausible 4S reading passes", () => {
    expect(errorsOf(multimeter({}))).toEqual({});
  });

  it("a multimeter voltage impossible for the cell count (2.5–4.35 V a cell)", () => {
    expect(errorsOf(multimeter({ measuredVolts: 25 }))["voltageCheck.readings.0.measuredVolts"]?.[0]).toMatch(/A 4S pack measures 10–17.4 V/);
  });

  it("a reported voltage impossible even for a badly set display", () => {
    expect(errorsOf(multimeter({ reportedVolts: 60 }))["voltageCheck.readings.0.reportedVolts"]?.[0]).toMatch(/impossible for a 4S pack/);
    expect(errorsOf(multimeter({ reportedVolts: 30 }))).toEqual({}); // ×1.8: a wrong default can do that
  });

  it("where it was measured is one of the two places", () => {
    expect(errorsOf(multimeter({ measuredAt: "somewhere" }))["voltageCheck.readings.0.measuredAt"]?.[0]).toMatch(/main lead or the balance plug/);
  });

  it("a multimeter submission needs the check, and others may not carry cycles", () => {
    expect(errorsOf({ ...multimeter({}), voltageCheck: null }).voltageCheck?.[0]).toMatch(/needs its voltage check/);
    expect(errorsOf({ ...multimeter({}), cycles: base.cycles }).cycles?.[0]).toMatch(/go with the fly-and-recharge method/);
  });
});

describe("bench points", () => {
  const bench = (points: { reportedAmps: number; measuredAmps: number }[]) => ({
    ...base,
    method: "bench_clamp",
    cycles: [],
    currentScale: 1250,
    currentOffset: 6,
    bench: { scaleUsed: 2000, offsetUsed: 0, points },
  });

  it("two points at different currents pass", () => {
    expect(
      errorsOf(
        bench([
          { reportedAmps: 3.2, measuredAmps: 5 },
          { reportedAmps: 12.5, measuredAmps: 20 },
        ]),
      ),
    ).toEqual({});
  });

  it("fewer than two, or all at one current, are refused on bench.points", () => {
    expect(errorsOf(bench([{ reportedAmps: 3, measuredAmps: 5 }]))["bench.points"]?.[0]).toMatch(/at least 2 points/);
    expect(
      errorsOf(
        bench([
          { reportedAmps: 3, measuredAmps: 5 },
          { reportedAmps: 3.1, measuredAmps: 5 },
        ]),
      )["bench.points"]?.[0],
    ).toMatch(/different currents/);
  });

  it("a fitted gain outside 0.2–5 cannot be the same current", () => {
    expect(
      errorsOf(
        bench([
          { reportedAmps: 60, measuredAmps: 5 },
          { reportedAmps: 240, measuredAmps: 20 },
        ]),
      )["bench.points"]?.[0],
    ).toMatch(/12 A per clamp-meter amp/);
  });

  it("a negative clamp reading is refused on its own field", () => {
    expect(
      errorsOf(
        bench([
          { reportedAmps: 3, measuredAmps: -5 },
          { reportedAmps: 12, measuredAmps: 20 },
        ]),
      )["bench.points.0.measuredAmps"],
    ).toEqual(["The clamp-meter current must be at least 0 A"]);
  });
});

describe("without a context the schema still checks what does not depend on it", () => {
  it("any positive whole scale and any cell count 1–14", () => {
    const plain = submissionSchema();
    expect(errorsOf({ ...base, currentScale: 999_999, cycles: [{ ...base.cycles![0], cells: 12 }] }, plain)).toEqual({});
    expect(errorsOf({ ...base, currentScale: 0 }, plain).currentScale?.[0]).toMatch(/more than 0/);
  });
});

describe("every message on the first try", () => {
  it("the cross-field rules speak even when other fields are still empty", () => {
    const e = errorsOf({ ...base, boardRevisionId: null, sensingSource: "", method: "fly_recharge", cycles: [], currentScale: null });
    expect(Object.keys(e).sort()).toEqual(["boardRevisionId", "cycles", "sensingSource", "voltageScale"]);
  });
});
